import { createHmac, randomBytes } from 'node:crypto';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { LOCAL_PUBLISHABLE_KEY, LOCAL_SECRET_KEY } from '../services/payments';

/**
 * A local stand-in, on loopback, for the few payment-service endpoints the app uses (payment intents
 * create / retrieve / confirm, refunds), so `npm start` and the tests run the official `stripe` SDK
 * end to end without the network. Requests arrive form-encoded as the SDK sends them; answers and
 * errors have the shapes the SDK reads; an Idempotency-Key replays the first answer. Every state
 * change is sent to the app as a webhook signed the way the real service signs it:
 * `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<body>" with the signing secret>`.
 *
 * Test payment methods: `pm_card_visa` pays; `pm_card_chargeDeclined` is declined (402, card_error).
 */

export const PAYS = 'pm_card_visa';
export const DECLINED = 'pm_card_chargeDeclined';

type Form = Record<string, string | Record<string, string>>;

interface FakeIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'requires_payment_method' | 'requires_confirmation' | 'succeeded';
  client_secret: string;
  created: number;
  description: string | null;
  livemode: false;
  metadata: Record<string, string>;
  payment_method: string | null;
  payment_method_types: string[];
  latest_charge: string | null;
  last_payment_error: null | { type: string; code: string; decline_code: string; message: string };
}

interface FakeCharge {
  id: string;
  object: 'charge';
  amount: number;
  amount_refunded: number;
  currency: string;
  paid: boolean;
  refunded: boolean;
  status: 'succeeded';
  payment_intent: string;
  metadata: Record<string, string>;
  created: number;
  livemode: false;
}

interface FakeRefund {
  id: string;
  object: 'refund';
  amount: number;
  currency: string;
  charge: string;
  payment_intent: string;
  status: 'succeeded';
  reason: string | null;
  metadata: Record<string, string>;
  created: number;
}

export interface SentWebhook {
  eventId: string;
  type: string;
  /** The HTTP status the app answered with (the last attempt), or 0 when it could not be reached. */
  status: number;
}

/** Delivers one signed webhook and gives the app's HTTP status: a URL, or a function (tests, through supertest). */
export type WebhookTarget = string | ((body: string, signature: string) => Promise<number>);

export interface PaymentsFake {
  port: number;
  url: string;
  intents: Map<string, FakeIntent>;
  refunds: Map<string, FakeRefund>;
  webhooks: SentWebhook[];
  setWebhookTarget(target: WebhookTarget): void;
  /** Resolves once every webhook sent so far has been answered (or given up on). */
  settled(): Promise<void>;
  close(): Promise<void>;
}

/** The real service's header: `t=<unix seconds>,v1=<hex HMAC-SHA256 of "t.payload">`. */
export function signWebhook(payload: string, secret: string, timestamp: number): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

const id = (prefix: string) => `${prefix}_${randomBytes(12).toString('base64url').replace(/[-_]/g, 'x')}`;
const now = () => Math.floor(Date.now() / 1000);

/** `a=1&metadata[k]=v` → `{ a: '1', metadata: { k: 'v' } }` (the depth the SDK uses for these calls). */
function parseForm(body: string): Form {
  const out: Form = {};
  for (const [key, value] of new URLSearchParams(body)) {
    const nested = /^(\w+)\[(\w*)\]$/.exec(key);
    if (!nested) {
      out[key] = value;
      continue;
    }
    const [, outer, inner] = nested as unknown as [string, string, string];
    const bag = (typeof out[outer] === 'object' ? out[outer] : {}) as Record<string, string>;
    bag[inner || String(Object.keys(bag).length)] = value;
    out[outer] = bag;
  }
  return out;
}

class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: Record<string, unknown>,
  ) {
    super(String(body.message));
  }
}
const invalid = (message: string, param?: string, code?: string) =>
  new ApiError(400, { type: 'invalid_request_error', message, ...(param ? { param } : {}), ...(code ? { code } : {}) });
const missing = (what: string, value: string) =>
  new ApiError(404, {
    type: 'invalid_request_error',
    code: 'resource_missing',
    message: `No such ${what}: '${value}'`,
  });

function text(form: Form, key: string): string | undefined {
  const v = form[key];
  return typeof v === 'string' ? v : undefined;
}

