import { randomUUID } from 'node:crypto';
import Stripe from 'stripe';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DECLINED, PAYS, signWebhook } from '../../server/src/fakes/payments-fake';
import {
  depositDue,
  paymentForVersion,
  recordDepositIntent,
  refundDeposit,
  startDeposit,
  type PaymentRow,
} from '../../server/src/modules/payments/payments.service';
import { z } from 'zod';
import { NO_CONTENT, PUBLIC, type ApiRouter } from '../../server/src/lib/route';
import {
  browserAgent,
  csrfOf,
  HTTPS,
  isProblem,
  login,
  makeCompany,
  type Session,
  type TestCompany,
} from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { newJob } from './jobs-helpers';

let t: TestApp;
let a: TestCompany;
let secret: string;
let estimator: Session;
// The SDK's own webhook helpers, used as the reference for how the real service signs.
const sdk = new Stripe('sk_test_reference');

/** Stands in for the route a proposal link opens (that slice is not built yet): a grant for the proposal. */
function linkOpener(api: ApiRouter): void {
  api.route({
    method: 'post',
    path: '/open/:companyId/:proposalId',
    policy: PUBLIC,
    params: z.strictObject({ companyId: z.uuid(), proposalId: z.uuid() }),
    response: NO_CONTENT,
    handler: async ({ req, params }) => {
      req.session.link = { ...params, expiresAt: Date.now() + 60_000 };
    },
  });
}

beforeAll(async () => {
  t = await buildTestApp({}, undefined, { modules: [['/payments-test', linkOpener]] });
  a = await makeCompany(t.orm.em.fork(), 'Deposit');
  secret = t.services.config.PAYMENTS_WEBHOOK_SECRET;
  estimator = await login(t.app, a.users.estimator.email);
});
afterAll(async () => t.close());

const em = () => t.orm.em.fork();

/** An issued proposal version on a new job; its snapshot holds two options with their deposits (cents). */
async function version(depositCents = 150_000) {
  const job = await newJob(estimator);
  const proposalId = randomUUID();
  const versionId = randomUUID();
  const option = (position: number, deposit: number) => ({
    position,
    name: `Option ${position}`,
    price: { depositCents: deposit },
  });
  await em().execute('insert into "proposal" ("id", "company_id", "job_id", "created_at") values (?, ?, ?, now())', [
    proposalId,
    a.id,
    job.id,
  ]);
  await em().execute(
    `insert into "proposal_version" ("id", "company_id", "proposal_id", "number", "snapshot", "snapshot_sha256",
       "calc_version", "issued_by_id", "issued_by_name", "issued_at") values (?, ?, ?, 1, ?::jsonb, ?, '0.1.0', ?, 'Test estimator', now())`,
    [
      versionId,
      a.id,
      proposalId,
      JSON.stringify({ schema: 1, options: [option(1, depositCents), option(2, depositCents + 25_000)] }),
      'c'.repeat(64),
      a.users.estimator.id,
    ],
  );
  return { companyId: a.id, proposalId, versionId, depositCents };
}

const auditOf = async (versionId: string) =>
  em().execute<Array<{ kind: string; data: Record<string, unknown> }>>(
    'select "kind", "data" from "proposal_event" where "version_id" = ? order by "seq"',
    [versionId],
  );

/** The server makes the intent for the version's own amount and keeps it as the payment row. */
async function openDeposit(depositCents = 150_000): Promise<PaymentRow> {
  const v = await version(depositCents);
  const intent = await t.services.payments.createDepositIntent({
    amountCents: v.depositCents,
    metadata: { companyId: v.companyId, proposalId: v.proposalId, versionId: v.versionId },
    idempotencyKey: `deposit:${v.versionId}`,
  });
  const row = await recordDepositIntent(em(), intent);
  await t.payments.settled();
  return row;
}

const reread = async (p: PaymentRow) => (await paymentForVersion(em(), p.company_id, p.proposal_version_id))!;

const eventRows = async (eventId: string) =>
  em().execute<Array<{ outcome: string; payment_id: string | null }>>(
    'select "outcome", "payment_id" from "payment_webhook_event" where "event_id" = ?',
    [eventId],
  );

/** A payment_intent.succeeded event for the row, as the service would send it. */
function succeededEvent(p: PaymentRow, amount = p.amount_cents) {
  return JSON.stringify({
    id: `evt_test${randomUUID().replace(/-/g, '')}`,
    object: 'event',
    type: 'payment_intent.succeeded',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    data: {
      object: {
        id: p.intent_id,
        object: 'payment_intent',
        amount,
        currency: 'usd',
        status: 'succeeded',
        metadata: { companyId: p.company_id, proposalId: p.proposal_id, versionId: p.proposal_version_id },
      },
    },
  });
}

