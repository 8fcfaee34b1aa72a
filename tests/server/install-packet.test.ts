import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTIONS } from '@calc';
import { installPacket, type InstallPacket } from '@contract';
import { routeRegistry } from '../../server/src/lib/route';
import { UserSchema } from '../../server/src/modules/users/user.entity';
import { login, makeCompany, TEST_PASSWORD, type Session, type TestCompany } from '../helpers/fixtures';
import { pdfText } from '../helpers/pdf-text';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';
import { signedJob, type SignedJob } from './install-helpers';
import { expectProblem, newJob, newRoom, sampleRoom } from './jobs-helpers';
import { hashPassword } from '../../server/src/services/passwords';

/**
 * Issue 15 (pack15): scheduling a won job's installers, the installer's day list, and the job packet on the
 * screen and as a PDF made by the queue — with the installer's scope (only assigned jobs; another company's
 * 404) and no money in any answer an installer gets (every key of every answer walked).
 */
let t: TestApp;
let db: pg.Client;
let a: TestCompany;
let b: TestCompany;
let owner: Session;
let estimator: Session;
let installer: Session;
let installer2: Session;
let installer2Id: string;
let salesperson: Session;
let ownerB: Session;

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off' });
  a = await makeCompany(t.orm.em.fork(), 'Packet');
  b = await makeCompany(t.orm.em.fork(), 'PacketB');
  const em = t.orm.em.fork();
  const second = em.create(UserSchema, {
    id: randomUUID(),
    company: a.id,
    name: 'Ines Thornquist',
    email: `ines-${randomUUID().slice(0, 8)}@packet.example.com`,
    role: 'installer',
    active: true,
    passwordHash: await hashPassword(TEST_PASSWORD),
  });
  await em.flush();
  installer2Id = second.id;
  owner = await login(t.app, a.users.owner.email);
  estimator = await login(t.app, a.users.estimator.email);
  installer = await login(t.app, a.users.installer.email);
  installer2 = await login(t.app, second.email);
  salesperson = await login(t.app, a.users.salesperson.email);
  ownerB = await login(t.app, b.users.owner.email);
  db = new pg.Client({ connectionString: testDatabaseUrl() });
  await db.connect();
}, 60_000);
afterAll(async () => {
  await db?.end();
  await t?.close();
});

const put = (s: Session, jobId: string, body: unknown) =>
  s.agent
    .put(`/api/jobs/${jobId}/assignments`)
    .set('X-CSRF-Token', s.csrf)
    .send(body as object);

/** A signed job whose sold option (2) has a takeoff with equipment, materials and labor, each with a price. */
async function soldJob(): Promise<SignedJob> {
  return signedJob(db, a, estimator, {
    position: 2,
    edit: (s) => {
      s.options[1]!.takeoff = [
        {
          itemKey: 'eq-1',
          description: 'Outdoor unit FX-30H2',
          quantity: 1,
          unit: 'ea',
          category: 'equipment',
          sellCents: 512300,
        },
        {
          itemKey: 'm-1',
          description: 'Line set 1/4 x 1/2 insulated',
          quantity: 35,
          unit: 'ft',
          category: 'material',
          sellCents: 31150,
        },
        {
          itemKey: 'm-2',
          description: 'Condensate pump, mini',
          quantity: 1,
          unit: 'ea',
          category: 'material',
          sellCents: 18900,
        },
        {
          itemKey: 'l-1',
          description: 'Install crew hours',
          quantity: 14,
          unit: 'h',
          category: 'labor',
          sellCents: 170800,
        },
      ];
    },
  });
}

/** Every key of a JSON value, at any depth. */
function keysOf(value: unknown, out: string[] = []): string[] {
  if (Array.isArray(value)) for (const v of value) keysOf(v, out);
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) {
      out.push(k);
      keysOf(v, out);
    }
  return out;
}
/** Key names that carry money in this product (price, cost, margin, discount, tax, deposit, sell, plans…; every money total ends in Cents). */
const MONEY_KEY = /cents|price|cost|margin|discount|tax|deposit|balance|monthly|markup|sell|apr/i;
function expectNoMoney(body: unknown, where: string) {
  const bad = keysOf(body).filter((k) => MONEY_KEY.test(k));
  expect(bad, where).toEqual([]);
}

