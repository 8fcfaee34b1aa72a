import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@contract';
import { NotFoundError } from '../../server/src/lib/errors';
import type { Actor } from '../../server/src/lib/route';
import { assertInstallerMayOpen, soldOption } from '../../server/src/modules/install/assignment';
import { findJob } from '../../server/src/modules/jobs/job-access';
import { systemClock } from '../../server/src/services/services';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';
import { assignDirect, cancelSigned, signedJob } from './install-helpers';
import { expectProblem } from './jobs-helpers';

/**
 * Issue 15 (pack15): the policy every installer-facing piece uses — an installer opens only a job they are
 * assigned to (404 otherwise, the same as a job that does not exist; another company's job 404 for
 * everyone) — and the sold option, read from the signed, not-cancelled version's frozen snapshot.
 */
let t: TestApp;
let db: pg.Client;
let a: TestCompany;
let b: TestCompany;
let estimator: Session;
let estimatorB: Session;

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off' });
  a = await makeCompany(t.orm.em.fork(), 'Assign');
  b = await makeCompany(t.orm.em.fork(), 'AssignB');
  estimator = await login(t.app, a.users.estimator.email);
  estimatorB = await login(t.app, b.users.estimator.email);
  db = new pg.Client({ connectionString: testDatabaseUrl() });
  await db.connect();
}, 60_000);
afterAll(async () => {
  await db?.end();
  await t?.close();
});

const actor = (c: TestCompany, role: Role): Actor => ({
  userId: c.users[role].id,
  companyId: c.id,
  role,
  name: c.users[role].name,
  email: c.users[role].email,
});

async function status404(p: Promise<unknown>): Promise<void> {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(NotFoundError);
  expect((err as NotFoundError).status).toBe(404);
}

describe('assertInstallerMayOpen', () => {
  it('refuses an installer who is not assigned with a 404, and opens the job once they are', async () => {
    const job = await signedJob(db, a, estimator);
    const em = t.orm.em.fork();
    await status404(assertInstallerMayOpen(em, actor(a, 'installer'), job.jobId));
    const ctx = () => ({ em: t.orm.em.fork(), actor: actor(a, 'installer'), clock: systemClock });
    await status404(findJob(ctx(), job.jobId));

    const installer = await login(t.app, a.users.installer.email);
    expectProblem(await installer.agent.get(`/api/jobs/${job.jobId}`), 404);
    const before = await installer.agent.get('/api/jobs');
    expect(before.status).toBe(200);
    expect(before.body.items.map((j: { id: string }) => j.id)).not.toContain(job.jobId);

    await assignDirect(db, a, job.jobId, a.users.installer.id);
    const open = await assertInstallerMayOpen(t.orm.em.fork(), actor(a, 'installer'), job.jobId);
    expect(open).toEqual({ id: job.jobId, status: 'won', companyId: a.id });
    // The entity scope (jobScope, used where a job is loaded to change) follows the same rule as the SQL one.
    expect((await findJob(ctx(), job.jobId)).id).toBe(job.jobId);
    // The job routes use the same scope: the job and its list entry now answer.
    expect((await installer.agent.get(`/api/jobs/${job.jobId}`)).status).toBe(200);
    const after = await installer.agent.get('/api/jobs');
    expect(after.body.items.map((j: { id: string }) => j.id)).toContain(job.jobId);
  });

  it('lets the office open any job of the company, and nobody of another company', async () => {
    const job = await signedJob(db, a, estimator);
    const em = t.orm.em.fork();
    for (const role of ['owner', 'estimator'] as const)
      expect((await assertInstallerMayOpen(em, actor(a, role), job.jobId)).id).toBe(job.jobId);
    // Another company's people, their installer assigned to nothing here, and a made-up id: all 404.
    for (const role of ['owner', 'estimator', 'installer'] as const)
      await status404(assertInstallerMayOpen(em, actor(b, role), job.jobId));
    await status404(assertInstallerMayOpen(em, actor(a, 'owner'), '00000000-0000-4000-8000-000000000000'));
    await status404(assertInstallerMayOpen(em, actor(a, 'owner'), 'not-a-uuid'));
    expectProblem(await estimatorB.agent.get(`/api/jobs/${job.jobId}`), 404);
  });

  it('does not let an assignment in company A open company B’s job for that installer', async () => {
    const jobB = await signedJob(db, b, estimatorB);
    const jobA = await signedJob(db, a, estimator);
    await assignDirect(db, a, jobA.jobId, a.users.installer.id);
    await status404(assertInstallerMayOpen(t.orm.em.fork(), actor(a, 'installer'), jobB.jobId));
  });
});

describe('soldOption', () => {
  it('reads the option the customer signed for from the signed version’s frozen snapshot', async () => {
    const job = await signedJob(db, a, estimator, {
      position: 2,
      edit: (s) => {
        s.options[1]!.name = 'Better, as signed';
        s.options[1]!.systems[0]!.outdoor.key = 'FX-30H2-SIGNED';
      },
    });
    const sold = await soldOption(t.orm.em.fork(), a.id, job.jobId);
    expect(sold).not.toBeNull();
    expect(sold!.versionId).toBe(job.versionId);
    expect(sold!.versionNumber).toBe(2);
    expect(sold!.position).toBe(2);
    // Version 2's option 2, not version 1's (which still says 'Better') and not option 1 or 3.
    expect(sold!.option.name).toBe('Better, as signed');
    expect(sold!.option.systems[0]!.outdoor.key).toBe('FX-30H2-SIGNED');
    expect(sold!.snapshot.customer.name).toBe('Odalys Brackenridge');
  });

  it('is null before a signature, after a cancellation, and for another company', async () => {
    const unsigned = await signedJob(db, a, estimator, { sign: false });
    expect(await soldOption(t.orm.em.fork(), a.id, unsigned.jobId)).toBeNull();

    const cancelled = await signedJob(db, a, estimator);
    expect(await soldOption(t.orm.em.fork(), a.id, cancelled.jobId)).not.toBeNull();
    await cancelSigned(db, a, cancelled);
    expect(await soldOption(t.orm.em.fork(), a.id, cancelled.jobId)).toBeNull();

    const other = await signedJob(db, a, estimator);
    expect(await soldOption(t.orm.em.fork(), b.id, other.jobId)).toBeNull();
  });
});
