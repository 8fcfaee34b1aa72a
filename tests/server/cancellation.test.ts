import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { coolingOffWindow } from '@calc';
import { DECLINED, PAYS } from '../../server/src/fakes/payments-fake';
import { NO_CONTENT, PUBLIC, type ApiRouter } from '../../server/src/lib/route';
import { paymentForVersion, recordDepositIntent } from '../../server/src/modules/payments/payments.service';
import { LOCAL_PUBLISHABLE_KEY } from '../../server/src/services/payments';
import { browserAgent, csrfOf, HTTPS, isProblem, login, makeCompany, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { newJob } from './jobs-helpers';

/**
 * Cancellation within three business days (16 CFR 429.1(a); business days per 429.0(g): Sundays and the
 * named federal holidays do not count, Saturdays do) and the deposit after signing. The window's dates
 * are calc's `coolingOffWindow`; each expected last day below is also worked out by hand from the rule.
 * Jobs are in Illinois (America/Chicago, UTC−6 in November and December).
 */

let t: TestApp;
let a: TestCompany;
let nowAt = new Date();
const clock = { now: () => nowAt };
const em = () => t.orm.em.fork();

/** Stands in for the route a proposal link opens: a grant for the proposal in the customer's session. */
function linkOpener(api: ApiRouter): void {
  api.route({
    method: 'post',
    path: '/open/:companyId/:proposalId',
    policy: PUBLIC,
    params: z.strictObject({ companyId: z.uuid(), proposalId: z.uuid() }),
    response: NO_CONTENT,
    handler: async ({ req, params }) => {
      req.session.link = { ...params, expiresAt: Date.now() + 600_000 };
    },
  });
}

beforeAll(async () => {
  t = await buildTestApp({}, clock, { modules: [['/cancel-test', linkOpener]] });
  a = await makeCompany(em(), 'Cancel');
});
afterAll(async () => t.close());
beforeEach(() => {
  nowAt = new Date();
});

interface Signed {
  jobId: string;
  proposalId: string;
  versionId: string;
}

/** An issued version on a new job in `region`, its option 1 chosen (deposit `depositCents`) and signed at `signedAt`. */
async function signedVersion(signedAt: string | null, depositCents = 120_000, region = 'Illinois'): Promise<Signed> {
  const estimator = await login(t.app, a.users.estimator.email);
  const job = await newJob(estimator, { region });
  const proposalId = randomUUID();
  const versionId = randomUUID();
  await em().execute('insert into "proposal" ("id", "company_id", "job_id", "created_at") values (?, ?, ?, now())', [
    proposalId,
    a.id,
    job.id,
  ]);
  await em().execute(
    `insert into "proposal_version" ("id", "company_id", "proposal_id", "number", "snapshot", "snapshot_sha256",
       "calc_version", "issued_by_id", "issued_by_name", "issued_at") values (?, ?, ?, 1, ?::jsonb, ?, '0.1.0', ?, 'Test estimator', '2026-11-01T00:00:00Z')`,
    [
      versionId,
      a.id,
      proposalId,
      JSON.stringify({ schema: 1, options: [{ position: 1, name: 'Option 1', price: { depositCents } }] }),
      'd'.repeat(64),
      a.users.estimator.id,
    ],
  );
  const event = (kind: string, at: string, data: object) =>
    em().execute(
      `insert into "proposal_event" ("id", "company_id", "proposal_id", "version_id", "kind", "at", "by_customer", "data")
       values (?, ?, ?, ?, ?, ?, true, ?::jsonb)`,
      [randomUUID(), a.id, proposalId, versionId, kind, at, JSON.stringify(data)],
    );
  await event('option-chosen', signedAt ?? '2026-11-20T12:00:00Z', { position: 1 });
  if (signedAt) await event('signed', signedAt, { signer: 'Test buyer' });
  return { jobId: job.id, proposalId, versionId };
}

/** The customer's browser with a link grant for the proposal (of `companyId`). */
async function customer(proposalId: string, companyId = a.id) {
  const agent = browserAgent(t.app);
  const csrf = await csrfOf(agent);
  const opened = await agent
    .post(`/api/cancel-test/open/${companyId}/${proposalId}`)
    .set(HTTPS)
    .set('X-CSRF-Token', csrf);
  expect(opened.status).toBe(204);
  return {
    state: () => agent.get(`/api/proposals/${proposalId}/after-signing`).set(HTTPS),
    cancel: (body: object = {}) =>
      agent
        .post(`/api/proposals/${proposalId}/cancellation`)
        .set(HTTPS)
        .set('X-CSRF-Token', csrf)
        .set('User-Agent', 'Phone browser 1.0')
        .send(body),
    deposit: () => agent.post(`/api/proposals/${proposalId}/deposit`).set(HTTPS).set('X-CSRF-Token', csrf).send({}),
  };
}

const trail = async (proposalId: string) =>
  (
    await em().execute<Array<{ kind: string }>>(
      'select "kind" from "proposal_event" where "proposal_id" = ? order by "seq"',
      [proposalId],
    )
  ).map((r) => r.kind);

const jobOf = async (jobId: string) =>
  (
    await em().execute<Array<{ status: string; lost_reason: string | null }>>(
      'select "status", "lost_reason" from "job" where "id" = ?',
      [jobId],
    )
  )[0]!;

const cancellations = async (versionId: string) =>
  em().execute<Array<Record<string, unknown>>>('select * from "proposal_cancellation" where "version_id" = ?', [
    versionId,
  ]);

/** Pays the version's deposit as the customer's page does: the intent from the server, the confirm from the browser. */
async function payDeposit(s: Signed, paymentMethod = PAYS) {
  const due = 120_000;
  const intent = await t.services.payments.createDepositIntent({
    amountCents: due,
    metadata: { companyId: a.id, proposalId: s.proposalId, versionId: s.versionId },
    idempotencyKey: `deposit:${s.versionId}`,
  });
  await recordDepositIntent(em(), intent);
  const res = await browserConfirm(intent.id, intent.clientSecret!, paymentMethod);
  await t.payments.settled();
  return { intent, res };
}

/** The browser's confirm, as the service's own browser library sends it: form-encoded, publishable key, client secret. */
function browserConfirm(intentId: string, clientSecret: string, paymentMethod: string, key = LOCAL_PUBLISHABLE_KEY) {
  return fetch(`${t.payments.url}/v1/payment_intents/${intentId}/confirm`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ payment_method: paymentMethod, client_secret: clientSecret, key }).toString(),
  });
}

