import { stringify } from 'csv-stringify/sync';
import { neutraliseCell } from '@calc';
import {
  AGE_BUCKETS,
  SIZING_BANDS,
  SYSTEM_TYPE_LABELS,
  type SalesReport,
  type SalesReportQuery,
  type WinGroup,
} from '@contract';
import { NotFoundError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { refreshStale } from './sales-summary';

/**
 * The owner's sales reports (issue 15): SQL aggregates over the sales summary (sales-summary.ts), which is
 * refreshed for the company's stale proposals first. The range filters on the day a proposal was first issued
 * (UTC calendar days, both ends inclusive); the salesperson on the job's salesperson. Nothing is loaded row by
 * row: each figure is one grouped query.
 */

const DAY_MS = 86_400_000;

interface Where {
  sql: string;
  params: unknown[];
}

function whereOf(companyId: string, q: SalesReportQuery, alias = 'p'): Where {
  const parts = [`${alias}."company_id" = ?`];
  const params: unknown[] = [companyId];
  if (q.from) {
    parts.push(`${alias}."first_issued_at" >= ?`);
    params.push(new Date(`${q.from}T00:00:00Z`));
  }
  if (q.to) {
    parts.push(`${alias}."first_issued_at" < ?`);
    params.push(new Date(Date.parse(`${q.to}T00:00:00Z`) + DAY_MS));
  }
  if (q.salesperson) {
    parts.push(`${alias}."salesperson_id" = ?`);
    params.push(q.salesperson);
  }
  return { sql: parts.join(' and '), params };
}

interface GroupRow {
  key: string | null;
  label: string | null;
  proposals: string;
  won: string;
  lost: string;
  revenue: string | null;
}

const toGroup = (r: GroupRow, label?: string): WinGroup => {
  const won = Number(r.won);
  const lost = Number(r.lost);
  const decided = won + lost;
  return {
    key: r.key ?? '',
    label: label ?? r.label ?? r.key ?? '',
    proposals: Number(r.proposals),
    won,
    lost,
    decided,
    winRate: decided === 0 ? null : won / decided,
    revenueCents: Number(r.revenue ?? 0),
  };
};

/** Per proposal: won/lost by the proposal's outcome. */
const PROPOSAL_COUNTS = `count(*) as proposals, count(*) filter (where p."outcome" = 'won') as won,
  count(*) filter (where p."outcome" = 'lost') as lost, coalesce(sum(p."revenue_cents"), 0) as revenue`;
/** Per option offered: won when this option was the one signed; lost when the proposal was decided otherwise. */
const OPTION_COUNTS = `count(*) as proposals, count(*) filter (where o."chosen" and p."outcome" = 'won') as won,
  count(*) filter (where p."outcome" = 'lost' or (p."outcome" = 'won' and not o."chosen")) as lost,
  coalesce(sum(p."revenue_cents") filter (where o."chosen"), 0) as revenue`;

const BAND_SQL = `case when o."sizing_ratio" is null then 'unknown' when o."sizing_ratio" < 0.9 then 'under'
  when o."sizing_ratio" <= 1.15 then 'right' when o."sizing_ratio" <= 1.3 then 'upper' else 'over' end`;

export async function salesReport({ em, actor, clock }: ServiceContext, q: SalesReportQuery): Promise<SalesReport> {
  const companyId = actor.companyId;
  if (q.salesperson) {
    const found = await em.execute<{ id: string }[]>(
      'select "id" from "app_user" where "id" = ? and "company_id" = ?',
      [q.salesperson, companyId],
    );
    if (!found[0]) throw new NotFoundError('The salesperson');
  }
  await refreshStale(em, companyId);
  const w = whereOf(companyId, q);
  const now = clock.now();

  const [totalsRow] = await em.execute<
    (GroupRow & { median_days: string | null; outstanding: string; signed: string; cancelled: string })[]
  >(
    `select 'all' as key, 'All proposals' as label, ${PROPOSAL_COUNTS},
      count(*) filter (where p."outcome" = 'outstanding') as outstanding,
      count(*) filter (where p."signed_at" is not null) as signed,
      count(*) filter (where p."cancelled_at" is not null) as cancelled,
      percentile_cont(0.5) within group (order by extract(epoch from p."signed_at" - p."first_visit_at") / 86400)
        filter (where p."outcome" = 'won' and p."signed_at" is not null) as median_days
     from "sales_report_proposal" p where ${w.sql}`,
    w.params,
  );
  const totalsGroup = toGroup(
    totalsRow ?? { key: 'all', label: 'All proposals', proposals: '0', won: '0', lost: '0', revenue: '0' },
  );

  const bySalesperson = await em.execute<GroupRow[]>(
    `select p."salesperson_id" as key, u."name" as label, ${PROPOSAL_COUNTS}
     from "sales_report_proposal" p join "app_user" u on u."id" = p."salesperson_id"
     where ${w.sql} group by p."salesperson_id", u."name" order by u."name"`,
    w.params,
  );
  const byMonth = await em.execute<GroupRow[]>(
    `select to_char(date_trunc('month', p."first_issued_at" at time zone 'UTC'), 'YYYY-MM') as key, null as label,
       ${PROPOSAL_COUNTS}
     from "sales_report_proposal" p where ${w.sql} group by 1 order by 1`,
    w.params,
  );
  const byOption = await em.execute<GroupRow[]>(
    `select o."position"::text as key, null as label, ${OPTION_COUNTS}
     from "sales_report_option" o join "sales_report_proposal" p on p."proposal_id" = o."proposal_id"
     where ${w.sql} group by o."position" order by o."position"`,
    w.params,
  );
  const bySystem = await em.execute<GroupRow[]>(
    `select o."system_type" as key, null as label, ${OPTION_COUNTS}
     from "sales_report_option" o join "sales_report_proposal" p on p."proposal_id" = o."proposal_id"
     where ${w.sql} group by o."system_type"`,
    w.params,
  );
  const byBand = await em.execute<GroupRow[]>(
    `select ${BAND_SQL} as key, null as label, ${OPTION_COUNTS}
     from "sales_report_option" o join "sales_report_proposal" p on p."proposal_id" = o."proposal_id"
     where ${w.sql} group by 1`,
    w.params,
  );
  const ages = await em.execute<{ key: string; count: string; oldest: string | null }[]>(
    `select case when d <= 7 then '0-7' when d <= 30 then '8-30' when d <= 90 then '31-90' else '91+' end as key,
       count(*) as count, max(d) as oldest
     from (select floor(extract(epoch from (?::timestamptz - p."last_issued_at")) / 86400)::int as d
           from "sales_report_proposal" p where ${w.sql} and p."outcome" = 'outstanding') a group by 1`,
    [now, ...w.params],
  );
  const lost = await em.execute<{ reason: string; count: string }[]>(
    `select coalesce(p."lost_reason", 'No reason recorded') as reason, count(*) as count
     from "sales_report_proposal" p where ${w.sql} and p."outcome" = 'lost' group by 1 order by count(*) desc, 1`,
    w.params,
  );

  // First price → proposal: the real jobs whose first desk option falls in the range (design_option, by job).
  const fp: unknown[] = [companyId];
  let fpWhere = '';
  if (q.from) {
    fpWhere += ' and f."first_at" >= ?';
    fp.push(new Date(`${q.from}T00:00:00Z`));
  }
  if (q.to) {
    fpWhere += ' and f."first_at" < ?';
    fp.push(new Date(Date.parse(`${q.to}T00:00:00Z`) + DAY_MS));
  }
  const [firstPrice] = await em.execute<{ priced: string; proposed: string }[]>(
    `select count(*) as priced,
       count(*) filter (where exists (select 1 from "proposal" x where x."job_id" = f."job_id")) as proposed
     from (select d."job_id", min(d."created_at") as first_at from "design_option" d
           join "job" j on j."id" = d."job_id" and j."company_id" = d."company_id"
           where d."company_id" = ?${q.salesperson ? ' and j."salesperson_id" = ?' : ''} group by d."job_id") f
     where true${fpWhere}`,
    q.salesperson ? [fp[0], q.salesperson, ...fp.slice(1)] : fp,
  );

  const salespeople = await em.execute<{ id: string; name: string }[]>(
    `select u."id", u."name" from "app_user" u where u."company_id" = ? and (u."role" = 'salesperson'
       or exists (select 1 from "sales_report_proposal" p where p."company_id" = u."company_id" and p."salesperson_id" = u."id"))
     order by u."name"`,
    [companyId],
  );

  const byKey = <T extends { key: string | null }>(rows: T[]) => new Map(rows.map((r) => [r.key ?? '', r]));
  const empty = (key: string): GroupRow => ({ key, label: null, proposals: '0', won: '0', lost: '0', revenue: '0' });
  const systems = byKey(bySystem);
  const bands = byKey(byBand);
  const ageMap = byKey(ages);
  const priced = Number(firstPrice?.priced ?? 0);
  const proposed = Number(firstPrice?.proposed ?? 0);
  const signed = Number(totalsRow?.signed ?? 0);
  const cancelled = Number(totalsRow?.cancelled ?? 0);
  const outstandingCount = Number(totalsRow?.outstanding ?? 0);
  const oldest = ages.reduce<number | null>(
    (m, a) => (a.oldest === null ? m : Math.max(m ?? 0, Number(a.oldest))),
    null,
  );
  const median = totalsRow?.median_days;

  return {
    filters: { from: q.from ?? null, to: q.to ?? null, salesperson: q.salesperson ?? null },
    salespeople,
    totals: {
      ...totalsGroup,
      outstanding: outstandingCount,
      averageTicketCents: totalsGroup.won === 0 ? null : Math.round(totalsGroup.revenueCents / totalsGroup.won),
      medianDaysToSignature: median === null || median === undefined ? null : Math.round(Number(median) * 10) / 10,
    },
    bySalesperson: bySalesperson.map((r) => toGroup(r)),
    byMonth: byMonth.map((r) => toGroup(r, monthLabel(r.key ?? ''))),
    byOption: byOption.map((r) => toGroup(r, `Option ${r.key}`)),
    bySystemType: (Object.keys(SYSTEM_TYPE_LABELS) as (keyof typeof SYSTEM_TYPE_LABELS)[])
      .filter((k) => systems.has(k) || k !== 'mixed')
      .map((k) => toGroup(systems.get(k) ?? empty(k), SYSTEM_TYPE_LABELS[k])),
    bySizingBand: SIZING_BANDS.filter((b) => bands.has(b.key) || b.key !== 'unknown').map((b) =>
      toGroup(bands.get(b.key) ?? empty(b.key), b.label),
    ),
    firstPrice: { priced, proposed, conversion: priced === 0 ? null : proposed / priced },
    outstanding: {
      count: outstandingCount,
      oldestDays: oldest,
      ages: AGE_BUCKETS.map((b) => ({ key: b.key, label: b.label, count: Number(ageMap.get(b.key)?.count ?? 0) })),
    },
    lostReasons: lost.map((r) => ({ reason: r.reason, count: Number(r.count) })),
    cancellations: { signed, cancelled, rate: signed === 0 ? null : cancelled / signed },
  };
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
function monthLabel(key: string): string {
  const [y, m] = key.split('-').map(Number);
  return `${MONTHS[(m ?? 1) - 1]} ${y}`;
}

const pct = (r: number | null) => (r === null ? '' : (r * 100).toFixed(1));
const dollars = (c: number | null) => (c === null ? '' : (c / 100).toFixed(2));

/**
 * The report as CSV: one section per table, each row "section, group, proposals, won, lost, decided, win rate %,
 * revenue $" (the other figures in the same columns, named in the group cell). Every cell that a spreadsheet
 * would run as a formula (=, +, -, @, tab, CR first) gets a leading apostrophe (calc's neutraliseCell, OWASP
 * "CSV Injection"); names and lost reasons are the company's own words, so they can begin with anything.
 */
export function salesReportCsv(r: SalesReport): string {
  const head = ['Section', 'Group', 'Proposals', 'Won', 'Lost', 'Decided', 'Win rate %', 'Revenue $'];
  const rows: string[][] = [];
  const group = (section: string, g: WinGroup) =>
    rows.push([
      section,
      g.label,
      `${g.proposals}`,
      `${g.won}`,
      `${g.lost}`,
      `${g.decided}`,
      pct(g.winRate),
      dollars(g.revenueCents),
    ]);
  group('Totals', r.totals);
  rows.push(['Totals', 'Average ticket $', '', '', '', '', '', dollars(r.totals.averageTicketCents)]);
  rows.push([
    'Totals',
    'Median days, first visit to signature',
    r.totals.medianDaysToSignature === null ? '' : `${r.totals.medianDaysToSignature}`,
    '',
    '',
    '',
    '',
    '',
  ]);
  for (const g of r.bySalesperson) group('By salesperson', g);
  for (const g of r.byMonth) group('By month issued', g);
  for (const g of r.byOption) group('By option offered', g);
  for (const g of r.bySystemType) group('By system type', g);
  for (const g of r.bySizingBand) group('By sizing (capacity at design ÷ block load)', g);
  rows.push([
    'First price to proposal',
    'Jobs priced / proposed / conversion %',
    `${r.firstPrice.priced}`,
    `${r.firstPrice.proposed}`,
    '',
    '',
    pct(r.firstPrice.conversion),
    '',
  ]);
  for (const a of r.outstanding.ages) rows.push(['Outstanding by age', a.label, `${a.count}`, '', '', '', '', '']);
  for (const l of r.lostReasons) rows.push(['Lost reasons', l.reason, `${l.count}`, '', '', '', '', '']);
  rows.push([
    'Cancellations within three days',
    'Signed / cancelled / rate %',
    `${r.cancellations.signed}`,
    `${r.cancellations.cancelled}`,
    '',
    '',
    pct(r.cancellations.rate),
    '',
  ]);
  // A BOM so spreadsheets read UTF-8 (÷, –).
  return `\uFEFF${stringify([head, ...rows.map((row) => row.map(neutraliseCell))], { record_delimiter: '\r\n' })}`;
}
