/**
 * Proposals issued per second, end to end (issue 14): the real server in production mode (its own process,
 * workers on, `QUEUE_CONCURRENCY` 2) on a throwaway copy of the demo data (database `gaugeline_bench_proposals`
 * on the demo cluster, made anew each run and dropped at the end: versions are immutable, so they never go
 * into the demo database). The demo estimator issues BENCH_ISSUE_COUNT (default 10) versions of the demo job
 * that is ready to propose, one request after another; the clock stops when the last version's PDF is
 * 'ready' in the database. Prints proposals/s beside the floor (1 per second: one worker at the 1 s render
 * goal) and the load average. Informational, never fails. BENCH_ISSUE_PORT (default 4899) is the server's port.
 *
 * Then the issue request alone: a second server on BENCH_ISSUE_PORT + 1 with its workers off (its PDF jobs go
 * to a queue namespace nobody runs, so no render shares its event loop) takes BENCH_ISSUE_ALONE (default 20)
 * more issues after 3 to warm up; printed are the server's CPU per request (from /proc: the fair figure on a
 * busy machine) and the wall median. BENCH_CPU_PROF=<dir> runs that server under `node --cpu-prof` and prints
 * its profile of those requests by area and by function (the requests are then slower: read the summary).
 */
import { availableParallelism, loadavg } from 'node:os';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import pg from 'pg';
import { demoAccounts, seedDemo } from '../fixtures/seed';
import { createLocalDiskStorage } from '../server/src/services/storage';
import { migrate, withOrm } from '../scripts/lib/db';
import { DEMO, startCluster } from '../scripts/lib/stack';
import { readdirSync } from 'node:fs';
import { cpuMs, signIn, startApp, stopAll } from './lib/app-process';
import { profileClockUs, summariseProfile } from './lib/profile-summary';

const COUNT = Number(process.env.BENCH_ISSUE_COUNT ?? 10);
const PORT = Number(process.env.BENCH_ISSUE_PORT ?? 4899);
const APP = `http://127.0.0.1:${PORT}`;
const FLOOR_PER_S = 1;
const ALONE = Number(process.env.BENCH_ISSUE_ALONE ?? 20);
const CPU_PROF = process.env.BENCH_CPU_PROF ? resolve(process.env.BENCH_CPU_PROF) : null;
const DATABASE = 'gaugeline_bench_proposals';
const load = () =>
  loadavg()
    .map((x) => x.toFixed(1))
    .join(' ');

