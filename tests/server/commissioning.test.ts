import { randomUUID } from 'node:crypto';
import pg from 'pg';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TEST_GAS_REASON } from '@contract';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';
import { assignDirect, cancelSigned, signedJob } from './install-helpers';
import { expectProblem, patch, post } from './jobs-helpers';

/**
 * Issue 15 (commission15): the commissioning record — validation beside the field (nitrogen only, the
 * equipment's test pressure, micron readings), calc's verdicts, the refrigerant entries and the extra
 * charge recomputed from measured lengths, If-Match conflicts with both sides, the sign-off that makes the
 * job installed and the record read-only, amendments, and tenant/installer scoping.
 */
let t: TestApp;
let db: pg.Client;
let a: TestCompany;
let b: TestCompany;
let estimator: Session;
let installer: Session;
let otherOwner: Session;
let sales: Session;

beforeAll(async () => {
  t = await buildTestApp();
  db = new pg.Client({ connectionString: testDatabaseUrl() });
  await db.connect();
  a = await makeCompany(t.orm.em.fork(), 'Commission');
  b = await makeCompany(t.orm.em.fork(), 'CommissionB');
  estimator = await login(t.app, a.users.estimator.email);
  installer = await login(t.app, a.users.installer.email);
  sales = await login(t.app, a.users.salesperson.email);
  otherOwner = await login(t.app, b.users.owner.email);
  // The sold outdoor unit in A's catalog: per-circuit pre-charge 25 ft, 0.22 oz/ft on 1/4 in liquid, and
  // a test pressure of 550 psig (invented test values, as the demo catalog's are).
  await db.query(
    `insert into company_data_row (id, company_id, dataset, key, data, created_at, updated_at)
     values ($1, $2, 'models', 'FX-30H2', $3, now(), now())`,
    [
      randomUUID(),
      a.id,
      JSON.stringify({
        key: 'FX-30H2',
        refrigerant: 'R-454B',
        prechargedLengthFt: 25,
        prechargeBasis: 'per-circuit',
        chargeAdders: [{ liquidOdIn: 0.25, ozPerFt: 0.22 }],
        testPressurePsig: 550,
      }),
    ],
  );
});
afterAll(async () => {
  await db?.end();
  await t?.close();
});

/** A won job of A signed for option 2 (system sys-2, FX-30H2, R-454B), scheduled for A's installer (pack15's helpers). */
async function wonJob(): Promise<string> {
  const { jobId } = await signedJob(db, a, estimator);
  await assignDirect(db, a, jobId, a.users.installer.id);
  return jobId;
}

const url = (jobId: string, rest = '') => `/api/jobs/${jobId}/commissioning${rest}`;
async function read(s: Session, jobId: string) {
  const r = await s.agent.get(url(jobId));
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return r.body.record as {
    version: number;
    state: string;
    jobStatus: string;
    verdicts: {
      pressureTest: { pass: boolean; outcome: string } | null;
      evacuation: { pass: boolean; outcome: string; words: string } | null;
    };
    systems: {
      key: string;
      charge: { extraOz: number; plannedOz: number; weighedInOz: number; differenceOz: number | null } | null;
    }[];
    missing: string[];
    amendments: { what: string; reason: string; by: string }[];
    testPressureLimitPsig: number | null;
    cautions: string[];
    refrigerant: { addedOz: number }[];
  };
}
const save = (s: Session, jobId: string, version: number, body: unknown) =>
  patch(s, url(jobId), version).send(body as object);

const GOOD_TEST = {
  testGas: 'nitrogen',
  testPsig: 300,
  gaugeResolutionPsi: 1,
  startPsig: 300,
  startF: 70,
  endPsig: 294,
  endF: 60,
  holdMinutes: 60,
};