describe('scheduling a won job', () => {
  it('the office puts installers on a won job for a day; each sees it on their day list, with the crew', async () => {
    const job = await soldJob();
    const r = await put(owner, job.jobId, {
      assignments: [
        { userId: a.users.installer.id, day: '2026-12-14' },
        { userId: installer2Id, day: '2026-12-14' },
      ],
    });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.mayAssign).toEqual({ ok: true });
    expect(r.body.assignments.map((x: { userId: string }) => x.userId).sort()).toEqual(
      [a.users.installer.id, installer2Id].sort(),
    );
    const got = await estimator.agent.get(`/api/jobs/${job.jobId}/assignments`);
    expect(got.body).toEqual(r.body);

    const mine = await installer.agent.get('/api/my-jobs?from=2026-12-01');
    expect(mine.status).toBe(200);
    const day = mine.body.days.find((d: { day: string }) => d.day === '2026-12-14');
    const entry = day.jobs.find((j: { jobId: string }) => j.jobId === job.jobId);
    expect(entry.customerName).toBeTruthy();
    expect(entry.crew).toEqual(['Ines Thornquist']);
    expectNoMoney(mine.body, 'my-jobs');

    // Moving one installer to another day: the set is replaced whole.
    const moved = await put(estimator, job.jobId, { assignments: [{ userId: installer2Id, day: '2026-12-15' }] });
    expect(moved.status).toBe(200);
    const after = await installer.agent.get('/api/my-jobs?from=2026-12-01');
    expect(after.body.days.flatMap((d: { jobs: { jobId: string }[] }) => d.jobs.map((j) => j.jobId))).not.toContain(
      job.jobId,
    );
    expectProblem(await installer.agent.get(`/api/jobs/${job.jobId}/packet`), 404);
    expect((await installer2.agent.get(`/api/jobs/${job.jobId}/packet`)).status).toBe(200);
  });

  it('refuses, changing nothing: a job not won, a person who is no installer of the company, bad days, others', async () => {
    const job = await soldJob();
    const ok = await put(owner, job.jobId, { assignments: [{ userId: a.users.installer.id, day: '2026-12-20' }] });
    expect(ok.status).toBe(200);

    const open = await newJob(estimator);
    const notWon = await put(owner, open.id, { assignments: [{ userId: a.users.installer.id, day: '2026-12-20' }] });
    expectProblem(notWon, 409);
    expect(notWon.body.detail).toMatch(/won/);

    const wrongPerson = await put(owner, job.jobId, {
      assignments: [
        { userId: a.users.installer.id, day: '2026-12-20' },
        { userId: a.users.salesperson.id, day: '2026-12-20' },
      ],
    });
    expectProblem(wrongPerson, 400);
    expect(wrongPerson.body.errors).toEqual([
      { path: 'assignments.1.userId', message: 'Choose an active installer of your company.' },
    ]);
    expectProblem(
      await put(owner, job.jobId, { assignments: [{ userId: b.users.installer.id, day: '2026-12-20' }] }),
      400,
    );
    for (const day of ['2026-02-30', '14/12/2026', ''])
      expectProblem(await put(owner, job.jobId, { assignments: [{ userId: a.users.installer.id, day }] }), 400);
    expectProblem(
      await put(owner, job.jobId, {
        assignments: [
          { userId: a.users.installer.id, day: '2026-12-20' },
          { userId: a.users.installer.id, day: '2026-12-21' },
        ],
      }),
      400,
    );
    expectProblem(await put(owner, job.jobId, { assignments: [], companyId: b.id }), 400);
    // Installers and salespeople do not schedule; another company's office does not see the job.
    expectProblem(await put(installer, job.jobId, { assignments: [] }), 403);
    expectProblem(await put(salesperson, job.jobId, { assignments: [] }), 403);
    expectProblem(await put(ownerB, job.jobId, { assignments: [] }), 404);
    expectProblem(await ownerB.agent.get(`/api/jobs/${job.jobId}/assignments`), 404);

    const still = await owner.agent.get(`/api/jobs/${job.jobId}/assignments`);
    expect(still.body.assignments).toEqual([
      { userId: a.users.installer.id, name: a.users.installer.name, day: '2026-12-20' },
    ]);
  });
});

