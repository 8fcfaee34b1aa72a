import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CANCELLED_BY_BUYER, DEFAULT_LOSS_REASONS } from '@contract';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, newJob, patch, post } from './jobs-helpers';
import { deskJob, newOption, seedData, singleZone } from './desk-helpers';
import { moveJobForProposal } from '../../server/src/modules/jobs/job-moves';
import { JobSchema } from '../../server/src/modules/jobs/job.entity';

/**
 * Issue 14 (office14): the job's proposal facts. The system's moves (moveJobForProposal, called by the
 * proposal slices inside their transaction), `hasProposal` on the job record, the hand "lost" with a reason
 * from the company's list (and its `marked-lost` event), and the owner's list itself.
 */
let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let owner: Session;
let estimator: Session;
let sales: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'Moves');
  await seedData(t.orm.em.fork(), a.id);
  b = await makeCompany(t.orm.em.fork(), 'MovesB');
  owner = await login(t.app, a.users.owner.email);
  estimator = await login(t.app, a.users.estimator.email);
  sales = await login(t.app, a.users.salesperson.email);
});
afterAll(async () => t.close());

const row = (id: string) => t.orm.em.fork().findOneOrFail(JobSchema, { id });
const readJob = async (s: Session, id: string) => {
  const r = await s.agent.get(`/api/jobs/${id}`);
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return r.body.job as { status: string; version: number; hasProposal: boolean; lostReason: string | null };
};
/** Puts a job in a status directly (the database), so each start is reachable. */
const putIn = (id: string, status: 'walkthrough' | 'design' | 'proposed' | 'won' | 'lost' | 'installed') =>
  t.orm.em.fork().nativeUpdate(JobSchema, { id }, { status, lostReason: null });
const move = (input: Parameters<typeof moveJobForProposal>[1]) =>
  t.orm.em.fork().transactional((tx) => moveJobForProposal(tx, input));

/** A job of company A with an issued proposal (one priced option, marked ready, version 1 issued). */
async function proposedJob(): Promise<string> {
  const { job, rooms } = await deskJob(estimator);
  await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '', 30) });
  const ready = await post(estimator, `/api/jobs/${job.id}/ready`).send({
    sizingOverride: { reason: 'The owner wants the larger unit for a sunny studio room.' },
  });
  expect(ready.status, JSON.stringify(ready.body)).toBe(200);
  const issued = await post(estimator, `/api/jobs/${job.id}/proposal/versions`).send();
  expect(issued.status, JSON.stringify(issued.body)).toBe(201);
  return job.id;
}

describe('moveJobForProposal (the system’s moves, inside the caller’s transaction)', () => {
  it('sent → proposed, signed → won, cancelled → lost with “Cancelled by buyer”; leaving lost clears it', async () => {
    const { id } = await newJob(sales);
    await putIn(id, 'design');
    const v0 = (await row(id)).version;
    expect(await move({ companyId: a.id, jobId: id, to: 'proposed', byUserId: a.users.estimator.id })).toEqual({
      from: 'design',
      to: 'proposed',
      changed: true,
    });
    const sent = await row(id);
    expect([sent.status, sent.lostReason, sent.changedByName]).toEqual(['proposed', null, a.users.estimator.name]);
    expect(sent.version).toBeGreaterThan(v0);
    // Sent again: it stays proposed, nothing written.
    expect(await move({ companyId: a.id, jobId: id, to: 'proposed' })).toEqual({
      from: 'proposed',
      to: 'proposed',
      changed: false,
    });
    expect((await row(id)).version).toBe(sent.version);

    expect((await move({ companyId: a.id, jobId: id, to: 'won' })).changed).toBe(true);
    const won = await row(id);
    // No staff member caused it (the customer signed): the last change says so.
    expect([won.status, won.changedById, won.changedByName]).toEqual(['won', null, 'The customer (proposal page)']);
    // A later send does not take a won job back to proposed.
    expect(await move({ companyId: a.id, jobId: id, to: 'proposed' })).toEqual({
      from: 'won',
      to: 'won',
      changed: false,
    });

    expect(await move({ companyId: a.id, jobId: id, to: 'lost' })).toEqual({ from: 'won', to: 'lost', changed: true });
    expect([(await row(id)).status, (await row(id)).lostReason]).toEqual(['lost', CANCELLED_BY_BUYER]);
    const record = await readJob(estimator, id);
    expect([record.status, record.lostReason]).toEqual(['lost', CANCELLED_BY_BUYER]);

    // Sent again after a cancellation: proposed, and the lost reason goes with the lost status.
    await move({ companyId: a.id, jobId: id, to: 'proposed' });
    expect([(await row(id)).status, (await row(id)).lostReason]).toEqual(['proposed', null]);
  });

  it('an installed job is never marked lost (409) and stays installed when signed again', async () => {
    const { id } = await newJob(sales);
    await putIn(id, 'installed');
    await expect(move({ companyId: a.id, jobId: id, to: 'lost' })).rejects.toMatchObject({ status: 409 });
    expect(await move({ companyId: a.id, jobId: id, to: 'won' })).toEqual({
      from: 'installed',
      to: 'installed',
      changed: false,
    });
    expect((await row(id)).status).toBe('installed');
  });

  it('another company’s job is 404 and unchanged; a rolled-back transaction leaves the job as it was', async () => {
    const { id } = await newJob(sales);
    await putIn(id, 'design');
    await expect(move({ companyId: b.id, jobId: id, to: 'proposed' })).rejects.toMatchObject({ status: 404 });
    expect((await row(id)).status).toBe('design');
    const before = await row(id);
    await expect(
      t.orm.em.fork().transactional(async (tx) => {
        await moveJobForProposal(tx, { companyId: a.id, jobId: id, to: 'proposed' });
        throw new Error('the send failed after the move');
      }),
    ).rejects.toThrow('the send failed');
    const after = await row(id);
    expect([after.status, after.version]).toEqual(['design', before.version]);
  });
});