export async function startPaymentsFake(opts: {
  port: number;
  host?: string;
  webhookSecret: string;
  webhookTarget?: WebhookTarget;
  secretKey?: string;
  publishableKey?: string;
}): Promise<PaymentsFake> {
  const secretKey = opts.secretKey ?? LOCAL_SECRET_KEY;
  const publishableKey = opts.publishableKey ?? LOCAL_PUBLISHABLE_KEY;
  const intents = new Map<string, FakeIntent>();
  const charges = new Map<string, FakeCharge>();
  const refunds = new Map<string, FakeRefund>();
  const idempotent = new Map<string, { fingerprint: string; status: number; body: string }>();
  const webhooks: SentWebhook[] = [];
  const pending = new Set<Promise<void>>();
  // Events go out one after another, in the order they happened.
  let lastDelivery: Promise<void> = Promise.resolve();
  let target = opts.webhookTarget;

  async function deliverOnce(body: string): Promise<number> {
    const signature = signWebhook(body, opts.webhookSecret, now());
    if (typeof target === 'function') return target(body, signature);
    if (!target) return 0;
    const res = await fetch(target, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json; charset=utf-8', 'Stripe-Signature': signature },
      body,
    });
    await res.arrayBuffer();
    return res.status;
  }

  /** Sends an event as the service does, after the ones before it, again (up to three tries) until the app answers 2xx. */
  function emit(type: string, object: unknown, request: { id: string; idempotency_key: string | null }) {
    const event = {
      id: id('evt'),
      object: 'event',
      api_version: '2026-10-28.endive',
      created: now(),
      type,
      livemode: false,
      pending_webhooks: 1,
      request,
      data: { object: structuredClone(object) },
    };
    const body = JSON.stringify(event, null, 2);
    const sent: SentWebhook = { eventId: event.id, type, status: 0 };
    webhooks.push(sent);
    const previous = lastDelivery;
    const run = (async () => {
      await previous;
      for (let attempt = 0; attempt < 3; attempt++) {
        if (attempt > 0) await new Promise((r) => setTimeout(r, 200 * 4 ** attempt));
        sent.status = await deliverOnce(body).catch(() => 0);
        if (sent.status >= 200 && sent.status < 300) return;
      }
    })();
    lastDelivery = run;
    pending.add(run);
    void run.finally(() => pending.delete(run));
  }

  function intentOr404(intentId: string): FakeIntent {
    const pi = intents.get(intentId);
    if (!pi) throw missing('payment_intent', intentId);
    return pi;
  }

  function handle(method: string, path: string, form: Form, request: { id: string; idempotency_key: string | null }) {
    if (method === 'POST' && path === '/v1/payment_intents') {
      const amount = Number(text(form, 'amount'));
      if (!Number.isInteger(amount) || amount < 50 || amount > 99_999_999)
        throw invalid('Amount must be a whole number of cents from 50 to 99,999,999.', 'amount');
      const currency = text(form, 'currency');
      if (!currency || !/^[a-z]{3}$/.test(currency)) throw invalid('Missing required param: currency.', 'currency');
      const pm = text(form, 'payment_method') ?? null;
      const pi: FakeIntent = {
        id: id('pi'),
        object: 'payment_intent',
        amount,
        amount_received: 0,
        currency,
        status: pm ? 'requires_confirmation' : 'requires_payment_method',
        client_secret: '',
        created: now(),
        description: text(form, 'description') ?? null,
        livemode: false,
        metadata: typeof form.metadata === 'object' ? { ...form.metadata } : {},
        payment_method: pm,
        payment_method_types:
          typeof form.payment_method_types === 'object' ? Object.values(form.payment_method_types) : ['card'],
        latest_charge: null,
        last_payment_error: null,
      };
      pi.client_secret = `${pi.id}_secret_${randomBytes(12).toString('hex')}`;
      intents.set(pi.id, pi);
      emit('payment_intent.created', pi, request);
      return { status: 200, body: pi };
    }
    const get = /^\/v1\/payment_intents\/([A-Za-z0-9_]+)$/.exec(path);
    if (method === 'GET' && get) return { status: 200, body: intentOr404(get[1] as string) };
    const confirm = /^\/v1\/payment_intents\/([A-Za-z0-9_]+)\/confirm$/.exec(path);
    if (method === 'POST' && confirm) {
      const pi = intentOr404(confirm[1] as string);
      if (pi.status === 'succeeded')
        throw invalid(
          'This PaymentIntent has already succeeded and cannot be confirmed again.',
          undefined,
          'payment_intent_unexpected_state',
        );
      const pm = text(form, 'payment_method') ?? pi.payment_method;
      if (!pm)
        throw invalid('You cannot confirm this PaymentIntent because it has no payment method.', 'payment_method');
      if (pm !== PAYS && pm !== DECLINED) throw missing('PaymentMethod', pm);
      pi.payment_method = pm;
      if (pm === DECLINED) {
        pi.status = 'requires_payment_method';
        pi.last_payment_error = {
          type: 'card_error',
          code: 'card_declined',
          decline_code: 'generic_decline',
          message: 'Your card was declined.',
        };
        emit('payment_intent.payment_failed', pi, request);
        throw new ApiError(402, { ...pi.last_payment_error, payment_intent: pi });
      }
      const charge: FakeCharge = {
        id: id('ch'),
        object: 'charge',
        amount: pi.amount,
        amount_refunded: 0,
        currency: pi.currency,
        paid: true,
        refunded: false,
        status: 'succeeded',
        payment_intent: pi.id,
        metadata: { ...pi.metadata },
        created: now(),
        livemode: false,
      };
      charges.set(charge.id, charge);
      Object.assign(pi, {
        status: 'succeeded',
        amount_received: pi.amount,
        latest_charge: charge.id,
        last_payment_error: null,
      });
      emit('charge.succeeded', charge, request);
      emit('payment_intent.succeeded', pi, request);
      return { status: 200, body: pi };
    }
    if (method === 'POST' && path === '/v1/refunds') {
      const piId = text(form, 'payment_intent');
      const chId = text(form, 'charge');
      const pi = piId ? intentOr404(piId) : null;
      const charge = charges.get(chId ?? pi?.latest_charge ?? '');
      if (!charge) {
        if (pi) throw invalid(`This PaymentIntent (${pi.id}) does not have a successful charge to refund.`);
        throw invalid('One of the following params should be provided for this request: payment_intent or charge.');
      }
      const left = charge.amount - charge.amount_refunded;
      if (left === 0)
        throw invalid(`Charge ${charge.id} has already been refunded.`, undefined, 'charge_already_refunded');
      const amount = text(form, 'amount') === undefined ? left : Number(text(form, 'amount'));
      if (!Number.isInteger(amount) || amount < 1 || amount > left)
        throw invalid(`Refund amount must be a whole number of cents from 1 to ${left}.`, 'amount');
      const refund: FakeRefund = {
        id: id('re'),
        object: 'refund',
        amount,
        currency: charge.currency,
        charge: charge.id,
        payment_intent: charge.payment_intent,
        status: 'succeeded',
        reason: text(form, 'reason') ?? null,
        metadata: typeof form.metadata === 'object' ? { ...form.metadata } : {},
        created: now(),
      };
      refunds.set(refund.id, refund);
      charge.amount_refunded += amount;
      charge.refunded = charge.amount_refunded === charge.amount;
      emit('refund.created', refund, request);
      emit('charge.refunded', charge, request);
      return { status: 200, body: refund };
    }
    throw new ApiError(404, {
      type: 'invalid_request_error',
      message: `Unrecognized request URL (${method}: ${path}).`,
    });
  }

  async function serve(req: IncomingMessage, res: ServerResponse) {
    const chunks: Buffer[] = [];
    for await (const c of req) chunks.push(c as Buffer);
    const raw = Buffer.concat(chunks).toString('utf8');
    const method = req.method ?? 'GET';
    const path = new URL(req.url ?? '/', 'http://fake').pathname;
    const requestId = id('req');
    const key = (req.headers['idempotency-key'] as string | undefined) ?? null;
    const send = (status: number, body: string, replayed = false) => {
      res.writeHead(status, {
        'Content-Type': 'application/json',
        // A customer's page confirms from its own origin with the publishable key (below), as the service's
        // browser library does; no cookies, so any origin may read the answer.
        'Access-Control-Allow-Origin': '*',
        'Request-Id': requestId,
        ...(replayed ? { 'Idempotent-Replayed': 'true' } : {}),
        ...(key ? { 'Idempotency-Key': key } : {}),
      });
      res.end(body);
    };
    if (method === 'OPTIONS') {
      res.writeHead(204, {
        'Access-Control-Allow-Origin': '*',
        'Access-Control-Allow-Methods': 'GET, POST',
        'Access-Control-Allow-Headers': 'Content-Type',
        'Access-Control-Max-Age': '600',
      });
      res.end();
      return;
    }
    const form = parseForm(raw);
    // The browser's one call: confirm an intent with the publishable key and the intent's client secret
    // (form fields `key` and `client_secret`), no secret key. Anything else needs the secret key.
    const browserConfirm = /^\/v1\/payment_intents\/([A-Za-z0-9_]+)\/confirm$/.exec(path);
    if (req.headers.authorization === undefined && text(form, 'key') !== undefined) {
      const pi = browserConfirm ? intents.get(browserConfirm[1] as string) : undefined;
      if (method !== 'POST' || !browserConfirm || text(form, 'key') !== publishableKey) {
        send(401, JSON.stringify({ error: { type: 'invalid_request_error', message: 'Invalid API Key provided.' } }));
        return;
      }
      if (!pi || text(form, 'client_secret') !== pi.client_secret) {
        const message = `No such payment_intent: '${browserConfirm[1]}'`;
        send(404, JSON.stringify({ error: { type: 'invalid_request_error', code: 'resource_missing', message } }));
        return;
      }
      delete form.key;
      delete form.client_secret;
    } else if (req.headers.authorization !== `Bearer ${secretKey}`) {
      send(401, JSON.stringify({ error: { type: 'invalid_request_error', message: 'Invalid API Key provided.' } }));
      return;
    }
    const fingerprint = `${method} ${path} ${raw}`;
    if (method === 'POST' && key) {
      const seen = idempotent.get(key);
      if (seen && seen.fingerprint !== fingerprint) {
        const message = `Keys for idempotent requests can only be used with the same parameters they were first used with.`;
        send(400, JSON.stringify({ error: { type: 'idempotency_error', message } }));
        return;
      }
      if (seen) return send(seen.status, seen.body, true);
    }
    let status: number;
    let body: string;
    try {
      const out = handle(method, path, form, { id: requestId, idempotency_key: key });
      status = out.status;
      body = JSON.stringify(out.body);
    } catch (err) {
      if (!(err instanceof ApiError)) throw err;
      status = err.status;
      body = JSON.stringify({ error: { ...err.body, request_log_url: null } });
    }
    // The real service keeps the answer for a key, errors included, unless the request never ran (a 5xx).
    if (method === 'POST' && key && status < 500) idempotent.set(key, { fingerprint, status, body });
    send(status, body);
  }

  const server = createServer((req, res) => {
    serve(req, res).catch(() => {
      if (!res.headersSent) res.writeHead(500, { 'Content-Type': 'application/json' });
      res.end(JSON.stringify({ error: { type: 'api_error', message: 'The payments fake failed.' } }));
    });
  });
  const host = opts.host ?? '127.0.0.1';
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, host, () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  return {
    port,
    url: `http://${host}:${port}`,
    intents,
    refunds,
    webhooks,
    setWebhookTarget(t) {
      target = t;
    },
    async settled() {
      while (pending.size > 0) await Promise.allSettled([...pending]);
    },
    async close() {
      await Promise.allSettled([...pending]);
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/**
 * The fake `npm start` and `npm run dev` run beside the server: on PAYMENTS_FAKE_PORT, only when no real
 * key (and no other API host) is configured. Its webhooks go to the app's own hook URL.
 */
export async function startLocalPaymentsFake(config: {
  PAYMENTS_SECRET_KEY?: string;
  PAYMENTS_API_URL?: string;
  PAYMENTS_FAKE_PORT: number;
  PAYMENTS_WEBHOOK_SECRET: string;
}): Promise<PaymentsFake | null> {
  if (config.PAYMENTS_SECRET_KEY || config.PAYMENTS_API_URL) return null;
  return startPaymentsFake({ port: config.PAYMENTS_FAKE_PORT, webhookSecret: config.PAYMENTS_WEBHOOK_SECRET });
}
