import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutgoingMessageSchema } from '../../server/src/modules/mail/outgoing-message.entity';
import { ProposalEventSchema, ProposalVersionSchema } from '../../server/src/modules/proposals/proposal.entity';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';
import { deskJob, newOption, seedData, singleZone } from './desk-helpers';
import { post } from './jobs-helpers';

/**
 * Issue 14, faults: the real server process (server/src/main.ts, what `npm start` runs) killed with SIGKILL
 * in the middle of issuing a proposal version and in the middle of rendering its PDF. The process is stopped
 * at a known place by the test-only pause (server/src/lib/test-pause.ts: NODE_ENV=test and
 * GAUGELINE_TEST_PAUSE=<point>:<file>; it writes <file> and waits there), then killed. This app (workers off,
 * the server processes' queue namespace) only prepares the job and reads the database.
 */
const namespace = `k-${randomUUID().slice(0, 8)}`;
const storageDir = mkdtempSync(join(tmpdir(), 'gaugeline-kill-'));
let t: TestApp;
let a: TestCompany;
let estimator: Session;
const children: ChildProcess[] = [];

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off', QUEUE_NAMESPACE: namespace });
  a = await makeCompany(t.orm.em.fork(), 'Killed');
  await seedData(t.orm.em.fork(), a.id);
  estimator = await login(t.app, a.users.estimator.email);
});
afterAll(async () => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill('SIGKILL');
  await t.close();
  rmSync(storageDir, { recursive: true, force: true });
});

/** A job of the company with one priced option, marked ready to propose. */
async function readyJob(): Promise<string> {
  const { job, rooms } = await deskJob(estimator);
  await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '', 30) });
  const r = await post(estimator, `/api/jobs/${job.id}/ready`).send({
    sizingOverride: { reason: 'The owner keeps this room cool for a home studio; the larger unit is wanted.' },
  });
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return job.id;
}

interface Server {
  child: ChildProcess;
  url: string;
  exited: Promise<void>;
}

/** The real server in its own process on this test's database and queue namespace; resolves once it listens. */
async function startServer(pause?: { point: string; file: string }): Promise<Server> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/src/main.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: testDatabaseUrl(),
      PORT: '0',
      HOST: '127.0.0.1',
      APP_ORIGIN: 'https://gaugeline.test',
      SESSION_SECRET: 'test-secret-test-secret-test-secret-0123',
      LOG_LEVEL: 'info',
      QUEUE_WORKERS: 'on',
      QUEUE_CONCURRENCY: '1',
      QUEUE_NAMESPACE: namespace,
      STORAGE_DIR: storageDir,
      DEV_OUTBOX: 'off',
      ...(pause ? { GAUGELINE_TEST_PAUSE: `${pause.point}:${pause.file}` } : { GAUGELINE_TEST_PAUSE: '' }),
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  let stderr = '';
  child.stderr?.on('data', (d: Buffer) => (stderr = (stderr + d.toString()).slice(-4000)));
  const url = await new Promise<string>((resolve, reject) => {
    const lines = createInterface({ input: child.stdout! });
    lines.on('line', (line) => {
      if (!line.startsWith('{')) return;
      const entry = JSON.parse(line) as { msg?: string; url?: string };
      if (entry.msg === 'Gaugeline is listening' && entry.url) resolve(entry.url);
    });
    void exited.then(() => reject(new Error(`the server exited before listening:\n${stderr}`)));
  });
  return { child, url, exited };
}

async function kill(server: Server): Promise<void> {
  server.child.kill('SIGKILL');
  await server.exited;
  expect(server.child.signalCode).toBe('SIGKILL');
}

