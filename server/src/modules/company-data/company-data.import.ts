import type { EntityManager } from '@mikro-orm/postgresql';
import { createHash } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import {
  DATASETS,
  IMPORT_LIMITS,
  columnsForUnits,
  diffImport,
  neutraliseCell,
  recordToCells,
  type CsvUnitSystem,
  type DatasetId,
  type ImportDiff,
  type ImportRowIn,
} from '@calc';
import { ConflictError, UnprocessableError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { CompanySchema } from '../companies/company.entity';
import { UserSchema } from '../users/user.entity';
import { CompanyDataChangeSchema, CompanyDataRowSchema, type CompanyDataRow } from './company-data.entity';
import { cellChanges, listRows, lockTable, referenceChecker } from './company-data.service';
import { templateExample } from './templates';

type Parsed = { header: string[]; rows: ImportRowIn[] } | { error: string };

const LINE_BREAKS = /\r\n|\n|\r/g;

/** Reads CSV text with csv-parse: BOM, quotes, embedded newlines, CRLF; rows of any width (the diff refuses them). */
export function parseCsv(text: string): Parsed {
  let records: Array<{ record: string[]; info: { lines: number } }>;
  try {
    records = parse(text, {
      bom: true,
      relax_column_count: true,
      skip_empty_lines: true,
      record_delimiter: ['\r\n', '\n', '\r'],
      info: true,
      to: IMPORT_LIMITS.maxRows + 2,
    }) as unknown as Array<{ record: string[]; info: { lines: number } }>;
  } catch (e) {
    const err = e as { message?: string; lines?: number };
    const where = typeof err.lines === 'number' ? ` (near line ${err.lines})` : '';
    return { error: `The file is not valid CSV${where}: ${String(err.message ?? 'unreadable').slice(0, 160)}` };
  }
  const [head, ...body] = records;
  if (!head) return { error: 'The file has no header row.' };
  if (body.length > IMPORT_LIMITS.maxRows)
    return { error: `The file has more than ${IMPORT_LIMITS.maxRows} rows, the limit per import. Split it.` };
  const rows = body.map(({ record, info }) => ({
    // info.lines is the line the record ends on; step back over line breaks inside its cells.
    line: info.lines - record.reduce((n, c) => n + (c.match(LINE_BREAKS)?.length ?? 0), 0),
    cells: record,
  }));
  return { header: head.record, rows };
}

function fingerprint(dataset: DatasetId, csv: string, rows: readonly CompanyDataRow[]): string {
  const h = createHash('sha256');
  h.update(`${dataset}\n${csv}\n`);
  for (const r of rows) h.update(`${r.key}@${r.version}\n`);
  return h.digest('base64url');
}

const EMPTY_DIFF = (fileError: string): ImportDiff => ({
  fileErrors: [fileError],
  rows: [],
  notInFile: [],
  counts: { added: 0, changed: 0, unchanged: 0, refused: 0 },
  canApply: false,
});

/** The company's unit system: a metric company's files may use (and its exports use) metric columns. */
export async function companyUnits(em: EntityManager, companyId: string): Promise<CsvUnitSystem> {
  const company = await em.findOneOrFail(CompanySchema, companyId, { fields: ['unitSystem'] });
  return company.unitSystem === 'metric' ? 'metric' : 'imperial';
}

async function diffAgainst(ctx: ServiceContext, dataset: DatasetId, csv: string) {
  const { em } = ctx;
  const companyId = ctx.actor.companyId;
  const held = await listRows(ctx, dataset);
  const units = await companyUnits(em, companyId);
  const parsed = parseCsv(csv);
  if ('error' in parsed) return { held, diff: EMPTY_DIFF(parsed.error) };
  const keyIndex = parsed.header.findIndex(
    (h) =>
      h
        .replace(/^\uFEFF/, '')
        .trim()
        .toLowerCase() === DATASETS[dataset].columns[0]?.name,
  );
  const pending = new Set(parsed.rows.map((r) => (r.cells[keyIndex] ?? '').trim()));
  const check = await referenceChecker(em, companyId, dataset, pending);
  const diff = diffImport({
    dataset: DATASETS[dataset],
    header: parsed.header,
    rows: parsed.rows,
    current: new Map(held.map((r) => [r.key, r.data])),
    units,
    checkRecord: (record) => check(record as Record<string, unknown> & { key: string }),
  });
  return { held, diff };
}

/** The diff plus what the client needs to show it; records themselves are not sent back. */
function presentDiff(diff: ImportDiff) {
  return {
    fileErrors: diff.fileErrors,
    counts: diff.counts,
    canApply: diff.canApply,
    notInFile: diff.notInFile,
    rows: diff.rows.map((r) =>
      r.status === 'changed'
        ? { line: r.line, key: r.key, status: r.status, changes: r.changes }
        : r.status === 'refused'
          ? { line: r.line, key: r.key, status: r.status, errors: r.errors }
          : { line: r.line, key: r.key, status: r.status },
    ),
  };
}

export async function previewImport(ctx: ServiceContext, dataset: DatasetId, csv: string) {
  const { held, diff } = await diffAgainst(ctx, dataset, csv);
  return { ...presentDiff(diff), token: fingerprint(dataset, csv, held) };
}

/**
 * Applies a previewed file in one transaction: the table is locked, the file is read again
 * against the records as they are now, and the write goes ahead only if the table is exactly
 * as it was at the preview (same keys, same versions) and no row is refused. Anything else
 * changes nothing.
 */
export async function applyImport(ctx: ServiceContext, dataset: DatasetId, csv: string, token: string) {
  const { actor } = ctx;
  return ctx.em.transactional(async (tx) => {
    await lockTable(tx, actor.companyId, dataset);
    const { held, diff } = await diffAgainst({ ...ctx, em: tx }, dataset, csv);
    if (fingerprint(dataset, csv, held) !== token)
      throw new ConflictError(
        `The ${DATASETS[dataset].label.toLowerCase()} changed after your preview (someone saved or imported). Nothing was imported: preview the file again to see the changes as they are now.`,
      );
    if (!diff.canApply)
      throw new UnprocessableError(
        diff.counts.refused > 0 || diff.fileErrors.length > 0
          ? 'The file has refused rows. Nothing was imported: fix them and preview again.'
          : 'The file changes nothing.',
        { preview: presentDiff(diff) },
      );
    const byKey = new Map(held.map((r) => [r.key, r]));
    const company = tx.getReference(CompanySchema, actor.companyId);
    const changedBy = tx.getReference(UserSchema, actor.userId);
    for (const r of diff.rows) {
      if (r.status !== 'added' && r.status !== 'changed') continue;
      const record = r.record as Record<string, unknown> & { key: string };
      const existing = byKey.get(record.key);
      const changes = cellChanges(dataset, existing?.data ?? null, record);
      if (existing) existing.data = record;
      else tx.create(CompanyDataRowSchema, { company, dataset, key: record.key, data: record });
      tx.create(CompanyDataChangeSchema, {
        company,
        dataset,
        key: record.key,
        action: existing ? 'changed' : 'created',
        source: 'import',
        changes,
        changedBy,
      });
    }
    await tx.flush();
    return presentDiff(diff);
  });
}

function toCsv(dataset: DatasetId, records: ReadonlyArray<Record<string, unknown>>, units: CsvUnitSystem): string {
  const ds = { ...DATASETS[dataset], columns: columnsForUnits(DATASETS[dataset].columns, units) };
  const rows = records.map((r) => recordToCells(ds, r).map(neutraliseCell));
  // A BOM so spreadsheets read UTF-8 (°, …); import strips it.
  return `\uFEFF${stringify([ds.columns.map((c) => c.name), ...rows], { record_delimiter: '\r\n' })}`;
}

export async function exportCsv(ctx: ServiceContext, dataset: DatasetId): Promise<string> {
  const rows = await listRows(ctx, dataset);
  return toCsv(
    dataset,
    rows.map((r) => r.data),
    await companyUnits(ctx.em, ctx.actor.companyId),
  );
}

export async function templateCsv({ em, actor }: ServiceContext, dataset: DatasetId): Promise<string> {
  return toCsv(dataset, [templateExample(dataset)], await companyUnits(em, actor.companyId));
}
