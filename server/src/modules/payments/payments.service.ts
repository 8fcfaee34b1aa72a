import type { EntityManager } from '@mikro-orm/postgresql';
import { randomUUID } from 'node:crypto';
import type { SnapshotOption } from '@contract';
import { ConflictError, NotFoundError } from '../../lib/errors';
import { moveJobForProposal } from '../jobs/job-moves';
import type { DepositIntent, PaymentEvent, Payments } from '../../services/payments';
import type { Queue } from '../../services/queue';
import type { PaymentState } from './payment.entity';
import { isVersionSigned } from '../signing/signing.service';

/**
 * The deposit's server side: the payment row for a version's intent, and the webhooks that move it.
 * The amount always comes from the server (the version's frozen deposit), never from a request.
 */

/** The version a deposit is for, and its deposit as the frozen snapshot states it (cents). */
export interface DepositVersion {
  companyId: string;
  proposalId: string;
  versionId: string;
  depositCents: number;
}

/**
 * The deposit the customer owes on the proposal's current version: the chosen option's `depositCents`
 * from the version's frozen snapshot — never a figure from the request. The option is the one named by
 * the version's latest `option-chosen` audit event (`data.position`, the snapshot option's position).
 * Another company's proposal, or one with no current version, is 404; no option chosen yet is 409.
 */
export async function depositDue(em: EntityManager, companyId: string, proposalId: string): Promise<DepositVersion> {
  const versions = await em.execute<Array<{ id: string; snapshot: { options?: SnapshotOption[] } }>>(
    `select "id", "snapshot" from "proposal_version"
     where "company_id" = ? and "proposal_id" = ? and "superseded_at" is null`,
    [companyId, proposalId],
  );
  const version = versions[0];
  if (!version) throw new NotFoundError('The proposal');
  const chosen = await em.execute<Array<{ position: string | null }>>(
    `select "data"->>'position' as "position" from "proposal_event"
     where "company_id" = ? and "version_id" = ? and "kind" = 'option-chosen' order by "seq" desc limit 1`,
    [companyId, version.id],
  );
  const position = Number(chosen[0]?.position);
  const option = (version.snapshot.options ?? []).find((o) => o.position === position);
  if (!option) throw new ConflictError('Choose one of the options before paying the deposit.');
  return { companyId, proposalId, versionId: version.id, depositCents: option.price.depositCents };
}

/**
 * Whether the version has been signed by the customer: payment comes after the signature (pay before
 * signing → 409). Answered from the insert-only signature table (modules/signing).
 */
export async function versionIsSigned(em: EntityManager, companyId: string, versionId: string): Promise<boolean> {
  return isVersionSigned(em, companyId, versionId);
}

export interface PaymentRow {
  id: string;
  company_id: string;
  proposal_id: string;
  proposal_version_id: string;
  amount_cents: number;
  intent_id: string;
  state: PaymentState;
  failure: string | null;
  refund_id: string | null;
}

export async function paymentForVersion(
  em: EntityManager,
  companyId: string,
  versionId: string,
): Promise<PaymentRow | null> {
  const rows = await em.execute<PaymentRow[]>(
    'select * from "payment" where "company_id" = ? and "proposal_version_id" = ?',
    [companyId, versionId],
  );
  return rows[0] ?? null;
}

/**
 * Opens (or finds again) the deposit for a signed version: one intent per version, made with the
 * idempotency key `deposit:<version id>` so a double click or a retry makes one intent. The amount is
 * the version's own; nothing in the request can change it.
 */
export async function startDeposit(
  em: EntityManager,
  payments: Payments,
  version: DepositVersion,
  now?: Date,
): Promise<{ payment: PaymentRow; intent: DepositIntent }> {
  if (!(await versionIsSigned(em, version.companyId, version.versionId))) {
    throw new ConflictError('The proposal is paid for after it is signed: sign it first.');
  }
  if (!Number.isSafeInteger(version.depositCents) || version.depositCents <= 0) {
    throw new ConflictError('This proposal asks for no deposit.');
  }
  const cancelled = await em.execute<Array<{ id: string }>>(
    'select "id" from "proposal_cancellation" where "company_id" = ? and "version_id" = ?',
    [version.companyId, version.versionId],
  );
  if (cancelled[0]) throw new ConflictError('This proposal was cancelled, so no deposit is taken.');
  const existing = await paymentForVersion(em, version.companyId, version.versionId);
  if (existing?.state === 'succeeded' || existing?.state === 'refunded') {
    throw new ConflictError('The deposit for this proposal has already been paid.');
  }
  const intent = await payments.createDepositIntent({
    amountCents: version.depositCents,
    metadata: { companyId: version.companyId, proposalId: version.proposalId, versionId: version.versionId },
    idempotencyKey: `deposit:${version.versionId}`,
  });
  const payment = await recordDepositIntent(em, intent, now);
  return { payment, intent };
}