/** Waits (polling, at most a minute) until `check` holds; the figures are never timed. */
async function until(what: string, check: () => Promise<boolean> | boolean): Promise<void> {
  for (let i = 0; i < 1200; i++) {
    if (await check()) return;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  throw new Error(`gave up waiting: ${what}`);
}

const sql = <T>(query: string, params: unknown[] = []) => t.orm.em.fork().getConnection().execute<T[]>(query, params);

/** graphile-worker's jobs with their payload (its public view has none). */
const JOBS = 'graphile_worker._private_jobs j join graphile_worker._private_tasks t on t.id = j.task_id';
const renderJobs = (versionId: string) =>
  sql<{ id: string; locked_by: string | null; attempts: number; max_attempts: number }>(
    `select j.id, j.locked_by, j.attempts, j.max_attempts from ${JOBS} where t.identifier = ? and j.payload->>'versionId' = ?`,
    [`${namespace}:render-proposal-pdf`, versionId],
  );

const pauseFile = (name: string) => join(storageDir, `${name}-${randomUUID().slice(0, 8)}.json`);
const readPause = async (file: string) => {
  await until(`the server reached ${file}`, () => existsSync(file));
  return JSON.parse(readFileSync(file, 'utf8')) as { pid: number; versionId: string; backendPid?: number };
};

describe('the server killed (SIGKILL) in the middle of its work', () => {
  it('while issuing: none of the version (row, events, PDF job); restarted: the whole version; killed while rendering its PDF: after a restart the render is taken again at once and ends ready', async () => {
    const jobId = await readyJob();

    // 1. Killed while issuing, everything written but not committed.
    const issueFile = pauseFile('issue');
    const first = await startServer({ point: 'issue-before-commit', file: issueFile });
    const office = await login(first.url, a.users.estimator.email);
    // The request never gets an answer: the process dies first.
    const issuing = post(office, `/api/jobs/${jobId}/proposal/versions`)
      .send()
      .then(
        () => 'answered',
        () => 'no answer',
      );
    const paused = await readPause(issueFile);
    expect(paused.pid).toBe(first.child.pid);
    // Everything is written inside the open transaction: its connection waits 'idle in transaction', and
    // from outside nothing of it shows yet.
    const [backend] = await sql<{ state: string; xid: string | null }>(
      'select state, backend_xid::text as xid from pg_stat_activity where pid = ?',
      [paused.backendPid],
    );
    expect(backend?.state).toBe('idle in transaction');
    expect(backend?.xid).not.toBeNull(); // it has written rows
    expect(await t.orm.em.fork().count(ProposalVersionSchema, { id: paused.versionId })).toBe(0);

    await kill(first);
    expect(await issuing).toBe('no answer');
    // PostgreSQL sees the connection close and rolls the transaction back.
    await until('the killed transaction ended', async () => {
      const rows = await sql('select 1 from pg_stat_activity where pid = ?', [paused.backendPid]);
      return rows.length === 0;
    });
    let em = t.orm.em.fork();
    expect(await em.count(ProposalVersionSchema, { id: paused.versionId })).toBe(0);
    expect(await em.count(ProposalVersionSchema, { proposal: { job: jobId } })).toBe(0);
    expect(await em.count(ProposalEventSchema, { proposal: { job: jobId } })).toBe(0);
    expect(await renderJobs(paused.versionId)).toEqual([]);

    // 2. Restarted: the same job issues version 1 whole (the row, its 'issued' event, its PDF job); this
    // process is then killed once its worker has begun the PDF.
    const renderFile = pauseFile('render');
    const second = await startServer({ point: 'render-pdf', file: renderFile });
    const issued = await post(
      await login(second.url, a.users.estimator.email),
      `/api/jobs/${jobId}/proposal/versions`,
    ).send();
    expect(issued.status, JSON.stringify(issued.body)).toBe(201);
    expect(issued.body.proposal.versions.map((v: { number: number }) => v.number)).toEqual([1]);
    const rendering = await readPause(renderFile);
    const [job] = await renderJobs(rendering.versionId);
    expect(job?.locked_by).toMatch(/^gl:[0-9a-f]{12}:0$/); // this process's worker holds it
    const token = job?.locked_by?.split(':')[1] ?? '';

    await kill(second);
    await until("the killed process's connections are gone", async () => {
      const rows = await sql('select 1 from pg_stat_activity where application_name = ?', [`gaugeline-queue:${token}`]);
      return rows.length === 0;
    });
    // The issue had committed: the whole version is there; its PDF says 'rendering' and its job stays locked
    // (graphile-worker alone would take it again only when the lock is 4 hours old).
    em = t.orm.em.fork();
    const left = await em.findOneOrFail(ProposalVersionSchema, { id: rendering.versionId });
    expect([left.number, left.pdfState, left.pdfSha256]).toEqual([1, 'rendering', null]);
    const trail = () =>
      t.orm.em.fork().find(ProposalEventSchema, { proposal: { job: jobId } }, { orderBy: { seq: 'asc' } });
    expect((await trail()).map((e) => e.kind)).toEqual(['issued']);
    expect(await renderJobs(rendering.versionId)).toEqual([
      { id: job?.id, locked_by: job?.locked_by, attempts: 1, max_attempts: job?.max_attempts },
    ]);

    // 3. Restarted (no pause): the new process releases the dead worker's job, puts the version back to
    // 'waiting', and its worker makes the PDF.
    const third = await startServer();
    // Released while it started, before it listened (not by graphile-worker's 4-hour expiry, nor by the
    // minute's sweep): the job is no longer the dead worker's.
    expect((await renderJobs(rendering.versionId))[0]?.locked_by ?? null).not.toBe(job?.locked_by);
    await until('the PDF is ready', async () => {
      const v = await t.orm.em.fork().findOneOrFail(ProposalVersionSchema, { id: rendering.versionId });
      return v.pdfState === 'ready';
    });
    const done = await t.orm.em.fork().findOneOrFail(ProposalVersionSchema, { id: rendering.versionId });
    expect(done.pdfSha256).toMatch(/^[0-9a-f]{64}$/);
    expect((await trail()).map((e) => [e.kind, e.data.attempt ?? null])).toEqual([
      ['issued', null],
      ['pdf-ready', 2], // the lost try counted as the first
    ]);
    await until('the job is done', async () => (await renderJobs(rendering.versionId)).length === 0);
    const pdf = await (
      await login(third.url, a.users.estimator.email)
    ).agent.get(`/api/jobs/${jobId}/proposal/versions/1/pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toMatch(/^application\/pdf/);
    third.child.kill('SIGTERM');
    await third.exited;
  }, 180_000);
});

/** Puts a job as a worker of a process that is gone left it: locked by `gl:<token>:0`, no connection of that token. */
async function lockedByTheDead(jobIdSql: string, params: unknown[], attempts: 'last' | 'first') {
  const [row] = await sql<{ id: string }>(jobIdSql, params);
  expect(row).toBeDefined();
  await sql(
    `update graphile_worker._private_jobs
        set locked_by = 'gl:0000deadbeef:0', locked_at = now(),
            attempts = case when ? then max_attempts else 1 end
      where id = ?`,
    [attempts === 'last', row?.id],
  );
}

describe('a try lost with its process, put right by the queue (releaseAbandoned)', () => {
  it("a render lost on its last try marks the version's PDF failed with one pdf-failed event; on an earlier try, waiting and then made", async () => {
    const jobId = await readyJob();
    expect((await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send()).status).toBe(201);
    const version = await t.orm.em.fork().findOneOrFail(ProposalVersionSchema, { proposal: { job: jobId } });
    const byVersion = `select j.id from ${JOBS} where t.identifier = ? and j.payload->>'versionId' = ?`;
    const params = [`${namespace}:render-proposal-pdf`, version.id];
    const rendering = () => sql(`update "proposal_version" set "pdf_state" = 'rendering' where "id" = ?`, [version.id]);

    await rendering();
    await lockedByTheDead(byVersion, params, 'first');
    expect(await t.services.queue.releaseAbandoned()).toBe(1);
    let v = await t.orm.em.fork().findOneOrFail(ProposalVersionSchema, { id: version.id });
    expect(v.pdfState).toBe('waiting');
    expect((await renderJobs(version.id))[0]?.locked_by).toBeNull();
    expect(await t.services.queue.releaseAbandoned()).toBe(0); // nothing left to release

    await rendering();
    await lockedByTheDead(byVersion, params, 'last');
    expect(await t.services.queue.releaseAbandoned()).toBe(1);
    expect(await t.services.queue.releaseAbandoned()).toBe(0);
    v = await t.orm.em.fork().findOneOrFail(ProposalVersionSchema, { id: version.id });
    expect(v.pdfState).toBe('failed');
    const failed = await t.orm.em.fork().find(ProposalEventSchema, { version: version.id, kind: 'pdf-failed' });
    expect(failed.map((e) => e.data.reason)).toEqual(['The process making the PDF stopped during its last try.']);
    // No tries left: the job is not run again.
    await t.services.queue.drain();
    expect((await t.orm.em.fork().findOneOrFail(ProposalVersionSchema, { id: version.id })).pdfState).toBe('failed');
  }, 60_000);

  it("an e-mail lost on its last try is 'failed' with why (the office's Try again sends it); a job of a live process is left alone", async () => {
    const owner = await login(t.app, a.users.owner.email);
    const email = `lost-${Date.now()}@mail.example.com`;
    const made = await post(owner, '/api/users').send({
      name: 'Lost Letter',
      email,
      role: 'installer',
      password: 'a-long-enough-password',
    });
    expect(made.status).toBe(201);
    const message = await t.orm.em.fork().findOneOrFail(OutgoingMessageSchema, { toAddress: email });
    const byMessage = `select j.id from ${JOBS} where t.identifier = ? and j.payload->>'messageId' = ?`;
    const params = [`${namespace}:send-email`, message.id];

    // Locked by a worker whose process still holds its connection: not released.
    const alive = `gl:${'a'.repeat(12)}:0`;
    const [row] = await sql<{ id: string }>(byMessage, params);
    await sql(`update graphile_worker._private_jobs set locked_by = ?, locked_at = now() where id = ?`, [
      alive,
      row?.id,
    ]);
    const pg = await import('pg');
    const presence = new pg.default.Client({
      connectionString: testDatabaseUrl(),
      application_name: `gaugeline-queue:${'a'.repeat(12)}`,
    });
    await presence.connect();
    try {
      expect(await t.services.queue.releaseAbandoned()).toBe(0);
    } finally {
      await presence.end();
    }

    await lockedByTheDead(byMessage, params, 'last');
    expect(await t.services.queue.releaseAbandoned()).toBe(1);
    const after = await t.orm.em.fork().findOneOrFail(OutgoingMessageSchema, { id: message.id });
    expect([after.state, after.lastError]).toEqual([
      'failed',
      'The process sending it stopped in the middle of a try.',
    ]);
  }, 60_000);
});