describe('the window (16 CFR 429.1(a), business days per 429.0(g))', () => {
  it('across a weekend: signed Friday → the last day is Tuesday (Sat counts, Sun does not); cancelling Tuesday 23:30 works', async () => {
    // Friday 4 Dec 2026, 10:00 in Chicago. By hand: Sat 5 (1), Sun 6 (not a business day), Mon 7 (2), Tue 8 (3).
    const s = await signedVersion('2026-12-04T16:00:00Z');
    expect(coolingOffWindow('2026-12-04').lastDayToCancel).toBe('2026-12-08');
    nowAt = new Date('2026-12-09T05:30:00Z'); // Tue 8 Dec, 23:30 in Chicago
    const c = await customer(s.proposalId);
    const before = await c.state();
    expect(before.status).toBe(200);
    expect(before.body.window).toEqual({ transactionDate: '2026-12-04', lastDayToCancel: '2026-12-08', open: true });
    const res = await c.cancel({ reason: 'We decided to wait a year.' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.cancellation).toMatchObject({ method: 'page', reason: 'We decided to wait a year.', sentOn: null });
    expect(res.body.window.open).toBe(false);
    const [row] = await cancellations(s.versionId);
    expect(row).toMatchObject({ by_customer: true, user_agent: 'Phone browser 1.0', method: 'page' });
    expect(row!.ip).toBeTruthy();
  });

  it('across Thanksgiving: signed the Wednesday before → the last day is Monday; just after its midnight is 409 naming it, nothing changes', async () => {
    // Wed 25 Nov 2026. By hand: Thu 26 Thanksgiving Day (named in 429.0(g)), Fri 27 (1), Sat 28 (2), Sun 29, Mon 30 (3).
    const s = await signedVersion('2026-11-25T18:00:00Z');
    expect(coolingOffWindow('2026-11-25').lastDayToCancel).toBe('2026-11-30');
    nowAt = new Date('2026-12-01T06:30:00Z'); // Tue 1 Dec, 00:30 in Chicago: the window closed 30 minutes ago
    const c = await customer(s.proposalId);
    expect((await c.state()).body.window).toEqual({
      transactionDate: '2026-11-25',
      lastDayToCancel: '2026-11-30',
      open: false,
    });
    const res = await c.cancel();
    expect(res.status).toBe(409);
    expect(isProblem(res)).toBe(true);
    expect(res.body.lastDayToCancel).toBe('2026-11-30');
    expect(res.body.detail).toContain('November 30, 2026');
    expect(await cancellations(s.versionId)).toHaveLength(0);
    expect(await trail(s.proposalId)).toEqual(['option-chosen', 'signed']);
    // An hour earlier (Mon 30 Nov, 23:30 in Chicago) it was still open.
    nowAt = new Date('2026-12-01T05:30:00Z');
    expect((await c.cancel()).status).toBe(201);
  });

  it('a state on two zones gives the buyer the later midnight (Texas: Central and, around El Paso, Mountain — from memory)', async () => {
    const s = await signedVersion('2026-11-25T18:00:00Z', 120_000, 'TX');
    nowAt = new Date('2026-12-01T06:30:00Z'); // 00:30 in Chicago, 23:30 on Mon 30 Nov in Denver
    const c = await customer(s.proposalId);
    expect((await c.state()).body.window).toMatchObject({ lastDayToCancel: '2026-11-30', open: true });
    expect((await c.cancel()).status).toBe(201);
  });
});

describe('cancelling with a paid deposit', () => {
  it('records it once, moves the job won → lost "Cancelled by buyer", refunds through the fake; the trail is in order', async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    nowAt = new Date('2026-12-05T18:00:00Z');
    const { intent, res } = await payDeposit(s);
    expect(res.status).toBe(200);
    expect((await paymentForVersion(em(), a.id, s.versionId))?.state).toBe('succeeded');
    expect(await jobOf(s.jobId)).toEqual({ status: 'won', lost_reason: null });
    const c = await customer(s.proposalId);
    const paid = (await c.state()).body;
    expect(paid.deposit).toMatchObject({ amountCents: 120_000, state: 'succeeded', refundPending: false });

    const cancelled = await c.cancel();
    expect(cancelled.status, JSON.stringify(cancelled.body)).toBe(201);
    expect(cancelled.body.deposit).toMatchObject({ state: 'succeeded', refundPending: true });
    expect(await jobOf(s.jobId)).toEqual({ status: 'lost', lost_reason: 'Cancelled by buyer' });

    await t.services.queue.drain();
    await t.payments.settled();
    const refunds = [...t.payments.refunds.values()].filter((r) => r.payment_intent === intent.id);
    expect(refunds).toHaveLength(1);
    expect(refunds[0]!.amount).toBe(120_000);
    const after = (await c.state()).body;
    expect(after.deposit).toMatchObject({ state: 'refunded', refundPending: false });
    expect(after.deposit.refundedAt).toBeTruthy();
    expect(await trail(s.proposalId)).toEqual(['option-chosen', 'signed', 'paid', 'cancelled', 'refunded']);

    // Twice: 409, and still one cancellation, one refund.
    const again = await c.cancel();
    expect(again.status).toBe(409);
    expect(isProblem(again)).toBe(true);
    expect(await cancellations(s.versionId)).toHaveLength(1);
    expect([...t.payments.refunds.values()].filter((r) => r.payment_intent === intent.id)).toHaveLength(1);
    // No deposit is taken on a cancelled proposal.
    expect((await c.deposit()).status).toBe(409);
  });

  it('a deposit never paid needs no refund: the cancellation alone', async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    nowAt = new Date('2026-12-05T18:00:00Z');
    const { res } = await payDeposit(s, DECLINED);
    expect(res.status).toBe(402);
    expect((await paymentForVersion(em(), a.id, s.versionId))?.state).toBe('failed');
    const c = await customer(s.proposalId);
    expect((await c.state()).body.deposit).toMatchObject({ state: 'failed', failure: 'Your card was declined.' });
    expect((await c.cancel()).status).toBe(201);
    await t.services.queue.drain();
    await t.payments.settled();
    expect((await paymentForVersion(em(), a.id, s.versionId))?.state).toBe('failed');
    expect(await trail(s.proposalId)).toEqual(['option-chosen', 'signed', 'cancelled']);
  });
});

