/**
 * API bench: the real server in production mode (built client, NODE_ENV=production, log level
 * info as in production) on the demo data, in its own process, driven by autocannon from this
 * process; beside each route, in the same run, the floor (bench/lib/floor-server.ts: a bare
 * Express route doing the same SQL through a pg pool of the same size) in a third process.
 * Prints requests/s, p50/p95/p99 and errors per route and each ratio to its floor. Never fails.
 *
 * BENCH_SECONDS (default 8) and BENCH_CONNECTIONS (default 50) change the load;
 * BENCH_APP_PORT / BENCH_FLOOR_PORT (default 4896 / 4897) the ports; BENCH_ROUTES picks routes
 * (comma-separated of jobs, rooms, loads, save, sign-in; default all); BENCH_CPU_PROF=<dir> runs the
 * app server under `node --cpu-prof` and leaves its profile there (open it in Chrome's DevTools).
 */
import { randomUUID } from 'node:crypto';
import { availableParallelism, loadavg } from 'node:os';
import { join, resolve } from 'node:path';
import pg from 'pg';
import { demoAccounts, isEmpty, seedDemo } from '../fixtures/seed';
import { buildClientIfStale } from '../scripts/lib/client-build';
import { migrate, withOrm } from '../scripts/lib/db';
import { DEMO, startCluster } from '../scripts/lib/stack';
import {
  cookieOf,
  cpuMs,
  signIn as signInAt,
  startApp,
  startProcess as start,
  stopAll,
  waitFor,
} from './lib/app-process';
import { load, type LoadResult } from './lib/load';
import { phoneTimings, type PhoneTiming } from './lib/phone';
import { formatTrace } from './lib/phone-trace';
import { printBudgets } from '../scripts/bundle-budget';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 8);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const SIGNIN_CONNECTIONS = 8;
const APP_PORT = Number(process.env.BENCH_APP_PORT ?? 4896);
const FLOOR_PORT = Number(process.env.BENCH_FLOOR_PORT ?? 4897);
const POOL_MAX = 10;
const EXTRA_JOBS = 120;
const APP = `http://127.0.0.1:${APP_PORT}`;
const FLOOR = `http://127.0.0.1:${FLOOR_PORT}`;
const BENCH_MARK = 'made by npm run bench';
// Another checkout's server and built client (e.g. an older commit, for a before/after in one sitting).
const SERVER_DIR = resolve(process.env.BENCH_SERVER_DIR ?? '.');
const ROUTES = new Set((process.env.BENCH_ROUTES ?? 'jobs,rooms,loads,save,sign-in').split(',').map((r) => r.trim()));
const CPU_PROF = process.env.BENCH_CPU_PROF ? resolve(process.env.BENCH_CPU_PROF) : null;
// BENCH_PHONE_PROFILE=1 traces each phone load and prints what its main thread did; =<dir> also keeps the traces there.
const PHONE_PROFILE = process.env.BENCH_PHONE_PROFILE;

/** What one autocannon connection carries from one step of its sequence to the next. */
interface Ctx {
  room?: { id: string; version: number };
  t0?: number;
  cookie?: string;
  token?: string;
}

/**
 * The phone runs side by side with the goals (issue 11): until the room field showed and until it took a
 * letter, cold and warm, each run and the median; with BENCH_PHONE_PROFILE, the main thread's CPU time (cold /
 * warm) before the field showed, between showing and taking the letter (what the letter waited behind), and in
 * the task of each letter typed once the page settled (median): CPU time, which the machine's load moves less.
 */
