import { createHash } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { stringify as canonicalJson } from 'safe-stable-stringify';
import {
  diffSnapshots,
  isOfficeRole,
  OWNER_ROLES,
  roleIn,
  PROPOSAL_MESSAGES,
  type ProposalDiffResponse,
  type ProposalEventKind,
  type ProposalEventRecord,
  type ProposalResponse,
  type ProposalVersionRecord,
  type ProposalVersionResponse,
  type BlockerRecord,
  type Role,
} from '@contract';
import type { DeskJobState } from '../desk/desk-read';
import { ConflictError, ForbiddenError, NotFoundError } from '../../lib/errors';
import { testPause } from '../../lib/test-pause';
import type { ServiceContext } from '../../lib/service-context';
import { hasBusinessAddress, proposalCompanyPart } from '../company-settings/proposal-details.service';
import { getDesk } from '../desk/desk.service';
import { findJob } from '../jobs/job-access';
import { UserSchema } from '../users/user.entity';
import { liveSignature, type LiveSignature } from './live-signature';
import { buildSnapshot, CALC_VERSION } from './snapshot';
import {
  ProposalEventSchema,
  ProposalSchema,
  ProposalVersionSchema,
  type Proposal,
  type ProposalVersion,
} from './proposal.entity';

/**
 * Proposals (issue 14, versions): issuing freezes a version, worked out again by the server with calc
 * (the desk's own computeOption on the saved inputs); reads answer with the versions, the audit trail in
 * order, one version's snapshot, and what changed between two versions. Every read and write is inside the
 * actor's job scope (another company's job or proposal is 404).
 */

/** The SHA-256 of a snapshot's canonical JSON (keys sorted: safe-stable-stringify), hex. */
export const snapshotSha256 = (snapshot: unknown): string =>
  createHash('sha256')
    .update(canonicalJson(snapshot) ?? '')
    .digest('hex');

/** Called inside the issuing transaction once the version and its events are written (the PDF task is added here). */
export type OnIssued = (tx: EntityManager, version: ProposalVersion) => Promise<void>;

type IssueRefusal = { reason: string; signed?: LiveSignature; fix?: 'desk' | 'settings' };

/**
 * Why this job cannot be issued now (for the 409 and the screen) and where that is put right (`fix`: the desk,
 * or the company settings for the business address), or null when it can.
 */
function whyNot(
  job: DeskJobState,
  blockers: readonly BlockerRecord[],
  role: Role,
  signed: LiveSignature | null,
  hasAddress: boolean,
): IssueRefusal | null {
  if (!isOfficeRole(role)) return { reason: 'Only an estimator or the owner issues a proposal.' };
  if (signed)
    return {
      reason: PROPOSAL_MESSAGES.signed(signed.versionNumber, signed.signedOn, signed.signerName),
      signed,
    };
  const why = whyNotReady(job, blockers);
  if (why) return { reason: why, fix: 'desk' };
  // The notice of cancellation in every proposal names the seller's address (16 CFR 429.1): none, nothing issued.
  if (!hasAddress) return { reason: PROPOSAL_MESSAGES.noBusinessAddress(roleIn(OWNER_ROLES, role)), fix: 'settings' };
  return null;
}

/** The desk's part: marked ready, and nothing but reasoned sizing blocks it. */
function whyNotReady(job: DeskJobState, blockers: readonly BlockerRecord[]): string | null {
  if (!job.readyAt) return PROPOSAL_MESSAGES.notReady;
  // Units outside their sizing range pass only with the office's reason, given when it marked the job ready.
  const left = blockers.filter((b) => !(b.code === 'sizing-outside-range' && job.readyOverride));
  if (left.length) return `The job cannot be proposed: ${left.map((b) => b.message).join(' ')}`;
  return null;
}

/**
 * Issues version N+1 of the job's proposal: recomputes the options from the saved inputs, builds and
 * checks the snapshot, stores it with its hash, marks the version before it superseded, and writes the
 * 'superseded' and 'issued' events — all in one transaction (the job row locked, so two issues queue).
 * 409 when the job is not marked ready, or the company has no business address for the cancellation notice
 * (why, in words, and `fix`: where to put it right); nothing is written then.
 */