async function drawnPng(): Promise<string> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="600" height="200"><path d="M20 150 C 120 20, 200 190, 300 90 S 480 40, 570 140" stroke="#102030" stroke-width="6" fill="none"/></svg>`;
  return `data:image/png;base64,${(await sharp(Buffer.from(svg)).png().toBuffer()).toString('base64')}`;
}

describe('the commissioning record', () => {
  it('refuses oxygen and air with the reason, beside the field, and changes nothing', async () => {
    const jobId = await wonJob();
    const r0 = await read(installer, jobId);
    const oxygen = await save(installer, jobId, r0.version, { pressureTest: { ...GOOD_TEST, testGas: 'oxygen' } });
    expectProblem(oxygen, 400);
    expect(oxygen.body.errors).toContainEqual({ path: 'pressureTest.testGas', message: TEST_GAS_REASON.oxygen });
    const air = await save(installer, jobId, r0.version, { pressureTest: { ...GOOD_TEST, testGas: 'compressed air' } });
    expectProblem(air, 400);
    expect(air.body.errors).toContainEqual({ path: 'pressureTest.testGas', message: TEST_GAS_REASON.air });
    expect((await read(installer, jobId)).version).toBe(r0.version);
  });

  it('refuses a test pressure above the equipment’s, naming the catalog value, and a negative micron reading', async () => {
    const jobId = await wonJob();
    const r0 = await read(installer, jobId);
    expect(r0.testPressureLimitPsig).toBe(550);
    const over = await save(installer, jobId, r0.version, { pressureTest: { ...GOOD_TEST, testPsig: 600 } });
    expectProblem(over, 400);
    const err = (over.body.errors as { path: string; message: string }[]).find(
      (e) => e.path === 'pressureTest.testPsig',
    );
    expect(err?.message).toMatch(/550 psig is the test pressure the catalog gives for FX-30H2/);
    const negative = await save(installer, jobId, r0.version, {
      evacuation: { reachedMicrons: -5, afterHoldMicrons: 600, holdMinutes: 10, holdReadings: [] },
    });
    expectProblem(negative, 400);
    expect(negative.body.errors[0].path).toBe('evacuation.reachedMicrons');
    expect(negative.body.errors[0].message).toMatch(/cannot be below zero/);
    expect((await read(installer, jobId)).version).toBe(r0.version);
  });

  it('saves each step as entered with calc’s verdicts; a hold reading above the policy fails the step', async () => {
    const jobId = await wonJob();
    const r0 = await read(installer, jobId);
    const s1 = await save(installer, jobId, r0.version, { pressureTest: GOOD_TEST });
    expect(s1.status, JSON.stringify(s1.body)).toBe(200);
    // [PUB: reference check 9.3 — 300 psig at 70 °F → 294.06 at 60 °F: the drop is the cooling]
    expect(s1.body.record.verdicts.pressureTest.outcome).toBe('drop-explained-by-temperature');
    // Default policy: ≤ 1,500 microns within 10 min [PUB: UL-derived instructions, reference §9]; 1,800 fails.
    const s2 = await save(installer, jobId, s1.body.record.version, {
      evacuation: { reachedMicrons: 420, afterHoldMicrons: 1800, holdMinutes: 10, holdReadings: [] },
    });
    expect(s2.status).toBe(200);
    expect(s2.body.record.verdicts.evacuation).toMatchObject({ pass: false, outcome: 'rose-too-far' });
    expect(s2.body.record.missing).toContain('Evacuation: it did not pass the company’s policy.');
    // A stricter policy set by the owner: 1,000 microns [common practice, reference §9 TRADE] — 1,200 fails, 900 passes.
    const owner = await login(t.app, a.users.owner.email);
    const pol = await owner.agent
      .put('/api/company/commissioning-policy')
      .set('X-CSRF-Token', owner.csrf)
      .set('If-Match', '"0"')
      .send({
        targetMicrons: 500,
        maxRiseToMicrons: 1000,
        holdMinutes: 10,
        startupReadings: ['Outdoor temperature (°F)'],
        askLot: true,
      });
    expect(pol.status, JSON.stringify(pol.body)).toBe(200);
    const s3 = await save(installer, jobId, s2.body.record.version, {
      evacuation: { reachedMicrons: 420, afterHoldMicrons: 1200, holdMinutes: 10, holdReadings: [] },
    });
    expect(s3.body.record.verdicts.evacuation.pass).toBe(false);
    const s4 = await save(installer, jobId, s3.body.record.version, {
      evacuation: { reachedMicrons: 420, afterHoldMicrons: 900, holdMinutes: 10, holdReadings: [] },
    });
    expect(s4.body.record.verdicts.evacuation.pass).toBe(true);
    const back = await owner.agent
      .put('/api/company/commissioning-policy')
      .set('X-CSRF-Token', owner.csrf)
      .set('If-Match', `"${pol.body.policy.version}"`)
      .send({ targetMicrons: 500, maxRiseToMicrons: 1500, holdMinutes: 10, startupReadings: [], askLot: false });
    expect(back.status).toBe(200);
  });

  it('a second device’s stale edit is a 409 carrying both sides, never a silent overwrite', async () => {
    const jobId = await wonJob();
    const r0 = await read(installer, jobId);
    const first = await save(installer, jobId, r0.version, { notes: 'Outdoor unit on the east pad.' });
    expect(first.status).toBe(200);
    const second = await save(estimator, jobId, r0.version, { notes: 'Outdoor unit on the west pad.' });
    expectProblem(second, 409);
    expect(second.body.current.notes).toBe('Outdoor unit on the east pad.');
    expect(second.body.yours).toEqual({ notes: 'Outdoor unit on the west pad.' });
    expect(second.body.currentVersion).toBe(first.body.record.version);
    expect((await read(installer, jobId)).version).toBe(first.body.record.version);
  });

  it('refrigerant must match the equipment’s; the extra charge is recomputed from measured lengths beside what was weighed in', async () => {
    const jobId = await wonJob();
    const r0 = await read(installer, jobId);
    // Planned: circuit z1 35 ft installed − 25 ft pre-charged = 10 ft × 0.22 oz/ft = 2.2 oz; z2 25 ft → 0.
    expect(r0.systems[0]?.charge?.plannedOz).toBeCloseTo(2.2, 9);
    const wrong = await post(installer, url(jobId, '/refrigerant')).send({
      id: randomUUID(),
      systemKey: 'sys-2',
      refrigerant: 'R-410A',
      addedOz: 4,
      recoveredOz: 0,
      lot: null,
      additives: null,
    });
    expectProblem(wrong, 400);
    expect(wrong.body.errors[0]).toMatchObject({ path: 'refrigerant' });
    expect(wrong.body.errors[0].message).toMatch(/This system takes R-454B/);
    const measured = await save(installer, jobId, r0.version, {
      measuredLines: [{ systemKey: 'sys-2', zoneKey: 'z1', measuredFt: 45 }],
    });
    expect(measured.status, JSON.stringify(measured.body)).toBe(200);
    const entryId = randomUUID();
    const entry = {
      id: entryId,
      systemKey: 'sys-2',
      refrigerant: 'R-454B',
      addedOz: 4,
      recoveredOz: 0,
      lot: 'LOT-7731',
      additives: null,
    };
    const added = await post(installer, url(jobId, '/refrigerant')).send(entry);
    expect(added.status, JSON.stringify(added.body)).toBe(201);
    // A replay of the same entry (the offline queue sending again) is not a second weighing.
    const again = await post(installer, url(jobId, '/refrigerant')).send(entry);
    expect(again.status).toBe(201);
    const r1 = await read(installer, jobId);
    expect(r1.refrigerant).toHaveLength(1);
    // [reference §8 formula: (45 − 25) ft × 0.22 oz/ft = 4.4 oz; weighed in 4 oz → 0.4 oz less]
    expect(r1.systems[0]?.charge).toMatchObject({ extraOz: 4.4, weighedInOz: 4, differenceOz: -0.4 });
    const rows = await db.query(
      `select company_id, job_id, refrigerant, added_oz, recovered_oz, technician_user_id, lot from refrigerant_entry where id = $1`,
      [entryId],
    );
    expect(rows.rows[0]).toMatchObject({
      company_id: a.id,
      job_id: jobId,
      refrigerant: 'R-454B',
      added_oz: '4.00',
      recovered_oz: '0.00',
      technician_user_id: a.users.installer.id,
      lot: 'LOT-7731',
    });
    expect(r1.cautions.some((c) => /A2L/.test(c))).toBe(true);
  });

  it('signs off only when complete and certified; then installed, read-only, amendments kept with who and why', async () => {
    const jobId = await wonJob();
    const r0 = await read(installer, jobId);
    const s1 = await save(installer, jobId, r0.version, {
      pressureTest: GOOD_TEST,
      evacuation: { reachedMicrons: 410, afterHoldMicrons: 780, holdMinutes: 10, holdReadings: [] },
    });
    expect(s1.status).toBe(200);
    const signature = await drawnPng();
    const early = await post(installer, url(jobId, '/sign-off'))
      .set('If-Match', `"${s1.body.record.version}"`)
      .send({ customerName: 'Odalys Brackenridge', signature });
    expectProblem(early, 409);
    expect(early.body.missing).toEqual(['Your refrigerant-handling certification number (on your profile).']);
    const cert = await installer.agent
      .put('/api/me/refrigerant-certification')
      .set('X-CSRF-Token', installer.csrf)
      .send({ certNumber: 'T608-55120' });
    expect(cert.status, JSON.stringify(cert.body)).toBe(200);
    const signed = await post(installer, url(jobId, '/sign-off'))
      .set('If-Match', `"${s1.body.record.version}"`)
      .send({ customerName: 'Odalys Brackenridge', signature });
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);
    expect(signed.body.record.state).toBe('installed');
    expect(signed.body.record.signOff).toMatchObject({ certNumber: 'T608-55120', customerName: 'Odalys Brackenridge' });
    expect(signed.body.record.jobStatus).toBe('installed');
    const job = await estimator.agent.get(`/api/jobs/${jobId}`);
    expect(job.body.job.status).toBe('installed');

    const locked = await save(installer, jobId, signed.body.record.version, { notes: 'Changed afterwards' });
    expectProblem(locked, 409);
    expect(locked.body.reason).toBe('read-only');
    const lateEntry = await post(installer, url(jobId, '/refrigerant')).send({
      id: randomUUID(),
      systemKey: 'sys-2',
      refrigerant: 'R-454B',
      addedOz: 1,
      recoveredOz: 0,
      lot: null,
      additives: null,
    });
    expectProblem(lateEntry, 409);
    // The database refuses it too.
    await expect(db.query(`update commissioning_record set notes = 'x' where job_id = $1`, [jobId])).rejects.toThrow(
      /read-only/,
    );

    const noReason = await post(estimator, url(jobId, '/amendments')).send({
      what: 'Hold',
      correction: '12 min',
      reason: '',
    });
    expectProblem(noReason, 400);
    const amended = await post(estimator, url(jobId, '/amendments')).send({
      what: 'Evacuation hold',
      correction: 'The hold was 12 minutes, not 10.',
      reason: 'The technician wrote the planned time instead of the timer’s.',
    });
    expect(amended.status, JSON.stringify(amended.body)).toBe(201);
    const r2 = await read(installer, jobId);
    expect(r2.amendments).toEqual([
      expect.objectContaining({
        what: 'Evacuation hold',
        reason: 'The technician wrote the planned time instead of the timer’s.',
        by: a.users.estimator.name,
      }),
    ]);
    expect(r2.state).toBe('installed');
  });

  it('another company’s job, an unassigned installer’s and a salesperson: 404 / 403, nothing shown', async () => {
    const jobId = await wonJob();
    expectProblem(await otherOwner.agent.get(url(jobId)), 404);
    expectProblem(await patch(otherOwner, url(jobId), 1).send({ notes: 'x' }), 404);
    expectProblem(await sales.agent.get(url(jobId)), 403);
    await db.query(`delete from job_assignment where job_id = $1`, [jobId]);
    expectProblem(await installer.agent.get(url(jobId)), 404);
    await assignDirect(db, a, jobId, a.users.installer.id);
    expect((await read(installer, jobId)).systems).toHaveLength(1);
  });

  it('a cancelled sale leaves nothing sold to commission', async () => {
    const job = await signedJob(db, a, estimator);
    await cancelSigned(db, a, job);
    const r = await read(estimator, job.jobId);
    expect(r.systems).toEqual([]);
    expect(r.missing).toContain('The job has no signed proposal: there is nothing sold to commission.');
  });
});
