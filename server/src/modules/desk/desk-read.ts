import { createHash } from 'node:crypto';
import { stringify as stableJson } from 'safe-stable-stringify';
import type { CatalogModel, DesignInput, HomeInput, PriceBookSettings, Room } from '@calc';
import type { OptionPricing, ReadyOverride } from '@contract';
import type { FieldError } from '../../lib/errors';
import { NotFoundError } from '../../lib/errors';
import { PureMemo } from '../../lib/pure-memo';
import type { ServiceContext } from '../../lib/service-context';
import { DEFAULT_PRICE_BOOK_SETTINGS } from '../company-data/price-book-settings.service';
import { jobScope } from '../jobs/job-access';
import { scopeSql } from '../jobs/job-reads';
import { JobSchema, type Job } from '../jobs/job.entity';
import { companyDeskFromRows, DESK_DATASETS_SQL, type CompanyDataRow } from './desk-inputs';
import {
  computeOption,
  engineData,
  parseHome,
  type ComputedOption,
  type EngineData,
  type OptionInputs,
  type ParsedHome,
} from './desk-compute';
import {
  DesignOptionSchema,
  type DesignOption,
  type StoredDiscountRequest,
  type StoredTakeoffEdit,
} from './option.entity';

/**
 * Reads for the estimator's desk (issue 13). GET …/desk reads everything in two statements with no entities
 * hydrated (the job in scope with its rooms and the company's catalog, price book and settings as text; the
 * options with their people); the writes read the job and the option as entities to change, and what the
 * options are worked out from by the same statement.
 *
 * What is worked out from those inputs is kept (lib/pure-memo.ts) by a hash of exactly the inputs as read:
 * the home (parsed, its loads) by the job's id and its saved inputs; the company's engine data (catalog and
 * price book through calc's schemas) by the company's id and its rows and settings; each option's figures by
 * those two keys and every input of the option. A write anywhere in them is a new key, so nothing stale is
 * shown, and a key always carries the job's or the company's id and is looked up only after the scoped read.
 */

/** The job as the desk shows it: an entity on the write paths, a row read by SQL on GET …/desk. */
export interface DeskJobState {
  readonly id: string;
  readonly status: Job['status'];
  readonly readyAt?: Date | null;
  readonly readyBy?: { readonly id: string; readonly name: string } | null;
  readonly readyOverride?: ReadyOverride | null;
}

/** What a job's options are worked out from, with the keys naming exactly those inputs. */
export interface DeskInputs {
  readonly home: ParsedHome | { problem: FieldError };
  readonly data: EngineData;
  readonly homeKey: string;
  readonly dataKey: string;
}

/** A job in the actor's scope with what its options are worked out from. */
export interface DeskJob<J extends DeskJobState = Job> extends DeskInputs {
  readonly job: J;
}

type Person = { readonly id: string; readonly name: string };

/** An option as the desk shows it (its entity, or its row read by SQL): inputs, version, times and people. */
export interface OptionRow extends OptionInputs {
  readonly job: { readonly id: string };
  readonly position: number;
  readonly reviewedBy?: Person | null;
  readonly reviewedAt?: Date | null;
  readonly createdBy?: Person | null;
  readonly version: number;
  readonly createdAt: Date;
  readonly updatedAt: Date;
}

const homes = new PureMemo<ParsedHome | { problem: FieldError }>(50);
const companies = new PureMemo<EngineData>(20);
const figures = new PureMemo<ComputedOption>(60);

const hash = (...parts: string[]) => {
  const h = createHash('sha256');
  for (const p of parts) h.update(p).update('\u0000');
  return h.digest('base64url');
};

interface InputsRow {
  id: string;
  company_id: string;
  status: Job['status'];
  ready_at: string | null;
  ready_override: ReadyOverride | null;
  ready_by_id: string | null;
  ready_by_name: string | null;
  /** [design conditions, tightness, house] as the database holds them. */
  home_facts: string;
  rooms: string;
  company_rows: string;
  settings: string | null;
}

/**
 * One statement: the job in the actor's scope (scopeSql, the rule of jobScope), its rooms' saved inputs in
 * order, and the company's rows and settings, the inputs as text (parsed only when not already worked out).
 */