export async function issueVersion(ctx: ServiceContext, jobId: string, onIssued?: OnIssued): Promise<ProposalVersion> {
  if (!isOfficeRole(ctx.actor.role)) throw new ForbiddenError('Only an estimator or the owner issues a proposal.');
  return ctx.em.transactional(async (tx) => {
    const c = { ...ctx, em: tx };
    const job = await findJob(c, jobId);
    // Two issues of one job wait for each other here, so version numbers never collide.
    await tx.execute('select id from "job" where id = ? for update', [job.id]);
    await tx.refresh(job);
    const desk = await getDesk(c, job.id);
    const company = await proposalCompanyPart(tx, ctx.actor.companyId);
    const why = whyNot(
      job,
      desk.blockers,
      ctx.actor.role,
      await liveSignature(tx, ctx.actor.companyId, job.id),
      company.address !== null,
    );
    if (why)
      throw new ConflictError(why.reason, {
        ...(why.signed ? { signed: why.signed } : {}),
        ...(why.fix ? { fix: why.fix } : {}),
      });
    const now = ctx.clock.now();
    const issuer = await tx.findOneOrFail(UserSchema, ctx.actor.userId);
    const snapshot = buildSnapshot({ company, customer: job.customer, job, options: desk.options, issuedAt: now });
    let proposal = await tx.findOne(ProposalSchema, { job: job.id, company: ctx.actor.companyId });
    proposal ??= tx.create(ProposalSchema, { company: ctx.actor.companyId, job: job.id, createdAt: now });
    // The earlier versions by number and whether current, never their snapshots: loaded as entities, each
    // snapshot was parsed, copied for change tracking and compared again at every flush of the transaction.
    const earlier = await tx.execute<Array<{ id: string; number: number; current: boolean }>>(
      `select "id", "number", "superseded_at" is null as "current" from "proposal_version"
        where "proposal_id" = ? and "company_id" = ? order by "number" desc`,
      [proposal.id, ctx.actor.companyId],
    );
    const previous = earlier.find((v) => v.current);
    if (previous)
      // The superseded version is written before the new one (one current version per proposal); the trigger
      // lets superseded_at go from null to a time once.
      await tx.execute('update "proposal_version" set "superseded_at" = ? where "id" = ? and "superseded_at" is null', [
        now,
        previous.id,
      ]);
    const version = tx.create(ProposalVersionSchema, {
      company: ctx.actor.companyId,
      proposal,
      number: (earlier[0]?.number ?? 0) + 1,
      snapshot,
      snapshotSha256: snapshotSha256(snapshot),
      calcVersion: CALC_VERSION,
      issuedBy: issuer,
      issuedByName: issuer.name,
      issuedAt: now,
      supersededAt: null,
      pdfState: 'waiting',
      pdfSha256: null,
      pdfKey: null,
    });
    const event = (kind: ProposalEventKind, versionId: string, data: Record<string, unknown>) =>
      tx.create(ProposalEventSchema, {
        company: ctx.actor.companyId,
        proposal,
        version: tx.getReference(ProposalVersionSchema, versionId),
        kind,
        at: now,
        byUser: issuer,
        byCustomer: false,
        ip: null,
        userAgent: null,
        data,
      });
    // The version, then its events in one statement, in the order made (their seq follows it): 'superseded'
    // before 'issued'. One flush, so the new snapshot is compared for changes once, not at three flushes.
    await tx.flush();
    if (previous) event('superseded', previous.id, { number: previous.number, by: version.number });
    event('issued', version.id, { number: version.number, snapshotSha256: version.snapshotSha256 });
    await tx.flush();
    if (onIssued) await onIssued(tx, version);
    // The fault test kills the process here: all written, nothing committed (lib/test-pause.ts).
    await testPause('issue-before-commit', async () => ({
      versionId: version.id,
      backendPid: (await tx.execute<{ pid: number }[]>('select pg_backend_pid() as pid'))[0]?.pid,
    }));
    return version;
  });
}

const iso = (d: Date | null | undefined) => (d ? d.toISOString() : null);

interface SignedRow {
  version_id: string;
  signed_at: Date;
  signer_name: string;
  copy_sha256: string | null;
}

