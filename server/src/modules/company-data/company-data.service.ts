import type { EntityManager } from '@mikro-orm/postgresql';
import { DATASETS, recordToCells, type CellChange, type CellError, type DatasetId, type DataRole } from '@calc';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Actor } from '../../lib/route';
import type { ServiceContext } from '../../lib/service-context';
import { zodToFieldErrors } from '../../lib/validate';
import { CompanySchema } from '../companies/company.entity';
import { UserSchema } from '../users/user.entity';
import { assertVersion } from '../../lib/version-lock';
import { CompanyDataChangeSchema, CompanyDataRowSchema, type CompanyDataRow } from './company-data.entity';
import { presentRow } from './company-data.presenter';

type Rec = Record<string, unknown> & { key: string };

export function assertReader(actor: Actor, dataset: DatasetId): void {
  if (!DATASETS[dataset].readers.includes(actor.role as DataRole))
    throw new ForbiddenError(`Your role does not use the ${DATASETS[dataset].label.toLowerCase()}.`);
}

/** Serialises writes to one company's table (edits and imports), released at the transaction's end. */
export async function lockTable(em: EntityManager, companyId: string, dataset: DatasetId): Promise<void> {
  await em.execute('select pg_advisory_xact_lock(hashtext(?))', [`company-data:${companyId}:${dataset}`]);
}

/** The records of one of the actor's company's tables, by key. */
export async function listRows({ em, actor }: ServiceContext, dataset: DatasetId) {
  return em.find(CompanyDataRowSchema, { company: actor.companyId, dataset }, { orderBy: { key: 'asc' } });
}

/** Each cell that differs between two records of a table, in column order. */
export function cellChanges(dataset: DatasetId, before: Rec | null, after: Rec): CellChange[] {
  const ds = DATASETS[dataset];
  const a = before ? recordToCells(ds, before) : ds.columns.map(() => '');
  const b = recordToCells(ds, after);
  return ds.columns.flatMap((c, i) =>
    a[i] === b[i] ? [] : [{ column: c.name, before: a[i] ?? '', after: b[i] ?? '' }],
  );
}

/**
 * Checks that need other records: a price-book item's category, a kit's component SKUs, a
 * model's matched models. `pendingKeys` are keys of the same table arriving in the same
 * import. Errors name the CSV column and the record field.
 */
export async function referenceChecker(
  em: EntityManager,
  companyId: string,
  dataset: DatasetId,
  pendingKeys: ReadonlySet<string> = new Set(),
): Promise<(record: Rec) => Array<CellError & { field: string }>> {
  const keysOf = async (d: DatasetId) =>
    new Set(
      (await em.find(CompanyDataRowSchema, { company: companyId, dataset: d }, { fields: ['key'] })).map((r) => r.key),
    );
  const categories = ['materials', 'labor', 'kits', 'models', 'refrigerants'].includes(dataset)
    ? await keysOf('categories')
    : null;
  const materials = dataset === 'kits' ? await keysOf('materials') : null;
  const models = dataset === 'models' ? await keysOf('models') : null;
  return (record) => {
    const errors: Array<CellError & { field: string }> = [];
    const category = record['category'];
    if (categories && typeof category === 'string' && !categories.has(category))
      errors.push({
        column: 'category',
        field: 'category',
        message: `No category "${category}": add it under categories first`,
      });
    const components = record['components'];
    if (materials && Array.isArray(components))
      for (const c of components as Array<{ sku: string }>)
        if (!materials.has(c.sku))
          errors.push({ column: 'components', field: 'components', message: `No material with SKU "${c.sku}"` });
    const matched = record['matchedKeys'];
    if (models && Array.isArray(matched))
      for (const k of matched as string[])
        if (!models.has(k) && !pendingKeys.has(k))
          errors.push({ column: 'matched_models', field: 'matchedKeys', message: `No model "${k}" in the catalog` });
    return errors;
  };
}

function parseRecord(dataset: DatasetId, raw: Record<string, unknown>): Rec {
  const r = DATASETS[dataset].schema.safeParse(raw);
  if (!r.success)
    throw new ValidationError(zodToFieldErrors(r.error).map((e) => ({ path: `record.${e.path}`, message: e.message })));
  return r.data as Rec;
}

async function checkReferences(em: EntityManager, companyId: string, dataset: DatasetId, record: Rec) {
  const errors = (await referenceChecker(em, companyId, dataset))(record);
  if (errors.length > 0)
    throw new ValidationError(errors.map((e) => ({ path: `record.${e.field}`, message: e.message })));
}

export async function getRow({ em, actor }: ServiceContext, dataset: DatasetId, key: string) {
  const row = await em.findOne(CompanyDataRowSchema, { company: actor.companyId, dataset, key });
  if (!row) throw new NotFoundError(`The ${DATASETS[dataset].noun} ${key}`);
  return row;
}

export async function createRow(
  { em, actor }: ServiceContext,
  dataset: DatasetId,
  raw: Record<string, unknown>,
): Promise<CompanyDataRow> {
  const record = parseRecord(dataset, raw);
  return em.transactional(async (tx) => {
    await lockTable(tx, actor.companyId, dataset);
    await checkReferences(tx, actor.companyId, dataset, record);
    if (await tx.findOne(CompanyDataRowSchema, { company: actor.companyId, dataset, key: record.key }))
      throw new ConflictError(`There is already a ${DATASETS[dataset].noun} ${record.key}. Open it to change it.`);
    const company = tx.getReference(CompanySchema, actor.companyId);
    const row = tx.create(CompanyDataRowSchema, { company, dataset, key: record.key, data: record });
    tx.create(CompanyDataChangeSchema, {
      company,
      dataset,
      key: record.key,
      action: 'created',
      source: 'edit',
      changes: cellChanges(dataset, null, record),
      changedBy: tx.getReference(UserSchema, actor.userId),
    });
    await tx.flush();
    return row;
  });
}

export async function updateRow(
  ctx: ServiceContext,
  dataset: DatasetId,
  key: string,
  version: number,
  raw: Record<string, unknown>,
): Promise<CompanyDataRow> {
  const { em, actor } = ctx;
  const record = parseRecord(dataset, raw);
  if (record.key !== key)
    throw new ValidationError([
      { path: 'record.key', message: 'The key cannot be changed; add a new record instead.' },
    ]);
  return em.transactional(async (tx) => {
    await lockTable(tx, actor.companyId, dataset);
    const row = await getRow({ ...ctx, em: tx }, dataset, key);
    assertVersion(version, row.version, `The ${DATASETS[dataset].noun} ${key}`, () =>
      presentRow(row, actor.role as DataRole),
    );
    await checkReferences(tx, actor.companyId, dataset, record);
    const changes = cellChanges(dataset, row.data, record);
    if (changes.length === 0) return row;
    row.data = record;
    tx.create(CompanyDataChangeSchema, {
      company: tx.getReference(CompanySchema, actor.companyId),
      dataset,
      key,
      action: 'changed',
      source: 'edit',
      changes,
      changedBy: tx.getReference(UserSchema, actor.userId),
    });
    await tx.flush();
    return row;
  });
}

export async function rowHistory(ctx: ServiceContext, dataset: DatasetId, key: string) {
  await getRow(ctx, dataset, key);
  return ctx.em.find(
    CompanyDataChangeSchema,
    { company: ctx.actor.companyId, dataset, key },
    { orderBy: { changedAt: 'desc', id: 'asc' }, populate: ['changedBy'], limit: 200 },
  );
}
