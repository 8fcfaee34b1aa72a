import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { proposalSnapshot } from '@contract';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, patch, post } from './jobs-helpers';
import { deskJob, newOption, seedData, singleZone } from './desk-helpers';
import { issueVersion, snapshotSha256 } from '../../server/src/modules/proposals/proposal.service';
import { ProposalEventSchema, ProposalVersionSchema } from '../../server/src/modules/proposals/proposal.entity';
import { systemClock } from '../../server/src/services/services';

/** Issue 14 (versions): issuing freezes a version worked out by the server; reads, diff, tenants, one transaction. */
let t: TestApp;
let a: TestCompany;
let estimator: Session;
let sales: Session;
let otherEstimator: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'Proposal');
  await seedData(t.orm.em.fork(), a.id);
  const b = await makeCompany(t.orm.em.fork(), 'ProposalB');
  await seedData(t.orm.em.fork(), b.id);
  estimator = await login(t.app, a.users.estimator.email);
  sales = await login(t.app, a.users.salesperson.email);
  otherEstimator = await login(t.app, b.users.estimator.email);
});
afterAll(async () => t.close());

const REASON = 'The owner keeps this room cool for a home studio; the larger unit is wanted.';
const markReady = async (jobId: string) => {
  const r = await post(estimator, `/api/jobs/${jobId}/ready`).send({ sizingOverride: { reason: REASON } });
  expect(r.status, JSON.stringify(r.body)).toBe(200);
};

/** A job of company A with one priced option (a 12k pair on the living room). */
async function pricedJob() {
  const { job, rooms } = await deskJob(estimator);
  const option = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '', 30) });
  return { jobId: job.id, option };
}

