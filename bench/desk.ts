/**
 * The estimator's desk recompute (issue 13): three options of a 40-room home — loads, sizing, line sets
 * and charge, electrical, takeoff with an edit, price and explanations — on the invented demo catalog and
 * price book, against the 16 ms frame the desk must answer within as the estimator types (goal: p95).
 * Prints, side by side, CPU ms and wall ms per request:
 * - the floors: calc alone (the engine on validated inputs, loads once for the three options) and a bare
 *   SQL read (node-pg, no ORM) of the same rows the route reads;
 * - the server's recompute in memory (desk-compute.ts, as GET …/desk runs it, no database);
 * - the real route, GET /api/jobs/:id/desk, and a PATCH of an option's pricing with its answer, through
 *   the real server in production mode (its own process, on the demo cluster, one request at a time):
 *   wall time at the client, and the server process's CPU time per request (from /proc).
 * Wall time on a shared machine includes waiting for a core; CPU time is the work itself, so both are
 * printed with the load average. BENCH_CPU_PROF=<dir> runs the server under `node --cpu-prof` and prints
 * its profile by area and by function (those requests are slower: read the summary, not the figures).
 * BENCH_DESK_PORT (default 4898) is the server's port, BENCH_DESK_RUNS (default 200) the requests per
 * route; BENCH_SERVER_DIR=<checkout> runs that checkout's server (a before/after in one sitting). The bench job (40 rooms, three options) is deleted when it ends. Informational, never fails.
 */