describe('the job record carries hasProposal, and the hand moves use it', () => {
  it('false before the first version, true after; “proposed” by hand is refused before and allowed after', async () => {
    const { job } = await deskJob(estimator);
    expect((await readJob(estimator, job.id)).hasProposal).toBe(false);
    const design = await readJob(estimator, job.id);
    const early = await patch(estimator, `/api/jobs/${job.id}`, design.version).send({ status: 'proposed' });
    expectProblem(early, 422);

    const id = await proposedJob();
    const now = await readJob(estimator, id);
    expect(now.hasProposal).toBe(true);
    const list = await estimator.agent.get('/api/jobs').query({ pageSize: 100 });
    const listed = (list.body.items as { id: string; hasProposal: boolean }[]).find((j) => j.id === id);
    expect(listed?.hasProposal).toBe(true);
    await putIn(id, 'design');
    const moved = await patch(estimator, `/api/jobs/${id}`, (await row(id)).version).send({ status: 'proposed' });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    expect([moved.body.job.status, moved.body.job.hasProposal]).toEqual(['proposed', true]);
  });
});

describe('marking a job lost by hand', () => {
  it('needs a reason from the company’s list (422, nothing changed, otherwise); the reason shows on the job', async () => {
    const { id } = await newJob(sales);
    const before = await readJob(sales, id);
    // A malformed body is 400 (the schema); a reason missing or off the list is 422 (the rule).
    for (const [body, status] of [
      [{ status: 'lost' }, 422],
      [{ status: 'lost', lostReason: 'The dog ate the proposal' }, 422],
      [{ status: 'lost', lostReason: CANCELLED_BY_BUYER }, 422],
      [{ status: 'lost', lostReason: '' }, 400],
      [{ lostReason: DEFAULT_LOSS_REASONS[0] }, 422],
    ] as const) {
      const r = await patch(sales, `/api/jobs/${id}`, before.version).send(body);
      expectProblem(r, status);
      expect(JSON.stringify(r.body.errors), JSON.stringify(body)).toContain('lostReason');
    }
    const unchanged = await row(id);
    expect([unchanged.status, unchanged.lostReason, unchanged.version]).toEqual(['walkthrough', null, before.version]);

    // The list's own spelling is kept, whatever the case sent.
    const lost = await patch(sales, `/api/jobs/${id}`, before.version).send({
      status: 'lost',
      lostReason: ` ${DEFAULT_LOSS_REASONS[1]?.toUpperCase()} `,
    });
    expect(lost.status, JSON.stringify(lost.body)).toBe(200);
    expect([lost.body.job.status, lost.body.job.lostReason]).toEqual(['lost', DEFAULT_LOSS_REASONS[1]]);
    // Back to design: the reason goes.
    const back = await patch(sales, `/api/jobs/${id}`, lost.body.job.version).send({ status: 'design' });
    expect([back.body.job.status, back.body.job.lostReason]).toEqual(['design', null]);
  });

  it('writes a marked-lost event on the proposal’s current version, after the issuing events', async () => {
    const id = await proposedJob();
    const { version, status: from } = await row(id);
    const r = await patch(estimator, `/api/jobs/${id}`, version).send({
      status: 'lost',
      lostReason: DEFAULT_LOSS_REASONS[0],
    });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const trail = await estimator.agent.get(`/api/jobs/${id}/proposal`);
    const events = trail.body.proposal.events as {
      seq: number;
      kind: string;
      versionNumber: number | null;
      by: { kind: string; name?: string };
      data: Record<string, unknown>;
    }[];
    const last = events.filter((e) => !e.kind.startsWith('pdf-')).at(-1);
    expect(last).toMatchObject({
      kind: 'marked-lost',
      versionNumber: 1,
      by: { kind: 'staff', name: a.users.estimator.name },
      data: { reason: DEFAULT_LOSS_REASONS[0], from },
    });
    const issued = events.find((e) => e.kind === 'issued');
    expect(last && issued && last.seq > issued.seq).toBe(true);
  });

  it('a job without a proposal writes no event and has no trail', async () => {
    const { id } = await newJob(sales);
    const r = await patch(sales, `/api/jobs/${id}`, (await row(id)).version).send({
      status: 'lost',
      lostReason: DEFAULT_LOSS_REASONS[2],
    });
    expect(r.status).toBe(200);
    const trail = await sales.agent.get(`/api/jobs/${id}/proposal`);
    expect(trail.body.proposal).toBeNull();
  });
});

