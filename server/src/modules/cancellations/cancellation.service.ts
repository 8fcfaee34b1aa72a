import type { EntityManager } from '@mikro-orm/postgresql';
import { randomUUID } from 'node:crypto';
import { formatUsDate, type AfterSigningRecord, type OfficeCancellationBody, type SnapshotOption } from '@contract';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Clock } from '../../services/services';
import type { Payments } from '../../services/payments';
import type { Queue } from '../../services/queue';
import { browserPayments } from '../../services/payments';
import type { Config } from '../../config';
import { moveJobForProposal } from '../jobs/job-moves';
import { paymentForVersion, refundDeposit, type PaymentRow } from '../payments/payments.service';
import { cancelWindow, type CancelWindow } from './cancellation-window';

/**
 * A buyer's cancellation of a signed proposal within the three business days of 16 CFR 429.1(a), and
 * what the customer's page reads after signing (the window, the deposit, the cancellation).
 *
 * The window starts at the `signed` audit event of the current version (the e-signature slice writes it
 * in the signature's own transaction) and is counted on the job site's calendar (cancellation-window.ts).
 * A cancellation is one transaction: the insert-only `proposal_cancellation` row, the `cancelled` event,
 * the job moved to lost ("Cancelled by buyer") and, when the version has a deposit, its refund queued
 * (the `refund-deposit` task asks the payment service; its webhook marks the payment refunded and adds the
 * `refunded` event).
 */

interface SignedVersion {
  companyId: string;
  proposalId: string;
  versionId: string;
  jobId: string;
  region: string;
  snapshot: { options?: SnapshotOption[] };
  signedAt: Date | null;
}

/** The proposal's current version, its job's site and the instant it was signed (null: not signed). */
async function currentVersion(em: EntityManager, companyId: string, proposalId: string): Promise<SignedVersion> {
  const rows = await em.execute<
    Array<{
      version_id: string;
      job_id: string;
      region: string;
      snapshot: SignedVersion['snapshot'];
      signed_at: Date | null;
    }>
  >(
    `select v."id" as "version_id", p."job_id", j."region", v."snapshot",
       (select e."at" from "proposal_event" e
         where e."company_id" = v."company_id" and e."version_id" = v."id" and e."kind" = 'signed'
         order by e."seq" asc limit 1) as "signed_at"
     from "proposal" p
     join "proposal_version" v on v."proposal_id" = p."id" and v."company_id" = p."company_id" and v."superseded_at" is null
     join "job" j on j."id" = p."job_id" and j."company_id" = p."company_id"
     where p."company_id" = ? and p."id" = ?`,
    [companyId, proposalId],
  );
  const row = rows[0];
  if (!row) throw new NotFoundError('The proposal');
  return {
    companyId,
    proposalId,
    versionId: row.version_id,
    jobId: row.job_id,
    region: row.region,
    snapshot: row.snapshot,
    signedAt: row.signed_at ? new Date(row.signed_at) : null,
  };
}

interface CancellationRow {
  at: Date;
  method: 'page' | 'mail' | 'delivered';
  sent_on: string | null;
  reason: string | null;
}

async function cancellationOf(em: EntityManager, companyId: string, versionId: string) {
  const rows = await em.execute<CancellationRow[]>(
    `select "at", "method", to_char("sent_on", 'YYYY-MM-DD') as "sent_on", "reason"
     from "proposal_cancellation" where "company_id" = ? and "version_id" = ?`,
    [companyId, versionId],
  );
  return rows[0] ?? null;
}

/** The deposit the chosen option asks for, from the frozen snapshot (0 when none is chosen or due). */
async function chosenDepositCents(em: EntityManager, v: SignedVersion): Promise<number> {
  const chosen = await em.execute<Array<{ position: string | null }>>(
    `select "data"->>'position' as "position" from "proposal_event"
     where "company_id" = ? and "version_id" = ? and "kind" = 'option-chosen' order by "seq" desc limit 1`,
    [v.companyId, v.versionId],
  );
  const position = Number(chosen[0]?.position);
  const option = (v.snapshot.options ?? []).find((o) => o.position === position);
  return option?.price.depositCents ?? 0;
}