const post = (body: string, signature?: string) => {
  const r = request(t.app).post('/api/hooks/payments').set(HTTPS).set('Content-Type', 'application/json');
  return (signature ? r.set('Stripe-Signature', signature) : r).send(body);
};
const sign = (payload: string, timestamp = Math.floor(Date.now() / 1000), withSecret = secret) =>
  sdk.webhooks.generateTestHeaderString({ payload, secret: withSecret, timestamp });

describe("the payments fake signs webhooks as the real service does (checked with the stripe SDK's own code)", () => {
  it("its header equals the SDK's generateTestHeaderString and passes constructEvent", async () => {
    const payload = JSON.stringify({ id: 'evt_sample', object: 'event', type: 'payment_intent.created' });
    const ts = 1_796_000_000;
    expect(signWebhook(payload, secret, ts)).toBe(
      sdk.webhooks.generateTestHeaderString({ payload, secret, timestamp: ts }),
    );
    const before = t.payments.webhooks.length;
    await openDeposit();
    // Everything the fake sent for that intent reached the app, whose handler verifies with constructEvent.
    const sent = t.payments.webhooks.slice(before);
    expect(sent.map((w) => w.type)).toEqual(['payment_intent.created']);
    expect(sent.every((w) => w.status === 200)).toBe(true);
  });

  it('a signature made with another secret fails constructEvent (the check is real)', () => {
    const payload = '{"id":"evt_x","object":"event"}';
    const header = signWebhook(payload, 'whsec_someOtherSecret000000', Math.floor(Date.now() / 1000));
    expect(() => sdk.webhooks.constructEvent(payload, header, secret)).toThrow(/signature/i);
  });
});

describe('the deposit through the fake, end to end with its webhooks', () => {
  it('pays with the test card: the webhook moves the row to succeeded; the refund moves it to refunded', async () => {
    const p = await openDeposit(125_000);
    expect(p.state).toBe('created');
    const paid = await t.services.payments.confirm(p.intent_id, PAYS, `confirm:${p.id}`);
    expect(paid.status).toBe('succeeded');
    await t.payments.settled();
    const afterPay = await reread(p);
    expect(afterPay.state).toBe('succeeded');
    expect(afterPay.amount_cents).toBe(125_000);

    const refundId = await refundDeposit(em(), t.services.payments, afterPay);
    await t.payments.settled();
    const afterRefund = await reread(p);
    expect(afterRefund.state).toBe('refunded');
    expect(afterRefund.refund_id).toBe(refundId);
    expect(t.payments.refunds.get(refundId)?.amount).toBe(125_000);
    // A refund retried with the same key is the same refund; a refunded deposit is not refunded again.
    await expect(refundDeposit(em(), t.services.payments, afterRefund)).rejects.toThrow(/Only a paid deposit/);
    const again = await t.services.payments.refund(p.intent_id, `refund:${p.id}`);
    expect(again.id).toBe(refundId);
    // The proposal's audit trail, in order: paid, then refunded, each naming the intent and the amount.
    const audit = await auditOf(p.proposal_version_id);
    expect(audit.map((e) => e.kind)).toEqual(['paid', 'refunded']);
    expect(audit[0]!.data).toMatchObject({ paymentIntentId: p.intent_id, amountCents: 125_000 });
    expect(audit[1]!.data).toMatchObject({ paymentIntentId: p.intent_id, amountCents: 125_000, refundId });
  });

  it('a declined card leaves the row failed with the reason; paying again with a good card succeeds', async () => {
    const p = await openDeposit(40_000);
    const declined = await t.services.payments.confirm(p.intent_id, DECLINED, `confirm-1:${p.id}`);
    expect(declined.status).toBe('requires_payment_method');
    expect(declined.failure).toBe('Your card was declined.');
    await t.payments.settled();
    const failed = await reread(p);
    expect(failed.state).toBe('failed');
    expect(failed.failure).toBe('Your card was declined.');
    await t.services.payments.confirm(p.intent_id, PAYS, `confirm-2:${p.id}`);
    await t.payments.settled();
    expect((await reread(p)).state).toBe('succeeded');
  });

  it("the SDK's idempotency key makes one intent; the same key with another amount is refused", async () => {
    const v = await version(90_000);
    const meta = { companyId: v.companyId, proposalId: v.proposalId, versionId: v.versionId };
    const before = t.payments.intents.size;
    const key = `deposit:${v.versionId}`;
    const one = await t.services.payments.createDepositIntent({
      amountCents: 90_000,
      metadata: meta,
      idempotencyKey: key,
    });
    const two = await t.services.payments.createDepositIntent({
      amountCents: 90_000,
      metadata: meta,
      idempotencyKey: key,
    });
    expect(two.id).toBe(one.id);
    expect(t.payments.intents.size).toBe(before + 1);
    await expect(
      t.services.payments.createDepositIntent({ amountCents: 1_000, metadata: meta, idempotencyKey: key }),
    ).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    await t.payments.settled();
  });

  it('pay before signing → 409, and no intent is made', async () => {
    const before = t.payments.intents.size;
    await expect(startDeposit(em(), t.services.payments, await version())).rejects.toMatchObject({ status: 409 });
    expect(t.payments.intents.size).toBe(before);
  });
});