/** What a version's record shows: its columns and, of its snapshot, each option's name and total. */
type VersionSummary = Pick<
  ProposalVersion,
  | 'id'
  | 'number'
  | 'issuedAt'
  | 'issuedByName'
  | 'supersededAt'
  | 'snapshotSha256'
  | 'calcVersion'
  | 'pdfState'
  | 'pdfSha256'
> & {
  readonly issuedBy: { readonly id: string } | null | undefined;
  readonly options: ReadonlyArray<{ readonly name: string; readonly totalCents: number }>;
};

const summaryOf = (v: ProposalVersion): VersionSummary => ({
  ...v,
  options: v.snapshot.options.map((o) => ({ name: o.name, totalCents: o.price.totalCents })),
});

/**
 * Every version of a proposal, newest first, as its record needs it: the options' names and totals are
 * taken out of each snapshot by PostgreSQL. The whole snapshots (tens of kB each) were read, parsed and
 * hydrated for two fields, on every issue and every read of the proposal: a cost growing with the versions.
 */
async function versionSummaries(ctx: ServiceContext, proposalId: string): Promise<VersionSummary[]> {
  const rows = await ctx.em.execute<
    Array<{
      id: string;
      number: number;
      issued_at: string;
      issued_by_id: string | null;
      issued_by_name: string;
      superseded_at: string | null;
      snapshot_sha256: string;
      calc_version: string;
      pdf_state: ProposalVersion['pdfState'];
      pdf_sha256: string | null;
      options: Array<{ name: string; totalCents: number }>;
    }>
  >(
    `select v."id", v."number", v."issued_at", v."issued_by_id", v."issued_by_name", v."superseded_at",
            v."snapshot_sha256", v."calc_version", v."pdf_state", v."pdf_sha256",
            coalesce((select jsonb_agg(jsonb_build_object('name', o.value->'name', 'totalCents',
                        o.value->'price'->'totalCents') order by o.ordinality)
                        from jsonb_array_elements(v."snapshot"->'options') with ordinality o), '[]'::jsonb) as "options"
       from "proposal_version" v
      where v."proposal_id" = ? and v."company_id" = ?
      order by v."number" desc`,
    [proposalId, ctx.actor.companyId],
  );
  // Times as the ORM reads them (its type parsers leave timestamps as text; its platform makes the Date).
  const platform = ctx.em.getPlatform();
  const date = (t: string) => platform.parseDate(t) as Date;
  return rows.map((r) => ({
    id: r.id,
    number: r.number,
    issuedAt: date(r.issued_at),
    issuedBy: r.issued_by_id ? { id: r.issued_by_id } : null,
    issuedByName: r.issued_by_name,
    supersededAt: r.superseded_at === null ? null : date(r.superseded_at),
    snapshotSha256: r.snapshot_sha256,
    calcVersion: r.calc_version,
    pdfState: r.pdf_state,
    pdfSha256: r.pdf_sha256,
    options: r.options,
  }));
}

function versionRecord(v: VersionSummary, signed?: SignedRow): ProposalVersionRecord {
  return {
    number: v.number,
    issuedAt: v.issuedAt.toISOString(),
    issuedBy: { id: v.issuedBy?.id ?? null, name: v.issuedByName },
    supersededAt: iso(v.supersededAt),
    current: v.supersededAt === null,
    snapshotSha256: v.snapshotSha256.trim(),
    calcVersion: v.calcVersion,
    pdf: { state: v.pdfState, sha256: v.pdfSha256?.trim() ?? null },
    options: v.options.map((o) => ({ name: o.name, totalCents: o.totalCents })),
    signed: signed
      ? {
          at: signed.signed_at.toISOString(),
          signerName: signed.signer_name,
          copySha256: signed.copy_sha256?.trim() ?? null,
        }
      : null,
  };
}

/** Each signed version of the proposal with its signer and the sealed copy's hash (insert-only tables of the signing module). */
async function signaturesByVersion(ctx: ServiceContext, proposalId: string): Promise<Map<string, SignedRow>> {
  const rows = await ctx.em.execute<SignedRow[]>(
    `select s."version_id", s."signed_at", s."signer_name", p."sha256" as "copy_sha256"
       from "proposal_signature" s left join "proposal_signed_pdf" p on p."signature_id" = s."id"
      where s."company_id" = ? and s."proposal_id" = ?`,
    [ctx.actor.companyId, proposalId],
  );
  return new Map(rows.map((r) => [r.version_id, { ...r, signed_at: new Date(r.signed_at) }]));
}