/** What the customer's page shows after the signature: the window, the deposit and any cancellation. */
export async function afterSigning(
  em: EntityManager,
  deps: { clock: Clock; config: Config },
  companyId: string,
  proposalId: string,
): Promise<AfterSigningRecord> {
  const v = await currentVersion(em, companyId, proposalId);
  const window = v.signedAt ? cancelWindow(v.signedAt, deps.clock.now(), v.region) : null;
  const payment = await paymentForVersion(em, companyId, v.versionId);
  const cancellation = await cancellationOf(em, companyId, v.versionId);
  const due = await chosenDepositCents(em, v);
  const times = payment
    ? (
        await em.execute<Array<{ paid_at: Date | null; refunded_at: Date | null }>>(
          'select "paid_at", "refunded_at" from "payment" where "id" = ?',
          [payment.id],
        )
      )[0]
    : undefined;
  const iso = (d: Date | null | undefined) => (d ? new Date(d).toISOString() : null);
  return {
    proposalId,
    signedAt: iso(v.signedAt),
    window: window
      ? {
          transactionDate: window.transactionDate,
          lastDayToCancel: window.lastDayToCancel,
          open: window.open && !cancellation,
        }
      : null,
    deposit: {
      amountCents: payment?.amount_cents ?? due,
      state: payment?.state ?? 'not-started',
      failure: payment?.state === 'failed' ? payment.failure : null,
      paidAt: iso(times?.paid_at),
      refundedAt: iso(times?.refunded_at),
      refundPending: Boolean(cancellation) && payment?.state === 'succeeded',
    },
    cancellation: cancellation
      ? {
          at: new Date(cancellation.at).toISOString(),
          method: cancellation.method,
          sentOn: cancellation.sent_on,
          reason: cancellation.reason,
        }
      : null,
    payWith: browserPayments(deps.config),
  };
}

/** Who cancels: the buyer on the page (with the request's IP and browser) or the office for a mailed notice. */
export type CancelledBy =
  | { kind: 'customer'; ip: string | null; userAgent: string | null; reason?: string | undefined }
  | { kind: 'office'; userId: string; body: Omit<OfficeCancellationBody, 'reason'> & { reason?: string | undefined } };

export interface CancelDeps {
  clock: Clock;
  queue: Queue;
}

const closedMessage = (w: CancelWindow) =>
  `The time to cancel ended at midnight at the end of ${formatUsDate(w.lastDayToCancel)} (three business days after the signing, 16 CFR 429.1).`;

/** Records the cancellation, moves the job to lost and queues the deposit's refund, in one transaction. */
export async function cancelProposal(
  em: EntityManager,
  deps: CancelDeps,
  companyId: string,
  proposalId: string,
  by: CancelledBy,
): Promise<void> {
  await em.transactional(async (tx) => {
    // One cancellation at a time per proposal: the second waits here and then finds the first.
    const locked = await tx.execute<Array<{ id: string }>>(
      'select "id" from "proposal" where "company_id" = ? and "id" = ? for update',
      [companyId, proposalId],
    );
    if (!locked[0]) throw new NotFoundError('The proposal');
    const v = await currentVersion(tx, companyId, proposalId);
    if (!v.signedAt) throw new ConflictError('This proposal has not been signed, so there is nothing to cancel.');
    const earlier = await cancellationOf(tx, companyId, v.versionId);
    if (earlier)
      throw new ConflictError('This proposal has already been cancelled.', {
        cancelledAt: new Date(earlier.at).toISOString(),
      });
    const now = deps.clock.now();
    const window = cancelWindow(v.signedAt, now, v.region);
    if (by.kind === 'customer' && !window.open)
      throw new ConflictError(closedMessage(window), { lastDayToCancel: window.lastDayToCancel });
    if (by.kind === 'office') {
      const { sentOn } = by.body;
      if (sentOn < window.transactionDate)
        throw new ValidationError([
          {
            path: 'sentOn',
            message: `The notice cannot be sent before the signing (${formatUsDate(window.transactionDate)}).`,
          },
        ]);
      if (sentOn > window.today)
        throw new ValidationError([{ path: 'sentOn', message: 'That date is in the future.' }]);
      if (sentOn > window.lastDayToCancel)
        throw new ConflictError(
          `A notice sent on ${formatUsDate(sentOn)} is too late: ${closedMessage(window).replace('The time', 'the time')}`,
          { lastDayToCancel: window.lastDayToCancel },
        );
    }
    const reason = (by.kind === 'customer' ? by.reason : by.body.reason) ?? null;
    const method = by.kind === 'customer' ? 'page' : by.body.method;
    const sentOn = by.kind === 'office' ? by.body.sentOn : null;
    await tx.execute(
      `insert into "proposal_cancellation" ("id", "company_id", "proposal_id", "version_id", "at", "method", "sent_on",
         "by_customer", "by_user_id", "ip", "user_agent", "reason", "last_day_to_cancel")
       values (?, ?, ?, ?, ?, ?, ?::date, ?, ?, ?, ?, ?, ?::date)`,
      [
        randomUUID(),
        companyId,
        proposalId,
        v.versionId,
        now,
        method,
        sentOn,
        by.kind === 'customer',
        by.kind === 'office' ? by.userId : null,
        by.kind === 'customer' ? clip(by.ip, 45) : null,
        by.kind === 'customer' ? clip(by.userAgent, 400) : null,
        reason,
        window.lastDayToCancel,
      ],
      'run',
    );
    const payment = await paymentForVersion(tx, companyId, v.versionId);
    await tx.execute(
      `insert into "proposal_event" ("id", "company_id", "proposal_id", "version_id", "kind", "at", "by_user_id",
         "by_customer", "ip", "user_agent", "data") values (?, ?, ?, ?, 'cancelled', ?, ?, ?, ?, ?, ?::jsonb)`,
      [
        randomUUID(),
        companyId,
        proposalId,
        v.versionId,
        now,
        by.kind === 'office' ? by.userId : null,
        by.kind === 'customer',
        by.kind === 'customer' ? clip(by.ip, 45) : null,
        by.kind === 'customer' ? clip(by.userAgent, 400) : null,
        JSON.stringify({
          method,
          ...(sentOn ? { sentOn } : {}),
          ...(reason ? { reason } : {}),
          lastDayToCancel: window.lastDayToCancel,
          ...(payment ? { depositCents: payment.amount_cents, refund: payment.state === 'succeeded' } : {}),
        }),
      ],
      'run',
    );
    await moveJobForProposal(tx, {
      companyId,
      jobId: v.jobId,
      to: 'lost',
      byUserId: by.kind === 'office' ? by.userId : null,
      at: now,
    });
    // Any deposit row: the task asks the service whether the money arrived (a webhook may still be on its
    // way) and refunds it if so; a deposit never paid needs nothing.
    if (payment)
      await deps.queue.add('refund-deposit', { paymentId: payment.id }, { jobKey: refundJobKey(payment.id), em: tx });
  });
}