describe('POST /api/hooks/payments', () => {
  it('a good signature is applied; the same event again (and ten at once) changes nothing', async () => {
    const p = await openDeposit();
    const body = succeededEvent(p);
    const eventId = (JSON.parse(body) as { id: string }).id;
    const first = await post(body, sign(body));
    expect(first.status).toBe(200);
    expect(first.body).toEqual({ received: true, outcome: 'applied' });
    const paidAt = (
      await em().execute<Array<{ paid_at: Date }>>('select "paid_at" from "payment" where "id" = ?', [p.id])
    )[0]!.paid_at;
    const repeats = await Promise.all(Array.from({ length: 10 }, () => post(body, sign(body))));
    expect(repeats.map((r) => r.status)).toEqual(Array(10).fill(200));
    expect(repeats.map((r) => (r.body as { outcome: string }).outcome)).toEqual(Array(10).fill('duplicate'));
    expect(await eventRows(eventId)).toEqual([{ outcome: 'applied', payment_id: p.id }]);
    const after = await em().execute<Array<{ state: string; paid_at: Date }>>(
      'select "state", "paid_at" from "payment" where "id" = ?',
      [p.id],
    );
    expect(after).toEqual([{ state: 'succeeded', paid_at: paidAt }]);
  });

  it('a bad signature, another secret or a changed body → 400 problem+json, nothing recorded', async () => {
    const p = await openDeposit();
    const body = succeededEvent(p);
    const eventId = (JSON.parse(body) as { id: string }).id;
    const good = sign(body);
    const cases = [
      good.replace(/v1=([0-9a-f])/, (_m, c: string) => `v1=${c === '0' ? '1' : '0'}`),
      sign(body, undefined, 'whsec_notTheEndpointSecret0000'),
      't=abc,v1=zz',
    ];
    for (const header of cases) {
      const res = await post(body, header);
      expect(res.status, header).toBe(400);
      expect(isProblem(res)).toBe(true);
      expect(res.text).not.toContain(secret);
    }
    const changed = await post(body.replace(String(p.amount_cents), '1'), good);
    expect(changed.status).toBe(400);
    expect(await eventRows(eventId)).toEqual([]);
    expect((await reread(p)).state).toBe('created');
  });

  it('no signature header → 401 (the signed policy), nothing recorded', async () => {
    const p = await openDeposit();
    const res = await post(succeededEvent(p));
    expect(res.status).toBe(401);
    expect(isProblem(res)).toBe(true);
    expect((await reread(p)).state).toBe('created');
  });

  it('the timestamp tolerance: signed 301 s ago or an hour ahead → 400; 299 s ago → applied', async () => {
    const tolerance = t.services.config.PAYMENTS_WEBHOOK_TOLERANCE_SECONDS;
    expect(tolerance).toBe(300);
    const now = Math.floor(Date.now() / 1000);
    const p = await openDeposit();
    const old = succeededEvent(p);
    const stale = await post(old, sign(old, now - 301));
    expect(stale.status).toBe(400);
    expect(isProblem(stale)).toBe(true);
    const ahead = await post(old, sign(old, now + 3_600));
    expect(ahead.status).toBe(400);
    expect(await eventRows((JSON.parse(old) as { id: string }).id)).toEqual([]);
    expect((await reread(p)).state).toBe('created');
    const fresh = await post(old, sign(old, now - 299));
    expect(fresh.status).toBe(200);
    expect((await reread(p)).state).toBe('succeeded');
  });

  it('an amount that is not the deposit asked for is recorded as a mismatch and not marked paid', async () => {
    const p = await openDeposit(150_000);
    const body = succeededEvent(p, 100);
    const res = await post(body, sign(body));
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ received: true, outcome: 'mismatch' });
    expect((await reread(p)).state).toBe('created');
  });

  it('a late failure never un-pays a deposit; an unknown intent or another event type is acknowledged and ignored', async () => {
    const p = await openDeposit();
    await t.services.payments.confirm(p.intent_id, PAYS, `confirm:${p.id}`);
    await t.payments.settled();
    const late = JSON.stringify({
      ...(JSON.parse(succeededEvent(p)) as object),
      id: `evt_late${randomUUID().replace(/-/g, '')}`,
      type: 'payment_intent.payment_failed',
    });
    expect((await post(late, sign(late))).body).toEqual({ received: true, outcome: 'unchanged' });
    expect((await reread(p)).state).toBe('succeeded');
    const stranger = JSON.stringify({
      ...(JSON.parse(late) as object),
      id: `evt_unknown${randomUUID().replace(/-/g, '')}`,
      type: 'payment_intent.succeeded',
      data: { object: { id: 'pi_neverMadeHere', object: 'payment_intent', amount: 5_000, metadata: {} } },
    });
    expect((await post(stranger, sign(stranger))).body).toEqual({ received: true, outcome: 'unknown-intent' });
    const other = JSON.stringify({
      id: `evt_other${randomUUID().slice(0, 8)}`,
      object: 'event',
      type: 'customer.created',
      data: { object: {} },
    });
    expect((await post(other, sign(other))).body).toEqual({ received: true, outcome: 'ignored' });
  });
});