async function readInputsRow(ctx: ServiceContext, jobId: string): Promise<InputsRow> {
  const scope = scopeSql(ctx.actor);
  const [row] = await ctx.em.execute<InputsRow[]>(
    `select j.id, j.company_id, j.status, j.ready_at, j.ready_override, rb.id as ready_by_id, rb.name as ready_by_name,
       json_build_array(j.design_conditions, j.tightness, j.house)::text as home_facts,
       coalesce((select json_agg(r.input order by r.position, r.created_at, r.id) from "room" r where r.job_id = j.id),
         '[]'::json)::text as rooms,
       coalesce((select json_agg(json_build_object('dataset', d.dataset, 'data', d.data) order by d.key)
         from "company_data_row" d where d.company_id = j.company_id and d.dataset in ${DESK_DATASETS_SQL}), '[]'::json)::text
         as company_rows,
       (select s.data from "price_book_settings" s where s.company_id = j.company_id)::text as settings
     from "job" j left join "app_user" rb on rb.id = j.ready_by_id
     where j.id = ? and ${scope.sql}`,
    [jobId, ...scope.params],
  );
  if (!row) throw new NotFoundError('The job');
  return row;
}

/** The home and the company's engine data of a row read by readInputsRow, worked out only for inputs not seen before. */
function inputsOf(row: InputsRow): DeskInputs {
  const homeKey = `${row.id}:${hash(row.home_facts, row.rooms)}`;
  let home = homes.get(homeKey);
  if (!home) {
    const [designConditions, tightness, house] = JSON.parse(row.home_facts) as [
      Job['designConditions'],
      Job['tightness'],
      Job['house'] | null,
    ];
    home = parseHome(homeOf({ id: row.id, designConditions, tightness, house }, JSON.parse(row.rooms) as Room[]));
    homes.set(homeKey, home);
  }
  const dataKey = `${row.company_id}:${hash(row.company_rows, row.settings ?? '')}`;
  let data = companies.get(dataKey);
  if (!data) {
    const settings = row.settings ? (JSON.parse(row.settings) as PriceBookSettings) : DEFAULT_PRICE_BOOK_SETTINGS;
    data = engineData(companyDeskFromRows(JSON.parse(row.company_rows) as CompanyDataRow[], settings));
    companies.set(dataKey, data);
  }
  return { home, data, homeKey, dataKey };
}

/**
 * The job (404 outside the actor's scope: another company, a salesperson's colleague's job, an installer's
 * unassigned job) as an entity to change, with what its options are worked out from.
 */
export async function readDeskJob(ctx: ServiceContext, jobId: string): Promise<DeskJob> {
  // The job with who marked it ready, nothing else: every entity the request holds is one more for the flush to diff.
  const job = await ctx.em.findOne(
    JobSchema,
    { $and: [jobScope(ctx.actor), { id: jobId }] },
    { populate: ['readyBy'] },
  );
  if (!job) throw new NotFoundError('The job');
  return { job, ...inputsOf(await readInputsRow(ctx, job.id)) };
}

interface OptionSqlRow {
  id: string;
  position: number;
  name: string;
  design: DesignInput | null;
  pricing: OptionPricing;
  takeoff_edits: StoredTakeoffEdit[];
  chosen_models: Record<string, CatalogModel>;
  discount_request: StoredDiscountRequest | null;
  preliminary: boolean;
  reviewed_at: string | null;
  version: number;
  created_at: string;
  updated_at: string;
  created_by_id: string | null;
  created_by_name: string | null;
  reviewed_by_id: string | null;
  reviewed_by_name: string | null;
}

const person = (id: string | null, name: string | null): Person | null => (id ? { id, name: name ?? '' } : null);