describe('the job packet', () => {
  it('holds the sold option’s equipment, rooms, lines, charge, electrical, condensate, materials and cautions', async () => {
    const job = await soldJob();
    // A room named as the sold design names it, with notes: the packet shows where the head goes.
    await newRoom(estimator, job.jobId, { ...sampleRoom('Great room'), notes: 'Head above the sliding door, left.' });
    await put(owner, job.jobId, { assignments: [{ userId: a.users.installer.id, day: '2026-12-22' }] });
    const r = await installer.agent.get(`/api/jobs/${job.jobId}/packet`);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const p: InstallPacket = installPacket.parse(r.body);
    const sold = job.snapshot.options[1]!;
    const sys = sold.systems[0]!;
    expect(p.sold).toMatchObject({ versionNumber: 2, optionName: 'Better' });
    expect(p.systems).toHaveLength(1);
    expect(p.systems[0]!.outdoor.model).toBe(sys.outdoor.key);
    expect(p.systems[0]!.indoorUnits.map((u) => u.unit.model)).toEqual(sys.zones.map((z) => z.indoor.key));
    const great = p.systems[0]!.indoorUnits[0]!.rooms.find((x) => x.name === 'Great room')!;
    expect(great.notes).toBe('Head above the sliding door, left.');
    expect(great.roomId).not.toBeNull();
    // A room the design names that the job no longer has is said so, not dropped.
    expect(p.systems[0]!.indoorUnits[0]!.rooms.find((x) => x.name === 'Kitchen')!.roomId).toBeNull();
    expect(
      p.systems[0]!.lineSets.map((l) => [l.plannedLengthFt, l.liftFt, l.liquid, l.suction, l.extraChargeText]),
    ).toEqual(sys.lineSets.map((l) => [l.lengthFt, l.liftFt, l.liquid, l.suction, l.extraChargeText]));
    expect(p.systems[0]!.lineSets.map((l) => l.condensate)).toEqual(sys.lineSets.map((l) => l.condensate));
    expect(p.systems[0]!.electrical).toEqual(sys.electrical);
    expect(p.extraChargeOz).toBe(sys.extraChargeOz);
    expect(p.totalChargeOz).toBe(sys.totalChargeOz);
    // Materials without labor and without any price.
    expect(p.materials).toEqual([
      { description: 'Outdoor unit FX-30H2', quantity: 1, unit: 'ea', category: 'equipment' },
      { description: 'Line set 1/4 x 1/2 insulated', quantity: 35, unit: 'ft', category: 'material' },
      { description: 'Condensate pump, mini', quantity: 1, unit: 'ea', category: 'material' },
    ]);
    // R-454B is A2L (ASHRAE 34 safety class, as calc's REFRIGERANT_INFO holds it): its caution is there.
    expect(p.systems[0]!.a2l).toBe(true);
    expect(p.cautions.map((c) => c.key)).toEqual([
      'makerAndCode',
      'refrigerant',
      'pressureTest',
      'a2l',
      'electrical',
      'estimate',
    ]);
    expect(p.cautions.find((c) => c.key === 'pressureTest')!.text).toContain(CAUTIONS.pressureTest);
    expect(p.cautions.find((c) => c.key === 'pressureTest')!.text).toMatch(/nameplate or installation manual/);
    expectNoMoney(r.body, 'packet');
    expect(JSON.stringify(r.body)).not.toMatch(/\$|1598000|512300|170800/);
  });

  it('leaves out the A2L caution for an A1 refrigerant, and is 409 before a signature, 404 outside the scope', async () => {
    const a1 = await signedJob(db, a, estimator, {
      edit: (s) => s.options.forEach((o) => (o.systems[0]!.refrigerant = 'R-410A')),
    });
    const r = await owner.agent.get(`/api/jobs/${a1.jobId}/packet`);
    expect(r.status).toBe(200);
    expect(r.body.systems[0].a2l).toBe(false);
    expect(r.body.cautions.map((c: { key: string }) => c.key)).not.toContain('a2l');

    const unsigned = await signedJob(db, a, estimator, { sign: false });
    expectProblem(await owner.agent.get(`/api/jobs/${unsigned.jobId}/packet`), 409);
    expectProblem(await installer.agent.get(`/api/jobs/${a1.jobId}/packet`), 404);
    expectProblem(await ownerB.agent.get(`/api/jobs/${a1.jobId}/packet`), 404);
    expectProblem(await salesperson.agent.get(`/api/jobs/${a1.jobId}/packet`), 403);
  });

  it('as a PDF through the queue: the same content a reader extracts, no price', async () => {
    const job = await soldJob();
    await put(owner, job.jobId, { assignments: [{ userId: a.users.installer.id, day: '2026-12-23' }] });
    expectProblem(await installer.agent.get(`/api/jobs/${job.jobId}/packet/pdf`), 409);
    const asked = await installer.agent.post(`/api/jobs/${job.jobId}/packet/pdf`).set('X-CSRF-Token', installer.csrf);
    expect(asked.status, JSON.stringify(asked.body)).toBe(202);
    expect(asked.body).toEqual({ state: 'waiting', sha256: null });
    await t.services.queue.drain();
    const packet = await installer.agent.get(`/api/jobs/${job.jobId}/packet`);
    expect(packet.body.pdf.state).toBe('ready');
    const res = await installer.agent
      .get(`/api/jobs/${job.jobId}/packet/pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers.etag).toBe(`"${packet.body.pdf.sha256}"`);
    const text = await pdfText(res.body as Buffer);
    const sys = job.snapshot.options[1]!.systems[0]!;
    for (const want of [
      'Job packet',
      sys.outdoor.key,
      ...sys.zones.map((z) => z.indoor.key),
      'Great room',
      '35 ft installed − 25 ft pre-charged = 10 ft × 0.22 oz/ft = 2.2 oz',
      'Total system charge',
      '88.2 oz',
      '2.2 oz',
      'R-454B (A2L)',
      'condensate pump',
      'gravity drain',
      'Line set 1/4 x 1/2 insulated',
      'Disconnect',
      '10 AWG copper',
      'dry nitrogen',
      CAUTIONS.a2l.slice(0, 60),
    ])
      expect(text, want).toContain(want);
    expect(text).not.toContain('Install crew hours');
    expect(text).not.toMatch(/\$\s?\d/);
    // Another company and an unassigned installer cannot fetch or ask for it.
    expectProblem(await ownerB.agent.get(`/api/jobs/${job.jobId}/packet/pdf`), 404);
    expectProblem(
      await installer2.agent.post(`/api/jobs/${job.jobId}/packet/pdf`).set('X-CSRF-Token', installer2.csrf),
      404,
    );
  }, 120_000);
});

describe('nothing an installer reads carries money', () => {
  it('every GET an installer may call on their assigned, signed job answers without a money key', async () => {
    const job = await soldJob();
    await newRoom(estimator, job.jobId);
    await put(owner, job.jobId, { assignments: [{ userId: a.users.installer.id, day: '2026-12-24' }] });
    const reads = routeRegistry.filter(
      (r) =>
        r.method === 'get' &&
        r.policy.kind === 'roles' &&
        r.policy.roles.includes('installer') &&
        !r.raw &&
        typeof r.response === 'object' &&
        !('kind' in r.response && (r.response as { kind: string }).kind === 'raw') &&
        // Only paths whose parameters this test can fill: the job's id, or none.
        (r.path.match(/:(\w+)/g) ?? []).every((p) => p === ':jobId' || p === ':id'),
    );
    const seen: string[] = [];
    for (const r of reads) {
      const isJobPath = /^\/api\/jobs\/:(jobId|id)/.test(r.path);
      if (/:(jobId|id)/.test(r.path) && !isJobPath) continue;
      const path = r.path.replace(/:(jobId|id)/, job.jobId);
      const res = await installer.agent.get(path);
      if (res.status !== 200) continue;
      seen.push(r.path);
      expectNoMoney(res.body, `GET ${r.path}`);
    }
    // The ones that matter most were among them.
    console.log(`money-key walk over ${seen.length} installer GETs: ${seen.join(', ')}`);
    for (const p of ['/api/jobs/', '/api/jobs/:id', '/api/jobs/:jobId/packet', '/api/my-jobs/'])
      expect(seen, p).toContain(p);
    // The company's data tables an installer may open (the price book's columns left out for them).
    const tables = await installer.agent.get('/api/company-data/tables');
    for (const table of tables.body.tables as { id: string }[]) {
      const res = await installer.agent.get(`/api/company-data/${table.id}`);
      if (res.status === 200) expectNoMoney(res.body, `GET /api/company-data/${table.id}`);
      else expect([403, 404], table.id).toContain(res.status);
    }
    // And the proposal routes, the proposal's PDFs and the signed copy are closed to installers.
    for (const path of ['proposal', 'proposal/versions/2', 'proposal/versions/2/pdf', 'proposal/versions/2/signed-pdf'])
      expectProblem(await installer.agent.get(`/api/jobs/${job.jobId}/${path}`), 403);
  });
});
