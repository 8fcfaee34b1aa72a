import type { EntityManager } from '@mikro-orm/postgresql';
import { modelCapacityAt, type CatalogModel } from '@calc';
import { proposalSnapshot, type ProposalSnapshot, type SnapshotOption } from '@contract';

/**
 * The sales summary the owner's reports read (migration …080000_sales_report): one row per proposal and one
 * per option offered, worked out here from the real rows — job, proposal, versions, signature, cancellation,
 * the desk's options — never entered by hand. Triggers mark a proposal stale when one of its facts is written
 * (whatever path wrote it); `refreshStale` works the marked ones of a company out again, inside one
 * transaction, before the report reads. See DEVELOPERS.md, "The owner's reports".
 */

export const SYSTEM_TYPES = ['single-zone', 'multi-zone', 'ducted', 'mixed'] as const;
export type SystemType = (typeof SYSTEM_TYPES)[number];

interface FactRow {
  proposal_id: string;
  company_id: string;
  job_id: string;
  salesperson_id: string;
  first_visit_at: Date;
  status: string;
  lost_reason: string | null;
  last_activity_at: Date;
  first_priced_at: Date | null;
  first_issued_at: Date | null;
  last_issued_at: Date | null;
  current_version_id: string | null;
  signed_version_id: string | null;
  option_position: number | null;
  signed_at: Date | null;
  cancelled_at: Date | null;
  marked_lost_at: Date | null;
}

/** The type of an option's systems: each outdoor unit's catalog kind; several kinds at once are "mixed". */
export function systemTypeOf(option: SnapshotOption): SystemType {
  const kinds = new Set(
    option.systems.map((s): SystemType => {
      if (s.outdoor.kind === 'outdoor-ducted') return 'ducted';
      if (s.outdoor.kind === 'outdoor-multi-zone' || s.zones.length > 1) return 'multi-zone';
      return 'single-zone';
    }),
  );
  const [only] = kinds;
  return kinds.size === 1 && only ? only : 'mixed';
}

/**
 * The option's cooling capacity at the design outdoor temperature (each system's outdoor unit from the
 * company's catalog, interpolated by calc's modelCapacityAt), over the block cooling load. Null where a model
 * is no longer in the catalog, lists no cooling points, or the snapshot has no design temperature or load.
 */
export function sizingOf(
  option: SnapshotOption,
  snapshot: ProposalSnapshot,
  models: ReadonlyMap<string, Pick<CatalogModel, 'coolingPoints' | 'heatingPoints'>>,
): { capacityBtuh: number | null; blockBtuh: number | null; ratio: number | null } {
  const blockBtuh = snapshot.loads.block.coolingBtuh > 0 ? snapshot.loads.block.coolingBtuh : null;
  const outdoorF = snapshot.design.conditions.outdoorCoolingDryBulbF;
  if (typeof outdoorF !== 'number' || option.systems.length === 0)
    return { capacityBtuh: null, blockBtuh, ratio: null };
  let capacity = 0;
  for (const system of option.systems) {
    const model = models.get(system.outdoor.key);
    const at = model ? modelCapacityAt({ model, mode: 'cooling', outdoorF }) : null;
    if (!at) return { capacityBtuh: null, blockBtuh, ratio: null };
    capacity += at.btuh;
  }
  return {
    capacityBtuh: Math.round(capacity * 10) / 10,
    blockBtuh,
    ratio: blockBtuh ? Math.round((capacity / blockBtuh) * 1000) / 1000 : null,
  };
}

const FACTS_SQL = `
select p."id" as proposal_id, p."company_id", p."job_id", j."salesperson_id", j."created_at" as first_visit_at,
  j."status", j."lost_reason", j."last_activity_at",
  (select min(d."created_at") from "design_option" d where d."job_id" = p."job_id") as first_priced_at,
  (select min(v."issued_at") from "proposal_version" v where v."proposal_id" = p."id") as first_issued_at,
  (select max(v."issued_at") from "proposal_version" v where v."proposal_id" = p."id") as last_issued_at,
  (select v."id" from "proposal_version" v where v."proposal_id" = p."id"
     order by v."superseded_at" is null desc, v."number" desc limit 1) as current_version_id,
  s."version_id" as signed_version_id, s."option_position", s."signed_at",
  c."at" as cancelled_at,
  (select max(e."at") from "proposal_event" e where e."proposal_id" = p."id" and e."kind" = 'marked-lost') as marked_lost_at
from "proposal" p
join "job" j on j."id" = p."job_id"
left join lateral (select * from "proposal_signature" x where x."proposal_id" = p."id"
  order by x."signed_at" desc limit 1) s on true
left join "proposal_cancellation" c on c."version_id" = s."version_id"
where p."company_id" = ? and p."id" in (?)`;