/** GET …/desk: the job in scope as a row, what its options are worked out from, and its options as rows (two statements). */
export async function readDeskView(
  ctx: ServiceContext,
  jobId: string,
): Promise<{ desk: DeskJob<DeskJobState>; options: OptionRow[] }> {
  const row = await readInputsRow(ctx, jobId);
  const rows = await ctx.em.execute<OptionSqlRow[]>(
    `select o.id, o.position, o.name, o.design, o.pricing, o.takeoff_edits, o.chosen_models, o.discount_request,
       o.preliminary, o.reviewed_at, o.version, o.created_at, o.updated_at, cb.id as created_by_id,
       cb.name as created_by_name, rv.id as reviewed_by_id, rv.name as reviewed_by_name
     from "design_option" o left join "app_user" cb on cb.id = o.created_by_id
       left join "app_user" rv on rv.id = o.reviewed_by_id
     where o.job_id = ? and o.company_id = ? order by o.position asc`,
    [row.id, ctx.actor.companyId],
  );
  // Times as the ORM reads them (its type parsers leave timestamps as text; its platform makes the Date).
  const platform = ctx.em.getPlatform();
  const date = (t: string) => platform.parseDate(t) as Date;
  const job: DeskJobState = {
    id: row.id,
    status: row.status,
    readyAt: row.ready_at === null ? null : date(row.ready_at),
    readyBy: person(row.ready_by_id, row.ready_by_name),
    readyOverride: row.ready_override,
  };
  const options = rows.map((o): OptionRow => ({
    id: o.id,
    job: { id: row.id },
    position: o.position,
    name: o.name,
    design: o.design,
    pricing: o.pricing,
    takeoffEdits: o.takeoff_edits,
    chosenModels: o.chosen_models,
    discountRequest: o.discount_request,
    preliminary: o.preliminary,
    reviewedBy: person(o.reviewed_by_id, o.reviewed_by_name),
    reviewedAt: o.reviewed_at === null ? null : date(o.reviewed_at),
    createdBy: person(o.created_by_id, o.created_by_name),
    version: o.version,
    createdAt: date(o.created_at),
    updatedAt: date(o.updated_at),
  }));
  return { desk: { job, ...inputsOf(row) }, options };
}

/** The home calc works out, or why it cannot yet. */
export function homeOf(
  job: Pick<Job, 'id' | 'designConditions' | 'tightness'> & { house?: Job['house'] | null },
  rooms: Room[],
): HomeInput | { problem: FieldError } {
  if (!job.designConditions)
    return { problem: { path: 'designConditions', message: 'Enter the design conditions for the site first.' } };
  if (rooms.length === 0) return { problem: { path: 'rooms', message: 'Add the rooms of the walk-through first.' } };
  return { id: job.id, designConditions: job.designConditions, tightness: job.tightness, ...(job.house ?? {}), rooms };
}

export async function listOptions(ctx: ServiceContext, jobId: string): Promise<DesignOption[]> {
  return ctx.em.find(
    DesignOptionSchema,
    { job: jobId, company: ctx.actor.companyId },
    { orderBy: { position: 'asc' }, populate: ['createdBy', 'reviewedBy'] },
  );
}

/** The key of an option's figures: the home's and the company's keys and every input of the option. */
function figuresKey(d: DeskInputs, o: OptionInputs): string {
  const inputs = [
    o.id,
    o.name,
    o.design,
    o.pricing,
    o.takeoffEdits,
    o.chosenModels,
    o.discountRequest ?? null,
    o.preliminary,
  ];
  return `${d.homeKey}|${d.dataKey}|${hash(stableJson(inputs) ?? '')}`;
}

/**
 * An option worked out from its saved inputs, or the figures already worked out from exactly these inputs
 * (the home's, the company's and every input of the option), with the key they are kept by. Callers only
 * read a ComputedOption.
 */
export function computeKeyed(d: DeskInputs, o: OptionInputs): { computed: ComputedOption; key: string } {
  const key = figuresKey(d, o);
  const known = figures.get(key);
  if (known)
    // The edits as this option holds them (same values; the option's own objects, in its own key order).
    return {
      key,
      computed: { ...known, edits: known.edits.map((e, i) => ({ ...e, stored: o.takeoffEdits[i] ?? e.stored })) },
    };
  const computed = computeOption(o, d.home, d.data);
  figures.set(key, computed);
  return { computed, key };
}

export const compute = (d: DeskInputs, o: OptionInputs): ComputedOption => computeKeyed(d, o).computed;

const presented = new PureMemo<Buffer>(120);

/**
 * An option's JSON as GET …/desk presents it, kept by a key of everything the presentation reads (its
 * figures' key, the role, the option's row and the job's ready override: desk.presenter.ts says which),
 * made by `make` when not seen before. Only for rows read by SQL (their JSON objects come back from the
 * database in one key order, so the same key always means the same bytes).
 */
export function keptOptionBytes(key: string, make: () => Buffer): Buffer {
  let bytes = presented.get(key);
  if (!bytes) {
    bytes = make();
    presented.set(key, bytes);
  }
  return bytes;
}

/** A stable key of values (canonical JSON, hashed). */
export const keyOf = (value: unknown): string => hash(stableJson(value) ?? '');