describe('POST /api/proposals/:proposalId/deposit (the customer, through a proposal link)', () => {
  async function customerFor(companyId: string, proposalId: string) {
    const agent = browserAgent(t.app);
    const csrf = await csrfOf(agent);
    const opened = await agent
      .post(`/api/payments-test/open/${companyId}/${proposalId}`)
      .set(HTTPS)
      .set('X-CSRF-Token', csrf);
    expect(opened.status).toBe(204);
    return (body: object) =>
      agent.post(`/api/proposals/${proposalId}/deposit`).set(HTTPS).set('X-CSRF-Token', csrf).send(body);
  }
  const chooseOption = (v: { companyId: string; proposalId: string; versionId: string }, position: number) =>
    em().execute(
      `insert into "proposal_event" ("id", "company_id", "proposal_id", "version_id", "kind", "at", "by_customer", "data")
       values (?, ?, ?, ?, 'option-chosen', now(), true, ?::jsonb)`,
      [randomUUID(), v.companyId, v.proposalId, v.versionId, JSON.stringify({ position })],
    );

  it('a request that names an amount is refused (400) and makes no intent', async () => {
    const v = await version(150_000);
    await chooseOption(v, 2);
    const pay = await customerFor(a.id, v.proposalId);
    const before = t.payments.intents.size;
    for (const tampered of [{ amountCents: 1 }, { amount: 100 }, { depositCents: 0 }]) {
      const res = await pay(tampered);
      expect(res.status, JSON.stringify(tampered)).toBe(400);
      expect(isProblem(res)).toBe(true);
    }
    expect(t.payments.intents.size).toBe(before);
    expect(await paymentForVersion(em(), a.id, v.versionId)).toBeNull();
  });

  it('the amount is the chosen option in the frozen snapshot; before an option is chosen → 409, before signing → 409', async () => {
    const v = await version(150_000);
    const pay = await customerFor(a.id, v.proposalId);
    const noChoice = await pay({});
    expect(noChoice.status).toBe(409);
    expect(noChoice.body.detail).toMatch(/Choose one of the options/);
    await chooseOption(v, 2);
    await expect(depositDue(em(), a.id, v.proposalId)).resolves.toMatchObject({ depositCents: 175_000 });
    const before = t.payments.intents.size;
    const unsigned = await pay({});
    expect(unsigned.status).toBe(409);
    expect(isProblem(unsigned)).toBe(true);
    expect(unsigned.body.detail).toMatch(/sign it first/);
    expect(t.payments.intents.size).toBe(before);
  });

  it("another company's proposal is 404 even with a grant naming it", async () => {
    const v = await version();
    const other = await makeCompany(em(), 'Other deposit');
    const pay = await customerFor(other.id, v.proposalId);
    expect((await pay({})).status).toBe(404);
  });
});