/** The job's proposal in the actor's scope (404 for a job outside it), or null before its first version. */
async function findProposal(ctx: ServiceContext, jobId: string): Promise<{ jobId: string; proposal: Proposal | null }> {
  const job = await findJob(ctx, jobId);
  const proposal = await ctx.em.findOne(ProposalSchema, { job: job.id, company: ctx.actor.companyId });
  return { jobId: job.id, proposal };
}

/** GET …/proposal: the versions (newest first), the audit trail in `seq` order, and whether a version may be issued. */
export async function getProposal(ctx: ServiceContext, jobId: string): Promise<ProposalResponse> {
  const { proposal } = await findProposal(ctx, jobId);
  const desk = await getDesk(ctx, jobId);
  const live = proposal ? await liveSignature(ctx.em, ctx.actor.companyId, desk.desk.job.id) : null;
  const why = whyNot(
    desk.desk.job,
    desk.blockers,
    ctx.actor.role,
    live,
    await hasBusinessAddress(ctx.em, ctx.actor.companyId),
  );
  const canIssue: ProposalResponse['canIssue'] = why
    ? {
        ok: false,
        reason: why.reason,
        ...(why.signed ? { signed: why.signed } : {}),
        ...(why.fix ? { fix: why.fix } : {}),
      }
    : { ok: true };
  if (!proposal) return { jobId, canIssue, proposal: null };
  const versions = await versionSummaries(ctx, proposal.id);
  const numbers = new Map(versions.map((v) => [v.id, v.number]));
  const signed = await signaturesByVersion(ctx, proposal.id);
  const events = await ctx.em.find(
    ProposalEventSchema,
    { proposal: proposal.id, company: ctx.actor.companyId },
    { orderBy: { seq: 'asc' }, populate: ['byUser'] },
  );
  return {
    jobId,
    canIssue,
    proposal: {
      id: proposal.id,
      createdAt: proposal.createdAt.toISOString(),
      versions: versions.map((v) => versionRecord(v, signed.get(v.id))),
      events: events.map((e): ProposalEventRecord => ({
        seq: Number(e.seq),
        kind: e.kind,
        at: e.at.toISOString(),
        versionNumber: e.version ? (numbers.get(e.version.id) ?? null) : null,
        by: e.byCustomer
          ? { kind: 'customer' }
          : e.byUser
            ? { kind: 'staff', id: e.byUser.id, name: e.byUser.name }
            : { kind: 'system' },
        data: e.data,
      })),
    },
  };
}

async function findVersion(ctx: ServiceContext, jobId: string, n: number): Promise<ProposalVersion> {
  const { proposal } = await findProposal(ctx, jobId);
  const v = proposal
    ? await ctx.em.findOne(ProposalVersionSchema, { proposal: proposal.id, number: n, company: ctx.actor.companyId })
    : null;
  if (!v) throw new NotFoundError(`Version ${n} of the proposal`);
  return v;
}

/** GET …/versions/:n: the version and its snapshot exactly as frozen. */
export async function getVersion(ctx: ServiceContext, jobId: string, n: number): Promise<ProposalVersionResponse> {
  const v = await findVersion(ctx, jobId, n);
  return { version: versionRecord(summaryOf(v)), snapshot: v.snapshot };
}

/** GET …/versions/:a/diff/:b: what changed from version a to version b. */
export async function diffVersions(
  ctx: ServiceContext,
  jobId: string,
  a: number,
  b: number,
): Promise<ProposalDiffResponse> {
  const from = await findVersion(ctx, jobId, a);
  const to = await findVersion(ctx, jobId, b);
  return { from: a, to: b, changes: diffSnapshots(from.snapshot, to.snapshot) };
}

/** Whether a job has an issued proposal (the job status machine's JobFacts.hasProposal; one rule, in jobs/job-moves.ts). */
export { jobHasProposal } from '../jobs/job-moves';
