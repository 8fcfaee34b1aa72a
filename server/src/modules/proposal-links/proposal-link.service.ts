import { createHash, randomBytes } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import {
  formatUsDate,
  PROPOSAL_LINK_DAYS,
  PROPOSAL_LINK_OPEN_PATH,
  proposalSnapshot,
  type ProposalLinkRecord,
  type ProposalLinksResponse,
  type ProposalLinkState,
} from '@contract';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import type { Queue } from '../../services/queue';
import type { Clock } from '../../services/services';
import { findJob } from '../jobs/job-access';
import { moveJobForProposal } from '../jobs/job-moves';
import type { Job } from '../jobs/job.entity';
import { queueMessage, type NotSent } from '../mail/mail.service';
import type { OutgoingMessage } from '../mail/outgoing-message.entity';
import { ProposalEventSchema, ProposalSchema, ProposalVersionSchema } from '../proposals/proposal.entity';
import { UserSchema } from '../users/user.entity';
import { ProposalLinkSchema, type ProposalLink } from './proposal-link.entity';

/**
 * Sending a proposal version to its customer (issue 14): each send is a new link (proposal_link) and an
 * e-mail on the queue. The token is made as the e-mail goes out (composeProposalLinkMessage) and only its
 * SHA-256 is stored. A re-send makes a new link; earlier links keep working until they expire, are revoked
 * or their version is replaced (a customer may open either e-mail).
 */

export interface LinkContext extends ServiceContext {
  readonly queue: Queue;
}

export const sha256Hex = (s: string) => createHash('sha256').update(s).digest('hex');

/** Header-safe text: no CR, LF or other line breaks (a name can never add an e-mail header). */
const oneLine = (s: string) => s.replace(/[\r\n\u0085\u2028\u2029]+/g, ' ').trim();

export function linkState(link: ProposalLink, now: Date): ProposalLinkState {
  if (link.revokedAt) return 'revoked';
  if (link.version.supersededAt) return 'superseded';
  if (link.expiresAt.getTime() <= now.getTime()) return 'expired';
  if (link.tokenSha256) return 'sent';
  if (link.message?.state === 'failed') return 'not-sent';
  return 'waiting-to-send';
}

function linkRecord(link: ProposalLink, now: Date): ProposalLinkRecord {
  const m = link.message;
  const unsent = !link.tokenSha256;
  return {
    id: link.id,
    state: linkState(link, now),
    versionNumber: link.version.number,
    to: link.recipient,
    createdAt: link.createdAt.toISOString(),
    createdBy: link.createdBy?.name ?? null,
    expiresAt: link.expiresAt.toISOString(),
    sentAt: m?.sentAt?.toISOString() ?? null,
    revokedAt: link.revokedAt?.toISOString() ?? null,
    mailProblem: unsent ? (m?.lastError ?? null) : null,
    nextAttemptAt: unsent && m?.state === 'retrying' ? (m.nextAttemptAt?.toISOString() ?? null) : null,
  };
}

async function currentVersionOf(em: EntityManager, companyId: string, jobId: string) {
  const proposal = await em.findOne(ProposalSchema, { job: jobId, company: companyId });
  const version = proposal
    ? await em.findOne(ProposalVersionSchema, { proposal: proposal.id, company: companyId, supersededAt: null })
    : null;
  return { proposal, version };
}

/** Why the current version cannot be sent now, or null when it can. */
function whyNotSend(job: Job, version: { number: number } | null): string | null {
  if (!version) return 'Issue a version of the proposal before sending it.';
  if (!job.readyAt)
    return `The job has changed since version ${version.number} was issued. Mark it ready on the desk and issue a new version, then send that.`;
  return null;
}

/** GET …/proposal/links: every link of the job's proposal (newest first) and whether the current version may be sent. */
export async function listLinks(ctx: ServiceContext, jobId: string): Promise<ProposalLinksResponse> {
  const job = await findJob(ctx, jobId);
  const { proposal, version } = await currentVersionOf(ctx.em, ctx.actor.companyId, job.id);
  const why = whyNotSend(job, version);
  const links = proposal
    ? await ctx.em.find(
        ProposalLinkSchema,
        { proposal: proposal.id, company: ctx.actor.companyId },
        { populate: ['version', 'message', 'createdBy'], orderBy: { createdAt: 'desc', id: 'asc' } },
      )
    : [];
  const now = ctx.clock.now();
  return {
    customerEmail: job.customer.email ?? null,
    canSend: why || !version ? { ok: false, reason: why ?? '' } : { ok: true, versionNumber: version.number },
    links: links.map((l) => linkRecord(l, now)),
  };
}

/**
 * Sends the current version to `to`: a new link and its e-mail on the queue, in one transaction with the
 * job row locked. Sending moves the job to "proposed" (jobs/job-moves: from walk-through, design or lost; a job
 * won or installed stays). 409 with the reason when
 * there is no version or the job changed since it was issued.
 */