describe('issuing a proposal version', () => {
  it('refuses a job not marked ready with 409 and says why; nothing is stored', async () => {
    const { jobId } = await pricedJob();
    const r = await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send();
    expectProblem(r, 409);
    expect(r.body.detail).toMatch(/ready to propose/);
    const read = await estimator.agent.get(`/api/jobs/${jobId}/proposal`);
    expect(read.status).toBe(200);
    expect(read.body.proposal).toBeNull();
    expect(read.body.canIssue).toEqual({ ok: false, fix: 'desk', reason: expect.stringMatching(/ready to propose/) });
  });

  it('freezes what the desk shows; a second issue makes version 2 and supersedes 1; the snapshot reads back identical; the trail is in order', async () => {
    const { jobId, option } = await pricedJob();
    await markReady(jobId);
    const desk = await estimator.agent.get(`/api/jobs/${jobId}/desk`);
    const deskTotal = desk.body.options[0].result.price.totalCents as number;
    const first = await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send();
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body.proposal.versions).toHaveLength(1);
    const v1 = await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/1`);
    expect(v1.status).toBe(200);
    const snap1 = proposalSnapshot.parse(v1.body.snapshot);
    // The server's own figures: the option's total is the desk's, recomputed from the saved inputs.
    expect(snap1.options[0]?.price.totalCents).toBe(deskTotal);
    expect(snap1.options[0]?.systems[0]?.outdoor.key).toBe('TSL-S12H-O');
    expect(snap1.options[0]?.systems[0]?.lineSets[0]?.lengthFt).toBe(30);
    expect(snap1.loads.rooms.map((r) => r.name)).toEqual(['Living room', 'Main bedroom', 'Office']);
    expect(v1.body.version.snapshotSha256).toBe(snapshotSha256(v1.body.snapshot));
    // Read again: byte for byte the same snapshot.
    const again = await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/1`);
    expect(JSON.stringify(again.body.snapshot)).toBe(JSON.stringify(v1.body.snapshot));

    // A change to the option takes the ready mark off; issuing again is refused until the office marks it.
    const renamed = await patch(estimator, `/api/jobs/${jobId}/options/${option.id}`, option.version).send({
      name: 'Essential plus',
      design: singleZone(String(snap1.loads.rooms[0]?.roomId), 45),
    });
    expect(renamed.status, JSON.stringify(renamed.body)).toBe(200);
    expectProblem(await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send(), 409);
    await markReady(jobId);
    const second = await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send();
    expect(second.status).toBe(201);
    const versions = second.body.proposal.versions as {
      number: number;
      current: boolean;
      supersededAt: string | null;
    }[];
    expect(versions.map((v) => [v.number, v.current, v.supersededAt === null])).toEqual([
      [2, true, true],
      [1, false, false],
    ]);
    const events = second.body.proposal.events as { seq: number; kind: string; versionNumber: number }[];
    // The PDF renders in the background (the test app runs the queue), so its 'pdf-ready' lands at its own time.
    const issuing = events.filter((e) => !e.kind.startsWith('pdf-'));
    expect(issuing.map((e) => [e.kind, e.versionNumber])).toEqual([
      ['issued', 1],
      ['superseded', 1],
      ['issued', 2],
    ]);
    expect(events.map((e) => e.seq)).toEqual([...events.map((e) => e.seq)].sort((x, y) => x - y));
    // Version 1 is unchanged by the second issue.
    const v1After = await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/1`);
    expect(JSON.stringify(v1After.body.snapshot)).toBe(JSON.stringify(v1.body.snapshot));
    expect(v1After.body.version.current).toBe(false);

    // What changed: the option's name and its line set's run, each once, in sentences.
    const diff = await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/1/diff/2`);
    expect(diff.status).toBe(200);
    const sentences = (diff.body.changes as { area: string; sentence: string }[]).map((c) => c.sentence);
    expect(sentences).toContain('Option “Essential plus”: name “Essential” → “Essential plus”.');
    expect(sentences.filter((s) => s.includes('line set') && s.includes('run (ft) 30 → 45'))).toHaveLength(1);
    expect((diff.body.changes as { area: string }[]).some((c) => c.area === 'prices')).toBe(true);
    const none = await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/2/diff/2`);
    expect(none.body.changes).toEqual([]);
  });

  it('another company’s proposal is 404; a salesperson may read but not issue; a bad version number is a problem', async () => {
    const { jobId } = await pricedJob();
    await markReady(jobId);
    expect((await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send()).status).toBe(201);
    expectProblem(await otherEstimator.agent.get(`/api/jobs/${jobId}/proposal`), 404);
    expectProblem(await otherEstimator.agent.get(`/api/jobs/${jobId}/proposal/versions/1`), 404);
    expectProblem(await otherEstimator.agent.get(`/api/jobs/${jobId}/proposal/versions/1/diff/1`), 404);
    expectProblem(await post(otherEstimator, `/api/jobs/${jobId}/proposal/versions`).send(), 404);
    expectProblem(await post(sales, `/api/jobs/${jobId}/proposal/versions`).send(), 403);
    expectProblem(await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/7`), 404);
    expectProblem(await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/first`), 400);
  });

  it('issuing queues the PDF in its transaction: once the queue has run, the version’s PDF is ready and served', async () => {
    const { jobId } = await pricedJob();
    await markReady(jobId);
    expect((await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send()).status).toBe(201);
    await t.services.queue.drain();
    const read = await estimator.agent.get(`/api/jobs/${jobId}/proposal`);
    expect(read.body.proposal.versions[0]).toMatchObject({ number: 1, pdf: { state: 'ready' } });
    const pdf = await estimator.agent
      .get(`/api/jobs/${jobId}/proposal/versions/1/pdf`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect((pdf.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('is one transaction: a failure after the version is written leaves no version and no event', async () => {
    const { jobId } = await pricedJob();
    await markReady(jobId);
    const em = t.orm.em.fork();
    const actor = { userId: a.users.estimator.id, companyId: a.id, role: 'estimator' as const, name: '', email: '' };
    await expect(
      issueVersion({ em, clock: systemClock, actor }, jobId, async (tx, version) => {
        // The version and its event are in the transaction at this point…
        expect(await tx.count(ProposalVersionSchema, { id: version.id })).toBe(1);
        throw new Error('forced failure after the version insert');
      }),
    ).rejects.toThrow('forced failure');
    const check = t.orm.em.fork();
    expect(await check.count(ProposalVersionSchema, { company: a.id, proposal: { job: jobId } })).toBe(0);
    expect(await check.count(ProposalEventSchema, { company: a.id, proposal: { job: jobId } })).toBe(0);
    const read = await estimator.agent.get(`/api/jobs/${jobId}/proposal`);
    expect(read.body.proposal).toBeNull();
  });
});