import { randomUUID } from 'node:crypto';
import { availableParallelism, loadavg } from 'node:os';
import { readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import pg from 'pg';
import {
  computeDesignFromParsed,
  DATASET_IDS,
  DEFAULT_SIZING_POLICY,
  designSchema,
  homeInputSchema,
  homeLoadFromParsed,
  roomInputSchema,
  type DesignInput,
  type RoomInput,
} from '../calc/index';
import { optionPricingSchema } from '../server/src/contract';
import { calcPricing, computeOption, engineData, parseHome } from '../server/src/modules/desk/desk-compute';
import { companyDeskFromRows, type CompanyDesk } from '../server/src/modules/desk/desk-inputs';
import type { DesignOption } from '../server/src/modules/desk/option.entity';
import { DEMO_PRICE_BOOK_SETTINGS, demoCompanyData } from '../fixtures/demo-company-data';
import { demoAccounts, isEmpty, seedDemo } from '../fixtures/seed';
import { migrate, withOrm } from '../scripts/lib/db';
import { DEMO, startCluster } from '../scripts/lib/stack';
import { DESIGN } from '../tests/helpers/sample-job';
import { cpuMs, signIn, startApp, stopAll } from './lib/app-process';
import { profileClockUs, summariseProfile } from './lib/profile-summary';

const FRAME_MS = 16;
const RUNS = Number(process.env.BENCH_DESK_RUNS ?? 200);
const PORT = Number(process.env.BENCH_DESK_PORT ?? 4898);
const APP = `http://127.0.0.1:${PORT}`;
// Another checkout's server (e.g. an older commit, for a before/after in one sitting).
const SERVER_DIR = resolve(process.env.BENCH_SERVER_DIR ?? '.');
const CPU_PROF = process.env.BENCH_CPU_PROF ? resolve(process.env.BENCH_CPU_PROF) : null;
const BENCH_MARK = 'made by bench/desk.ts';
const directions = ['N', 'E', 'S', 'W'] as const;

function room(i: number, id = `room-${i}`): RoomInput {
  return {
    id,
    name: `Room ${i + 1}`,
    lengthFt: 10 + (i % 6),
    widthFt: 9 + (i % 4),
    ceilingHeightFt: 8,
    exposedWalls: [
      {
        direction: directions[i % 4] ?? 'N',
        lengthFt: 10 + (i % 6),
        windows: [{ widthIn: 36, heightIn: 48, count: 1 + (i % 2), glazing: 'double-low-e' }],
      },
    ],
    above: i % 2 === 0 ? { kind: 'attic', insulation: 'r38' } : { kind: 'conditioned' },
    below: i % 2 === 0 ? { kind: 'slab' } : { kind: 'conditioned' },
    occupants: 1 + (i % 3),
  };
}

// The demo price book as the server reads it from its rows (desk-inputs.ts).
const data = demoCompanyData(1);
const desk: CompanyDesk = companyDeskFromRows(
  DATASET_IDS.flatMap((dataset) => data[dataset].map((row) => ({ dataset, data: row }))),
  DEMO_PRICE_BOOK_SETTINGS,
);
const engine = engineData(desk);
const home = {
  id: 'bench-home',
  designConditions: DESIGN,
  tightness: 'average' as const,
  bedrooms: 6,
  rooms: Array.from({ length: 40 }, (_, i) => room(i)),
};

/** `perZone` rooms per head, five heads per 48k multi-zone outdoor unit. */
function multiZone(perZone: number, head: string, ids: readonly string[]): DesignInput {
  const zones = Array.from({ length: ids.length / perZone }, (_, z) => ({
    key: `z${z}`,
    name: `Zone ${z + 1}`,
    roomIds: ids.slice(z * perZone, z * perZone + perZone),
    indoorUnitKey: head,
  }));
  const systems = Array.from({ length: Math.ceil(zones.length / 5) }, (_, s) => ({
    key: `s${s}`,
    name: `System ${s + 1}`,
    outdoorUnitKey: 'TSL-M48-5P',
    circuits: zones.slice(s * 5, s * 5 + 5).map((z, c) => ({ zoneKey: z.key, lengthFt: 20 + 5 * c })),
    electrical: { circuitLengthFt: 40 + 5 * s },
  }));
  return { zones, systems };
}

/** One single-zone pair per four rooms. */
function pairs(ids: readonly string[]): DesignInput {
  const zones = Array.from({ length: ids.length / 4 }, (_, z) => ({
    key: `z${z}`,
    name: `Zone ${z + 1}`,
    roomIds: ids.slice(z * 4, z * 4 + 4),
    indoorUnitKey: 'TSL-S18H-W',
  }));
  return {
    zones,
    systems: zones.map((z, s) => ({
      key: `s${s}`,
      name: `System ${s + 1}`,
      outdoorUnitKey: 'TSL-S18H-O',
      circuits: [{ zoneKey: z.key, lengthFt: 25 + s }],
      electrical: { circuitLengthFt: 35 },
    })),
  };
}

/** The three options, as the API takes them (names, designs, pricing inputs, one takeoff edit). */
const optionInputs = (ids: readonly string[]) => [
  { name: 'Essential', design: multiZone(2, 'TSL-MH12-W', ids), discount: 0 },
  { name: 'Quiet comfort', design: multiZone(1, 'TSL-MH9-W', ids), discount: 5 },
  { name: 'Room by room', design: pairs(ids), discount: 0 },
];
const pricingOf = (discount: number) => ({
  discounts: discount ? [{ label: 'Offer', kind: 'percent' as const, value: discount }] : [],
  financingPlanKey: 'low-rate-60',
});
const EDIT = { kind: 'quantity' as const, itemKey: 'comm-cable:14-4', quantity: 900 };

const options = optionInputs(home.rooms.map((r) => r.id)).map(
  (o, i) =>
    ({
      id: `o${i + 1}`,
      name: o.name,
      design: o.design,
      pricing: optionPricingSchema.parse(pricingOf(o.discount)),
      takeoffEdits: [{ ...EDIT, generatedQuantity: 0 }],
      chosenModels: {},
      discountRequest: null,
      preliminary: false,
    }) as unknown as DesignOption,
);

interface Stats {
  median: number;
  p95: number;
}
const stats = (times: number[]): Stats => {
  const sorted = [...times].sort((a, b) => a - b);
  const at = (q: number) => sorted[Math.min(sorted.length - 1, Math.floor(sorted.length * q))] ?? NaN;
  return { median: at(0.5), p95: at(0.95) };
};

/** Wall and this process's CPU (process.cpuUsage: the work itself, GC threads included) per call, after a warm-up. */
async function measure(run: () => unknown, warmup: number, runs: number): Promise<{ wall: Stats; cpu: Stats }> {
  for (let i = 0; i < warmup; i += 1) await run();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    await run();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { wall: stats(wall), cpu: stats(cpu) };
}

const n2 = (x: number) => (Number.isFinite(x) ? x.toFixed(2).padStart(7) : '      —');
const load = () =>
  loadavg()
    .map((l) => l.toFixed(2))
    .join(' / ');
interface Row {
  what: string;
  /** CPU ms: median and p95 per call, or (server process from /proc) the mean per request. */
  cpu: Stats | { mean: number };
  wall: Stats;
}
function printRows(rows: Row[]): void {
  const w = Math.max(...rows.map((r) => r.what.length));
  console.log(`  ${''.padEnd(w)}   CPU ms median / p95      wall ms median / p95`);
  for (const r of rows) {
    const cpu = 'mean' in r.cpu ? `${n2(r.cpu.mean)} (mean)  ` : `${n2(r.cpu.median)} / ${n2(r.cpu.p95)}`;
    console.log(`  ${r.what.padEnd(w)}   ${cpu}        ${n2(r.wall.median)} / ${n2(r.wall.p95)}`);
  }
  console.log(`  ${'budget (one frame, p95)'.padEnd(w)}   ${n2(FRAME_MS)}`);
}

/** The engine alone on validated inputs: the home's loads once, each option's design, takeoff, price and every explanation. */
function calcAlone(): unknown {
  const parsed = homeInputSchema.parse(home);
  const loads = homeLoadFromParsed(parsed);
  return options.map((o) =>
    computeDesignFromParsed({
      home: parsed,
      design: designSchema.parse(o.design),
      catalog: engine.catalog,
      priceBook: engine.priceBook,
      pricing: calcPricing(o.pricing, desk).pricing,
      policy: DEFAULT_SIZING_POLICY,
      loads,
    }),
  );
}

/** As the server does per request: the home parsed once, then each option worked out. */
function serverCompute() {
  const parsed = parseHome(home);
  return options.map((o) => computeOption(o, parsed, engine));
}

async function inMemory(): Promise<Row[]> {
  const first = serverCompute();
  const problems = first.flatMap((c) => c.problems.map((p) => `${p.path}: ${p.message}`));
  if (problems.length) throw new Error(problems.join('; '));
  for (const [i, c] of first.entries())
    console.log(
      `  ${options[i]?.name}: ${c.figures?.design.systems.length} systems, ${c.figures?.lines.length} takeoff lines, total $${((c.figures?.price.totalCents ?? 0) / 100).toFixed(2)}`,
    );
  const calc = await measure(calcAlone, 30, RUNS);
  const server = await measure(serverCompute, 30, RUNS);
  return [
    { what: 'floor: calc alone (engine on validated inputs)', ...calc },
    { what: 'server recompute in memory (desk-compute.ts)', ...server },
  ];
}

/** The demo cluster with the bench's job: a copy of a demo job of the owner's company, 40 rooms, no options yet. */
async function benchJob(db: pg.Pool, ownerEmail: string): Promise<{ jobId: string; companyId: string; ids: string[] }> {
  await db.query('delete from job where notes like $1', [`%${BENCH_MARK}%`]);
  const jobId = randomUUID();
  const made = await db.query<{ company_id: string }>(
    `insert into job (id, company_id, customer_id, salesperson_id, assigned_installer_id, status, street, unit, city,
       region, postal_code, notes, design_conditions, design_sources, tightness, house, version, created_at, updated_at,
       last_activity_at)
     select $1, j.company_id, j.customer_id, j.salesperson_id, null, 'design', j.street, j.unit, j.city, j.region,
       j.postal_code, $2, $3, j.design_sources, 'average', '{"bedrooms": 6}', 1, now(), now(), now()
     from job j join app_user u on u.company_id = j.company_id where u.email = $4 and j.notes not like $5
     order by j.created_at, j.id limit 1 returning company_id`,
    [jobId, `Bench job (${BENCH_MARK}; deleted when it ends)`, DESIGN, ownerEmail, `%bench%`],
  );
  const companyId = made.rows[0]?.company_id;
  if (!companyId) throw new Error('the demo data has no job to copy');
  const ids = home.rooms.map(() => randomUUID());
  for (const [i, id] of ids.entries())
    await db.query(
      `insert into room (id, job_id, position, input, version, created_at, updated_at) values ($1, $2, $3, $4, 1, now(), now())`,
      [id, jobId, i, JSON.stringify(roomInputSchema.parse(room(i, id)))],
    );
  return { jobId, companyId, ids };
}

/**
 * Sequential requests, each after its `prepare` step (not measured): wall time at this client, and the server
 * process's CPU (from /proc) summed over the measured requests only, per request.
 */
async function requests(
  pid: number | undefined,
  send: (i: number) => Promise<Response>,
  prepare?: (i: number) => Promise<void>,
): Promise<{ wall: Stats; cpu: { mean: number } }> {
  const one = async (i: number) => {
    if (prepare) await prepare(i);
    const c0 = cpuMs(pid);
    const t0 = performance.now();
    const r = await send(i);
    await r.arrayBuffer();
    const wall = performance.now() - t0;
    if (r.status >= 300) throw new Error(`the server answered ${r.status}`);
    return { wall, cpu: cpuMs(pid) - c0 };
  };
  for (let i = 0; i < 20; i += 1) await one(RUNS + i);
  const wall: number[] = [];
  let cpu = 0;
  for (let i = 0; i < RUNS; i += 1) {
    const m = await one(i);
    wall.push(m.wall);
    cpu += m.cpu;
  }
  return { wall: stats(wall), cpu: { mean: cpu / RUNS } };
}

/** The same rows the route reads, by node-pg with no ORM: the job in scope, its rooms and options, the company's catalog, price book and settings. */
async function bareRead(db: pg.Pool, jobId: string, companyId: string): Promise<unknown> {
  const [job, company] = await Promise.all([
    db.query(
      `select j.*, (select json_agg(r.input order by r.position, r.created_at, r.id) from room r where r.job_id = j.id) as rooms,
         (select json_agg(o order by o.position) from design_option o where o.job_id = j.id) as options
       from job j where j.id = $1 and j.company_id = $2`,
      [jobId, companyId],
    ),
    db.query(
      `select dataset, data from company_data_row where company_id = $1 and dataset in ('models', 'labor', 'materials',
         'kits', 'refrigerants', 'categories', 'financing', 'discount-limits')
       union all select 'settings', data from price_book_settings where company_id = $1`,
      [companyId],
    ),
  ]);
  return [job.rows, company.rows];
}

async function throughServer(): Promise<Row[]> {
  const owner = demoAccounts.find((a) => a.role === 'owner');
  if (!owner) throw new Error('no demo owner');
  const { url } = await startCluster(DEMO);
  await migrate(url);
  await withOrm(url, async (orm) => {
    if (await isEmpty(orm.em.fork())) await seedDemo(orm);
  });
  const db = new pg.Pool({ connectionString: url, max: 2 });
  try {
    const { jobId, companyId, ids } = await benchJob(db, owner.email);
    const app = await startApp({
      port: PORT,
      databaseUrl: url,
      serverDir: SERVER_DIR,
      cpuProfDir: CPU_PROF,
      env: { QUEUE_WORKERS: 'off' },
    });
    const s = await signIn(APP, owner.email, owner.password);
    const headers = {
      cookie: s.cookie,
      'x-forwarded-proto': 'https',
      'x-csrf-token': s.csrf,
      'accept-encoding': 'gzip, deflate, br',
    };
    const send = (method: string, path: string, body?: unknown, extra: Record<string, string> = {}) =>
      fetch(`${APP}${path}`, {
        method,
        headers: { ...headers, ...extra, ...(body ? { 'content-type': 'application/json' } : {}) },
        body: body ? JSON.stringify(body) : undefined,
      });
    const made: { id: string; version: number }[] = [];
    for (const o of optionInputs(ids)) {
      const r = await send('POST', `/api/jobs/${jobId}/options`, {
        name: o.name,
        design: o.design,
        pricing: pricingOf(o.discount),
      });
      if (r.status !== 201) throw new Error(`creating an option answered ${r.status}: ${await r.text()}`);
      made.push(((await r.json()) as { option: { id: string; version: number } }).option);
    }
    const first = made[0];
    if (!first) throw new Error('no option');
    const edit = await send(
      'PUT',
      `/api/jobs/${jobId}/options/${first.id}/takeoff-edits`,
      { edits: [EDIT] },
      {
        'if-match': `"${first.version}"`,
      },
    );
    if (edit.status !== 200) throw new Error(`the takeoff edit answered ${edit.status}: ${await edit.text()}`);
    let version = ((await edit.json()) as { option: { version: number } }).option.version;
    const deskBody = await (await send('GET', `/api/jobs/${jobId}/desk`)).text();
    console.log(
      `  bench job: 40 rooms, three options; GET …/desk answers ${(deskBody.length / 1024).toFixed(0)} KB of JSON (before compression)`,
    );

    const floor = await measure(() => bareRead(db, jobId, companyId), 20, RUNS);
    const getDesk = () => send('GET', `/api/jobs/${jobId}/desk`);
    const windows: { label: string; fromUs: number; toUs: number }[] = [];
    const phase = async <T>(label: string, run: () => Promise<T>): Promise<T> => {
      const fromUs = profileClockUs();
      const out = await run();
      windows.push({ label, fromUs, toUs: profileClockUs() });
      return out;
    };
    const get = await phase('GET …/desk, nothing changed', () => requests(app.pid, getDesk));
    // A room changes before each read (a length never used before in the run): every option is worked out afresh.
    const firstRoom = ids[0] ?? '';
    let roomVersion = 1;
    const afresh = await phase('GET …/desk after a room changed', () =>
      requests(app.pid, getDesk, async (i) => {
        const r = await send(
          'PATCH',
          `/api/jobs/${jobId}/rooms/${firstRoom}`,
          { input: { ...room(0, firstRoom), lengthFt: 10 + (i % 400) / 20 } },
          { 'if-match': `"${roomVersion}"` },
        );
        if (r.status !== 200) throw new Error(`the room save answered ${r.status}: ${await r.text()}`);
        roomVersion = ((await r.json()) as { room: { version: number } }).room.version;
      }),
    );
    // The estimator changes one option's deposit (a value not used before in the run): the PATCH answers that
    // option worked out again; then the desk is read again, as the desk's screen does after a save.
    const patchOption = (i: number) =>
      send(
        'PATCH',
        `/api/jobs/${jobId}/options/${first.id}`,
        { pricing: { ...pricingOf(0), deposit: { kind: 'percent', value: (i % 1000) / 10 } } },
        { 'if-match': `"${version}"` },
      ).then(async (r) => {
        version += 1;
        return r;
      });
    const patch = await phase('PATCH of an option', () => requests(app.pid, patchOption));
    const after = await phase('GET …/desk after an option changed', () =>
      requests(app.pid, getDesk, async (i) => {
        await (await patchOption(500 + i)).arrayBuffer();
      }),
    );
    await stopAll();
    if (CPU_PROF) {
      // CPU.<date>.<time>.<pid>.<thread>.<n>.cpuprofile: the server's main thread (0), not tsx's loader thread.
      const newest = readdirSync(CPU_PROF)
        .filter((f) => f.endsWith('.cpuprofile') && f.includes(`.${app.pid}.0.`))
        .sort()
        .at(-1);
      if (newest) {
        const file = join(CPU_PROF, newest);
        console.log(`  profile: ${file}`);
        for (const w of windows) summariseProfile(file, 20, `${RUNS + 20} × ${w.label}`, w);
      }
    }
    return [
      { what: 'floor: bare SQL read of the same rows (node-pg)', ...floor },
      { what: 'GET …/desk, nothing changed (server CPU from /proc)', ...get },
      { what: 'GET …/desk after a room changed (all worked out)', ...afresh },
      { what: "PATCH of an option's deposit, with its answer", ...patch },
      { what: 'GET …/desk after that PATCH', ...after },
    ];
  } finally {
    await stopAll();
    await db.query('delete from job where notes like $1', [`%${BENCH_MARK}%`]).catch(() => undefined);
    await db.end();
  }
}

console.log(
  'desk benchmark — three options of a 40-room home (loads, sizing, lines, charge, electrical, takeoff, edits, price, explanations)',
);
console.log(
  `  load average (1/5/15 min) before: ${load()} on ${availableParallelism()} CPU(s); ${RUNS} runs each; server from ${SERVER_DIR}`,
);
const rows: Row[] = [];
try {
  rows.push(...(await inMemory()));
} catch (e) {
  console.log('  the in-memory recompute could not run:', e instanceof Error ? e.message : String(e));
}
try {
  rows.push(...(await throughServer()));
} catch (e) {
  console.log('  the server part could not run:', e instanceof Error ? e.message : String(e));
}
printRows(rows);
console.log(
  `  load average after: ${load()}${CPU_PROF ? ' (the server ran under --cpu-prof: its figures are inflated)' : ''}`,
);
