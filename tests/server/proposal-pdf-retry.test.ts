import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, post } from './jobs-helpers';
import { deskJob, newOption, seedData, singleZone } from './desk-helpers';

/**
 * Issue 14 (office14): the office's "Try again" for a PDF that failed after the queue's last try. Workers are
 * off: the test drains the queue itself, so it sees each try.
 */
let t: TestApp;
let a: TestCompany;
let estimator: Session;
let sales: Session;
let other: Session;

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off' });
  a = await makeCompany(t.orm.em.fork(), 'Retry');
  await seedData(t.orm.em.fork(), a.id);
  const b = await makeCompany(t.orm.em.fork(), 'RetryB');
  estimator = await login(t.app, a.users.estimator.email);
  sales = await login(t.app, a.users.salesperson.email);
  other = await login(t.app, b.users.estimator.email);
});
afterAll(async () => t.close());

async function issuedJob(): Promise<string> {
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

const pdfState = async (jobId: string) =>
  ((await estimator.agent.get(`/api/jobs/${jobId}/proposal`)).body.proposal.versions[0] as { pdf: { state: string } })
    .pdf.state;
const retry = (s: Session, jobId: string, n: number | string = 1) =>
  post(s, `/api/jobs/${jobId}/proposal/versions/${n}/pdf/retry`).send();

describe('POST …/versions/:n/pdf/retry', () => {
  it('refuses a PDF still waiting (409), queues a failed one again, and the next try makes it', async () => {
    const jobId = await issuedJob();
    expect(await pdfState(jobId)).toBe('waiting');
    const early = await retry(estimator, jobId);
    expectProblem(early, 409);
    expect(early.body.detail).toBe('The PDF of this version is already being prepared.');

    const put = vi.spyOn(t.services.storage, 'put').mockRejectedValue(new Error('disk full'));
    await t.services.queue.drain();
    for (let i = 0; i < 5; i++) await t.services.queue.drain({ retriesNow: true });
    put.mockRestore();
    expect(await pdfState(jobId)).toBe('failed');

    // Not the office's: a salesperson 403, another company 404; nothing changes.
    expectProblem(await retry(sales, jobId), 403);
    expectProblem(await retry(other, jobId), 404);
    expectProblem(await retry(estimator, jobId, 2), 404);
    expectProblem(await retry(estimator, jobId, 'x'), 400);
    expect(await pdfState(jobId)).toBe('failed');

    const again = await retry(estimator, jobId);
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body.proposal.versions[0].pdf.state).toBe('waiting');
    await t.services.queue.drain();
    expect(await pdfState(jobId)).toBe('ready');
    const kinds = (
      (await estimator.agent.get(`/api/jobs/${jobId}/proposal`)).body.proposal.events as { kind: string }[]
    )
      .map((e) => e.kind)
      .filter((k) => k.startsWith('pdf-'));
    expect(kinds).toEqual(['pdf-failed', 'pdf-ready']);
    const done = await retry(estimator, jobId);
    expectProblem(done, 409);
    expect(done.body.detail).toMatch(/is ready/);
  });
});