/**
 * The queued refund of a cancelled version's deposit. Asks the payment service for the intent (the
 * `succeeded` webhook may not have arrived yet) and refunds a paid one with the key `refund:<payment id>`,
 * so a retried task is one refund. A deposit that was never paid needs nothing.
 */
export async function refundCancelledDeposit(em: EntityManager, payments: Payments, paymentId: string): Promise<void> {
  const payment = await refundOwed(em, paymentId);
  if (!payment) return;
  if (payment.state !== 'succeeded') {
    const intent = await payments.retrieve(payment.intent_id);
    if (intent.status !== 'succeeded') return;
  }
  await refundDeposit(em, payments, { ...payment, state: 'succeeded' });
}

/** A cancelled version's deposit whose refund has not been asked for and recorded yet, or null. */
async function refundOwed(em: EntityManager, paymentId: string): Promise<PaymentRow | null> {
  const rows = await em.execute<PaymentRow[]>(
    `select p.* from "payment" p join "proposal_cancellation" c on c."version_id" = p."proposal_version_id"
     where p."id" = ?`,
    [paymentId],
  );
  const payment = rows[0];
  return !payment || payment.state === 'refunded' || payment.refund_id ? null : payment;
}

/** The queue's one `refund-deposit` job per deposit: adding again replaces a waiting one (graphile's job key). */
export const refundJobKey = (paymentId: string): string => `refund:${paymentId}`;

/**
 * A refund try lost with its process (SIGKILL, out of memory; services/queue.ts releaseAbandoned). The try
 * may have stopped before asking the payment service, or after the service made the refund and before the
 * row recorded it: the task writes nothing until the end, so either way the next try finishes the work, and
 * it asks with the same idempotency key `refund:<payment id>`, which makes the service answer with the first
 * refund instead of making a second (payments.service.ts refundDeposit). On an earlier try the queue unlocks
 * the job and it runs again at once. A lost last try would leave the buyer's money owed with no try left, so
 * the refund is queued again under the same job key (graphile-worker retires the locked job and adds a fresh
 * one with its tries). Nothing is queued when the refund is already recorded or no longer owed.
 */
export async function refundAbandoned(
  deps: { em: EntityManager; queue: Pick<Queue, 'add'> },
  paymentId: string,
  run: { attempt: number; maxAttempts: number },
): Promise<void> {
  if (run.attempt < run.maxAttempts) return;
  if (!(await refundOwed(deps.em, paymentId))) return;
  await deps.queue.add('refund-deposit', { paymentId }, { jobKey: refundJobKey(paymentId) });
}

/** Whether the proposal's current version has been cancelled (a deposit is not taken after that). */
export async function versionIsCancelled(em: EntityManager, companyId: string, versionId: string): Promise<boolean> {
  return (await cancellationOf(em, companyId, versionId)) !== null;
}

const clip = (s: string | null, n: number) => (s ? s.slice(0, n) : null);
