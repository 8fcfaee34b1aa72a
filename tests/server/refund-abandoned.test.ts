import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PAYS } from '../../server/src/fakes/payments-fake';
import { paymentForVersion, recordDepositIntent } from '../../server/src/modules/payments/payments.service';
import { LOCAL_PUBLISHABLE_KEY } from '../../server/src/services/payments';
import { login, makeCompany, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { newJob } from './jobs-helpers';

/**
 * Issue 14, faults: a `refund-deposit` try lost with its process (SIGKILL in the middle of it: the worker's
 * lock is left behind, as tests/server/process-kill.test.ts shows for a render). The refund writes nothing
 * until it ends, so the lost try may have made the refund at the payment service without recording it; the
 * next try asks again with the same idempotency key `refund:<payment id>` and the service answers with that
 * same refund (the payments fake replays a key's first answer, as the real service does). This app runs no
 * workers: the test puts the job as a dead process's worker leaves it, calls the queue's releaseAbandoned
 * (which a starting process and the minute's sweep run) and then drains the queue.
 */
const namespace = `r-${randomUUID().slice(0, 8)}`;
let t: TestApp;
let a: TestCompany;
const em = () => t.orm.em.fork();
const sql = <T>(query: string, params: unknown[] = []) => em().getConnection().execute<T[]>(query, params);

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off', QUEUE_NAMESPACE: namespace });
  a = await makeCompany(em(), 'Refunds');
});
afterAll(async () => t.close());

/** The fake's webhooks delivered to this app, as buildTestApp does; `hold` keeps them back instead. */
let held: Array<{ body: string; signature: string }> | null = null;
const deliver = async (body: string, signature: string) =>
  (
    await request(t.app)
      .post('/api/hooks/payments')
      .set('X-Forwarded-Proto', 'https')
      .set('Content-Type', 'application/json; charset=utf-8')
      .set('Stripe-Signature', signature)
      .send(body)
  ).status;
beforeAll(() =>
  t.payments.setWebhookTarget(async (body, signature) => {
    if (!held) return deliver(body, signature);
    held.push({ body, signature });
    return 200;
  }),
);

/**
 * A signed version of a new job, cancelled by the buyer, whose deposit (120,000 cents) was then paid: the
 * payment's webhook finds the cancellation and queues the refund (payments.service.ts), as when the buyer's
 * confirm was on its way while they cancelled. Rows as the signing and cancelling slices write them.
 */
async function cancelledPaidDeposit() {
  const estimator = await login(t.app, a.users.estimator.email);
  const job = await newJob(estimator, { region: 'Illinois' });
  const proposalId = randomUUID();
  const versionId = randomUUID();
  await sql('insert into "proposal" ("id", "company_id", "job_id", "created_at") values (?, ?, ?, now())', [
    proposalId,
    a.id,
    job.id,
  ]);
  await sql(
    `insert into "proposal_version" ("id", "company_id", "proposal_id", "number", "snapshot", "snapshot_sha256",
       "calc_version", "issued_by_id", "issued_by_name", "issued_at")
     values (?, ?, ?, 1, ?::jsonb, ?, '0.1.0', ?, 'Test estimator', '2026-12-01T15:00:00Z')`,
    [
      versionId,
      a.id,
      proposalId,
      JSON.stringify({ schema: 1, options: [{ position: 1, name: 'Option 1', price: { depositCents: 120_000 } }] }),
      'd'.repeat(64),
      a.users.estimator.id,
    ],
  );
  await sql(
    `insert into "proposal_cancellation" ("id", "company_id", "proposal_id", "version_id", "at", "method",
       "by_customer", "last_day_to_cancel") values (?, ?, ?, ?, now(), 'page', true, '2026-12-08')`,
    [randomUUID(), a.id, proposalId, versionId],
  );
  const intent = await t.services.payments.createDepositIntent({
    amountCents: 120_000,
    metadata: { companyId: a.id, proposalId, versionId },
    idempotencyKey: `deposit:${versionId}`,
  });
  await recordDepositIntent(em(), intent);
  const confirmed = await fetch(`${t.payments.url}/v1/payment_intents/${intent.id}/confirm`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({
      payment_method: PAYS,
      client_secret: intent.clientSecret!,
      key: LOCAL_PUBLISHABLE_KEY,
    }),
  });
  expect(confirmed.status).toBe(200);
  await t.payments.settled();
  const payment = await paymentForVersion(em(), a.id, versionId);
  expect(payment?.state).toBe('succeeded');
  return { proposalId, versionId, intentId: intent.id, paymentId: payment!.id };
}

const JOBS = 'graphile_worker._private_jobs j join graphile_worker._private_tasks t on t.id = j.task_id';
const refundJobs = (paymentId: string) =>
  sql<{ id: string; key: string | null; locked_by: string | null; attempts: number; max_attempts: number }>(
    `select j.id, j.key, j.locked_by, j.attempts, j.max_attempts from ${JOBS}
      where t.identifier = ? and j.payload->>'paymentId' = ? order by j.id`,
    [`${namespace}:refund-deposit`, paymentId],
  );

