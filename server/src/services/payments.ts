import Stripe from 'stripe';
import type { Config } from '../config';

/** What a deposit's payment intent carries, so a webhook finds its company, proposal and version again. */
export interface DepositMetadata {
  companyId: string;
  proposalId: string;
  versionId: string;
}

/** The provider's states that matter here (the intent's own `status`, as the service names it). */
export type IntentStatus =
  | 'requires_payment_method'
  | 'requires_confirmation'
  | 'requires_action'
  | 'processing'
  | 'requires_capture'
  | 'canceled'
  | 'succeeded';

export interface DepositIntent {
  id: string;
  amountCents: number;
  currency: string;
  status: IntentStatus;
  /** Handed to the customer's page to pay (never logged, never stored). */
  clientSecret: string | null;
  metadata: DepositMetadata;
  /** Why the last attempt failed (a declined card), or null. */
  failure: string | null;
}

export interface DepositRefund {
  id: string;
  amountCents: number;
  status: string;
}

/** A webhook the service signed, after the signature and its timestamp were checked. */
export type PaymentEvent = Stripe.Event;

/** The signature header is there but does not verify, or its timestamp is too old. */
export class WebhookSignatureError extends Error {}

/**
 * The deposit's payment service, through the official `stripe` SDK: one small interface so the rest of
 * the app never touches the SDK. Every write takes an idempotency key, so a retried request (a double
 * click, a network retry) makes one intent and one refund.
 */
export interface Payments {
  /** True when the SDK talks to the local fake (no secret key in the configuration). */
  readonly local: boolean;
  createDepositIntent(input: {
    amountCents: number;
    metadata: DepositMetadata;
    idempotencyKey: string;
  }): Promise<DepositIntent>;
  retrieve(intentId: string): Promise<DepositIntent>;
  /** Confirms with a payment method; a declined card answers the intent with its failure, not an exception. */
  confirm(intentId: string, paymentMethod: string, idempotencyKey: string): Promise<DepositIntent>;
  /** Refunds the whole intent. */
  refund(intentId: string, idempotencyKey: string): Promise<DepositRefund>;
  /** Checks the Stripe-Signature header (HMAC-SHA256 over "t.body") and the timestamp's age; throws WebhookSignatureError. */
  parseWebhook(rawBody: Buffer, signatureHeader: string): PaymentEvent;
}

/** The key the SDK sends to the local fake: a test key, so nothing ever looks live. */
export const LOCAL_SECRET_KEY = 'sk_test_gaugelineLocalFake';

/** The publishable key the customer's page sends with a confirm to the local fake (a test key). */
export const LOCAL_PUBLISHABLE_KEY = 'pk_test_gaugelineLocalFake';

/**
 * What the customer's browser needs to confirm a deposit with the payment service itself (card data goes
 * from the browser to the service, never through this server): the service's address and the
 * publishable key. Only for the local fake (its test payment methods, `testMode`); with a real key this
 * build has no card form, so null. The app's CSP allows exactly this origin in connect-src.
 */
export function browserPayments(config: Config): { apiUrl: string; publishableKey: string; testMode: true } | null {
  if (config.PAYMENTS_SECRET_KEY) return null;
  const apiUrl = new URL(config.PAYMENTS_API_URL ?? `http://127.0.0.1:${config.PAYMENTS_FAKE_PORT}`).origin;
  return { apiUrl, publishableKey: LOCAL_PUBLISHABLE_KEY, testMode: true };
}

/** Where the SDK goes: the real service with a key (unless PAYMENTS_API_URL says otherwise), the fake without. */
export function paymentsEndpoint(config: Config): { host: string; port: number; protocol: 'http' | 'https' } | null {
  const url =
    config.PAYMENTS_API_URL ?? (config.PAYMENTS_SECRET_KEY ? null : `http://127.0.0.1:${config.PAYMENTS_FAKE_PORT}`);
  if (!url) return null;
  const u = new URL(url);
  const protocol = u.protocol === 'http:' ? 'http' : 'https';
  return { host: u.hostname, port: Number(u.port || (protocol === 'http' ? 80 : 443)), protocol };
}

function intentOf(pi: Stripe.PaymentIntent): DepositIntent {
  const m = pi.metadata ?? {};
  return {
    id: pi.id,
    amountCents: pi.amount,
    currency: pi.currency,
    status: pi.status as IntentStatus,
    clientSecret: pi.client_secret ?? null,
    metadata: { companyId: m.companyId ?? '', proposalId: m.proposalId ?? '', versionId: m.versionId ?? '' },
    failure: pi.last_payment_error?.message ?? null,
  };
}

export function createStripePayments(config: Config): Payments {
  const endpoint = paymentsEndpoint(config);
  const stripe = new Stripe(config.PAYMENTS_SECRET_KEY ?? LOCAL_SECRET_KEY, {
    ...(endpoint ?? {}),
    maxNetworkRetries: 2,
    timeout: 15_000,
    telemetry: false,
    appInfo: { name: 'Gaugeline' },
  });
  const secret = config.PAYMENTS_WEBHOOK_SECRET;
  const tolerance = config.PAYMENTS_WEBHOOK_TOLERANCE_SECONDS;
  return {
    local: !config.PAYMENTS_SECRET_KEY,
    async createDepositIntent({ amountCents, metadata, idempotencyKey }) {
      if (!Number.isSafeInteger(amountCents) || amountCents <= 0)
        throw new Error('A deposit is a whole, positive number of cents.');
      const pi = await stripe.paymentIntents.create(
        {
          amount: amountCents,
          currency: 'usd',
          metadata: { ...metadata },
          description: 'Deposit',
        },
        { idempotencyKey },
      );
      return intentOf(pi);
    },
    async retrieve(intentId) {
      return intentOf(await stripe.paymentIntents.retrieve(intentId));
    },
    async confirm(intentId, paymentMethod, idempotencyKey) {
      try {
        return intentOf(
          await stripe.paymentIntents.confirm(intentId, { payment_method: paymentMethod }, { idempotencyKey }),
        );
      } catch (err) {
        // A declined card is an answer, not a fault: the intent now carries the failure.
        if (err instanceof Stripe.errors.StripeCardError)
          return intentOf(await stripe.paymentIntents.retrieve(intentId));
        throw err;
      }
    },
    async refund(intentId, idempotencyKey) {
      const r = await stripe.refunds.create({ payment_intent: intentId }, { idempotencyKey });
      return { id: r.id, amountCents: r.amount, status: r.status ?? 'pending' };
    },
    parseWebhook(rawBody, signatureHeader) {
      // The SDK refuses a timestamp older than the tolerance; one from the future is refused here too,
      // so a header signed ahead of time cannot be kept and replayed later.
      const signedAt = Number(/(?:^|,)t=(\d+)(?:,|$)/.exec(signatureHeader)?.[1]);
      if (Number.isFinite(signedAt) && signedAt > Date.now() / 1000 + tolerance) {
        throw new WebhookSignatureError('The webhook was signed in the future.');
      }
      try {
        // constructEvent with an explicit tolerance: called without one, the lower-level verifyHeader
        // would accept any age (security.md §5, gotcha 1).
        return stripe.webhooks.constructEvent(rawBody, signatureHeader, secret, tolerance);
      } catch (err) {
        if (err instanceof Stripe.errors.StripeSignatureVerificationError) throw new WebhookSignatureError(err.message);
        throw err;
      }
    },
  };
}