describe('a payment that lands after the cancellation', () => {
  it('is refunded too, and the job stays lost', async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    nowAt = new Date('2026-12-05T18:00:00Z');
    const intent = await t.services.payments.createDepositIntent({
      amountCents: 120_000,
      metadata: { companyId: a.id, proposalId: s.proposalId, versionId: s.versionId },
      idempotencyKey: `deposit:${s.versionId}`,
    });
    await recordDepositIntent(em(), intent);
    const c = await customer(s.proposalId);
    expect((await c.cancel()).status).toBe(201);
    await t.services.queue.drain();
    // The confirm was already on its way from another tab.
    expect((await browserConfirm(intent.id, intent.clientSecret!, PAYS)).status).toBe(200);
    await t.payments.settled();
    await t.services.queue.drain();
    await t.payments.settled();
    expect((await paymentForVersion(em(), a.id, s.versionId))?.state).toBe('refunded');
    expect(await jobOf(s.jobId)).toEqual({ status: 'lost', lost_reason: 'Cancelled by buyer' });
    expect(await trail(s.proposalId)).toEqual(['option-chosen', 'signed', 'cancelled', 'paid', 'refunded']);
  });
});

describe('refusals', () => {
  it('an unsigned version is 409 and nothing is recorded', async () => {
    const s = await signedVersion(null);
    const c = await customer(s.proposalId);
    const res = await c.cancel();
    expect(res.status).toBe(409);
    expect(res.body.detail).toContain('not been signed');
    expect((await c.state()).body).toMatchObject({ signedAt: null, window: null, cancellation: null });
    expect(await cancellations(s.versionId)).toHaveLength(0);
  });

  it("another company's proposal is 404 even with a grant naming it", async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    const other = await makeCompany(em(), 'Other cancel');
    const c = await customer(s.proposalId, other.id);
    expect((await c.cancel()).status).toBe(404);
    expect((await c.state()).status).toBe(404);
    expect(await cancellations(s.versionId)).toHaveLength(0);
  });

  it('a body with anything but a reason is 400; a reason over 1,000 characters is 400', async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    nowAt = new Date('2026-12-05T18:00:00Z');
    const c = await customer(s.proposalId);
    expect((await c.cancel({ refundCents: 1 })).status).toBe(400);
    expect((await c.cancel({ reason: 'x'.repeat(1001) })).status).toBe(400);
    expect(await cancellations(s.versionId)).toHaveLength(0);
  });

  it('staff sessions cannot use the customer route (401)', async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    const owner = await login(t.app, a.users.owner.email);
    const res = await owner.agent
      .post(`/api/proposals/${s.proposalId}/cancellation`)
      .set('X-CSRF-Token', owner.csrf)
      .send({});
    expect(res.status).toBe(401);
  });
});