/**
 * Keeps the intent the server made as the version's payment row (once: the same intent again finds it).
 * `now` is the time written (now by default; the demo seed gives its own clock's).
 */
export async function recordDepositIntent(em: EntityManager, intent: DepositIntent, now?: Date): Promise<PaymentRow> {
  const { companyId, proposalId, versionId } = intent.metadata;
  const at = now ?? new Date();
  await em.execute(
    `insert into "payment" ("id", "company_id", "proposal_id", "proposal_version_id", "amount_cents", "currency",
       "intent_id", "state", "created_at", "updated_at")
     values (?, ?, ?, ?, ?, ?, ?, 'created', ?, ?)
     on conflict ("intent_id") do nothing`,
    [randomUUID(), companyId, proposalId, versionId, intent.amountCents, intent.currency, intent.id, at, at],
    'run',
  );
  const row = await paymentForVersion(em, companyId, versionId);
  if (!row || row.intent_id !== intent.id) throw new ConflictError('This proposal already has another deposit.');
  return row;
}

/**
 * Refunds a paid deposit through the payment service (a cancellation inside the window calls this).
 * The key `refund:<payment id>` makes a retried refund one refund; the row becomes `refunded` when the
 * service's webhook says the charge was refunded.
 */
export async function refundDeposit(em: EntityManager, payments: Payments, payment: PaymentRow): Promise<string> {
  if (payment.state !== 'succeeded') throw new ConflictError('Only a paid deposit can be refunded.');
  const refund = await payments.refund(payment.intent_id, `refund:${payment.id}`);
  await em.execute(
    'update "payment" set "refund_id" = ?, "updated_at" = ? where "id" = ? and "refund_id" is null',
    [refund.id, new Date(), payment.id],
    'run',
  );
  return refund.id;
}

export type WebhookOutcome = 'applied' | 'unchanged' | 'ignored' | 'unknown-intent' | 'mismatch' | 'duplicate';

interface EventObject {
  id?: string;
  object?: string;
  amount?: number;
  currency?: string;
  payment_intent?: string;
  refunded?: boolean;
  metadata?: Record<string, string>;
  last_payment_error?: { message?: string } | null;
}

/** The moves a webhook may make; nothing goes backwards (a late failure never un-pays a deposit). */
function nextState(
  type: string,
  obj: EventObject,
  from: PaymentState,
): { to: PaymentState; failure?: string | null } | null {
  if (type === 'payment_intent.succeeded' && (from === 'created' || from === 'failed')) return { to: 'succeeded' };
  if (type === 'payment_intent.payment_failed' && from === 'created')
    return { to: 'failed', failure: (obj.last_payment_error?.message ?? 'The payment failed.').slice(0, 500) };
  if (type === 'charge.refunded' && obj.refunded === true && from === 'succeeded') return { to: 'refunded' };
  return null;
}

const HANDLED = new Set([
  'payment_intent.succeeded',
  'payment_intent.payment_failed',
  'refund.created',
  'charge.refunded',
]);

/**
 * Applies one verified webhook event, once: its id goes into payment_webhook_event first (unique), so
 * the same event again — sequentially or concurrently — finds it there and changes nothing. An intent's
 * amount, currency or metadata that does not match the row is recorded as a mismatch and not applied.
 * `now` is the time written on the payment, its audit event and the job (now by default; the demo seed's clock).
 */