/** Works out the summary rows of the given proposals of one company again (inside the caller's transaction). */
export async function refreshProposals(em: EntityManager, companyId: string, proposalIds: readonly string[]) {
  if (proposalIds.length === 0) return 0;
  const facts = await em.execute<FactRow[]>(FACTS_SQL, [companyId, proposalIds]);
  const versionIds = facts.map((f) => f.signed_version_id ?? f.current_version_id).filter((v): v is string => !!v);
  const snapshots = new Map<string, ProposalSnapshot>();
  if (versionIds.length > 0) {
    const rows = await em.execute<{ id: string; snapshot: unknown }[]>(
      'select "id", "snapshot" from "proposal_version" where "company_id" = ? and "id" in (?)',
      [companyId, versionIds],
    );
    for (const r of rows) {
      const parsed = proposalSnapshot.safeParse(r.snapshot);
      if (parsed.success) snapshots.set(r.id, parsed.data);
    }
  }
  const modelKeys = [
    ...new Set([...snapshots.values()].flatMap((s) => s.options.flatMap((o) => o.systems.map((x) => x.outdoor.key)))),
  ];
  const models = new Map<string, CatalogModel>();
  if (modelKeys.length > 0) {
    const rows = await em.execute<{ key: string; data: CatalogModel }[]>(
      `select "key", "data" from "company_data_row" where "company_id" = ? and "dataset" = 'models' and "key" in (?)`,
      [companyId, modelKeys],
    );
    for (const r of rows) models.set(r.key, r.data);
  }

  await em.execute('delete from "sales_report_proposal" where "company_id" = ? and "proposal_id" in (?)', [
    companyId,
    proposalIds,
  ]);
  const now = new Date();
  for (const f of facts) {
    if (!f.first_issued_at || !f.last_issued_at) continue;
    const versionId = f.signed_version_id ?? f.current_version_id;
    const snapshot = versionId ? snapshots.get(versionId) : undefined;
    const won = f.status === 'won' || f.status === 'installed';
    const lost = f.status === 'lost';
    const outcome = won ? 'won' : lost ? 'lost' : 'outstanding';
    const decidedAt = won
      ? (f.signed_at ?? f.last_activity_at)
      : lost
        ? (f.cancelled_at ?? f.marked_lost_at ?? f.last_activity_at)
        : null;
    const chosenPosition = f.signed_version_id ? f.option_position : null;
    const sold = won && snapshot ? snapshot.options.find((o) => o.position === chosenPosition) : undefined;
    await em.execute(
      `insert into "sales_report_proposal" ("proposal_id", "company_id", "job_id", "salesperson_id", "first_visit_at",
        "first_priced_at", "first_issued_at", "last_issued_at", "outcome", "decided_at", "signed_at", "option_position",
        "revenue_cents", "lost_reason", "cancelled_at", "refreshed_at") values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      [
        f.proposal_id,
        companyId,
        f.job_id,
        f.salesperson_id,
        f.first_visit_at,
        f.first_priced_at,
        f.first_issued_at,
        f.last_issued_at,
        outcome,
        decidedAt,
        f.signed_at,
        chosenPosition,
        sold ? Math.max(0, sold.price.subtotalCents) : null,
        lost ? f.lost_reason : null,
        f.cancelled_at,
        now,
      ],
    );
    for (const option of snapshot?.options ?? []) {
      const sizing = sizingOf(option, snapshot as ProposalSnapshot, models);
      await em.execute(
        `insert into "sales_report_option" ("proposal_id", "position", "company_id", "system_type", "capacity_btuh",
          "block_load_btuh", "sizing_ratio", "total_cents", "chosen") values (?, ?, ?, ?, ?, ?, ?, ?, ?)`,
        [
          f.proposal_id,
          option.position,
          companyId,
          systemTypeOf(option),
          sizing.capacityBtuh,
          sizing.blockBtuh,
          sizing.ratio,
          Math.max(0, option.price.subtotalCents),
          chosenPosition === option.position,
        ],
      );
    }
  }
  return facts.length;
}

/** Refreshes every proposal of the company marked stale, in batches, in one transaction with the marks' removal. */
export async function refreshStale(em: EntityManager, companyId: string, batch = 500): Promise<number> {
  return em.transactional(async (tx) => {
    let done = 0;
    for (;;) {
      const marked = await tx.execute<{ proposal_id: string }[]>(
        `delete from "sales_report_stale" where "proposal_id" in (select "proposal_id" from "sales_report_stale"
          where "company_id" = ? limit ? for update skip locked) returning "proposal_id"`,
        [companyId, batch],
      );
      if (marked.length === 0) return done;
      done += await refreshProposals(
        tx,
        companyId,
        marked.map((m) => m.proposal_id),
      );
    }
  });
}