describe('the company’s loss reasons', () => {
  it('start as the defaults; the owner replaces them; the hand move then takes only the new list', async () => {
    const start = await estimator.agent.get('/api/company/loss-reasons');
    expect(start.status).toBe(200);
    expect(start.body.lossReasons).toEqual({
      reasons: [...DEFAULT_LOSS_REASONS],
      systemReason: CANCELLED_BY_BUYER,
      isDefault: true,
      version: 0,
    });
    const put = (s: Session, version: number, body: object) =>
      s.agent.put('/api/company/loss-reasons').set('X-CSRF-Token', s.csrf).set('If-Match', `"${version}"`).send(body);

    expectProblem(await put(estimator, 0, { reasons: ['Price too high'] }), 403);
    for (const bad of [
      { reasons: [] },
      { reasons: ['Price too high', 'price too high '] },
      { reasons: ['cancelled BY buyer'] },
      { reasons: ['Two\nlines'] },
      { reasons: ['x'.repeat(81)] },
      { reasons: Array.from({ length: 21 }, (_, i) => `Reason ${i}`) },
    ])
      expectProblem(await put(owner, 0, bad), 400);
    expect((await estimator.agent.get('/api/company/loss-reasons')).body.lossReasons.isDefault).toBe(true);

    const saved = await put(owner, 0, { reasons: ['  Chose a heat pump water heater first ', 'Moved away'] });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body.lossReasons).toMatchObject({
      reasons: ['Chose a heat pump water heater first', 'Moved away'],
      isDefault: false,
      version: 1,
    });
    // A stale If-Match is a 409 with the list as it is now.
    const stale = await put(owner, 0, { reasons: ['Other'] });
    expectProblem(stale, 409);

    const { id } = await newJob(sales);
    const version = (await row(id)).version;
    expectProblem(
      await patch(sales, `/api/jobs/${id}`, version).send({ status: 'lost', lostReason: DEFAULT_LOSS_REASONS[0] }),
      422,
    );
    const ok = await patch(sales, `/api/jobs/${id}`, version).send({ status: 'lost', lostReason: 'moved away' });
    expect([ok.status, ok.body.job.lostReason]).toEqual([200, 'Moved away']);

    // Another company still has the defaults.
    const other = await login(t.app, b.users.estimator.email);
    expect((await other.agent.get('/api/company/loss-reasons')).body.lossReasons.isDefault).toBe(true);
  });
});