describe("the office records the buyer's mailed notice", () => {
  const officePost = async (role: 'owner' | 'estimator' | 'salesperson', jobId: string, body: object) => {
    const s = await login(t.app, a.users[role].email);
    return s.agent.post(`/api/jobs/${jobId}/proposal/cancellation`).set('X-CSRF-Token', s.csrf).send(body);
  };

  it('a notice postmarked on the last day counts though it arrives later (429.1(b)); the same effects as on the page', async () => {
    const s = await signedVersion('2026-11-25T18:00:00Z');
    await payDeposit(s);
    nowAt = new Date('2026-12-03T15:00:00Z'); // it reached the office on Thursday
    expect((await officePost('salesperson', s.jobId, { method: 'mail', sentOn: '2026-11-30' })).status).toBe(403);
    const late = await officePost('estimator', s.jobId, { method: 'mail', sentOn: '2026-12-01' });
    expect(late.status).toBe(409);
    expect(late.body.detail).toContain('November 30, 2026');
    const early = await officePost('estimator', s.jobId, { method: 'mail', sentOn: '2026-11-24' });
    expect(early.status).toBe(400);
    const future = await officePost('estimator', s.jobId, { method: 'mail', sentOn: '2026-12-04' });
    expect(future.status).toBe(400);
    expect(await cancellations(s.versionId)).toHaveLength(0);

    const res = await officePost('owner', s.jobId, { method: 'mail', sentOn: '2026-11-30', reason: 'Letter received' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.cancellation).toMatchObject({ method: 'mail', sentOn: '2026-11-30', reason: 'Letter received' });
    const [row] = await cancellations(s.versionId);
    expect(row).toMatchObject({ by_customer: false, by_user_id: a.users.owner.id, ip: null });
    expect(await jobOf(s.jobId)).toEqual({ status: 'lost', lost_reason: 'Cancelled by buyer' });
    await t.services.queue.drain();
    await t.payments.settled();
    expect((await paymentForVersion(em(), a.id, s.versionId))?.state).toBe('refunded');
    expect(await trail(s.proposalId)).toEqual(['option-chosen', 'signed', 'paid', 'cancelled', 'refunded']);
    expect((await officePost('estimator', s.jobId, { method: 'delivered', sentOn: '2026-11-30' })).status).toBe(409);
  });
});

describe('the cancellation record is insert-only in PostgreSQL', () => {
  it('UPDATE and DELETE are refused by the trigger; a second row for the version by the unique key', async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    nowAt = new Date('2026-12-05T18:00:00Z');
    expect((await (await customer(s.proposalId)).cancel()).status).toBe(201);
    await expect(
      em().execute('update "proposal_cancellation" set "reason" = \'changed\' where "version_id" = ?', [s.versionId]),
    ).rejects.toThrow(/recorded once and never changed/);
    await expect(
      em().execute('delete from "proposal_cancellation" where "version_id" = ?', [s.versionId]),
    ).rejects.toThrow(/recorded once and never changed/);
    await expect(
      em().execute(
        `insert into "proposal_cancellation" ("id", "company_id", "proposal_id", "version_id", "at", "method", "by_customer",
           "last_day_to_cancel") values (?, ?, ?, ?, now(), 'page', true, '2026-12-08')`,
        [randomUUID(), a.id, s.proposalId, s.versionId],
      ),
    ).rejects.toThrow(/proposal_cancellation_version_unique/);
    expect(await cancellations(s.versionId)).toHaveLength(1);
  });
});

