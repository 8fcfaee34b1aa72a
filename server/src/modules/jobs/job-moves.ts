import type { EntityManager } from '@mikro-orm/postgresql';
import { CANCELLED_BY_BUYER, LOSS_REASON_MAX, type JobStatus } from '@contract';
import { ConflictError, NotFoundError } from '../../lib/errors';
import { ProposalEventSchema, ProposalSchema, ProposalVersionSchema } from '../proposals/proposal.entity';
import { UserSchema } from '../users/user.entity';
import { JobSchema } from './job.entity';

/**
 * The job's status as proposals move it (issue 14). The hand moves (the contract's JOB_STATUS_MACHINE, by
 * role) are job.service's; the moves here are the system's, made by the proposal slices inside their own
 * transaction, at the moment the fact happens:
 *
 * - `proposed`: a version was sent to the customer (send). From walk-through, design or lost; a job
 *   already proposed stays; a job won or installed is not moved back by a later send.
 * - `won`: the customer signed (and paid the deposit where one is due). From any status but installed
 *   (installed stays: it is past won).
 * - `lost`: the buyer cancelled within the cooling-off window. From any status but installed (409);
 *   the reason is the fixed "Cancelled by buyer" unless the caller gives another.
 *
 * Leaving `lost` clears the lost reason. The job's version goes up (an open edit on a device then meets a
 * 409 and reloads, as with any change) and its last activity is now.
 */

export type ProposalMove = 'proposed' | 'won' | 'lost';

export interface ProposalMoveInput {
  readonly companyId: string;
  readonly jobId: string;
  readonly to: ProposalMove;
  /** Only for `lost`: the words kept on the job (default "Cancelled by buyer"). */
  readonly reason?: string;
  /** The person who caused it (the estimator who sent), or null/absent when the customer or the system did. */
  readonly byUserId?: string | null;
  /** When it happened (the caller's clock); now by default. */
  readonly at?: Date;
}

export interface ProposalMoveResult {
  readonly from: JobStatus;
  readonly to: JobStatus;
  /** False when the job already stood there or stays where it is (see the rules above). */
  readonly changed: boolean;
}

/** Where each proposal move comes from; from any other status the job stays (or, for `lost`, a 409). */
export const PROPOSAL_MOVE_FROM: Readonly<Record<ProposalMove, readonly JobStatus[]>> = {
  proposed: ['walkthrough', 'design', 'lost'],
  won: ['walkthrough', 'design', 'proposed', 'lost'],
  lost: ['walkthrough', 'design', 'proposed', 'won'],
};

/** The name a system move leaves as the job's last change when no staff member caused it. */
export const CUSTOMER_CHANGE_NAME = 'The customer (proposal page)';

/**
 * Moves the job for a proposal fact, inside the caller's transaction (pass its EntityManager). Locks the
 * job row first, so it never races a hand move. 404 for a job not of this company.
 */
export async function moveJobForProposal(em: EntityManager, input: ProposalMoveInput): Promise<ProposalMoveResult> {
  const { companyId, jobId, to } = input;
  const locked = await em.execute<{ id: string }[]>('select id from "job" where id = ? and company_id = ? for update', [
    jobId,
    companyId,
  ]);
  if (!locked[0]) throw new NotFoundError('The job');
  const job = await em.findOneOrFail(JobSchema, { id: jobId, company: companyId }, { refresh: true });
  const from = job.status;
  const reason = to === 'lost' ? (input.reason ?? CANCELLED_BY_BUYER).trim().slice(0, LOSS_REASON_MAX) : null;
  if (from === to && (to !== 'lost' || job.lostReason === reason)) return { from, to, changed: false };
  if (from !== to && !PROPOSAL_MOVE_FROM[to].includes(from)) {
    if (to === 'lost') throw new ConflictError(`An ${from} job cannot be marked lost.`);
    return { from, to: from, changed: false };
  }
  const user = input.byUserId ? await em.findOne(UserSchema, { id: input.byUserId, company: companyId }) : null;
  job.status = to;
  job.lostReason = reason || null;
  job.lastActivityAt = input.at ?? new Date();
  job.changedById = user?.id ?? null;
  job.changedByName = user?.name ?? CUSTOMER_CHANGE_NAME;
  job.changedOnDevice = null;
  await em.flush();
  return { from, to, changed: true };
}

/** Whether a job has an issued proposal: the status machine's JobFacts.hasProposal (the job record carries it). */
export async function jobHasProposal(em: EntityManager, companyId: string, jobId: string): Promise<boolean> {
  return (await em.count(ProposalSchema, { job: jobId, company: companyId })) > 0;
}

/**
 * The `marked-lost` event on the job's proposal, when it has one (the office marked the job lost by hand):
 * on its current version, by the person, with the reason and the status it left. Nothing when no proposal.
 * The caller's flush writes it (with the job's own change, in one unit of work).
 */
export async function recordMarkedLost(
  em: EntityManager,
  input: { companyId: string; jobId: string; reason: string; from: JobStatus; byUserId: string; at: Date },
): Promise<boolean> {
  const proposal = await em.findOne(ProposalSchema, { job: input.jobId, company: input.companyId });
  if (!proposal) return false;
  const current = await em.findOne(ProposalVersionSchema, {
    proposal: proposal.id,
    company: input.companyId,
    supersededAt: null,
  });
  em.create(ProposalEventSchema, {
    company: input.companyId,
    proposal,
    version: current ?? null,
    kind: 'marked-lost',
    at: input.at,
    byUser: em.getReference(UserSchema, input.byUserId),
    byCustomer: false,
    ip: null,
    userAgent: null,
    data: { reason: input.reason, from: input.from },
  });
  return true;
}