export async function sendProposal(ctx: LinkContext, jobId: string, to: string): Promise<void> {
  await ctx.em.transactional(async (tx) => {
    const job = await findJob({ ...ctx, em: tx }, jobId);
    // The job row is locked by the move below; sends of one job queue here first.
    await tx.execute('select id from "job" where id = ? for update', [job.id]);
    await tx.refresh(job);
    const { proposal, version } = await currentVersionOf(tx, ctx.actor.companyId, job.id);
    const why = whyNotSend(job, version);
    if (why || !proposal || !version) throw new ConflictError(why ?? 'Issue a version of the proposal first.');
    const snapshot = proposalSnapshot.parse(version.snapshot);
    const now = ctx.clock.now();
    const message = await queueMessage(tx, ctx.queue, {
      companyId: ctx.actor.companyId,
      kind: 'proposal-link',
      to,
      subject: oneLine(`Your proposal from ${snapshot.company.name}`).slice(0, 300),
      text: null, // made when sent, with the link's token (composeProposalLinkMessage)
    });
    tx.create(ProposalLinkSchema, {
      company: ctx.actor.companyId,
      proposal,
      version,
      message,
      tokenSha256: null,
      recipient: to,
      createdBy: tx.getReference(UserSchema, ctx.actor.userId),
      createdAt: now,
      expiresAt: new Date(now.getTime() + PROPOSAL_LINK_DAYS * 86_400_000),
      revokedAt: null,
      revokedBy: null,
    });
    await tx.flush();
    await moveJobForProposal(tx, {
      companyId: ctx.actor.companyId,
      jobId: job.id,
      to: 'proposed',
      byUserId: ctx.actor.userId,
      at: now,
    });
  });
}

/** Revokes one link of the job's proposal: it stops working at once (sessions it opened too), with a link-revoked event. */
export async function revokeLink(ctx: ServiceContext, jobId: string, linkId: string): Promise<void> {
  await ctx.em.transactional(async (tx) => {
    const job = await findJob({ ...ctx, em: tx }, jobId);
    const link = await tx.findOne(
      ProposalLinkSchema,
      { id: linkId, company: ctx.actor.companyId, proposal: { job: job.id } },
      { populate: ['version'] },
    );
    if (!link) throw new NotFoundError('The link');
    if (link.revokedAt) throw new ConflictError('This link was already withdrawn.');
    const now = ctx.clock.now();
    link.revokedAt = now;
    link.revokedBy = tx.getReference(UserSchema, ctx.actor.userId);
    tx.create(ProposalEventSchema, {
      company: ctx.actor.companyId,
      proposal: link.proposal,
      version: link.version,
      kind: 'link-revoked',
      at: now,
      byUser: tx.getReference(UserSchema, ctx.actor.userId),
      byCustomer: false,
      ip: null,
      userAgent: null,
      data: { linkId: link.id, to: link.recipient },
    });
    await tx.flush();
  });
}

/** A new token: 32 random bytes (256 bits), base64url (43 characters). */
export const newLinkToken = () => randomBytes(32).toString('base64url');

/**
 * The body of a proposal e-mail, made by the queue's worker as it is sent (inside the sending transaction):
 * a new token whose SHA-256 alone is stored on the link, and the 'sent' audit event. A send that fails rolls
 * both back. Not sent at all when the link was revoked or its version replaced before it went out.
 * Every name is plain text in a plain-text e-mail: markup and template syntax stay as typed.
 */
export async function composeProposalLinkMessage(
  em: EntityManager,
  message: OutgoingMessage,
  deps: { clock: Clock; appOrigin: string },
): Promise<string | NotSent> {
  const link = await em.findOne(ProposalLinkSchema, { message: message.id }, { populate: ['version'] });
  if (!link) return { notSent: 'Not sent: its proposal link no longer exists.' };
  if (link.revokedAt) return { notSent: 'Not sent: the link was withdrawn before the e-mail went out.' };
  if (link.version.supersededAt)
    return { notSent: 'Not sent: a newer version of the proposal was issued before the e-mail went out.' };
  const token = newLinkToken();
  link.tokenSha256 = sha256Hex(token);
  em.create(ProposalEventSchema, {
    company: link.company,
    proposal: link.proposal,
    version: link.version,
    kind: 'sent',
    at: deps.clock.now(),
    byUser: link.createdBy,
    byCustomer: false,
    ip: null,
    userAgent: null,
    data: { linkId: link.id, to: link.recipient },
  });
  await em.flush();
  const s = proposalSnapshot.parse(link.version.snapshot);
  const url = `${deps.appOrigin.replace(/\/$/, '')}${PROPOSAL_LINK_OPEN_PATH}?t=${token}`;
  const place = [s.site.street, s.site.unit, s.site.city].filter((x) => x.trim()).join(', ');
  const contact = [s.company.phone, s.company.email].filter(Boolean).join(' or ');
  return (
    `Hello ${s.customer.name},\n\n` +
    `${s.company.name} has sent you a proposal (version ${link.version.number})${place ? ` for ${place}` : ''}.\n` +
    `Open this link to read it, compare the options and choose one:\n\n${url}\n\n` +
    `The link is for you alone and works until ${formatUsDate(link.expiresAt.toISOString().slice(0, 10))}.` +
    `${contact ? ` Questions: ${contact}.` : ''}\n\n` +
    `If you were not expecting this e-mail, you can ignore it.\n`
  );
}

/** After a proposal e-mail's last failed try: a 'send-failed' event on the trail, with the mail server's words. */
export async function recordProposalSendFailed(em: EntityManager, message: OutgoingMessage, at: Date): Promise<void> {
  const link = await em.findOne(ProposalLinkSchema, { message: message.id });
  if (!link) return;
  em.create(ProposalEventSchema, {
    company: link.company,
    proposal: link.proposal,
    version: link.version,
    kind: 'send-failed',
    at,
    byUser: null,
    byCustomer: false,
    ip: null,
    userAgent: null,
    data: { linkId: link.id, to: link.recipient, reason: message.lastError },
  });
  await em.flush();
}