export async function applyPaymentEvent(
  em: EntityManager,
  event: PaymentEvent,
  queue?: Pick<Queue, 'add'>,
  now?: Date,
): Promise<WebhookOutcome> {
  return em.transactional(async (tx) => {
    const at = now ?? new Date();
    const inserted = await tx.execute<Array<{ event_id: string }>>(
      `insert into "payment_webhook_event" ("event_id", "type", "received_at") values (?, ?, ?)
       on conflict ("event_id") do nothing returning "event_id"`,
      [event.id, event.type, at],
    );
    if (inserted.length === 0) return 'duplicate';
    const obj = event.data.object as EventObject;
    const settle = async (outcome: Exclude<WebhookOutcome, 'duplicate'>, payment?: PaymentRow) => {
      await tx.execute(
        'update "payment_webhook_event" set "outcome" = ?, "payment_id" = ?, "company_id" = ? where "event_id" = ?',
        [outcome, payment?.id ?? null, payment?.company_id ?? null, event.id],
        'run',
      );
      return outcome;
    };
    if (!HANDLED.has(event.type)) return settle('ignored');
    const intentId = obj.object === 'payment_intent' ? obj.id : obj.payment_intent;
    const rows = await tx.execute<PaymentRow[]>('select * from "payment" where "intent_id" = ? for update', [
      intentId ?? '',
    ]);
    const payment = rows[0];
    if (!payment) return settle('unknown-intent');
    if (obj.object === 'payment_intent') {
      const m = obj.metadata ?? {};
      const matches =
        obj.amount === payment.amount_cents &&
        m.companyId === payment.company_id &&
        m.versionId === payment.proposal_version_id;
      if (!matches) return settle('mismatch', payment);
    }
    if (event.type === 'refund.created') {
      // The refund's id, kept even when this arrives before the refund call's own answer is stored.
      const kept = await tx.execute(
        'update "payment" set "refund_id" = ?, "updated_at" = ? where "id" = ? and "refund_id" is null',
        [obj.id ?? null, at, payment.id],
        'run',
      );
      return settle((kept as { affectedRows?: number }).affectedRows ? 'applied' : 'unchanged', payment);
    }
    const move = nextState(event.type, obj, payment.state);
    if (!move) return settle('unchanged', payment);
    const paid = move.to === 'succeeded' || move.to === 'refunded';
    await tx.execute(
      `update "payment" set "state" = ?, "updated_at" = ?, "failure" = ?,
         "paid_at" = coalesce("paid_at", ?::timestamptz), "refunded_at" = ?::timestamptz
       where "id" = ?`,
      [
        move.to,
        at,
        move.to === 'failed' ? (move.failure ?? null) : null,
        paid ? at : null,
        move.to === 'refunded' ? at : null,
        payment.id,
      ],
      'run',
    );
    // The proposal's audit trail: the payment service moved the money (no staff user, not the customer).
    if (move.to === 'succeeded' || move.to === 'refunded') {
      await tx.execute(
        `insert into "proposal_event" ("id", "company_id", "proposal_id", "version_id", "kind", "at", "data")
         values (?, ?, ?, ?, ?, ?, ?::jsonb)`,
        [
          randomUUID(),
          payment.company_id,
          payment.proposal_id,
          payment.proposal_version_id,
          move.to === 'succeeded' ? 'paid' : 'refunded',
          at,
          JSON.stringify({
            paymentIntentId: payment.intent_id,
            amountCents: payment.amount_cents,
            eventId: event.id,
            ...(move.to === 'refunded' ? { refundId: payment.refund_id } : {}),
          }),
        ],
        'run',
      );
    }
    // The deposit was due and is now paid: the job is won (signing alone moves it where no deposit is due).
    // Not for a version the buyer cancelled meanwhile: its refund task gives the money back instead.
    if (move.to === 'succeeded') {
      const job = await tx.execute<Array<{ job_id: string; cancelled: boolean }>>(
        `select p."job_id", exists (select 1 from "proposal_cancellation" c where c."version_id" = ?) as "cancelled"
         from "proposal" p where p."id" = ? and p."company_id" = ?`,
        [payment.proposal_version_id, payment.proposal_id, payment.company_id],
      );
      if (job[0] && !job[0].cancelled)
        await moveJobForProposal(tx, { companyId: payment.company_id, jobId: job[0].job_id, to: 'won', at });
      // Paid after the buyer cancelled (the confirm was on its way): give it back.
      if (job[0]?.cancelled && queue)
        await queue.add('refund-deposit', { paymentId: payment.id }, { jobKey: `refund:${payment.id}`, em: tx });
    }
    return settle('applied', payment);
  });
}