describe("the deposit from the customer's browser", () => {
  it('the page is told the fake and its publishable key by the server, and the CSP lets it connect there only', async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    const state = await (await customer(s.proposalId)).state();
    expect(state.body.payWith).toEqual({
      apiUrl: t.payments.url,
      publishableKey: LOCAL_PUBLISHABLE_KEY,
      testMode: true,
    });
    const page = await request(t.app).get('/api/health').set(HTTPS);
    const csp = String(page.headers['content-security-policy']);
    expect(csp).toContain(`connect-src 'self' ${t.payments.url}`);
  });

  it('the fake takes a confirm with the publishable key and the client secret only; other calls need the secret key', async () => {
    const s = await signedVersion('2026-12-04T16:00:00Z');
    const intent = await t.services.payments.createDepositIntent({
      amountCents: 120_000,
      metadata: { companyId: a.id, proposalId: s.proposalId, versionId: s.versionId },
      idempotencyKey: `deposit:${s.versionId}`,
    });
    expect((await browserConfirm(intent.id, 'pi_wrong_secret_x', PAYS)).status).toBe(404);
    expect((await browserConfirm(intent.id, intent.clientSecret!, PAYS, 'pk_test_other')).status).toBe(401);
    const refund = await fetch(`${t.payments.url}/v1/refunds`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ payment_intent: intent.id, key: LOCAL_PUBLISHABLE_KEY }).toString(),
    });
    expect(refund.status).toBe(401);
    const declined = await browserConfirm(intent.id, intent.clientSecret!, DECLINED);
    expect(declined.status).toBe(402);
    expect(declined.headers.get('access-control-allow-origin')).toBe('*');
    expect(((await declined.json()) as { error: { message: string } }).error.message).toBe('Your card was declined.');
    const paid = await browserConfirm(intent.id, intent.clientSecret!, PAYS);
    expect(paid.status).toBe(200);
    expect(((await paid.json()) as { status: string }).status).toBe('succeeded');
    await t.payments.settled();
  });
});