/** The job as a worker of a process that is gone leaves it: locked by `gl:<token>:0`, no connection of that token. */
async function lockedByTheDead(jobId: string, attempts: 'first' | 'last') {
  await sql(
    `update graphile_worker._private_jobs
        set locked_by = 'gl:00000dead0ff:0', locked_at = now(),
            attempts = case when ? then max_attempts else 1 end
      where id = ?`,
    [attempts === 'last', jobId],
  );
}

const refundsOf = (intentId: string) => [...t.payments.refunds.values()].filter((r) => r.payment_intent === intentId);
const trail = async (proposalId: string) =>
  (
    await sql<{ kind: string }>('select "kind" from "proposal_event" where "proposal_id" = ? order by "seq"', [
      proposalId,
    ])
  ).map((r) => r.kind);

describe('a refund left half-done by a killed process', () => {
  it('is taken up again: the lost try’s refund is the one recorded, never a second', async () => {
    const d = await cancelledPaidDeposit();
    const [job] = await refundJobs(d.paymentId);
    expect(job).toMatchObject({ key: `refund:${d.paymentId}`, locked_by: null, attempts: 0 });

    // The lost try: the service made the refund (its webhook not delivered yet), then the process died before
    // the row recorded it.
    held = [];
    const lost = await t.services.payments.refund(d.intentId, `refund:${d.paymentId}`);
    await t.payments.settled();
    await lockedByTheDead(job!.id, 'first');
    expect((await paymentForVersion(em(), a.id, d.versionId))?.refund_id).toBeNull();

    expect(await t.services.queue.releaseAbandoned()).toBe(1);
    expect((await refundJobs(d.paymentId))[0]?.locked_by).toBeNull();
    await t.services.queue.drain();
    await t.payments.settled();
    // One refund at the service, and the row names it.
    expect(refundsOf(d.intentId).map((r) => [r.id, r.amount])).toEqual([[lost.id, 120_000]]);
    expect((await paymentForVersion(em(), a.id, d.versionId))?.refund_id).toBe(lost.id);
    expect(await refundJobs(d.paymentId)).toEqual([]); // done

    // The service's webhooks arrive (the refund's, and the replayed one if any): refunded once, on the trail once.
    const waiting = held;
    held = null;
    for (const w of waiting) expect(await deliver(w.body, w.signature)).toBe(200);
    const payment = await paymentForVersion(em(), a.id, d.versionId);
    expect([payment?.state, payment?.refund_id]).toEqual(['refunded', lost.id]);
    expect((await trail(d.proposalId)).filter((k) => k === 'refunded')).toHaveLength(1);
  }, 60_000);

  it('lost on its last try, it is queued again under the same key (the money is still owed) and refunded once', async () => {
    const d = await cancelledPaidDeposit();
    const [job] = await refundJobs(d.paymentId);
    await lockedByTheDead(job!.id, 'last');

    expect(await t.services.queue.releaseAbandoned()).toBe(1);
    expect(await t.services.queue.releaseAbandoned()).toBe(0); // nothing left to release
    // The spent job keeps no key and no tries; a fresh one holds the key.
    const jobs = await refundJobs(d.paymentId);
    expect(jobs.map((j) => [j.id === job!.id, j.key, j.locked_by, j.attempts === j.max_attempts])).toEqual(
      expect.arrayContaining([
        [true, null, null, true],
        [false, `refund:${d.paymentId}`, null, false],
      ]),
    );
    expect(jobs).toHaveLength(2);

    await t.services.queue.drain();
    await t.payments.settled();
    expect(refundsOf(d.intentId).map((r) => r.amount)).toEqual([120_000]);
    const payment = await paymentForVersion(em(), a.id, d.versionId);
    expect(payment?.state).toBe('refunded');
    expect((await trail(d.proposalId)).filter((k) => k === 'refunded')).toHaveLength(1);
  }, 60_000);

  it('lost on its last try after the refund was recorded: nothing is queued again', async () => {
    const d = await cancelledPaidDeposit();
    const [job] = await refundJobs(d.paymentId);
    await t.services.queue.drain(); // the refund goes through
    await t.payments.settled();
    expect((await paymentForVersion(em(), a.id, d.versionId))?.state).toBe('refunded');
    // As if the process had died after recording it (the job row still there, locked, its last try).
    await sql(
      `insert into graphile_worker._private_jobs (job_queue_id, task_id, payload, run_at, max_attempts, key)
       select null, t.id, ?::json, now(), 10, null from graphile_worker._private_tasks t where t.identifier = ?`,
      [JSON.stringify({ paymentId: d.paymentId }), `${namespace}:refund-deposit`],
    );
    const [again] = await refundJobs(d.paymentId);
    expect(again?.id).not.toBe(job?.id);
    await lockedByTheDead(again!.id, 'last');
    expect(await t.services.queue.releaseAbandoned()).toBe(1);
    expect((await refundJobs(d.paymentId)).map((j) => j.attempts === j.max_attempts)).toEqual([true]);
    await t.services.queue.drain();
    expect(refundsOf(d.intentId)).toHaveLength(1);
  }, 60_000);
});