function printPhoneTable(runs: ReadonlyArray<PhoneTiming & { load: number }>): void {
  const median = (xs: readonly number[]) => {
    const s = [...xs].sort((a, b) => a - b);
    const m = Math.floor(s.length / 2);
    return s.length % 2 ? (s[m] ?? Number.NaN) : ((s[m - 1] ?? 0) + (s[m] ?? 0)) / 2;
  };
  const gap = (r: PhoneTiming, k: 'cold' | 'warm') => r.traces?.[k].busyVisibleToTypedMs ?? Number.NaN;
  const before = (r: PhoneTiming, k: 'cold' | 'warm') => r.traces?.[k].busyBeforeVisibleMs ?? Number.NaN;
  const key = (r: PhoneTiming, k: 'cold' | 'warm') => median(r.traces?.[k].keyTasksMs ?? []);
  const rows = runs.map((r, i) => [
    `run ${i + 1}`,
    f(r.coldVisibleMs),
    f(r.coldMs),
    f(r.warmVisibleMs),
    f(r.warmMs),
    `${f(before(r, 'cold'))} / ${f(before(r, 'warm'))}`,
    `${f(gap(r, 'cold'))} / ${f(gap(r, 'warm'))}`,
    `${f(key(r, 'cold'))} / ${f(key(r, 'warm'))}`,
    f(r.load, 1),
  ]);
  const pick = (g: (r: PhoneTiming & { load: number }) => number) => median(runs.map(g));
  rows.push([
    'median',
    f(pick((r) => r.coldVisibleMs)),
    f(pick((r) => r.coldMs)),
    f(pick((r) => r.warmVisibleMs)),
    f(pick((r) => r.warmMs)),
    `${f(pick((r) => before(r, 'cold')))} / ${f(pick((r) => before(r, 'warm')))}`,
    `${f(pick((r) => gap(r, 'cold')))} / ${f(pick((r) => gap(r, 'warm')))}`,
    `${f(pick((r) => key(r, 'cold')))} / ${f(pick((r) => key(r, 'warm')))}`,
    f(
      pick((r) => r.load),
      1,
    ),
  ]);
  rows.push(['goal', '', '≤ 3000', '', '≤ 1000', '', '', '', '']);
  const head = [
    'phone',
    'cold shown ms',
    'cold typed ms',
    'warm shown ms',
    'warm typed ms',
    'CPU ms before shown',
    'CPU ms shown→typed',
    'CPU ms per key',
    'load',
  ];
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const fmt = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i] ?? 0)).join('  ');
  console.log('');
  console.log(fmt(head));
  for (const r of rows) console.log(fmt(r));
  const typed = pick((r) => r.warmMs);
  console.log(
    `phone goals (median): cold ${pick((r) => r.coldMs) <= 3000 ? 'MET' : 'NOT MET'}, warm ${typed <= 1000 ? 'MET' : 'NOT MET'}` +
      (runs.some((r) => r.traces)
        ? ''
        : ' (BENCH_PHONE_PROFILE=1 adds the main-thread CPU before the field showed, between showing and typing, and per key)'),
  );
}

const f = (n: number, d = 0) => (Number.isFinite(n) ? n.toFixed(d) : '—');
interface Row {
  route: string;
  floor: LoadResult;
  app: LoadResult;
  floorCpu: number;
  appCpu: number;
}
function table(rows: Row[]): void {
  const head = [
    'route',
    'floor req/s',
    'app req/s',
    'floor p50/p95/p99 ms',
    'app p50/p95/p99 ms',
    'errors',
    'p95 ×',
    'CPU ms/req floor/app',
  ];
  const lines = rows.map(({ route, floor, app, floorCpu, appCpu }) => [
    route,
    f(floor.rps),
    f(app.rps),
    `${f(floor.p50)}/${f(floor.p95)}/${f(floor.p99)}`,
    `${f(app.p50)}/${f(app.p95)}/${f(app.p99)}`,
    `${floor.errors}/${app.errors}`,
    `${f(app.p95 / floor.p95, 2)}`,
    `${f(floorCpu, 2)}/${f(appCpu, 2)} (${f(appCpu / floorCpu, 2)}×)`,
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...lines.map((l) => (l[i] ?? '').length)));
  const fmt = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i] ?? 0)).join('  ');
  console.log(fmt(head));
  for (const l of lines) console.log(fmt(l));
}

const owner = demoAccounts.find((a) => a.role === 'owner');
if (!owner) throw new Error('no demo owner');
const { url: databaseUrl } = await startCluster(DEMO);
await migrate(databaseUrl);
await withOrm(databaseUrl, async (orm) => {
  if (await isEmpty(orm.em.fork())) await seedDemo(orm);
});
await buildClientIfStale();