const { cluster } = await startCluster(DEMO);
const url = await cluster.ensureDatabase(DATABASE, DEMO.role, DEMO.password, { recreate: true });
const storageDir = mkdtempSync(join(tmpdir(), 'gaugeline-bench-proposals-'));
const db = new pg.Pool({ connectionString: url, max: 2 });
try {
  await migrate(url);
  await withOrm(url, (orm) => seedDemo(orm, { storage: createLocalDiskStorage(storageDir) }));
  const estimator = demoAccounts.find((a) => a.role === 'estimator');
  if (!estimator) throw new Error('no demo estimator');
  const ready = await db.query<{ id: string }>(
    `select j.id from job j join app_user u on u.company_id = j.company_id
      where u.email = $1 and j.ready_at is not null order by j.created_at limit 1`,
    [estimator.email],
  );
  const jobId = ready.rows[0]?.id;
  if (!jobId) throw new Error('the demo data has no job ready to propose');
  await startApp({
    port: PORT,
    databaseUrl: url,
    serverDir: resolve('.'),
    cpuProfDir: null,
    env: { QUEUE_WORKERS: 'on', QUEUE_CONCURRENCY: '2', STORAGE_DIR: storageDir, LOG_LEVEL: 'warn' },
  });
  const s = await signIn(APP, estimator.email, estimator.password);
  const headers = { cookie: s.cookie, 'x-forwarded-proto': 'https', 'x-csrf-token': s.csrf };
  const issue = async () => {
    const r = await fetch(`${APP}/api/jobs/${jobId}/proposal/versions`, { method: 'POST', headers });
    if (r.status !== 201) throw new Error(`issuing answered ${r.status}: ${await r.text()}`);
    await r.arrayBuffer();
  };
  // One issue and its PDF first, apart: the server's first render loads the typeface.
  const readyCount = async () =>
    Number(
      (
        await db.query<{ n: string }>(
          `select count(*) as n from proposal_version v join proposal p on p.id = v.proposal_id
            where p.job_id = $1 and v.pdf_state = 'ready'`,
          [jobId],
        )
      ).rows[0]?.n ?? 0,
    );
  const waitReady = async (n: number) => {
    for (;;) {
      if ((await readyCount()) >= n) return;
      await new Promise((r) => setTimeout(r, 20));
    }
  };
  console.log(`load average ${load()} on ${availableParallelism()} cores`);
  const w0 = performance.now();
  await issue();
  await waitReady(1);
  console.log(
    `first proposal (the server's first render loads the typeface): ${(performance.now() - w0).toFixed(0)} ms`,
  );

  const t0 = performance.now();
  const issueMs: number[] = [];
  for (let i = 0; i < COUNT; i++) {
    const i0 = performance.now();
    await issue();
    issueMs.push(performance.now() - i0);
  }
  const issuedAt = performance.now() - t0;
  await waitReady(COUNT + 1);
  const total = performance.now() - t0;
  const rate = (COUNT * 1000) / total;
  const sorted = [...issueMs].sort((a, b) => a - b);
  console.log(`${COUNT} proposals, issue → PDF ready: ${(total / 1000).toFixed(1)} s`);
  console.log(
    `  ${rate.toFixed(2)} proposals/s (floor ${FLOOR_PER_S}/s: ${rate >= FLOOR_PER_S ? 'met' : 'not met'}); ` +
      `the requests alone took ${(issuedAt / 1000).toFixed(1)} s, median ${sorted[Math.floor(COUNT / 2)]?.toFixed(0)} ms each`,
  );
  console.log(`load average after: ${load()}`);
  await stopAll();

  // The issue request alone: its own server, workers off, the PDF jobs in a namespace no worker runs.
  const alonePort = PORT + 1;
  const ALONE_APP = `http://127.0.0.1:${alonePort}`;
  const alone = await startApp({
    port: alonePort,
    databaseUrl: url,
    serverDir: resolve('.'),
    cpuProfDir: CPU_PROF,
    env: { QUEUE_WORKERS: 'off', QUEUE_NAMESPACE: 'bench-unrun', STORAGE_DIR: storageDir, LOG_LEVEL: 'warn' },
  });
  const s2 = await signIn(ALONE_APP, estimator.email, estimator.password);
  const issueAlone = async (): Promise<{ wall: number; cpu: number }> => {
    const c0 = cpuMs(alone.pid);
    const i0 = performance.now();
    const r = await fetch(`${ALONE_APP}/api/jobs/${jobId}/proposal/versions`, {
      method: 'POST',
      headers: { cookie: s2.cookie, 'x-forwarded-proto': 'https', 'x-csrf-token': s2.csrf },
    });
    if (r.status !== 201) throw new Error(`issuing answered ${r.status}: ${await r.text()}`);
    await r.arrayBuffer();
    return { wall: performance.now() - i0, cpu: cpuMs(alone.pid) - c0 };
  };
  for (let i = 0; i < 3; i++) await issueAlone();
  const from = { us: profileClockUs(), load: load() };
  const runs: { wall: number; cpu: number }[] = [];
  for (let i = 0; i < ALONE; i++) runs.push(await issueAlone());
  const to = profileClockUs();
  const wallSorted = runs.map((r) => r.wall).sort((a, b) => a - b);
  const cpuMean = runs.reduce((sum, r) => sum + r.cpu, 0) / ALONE;
  const versions = Number(
    (
      await db.query<{ n: string }>(
        'select count(*) as n from proposal_version v join proposal p on p.id = v.proposal_id where p.job_id = $1',
        [jobId],
      )
    ).rows[0]?.n ?? 0,
  );
  console.log(
    `the issue request alone (workers off), ${ALONE} requests, versions ${versions - ALONE + 1}–${versions} of the job, ` +
      `load average ${from.load} → ${load()}:`,
  );
  console.log(
    `  server CPU ${cpuMean.toFixed(0)} ms per request (mean, /proc); wall median ${wallSorted[Math.floor(ALONE / 2)]?.toFixed(0)} ms`,
  );
  await stopAll();
  if (CPU_PROF) {
    // CPU.<date>.<time>.<pid>.<thread>.<n>.cpuprofile: the server's main thread (0), not tsx's loader thread.
    const newest = readdirSync(CPU_PROF)
      .filter((f) => f.endsWith('.cpuprofile') && f.includes(`.${alone.pid}.0.`))
      .sort()
      .at(-1);
    if (newest) {
      console.log(`  profile: ${join(CPU_PROF, newest)}`);
      summariseProfile(join(CPU_PROF, newest), 25, `${ALONE} × POST …/proposal/versions`, {
        fromUs: from.us,
        toUs: to,
      });
    }
  }
} finally {
  await stopAll();
  await db.end();
  const admin = new pg.Client({ connectionString: cluster.adminUrl() });
  await admin.connect();
  await admin.query(`drop database if exists ${DATABASE} with (force)`).catch(() => undefined);
  await admin.end();
  rmSync(storageDir, { recursive: true, force: true });
}