const db = new pg.Pool({ connectionString: databaseUrl, max: 2 });
let benchJobId: string | undefined;
try {
  // The job with the most rooms among the owner's company's jobs with design conditions.
  const pick = await db.query<{ job_id: string; company_id: string; rooms: string }>(
    `select j.id as job_id, j.company_id, count(r.id) as rooms from job j join app_user u on u.company_id = j.company_id
     join room r on r.job_id = j.id where u.email = $1 and j.design_conditions is not null and j.notes not like $2
     group by j.id order by count(r.id) desc, j.id limit 1`,
    // Not a job a stopped run left behind (deleted below, and it would be picked: it has the most rooms).
    [owner.email, `%${BENCH_MARK}%`],
  );
  const target = pick.rows[0];
  if (!target) throw new Error('the demo data has no job with rooms');

  // Leftovers of a bench that was stopped half-way, then more jobs so the list pages (25 of many) like a busy company's.
  await db.query('delete from job where notes like $1', [`%${BENCH_MARK}%`]);
  await db.query(
    `insert into job (id, company_id, customer_id, salesperson_id, assigned_installer_id, status, street, unit, city,
       region, postal_code, notes, design_conditions, design_sources, tightness, version, created_at, updated_at,
       last_activity_at)
     select gen_random_uuid(), company_id, customer_id, salesperson_id, assigned_installer_id, status, street, unit,
       city, region, postal_code, $1, design_conditions, design_sources, tightness, 1, now(), now(),
       now() - (g || ' hours')::interval from job, generate_series(1, $2) g where id = $3`,
    [`Bench job (${BENCH_MARK}; deleted when it ends)`, EXTRA_JOBS, target.job_id],
  );
  // A job of its own for the room saves (a room per connection each for app and floor), deleted at the end.
  benchJobId = randomUUID();
  await db.query(
    `insert into job (id, company_id, customer_id, salesperson_id, assigned_installer_id, status, street, unit, city,
       region, postal_code, notes, design_conditions, design_sources, tightness, version, created_at, updated_at,
       last_activity_at)
     select $1, company_id, customer_id, salesperson_id, null, 'walkthrough', street, unit, city, region, postal_code,
       $2, design_conditions, design_sources, tightness, 1, now(), now(), now() from job where id = $3`,
    [benchJobId, `Bench job (${BENCH_MARK}; deleted when it ends)`, target.job_id],
  );
  const sample = await db.query<{ input: Record<string, unknown> }>(
    'select input from room where job_id = $1 order by position limit 1',
    [target.job_id],
  );
  const roomInput = sample.rows[0]?.input ?? {};
  const makeRooms = async (n: number) => {
    const ids: string[] = [];
    for (let i = 0; i < n; i += 1) {
      const id = randomUUID();
      await db.query(
        `insert into room (id, job_id, position, input, version, created_at, updated_at) values ($1, $2, $3, $4, 1, now(), now())`,
        [id, benchJobId, ids.length, JSON.stringify({ ...roomInput, id, name: `Bench room ${i + 1}` })],
      );
      ids.push(id);
    }
    return ids;
  };
  const jobsCount = await db.query<{ n: string }>('select count(*) as n from job where company_id = $1', [
    target.company_id,
  ]);
  const appRooms = await makeRooms(CONNECTIONS);
  const floorRooms = await makeRooms(CONNECTIONS);

  const floorProcess = start('bench/lib/floor-server.ts', {
    DATABASE_URL: databaseUrl,
    PORT: String(FLOOR_PORT),
    DB_POOL_MAX: String(POOL_MAX),
  });
  const [appProcess] = await Promise.all([
    startApp({
      port: APP_PORT,
      databaseUrl,
      serverDir: SERVER_DIR,
      cpuProfDir: CPU_PROF,
      env: {
        DB_POOL_MAX: String(POOL_MAX),
        // Sign-in is benchmarked: the per-IP and per-account failure limits would otherwise stop it.
        LOGIN_MAX_PER_IP: '1000000',
        LOGIN_MAX_PER_ACCOUNT: '1000000',
        CLIENT_DIST: join(SERVER_DIR, 'dist/client'),
      },
    }),
    waitFor(`${FLOOR}/floor/nothing`),
  ]);

  const s = await signInAt(APP, owner.email, owner.password);
  const appHeaders = {
    cookie: s.cookie,
    'x-forwarded-proto': 'https',
    'accept-encoding': process.env.XAE ?? 'gzip, deflate, br',
  };
  const floorHeaders = { 'accept-encoding': 'gzip, deflate, br' };
  const q = `company=${target.company_id}`;

  console.log(
    `API bench — ${CONNECTIONS} connections × ${SECONDS} s per route (sign-in: ${SIGNIN_CONNECTIONS}), loopback, demo data ` +
      `(${jobsCount.rows[0]?.n ?? '?'} jobs in the company, ${EXTRA_JOBS} of them added for the run; job ${target.job_id.slice(0, 8)} has ${target.rooms} rooms)`,
  );
  console.log(
    `server: NODE_ENV=production, LOG_LEVEL=info, pool ${POOL_MAX}; floor: bare Express + pg pool ${POOL_MAX}, same SQL`,
  );
  console.log(
    `load average before: ${loadavg()
      .map((l) => l.toFixed(2))
      .join(' / ')} on ${availableParallelism()} CPU(s) — other work on the machine slows both sides; read the ratios`,
  );

  const warm = async (url: string, headers: Record<string, string>) =>
    load({ label: 'warm-up', url, connections: 10, seconds: 1, headers });

  const rows: Row[] = [];
  // Each side's CPU per request: the process's CPU time over the run divided by the requests answered.
  const measured = async (pid: number | undefined, run: () => Promise<LoadResult>) => {
    const before = cpuMs(pid);
    const result = await run();
    return { result, cpu: (cpuMs(pid) - before) / Math.max(1, result.total) };
  };
  const pair = async (route: string, floorRun: () => Promise<LoadResult>, appRun: () => Promise<LoadResult>) => {
    const { result: floor, cpu: floorCpu } = await measured(floorProcess.pid, floorRun);
    const { result: app, cpu: appCpu } = await measured(appProcess.pid, appRun);
    rows.push({ route, floor, app, floorCpu, appCpu });
    console.log(
      `  ${route}: app ${f(app.rps)} req/s p95 ${f(app.p95)} ms (${app.errors} errors) · floor ${f(floor.rps)} req/s p95 ${f(floor.p95)} ms (${floor.errors} errors)`,
    );
  };
  const get = (label: string, url: string, headers: Record<string, string>) =>
    load({ label, url, connections: CONNECTIONS, seconds: SECONDS, headers });

  for (const [key, route, appPath, floorPath] of [
    ['jobs', 'GET /api/jobs', '/api/jobs', `/floor/jobs?${q}`],
    ['rooms', `GET /api/jobs/:id/rooms`, `/api/jobs/${target.job_id}/rooms`, `/floor/jobs/${target.job_id}/rooms?${q}`],
    ['loads', `GET /api/jobs/:id/loads`, `/api/jobs/${target.job_id}/loads`, `/floor/jobs/${target.job_id}/loads?${q}`],
  ] as const) {
    if (!ROUTES.has(key)) continue;
    await warm(`${FLOOR}${floorPath}`, floorHeaders);
    await warm(`${APP}${appPath}`, appHeaders);
    await pair(
      route,
      () => get(route, `${FLOOR}${floorPath}`, floorHeaders),
      () => get(route, `${APP}${appPath}`, appHeaders),
    );
  }

  // Room save: each in-flight request takes a free room and returns it with the version the answer gave.
  const saver = (base: string, headers: Record<string, string>, ids: string[], prefix: string) => {
    const free = ids.map((id) => ({ id, version: 1 }));
    let n = 0;
    return load({
      label: 'room save',
      url: base,
      connections: CONNECTIONS,
      seconds: SECONDS,
      requests: [
        {
          method: 'PATCH',
          setupRequest: (req, ctx) => {
            const context = ctx as Ctx;
            const room = free.pop();
            if (!room) throw new Error('no free room: more connections than rooms');
            context.room = room;
            n += 1;
            return {
              ...req,
              path: `${prefix}/jobs/${benchJobId}/rooms/${room.id}`,
              headers: { ...headers, 'content-type': 'application/json', 'if-match': `"${room.version}"` },
              body: JSON.stringify({ input: { ...roomInput, name: `Bench room save ${n}` } }),
            };
          },
          onResponse: (status, body, ctx) => {
            const context = ctx as Ctx;
            const room = context.room;
            if (!room) return;
            if (status === 200) room.version = (JSON.parse(body) as { room: { version: number } }).room.version;
            free.push(room);
          },
        },
      ],
    });
  };
  if (ROUTES.has('save'))
    await pair(
      'PATCH /api/jobs/:id/rooms/:roomId',
      () => saver(FLOOR, {}, floorRooms, '/floor'),
      // Uncompressed answers here: the driver reads each saved room's new version from the body.
      () => saver(APP, { ...appHeaders, 'accept-encoding': 'identity', 'x-csrf-token': s.csrf }, appRooms, '/api'),
    );

  // Sign-in: GET /api/auth/csrf (a fresh anonymous session) then POST /api/auth/login; the login step is timed.
  const floorTimes: number[] = [];
  const appTimes: number[] = [];
  const body = JSON.stringify({ email: owner.email, password: owner.password });
  if (ROUTES.has('sign-in'))
    await pair(
      'POST /api/auth/login',
      () =>
        load({
          label: 'sign-in floor',
          url: FLOOR,
          connections: SIGNIN_CONNECTIONS,
          seconds: SECONDS,
          timed: floorTimes,
          requests: [
            {
              method: 'POST',
              path: '/floor/login',
              headers: { 'content-type': 'application/json' },
              body,
              setupRequest: (req, ctx) => {
                const context = ctx as Ctx;
                context.t0 = performance.now();
                return req;
              },
              onResponse: (_status, _body, ctx) => {
                floorTimes.push(performance.now() - ((ctx as Ctx).t0 ?? 0));
              },
            },
          ],
        }),
      () =>
        load({
          label: 'sign-in app',
          url: APP,
          connections: SIGNIN_CONNECTIONS,
          seconds: SECONDS,
          timed: appTimes,
          requests: [
            {
              method: 'GET',
              path: '/api/auth/csrf',
              headers: { 'x-forwarded-proto': 'https' },
              onResponse: (_status, resBody, ctx, headers) => {
                const context = ctx as Ctx;
                const h = headers as Record<string, string | string[]>;
                context.cookie = cookieOf(h['set-cookie'] ?? h['Set-Cookie']);
                context.token = (JSON.parse(resBody) as { token: string }).token;
              },
            },
            {
              method: 'POST',
              path: '/api/auth/login',
              setupRequest: (req, ctx) => {
                const context = ctx as Ctx;
                context.t0 = performance.now();
                return {
                  ...req,
                  headers: {
                    'content-type': 'application/json',
                    'x-forwarded-proto': 'https',
                    cookie: context.cookie ?? '',
                    'x-csrf-token': context.token ?? '',
                  },
                  body,
                };
              },
              onResponse: (_status, _body, ctx) => {
                appTimes.push(performance.now() - ((ctx as Ctx).t0 ?? 0));
              },
            },
          ],
        }),
    );

  console.log('');
  table(rows);
  console.log(
    `load average after: ${loadavg()
      .map((l) => l.toFixed(2))
      .join(' / ')}. Goals (issue 11): read routes p95 ≤ 2× floor with 0 errors, room save ≤ 3×.`,
  );
  console.log(
    "CPU ms/req: the server process's CPU time per answered request (the database's is not in it); it moves far less with the machine's load than the latencies do.",
  );
  console.log(
    'Sign-in: autocannon counts csrf + login as one sign-in on the app side; latencies are the login step; argon2id dominates both.',
  );

  console.log('');
  printBudgets(join(SERVER_DIR, 'dist/client'));
  if (process.env.BENCH_PHONE === 'off') console.log('phone timings: skipped (BENCH_PHONE=off)');
  else {
    const eq = s.cookie.indexOf('=');
    // BENCH_PHONE_RUNS: more than one run (each a fresh browser) shows how much the figures move.
    const phoneRuns: Array<PhoneTiming & { load: number }> = [];
    for (let run = 0; run < Number(process.env.BENCH_PHONE_RUNS ?? 1); run += 1)
      try {
        const p = await phoneTimings(
          APP,
          { name: s.cookie.slice(0, eq), value: s.cookie.slice(eq + 1) },
          // The bench's own job (its rooms go when the bench ends), so typing leaves no trace in the demo data.
          `/jobs/${benchJobId}`,
          PHONE_PROFILE
            ? {
                assetsDir: join(SERVER_DIR, 'dist/client/assets'),
                ...(PHONE_PROFILE === '1' ? {} : { saveDir: PHONE_PROFILE }),
              }
            : undefined,
        );
        console.log(
          `phone (Chromium, 375 px, CPU 4× slower, 1.6 Mbps / 150 ms): walk-through until a room field takes typing — ` +
            `cold ${f(p.coldMs)} ms (goal ≤ 3000: ${p.coldMs <= 3000 ? 'MET' : 'NOT MET'}), warm ${f(p.warmMs)} ms ` +
            `(goal ≤ 1000: ${p.warmMs <= 1000 ? 'MET' : 'NOT MET'}); the field on screen at ${f(p.coldVisibleMs)} / ${f(p.warmVisibleMs)} ms; ` +
            `warm load ${p.warmFromWorker ? 'answered by the service worker' : 'NOT answered by the service worker'}; ` +
            `${f(p.transferredKb)} KB over the wire on the cold load` +
            (p.foreign ? `; ${p.foreign} requests to other hosts (a bug)` : '') +
            ` (load average ${f(loadavg()[0] ?? 0, 2)})`,
        );
        if (p.traces)
          for (const line of [...formatTrace('cold', p.traces.cold), ...formatTrace('warm', p.traces.warm)])
            console.log(line);
        phoneRuns.push({ ...p, load: loadavg()[0] ?? Number.NaN });
      } catch (e) {
        console.log('phone timings could not run:', e instanceof Error ? e.message.split('\n')[0] : String(e));
      }
    if (phoneRuns.length > 0) printPhoneTable(phoneRuns);
  }
} catch (e) {
  console.log('API bench could not finish:', e instanceof Error ? e.message : String(e));
} finally {
  await stopAll();
  await db.query('delete from job where notes like $1', [`%${BENCH_MARK}%`]).catch(() => undefined);
  await db.end();
}
