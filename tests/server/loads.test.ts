import { homeLoad, type HomeInput, type RoomInput } from '@calc';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { DESIGN, expectProblem, newCustomer, newJob, newRoom, patch, post, sampleRoom, SITE } from './jobs-helpers';

let t: TestApp;
let a: TestCompany;
let sales: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'LoadsA');
  sales = await login(t.app, a.users.salesperson.email);
});
afterAll(async () => t.close());

const FIXTURE_ROOMS: Array<Omit<RoomInput, 'id'>> = [
  sampleRoom('Living room'),
  {
    name: 'Kitchen',
    areaFt2: 140,
    ceilingHeightFt: 9,
    exposedWalls: [
      { direction: 'E', lengthFt: 12, windows: [{ widthIn: 30, heightIn: 36, interiorShading: 'blinds' }] },
    ],
    appliances: [{ label: 'Range', gain: 1200, latentBtuh: 400 }],
    occupants: 2,
    above: { kind: 'attic', insulation: 'r30' },
    below: { kind: 'slab' },
  },
  {
    name: 'Bedroom',
    lengthFt: 12,
    widthFt: 11,
    exposedWalls: [
      { direction: 'N', lengthFt: 12, windows: [{ areaFt2: 15, glazing: 'single-clear' }] },
      { direction: 'W', lengthFt: 11 },
    ],
    occupants: 2,
    above: { kind: 'roof', insulation: 'r19' },
    below: { kind: 'garage', insulation: 'none' },
  },
];

describe('GET /api/jobs/:id/loads', () => {
  it('401 signed out; 404 for another company and another salesperson', async () => {
    const job = await newJob(sales);
    await newRoom(sales, job.id);
    expectProblem(await browserAgent(t.app).get(`/api/jobs/${job.id}/loads`).set(HTTPS), 401);
    const b = await makeCompany(t.orm.em.fork(), 'LoadsB');
    expectProblem(await (await login(t.app, b.users.estimator.email)).agent.get(`/api/jobs/${job.id}/loads`), 404);
    const owner = await login(t.app, a.users.owner.email);
    const ownJob = await newJob(owner);
    expectProblem(await sales.agent.get(`/api/jobs/${ownJob.id}/loads`), 404);
    expectProblem(await sales.agent.get('/api/jobs/not-an-id/loads'), 400);
  });

  it('equals calc’s homeLoad computed directly from the same inputs', async () => {
    const job = await newJob(sales, { tightness: 'leaky' });
    const ids: string[] = [];
    for (const input of FIXTURE_ROOMS) ids.push((await newRoom(sales, job.id, input)).id);
    const r = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const home: HomeInput = {
      id: job.id,
      designConditions: DESIGN,
      tightness: 'leaky',
      rooms: FIXTURE_ROOMS.map((room, i) => ({ ...room, id: ids[i] ?? '' })),
    };
    const expected = JSON.parse(JSON.stringify(homeLoad({ home })));
    expect(r.body.loads).toEqual(expected);
    expect(r.body.loads.rooms.map((x: { roomId: string }) => x.roomId)).toEqual(ids);
    expect(r.body.loads.totals.coolingBtuh).toBeGreaterThan(0);
    expect(r.body.loads.totals.heatingBtuh).toBeGreaterThan(0);
    expect(Object.keys(r.body.warnings.rooms)).toEqual(ids);
    // An installer assigned to the job reads the same numbers.
    const owner = await login(t.app, a.users.owner.email);
    await patch(owner, `/api/jobs/${job.id}`, job.version).send({ assignedInstallerId: a.users.installer.id });
    const inst = await login(t.app, a.users.installer.email);
    expect((await inst.agent.get(`/api/jobs/${job.id}/loads`)).body.loads).toEqual(expected);
  });

  it('answers the current inputs after every change (results are kept by the inputs, so an edit is new figures)', async () => {
    const job = await newJob(sales, { tightness: 'average' });
    const room = await newRoom(sales, job.id, FIXTURE_ROOMS[1]);
    const expectedFor = (rooms: RoomInput[], tightness: HomeInput['tightness']) =>
      JSON.parse(JSON.stringify(homeLoad({ home: { id: job.id, designConditions: DESIGN, tightness, rooms } })));
    const kitchen = { ...FIXTURE_ROOMS[1], id: room.id } as RoomInput;
    const first = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(first.body.loads).toEqual(expectedFor([kitchen], 'average'));
    expect((await sales.agent.get(`/api/jobs/${job.id}/loads`)).body.loads).toEqual(first.body.loads);

    // A room edit, then a job edit, then a room added and removed again: each answer is the inputs of that moment.
    const bigger = { ...kitchen, areaFt2: 260 };
    expect(
      (await patch(sales, `/api/jobs/${job.id}/rooms/${room.id}`, room.version).send({ input: bigger })).status,
    ).toBe(200);
    const second = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(second.body.loads).toEqual(expectedFor([bigger], 'average'));
    expect(second.body.loads.totals.coolingBtuh).not.toBe(first.body.loads.totals.coolingBtuh);
    const tight = await patch(sales, `/api/jobs/${job.id}`, job.version).send({ tightness: 'tight' });
    expect(tight.status, JSON.stringify(tight.body)).toBe(200);
    const third = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(third.body.loads).toEqual(expectedFor([bigger], 'tight'));
    expect(third.body.jobVersion).toBe(tight.body.job.version);
    expect(third.body.tightness).toBe('tight');
  });

  it('jobs of two companies with the same rooms each get their own job and rooms in the answer, never the other’s', async () => {
    const b = await makeCompany(t.orm.em.fork(), 'LoadsTwin');
    const other = await login(t.app, b.users.salesperson.email);
    const mine = await newJob(sales);
    const theirs = await newJob(other);
    const myRoom = await newRoom(sales, mine.id, FIXTURE_ROOMS[2]);
    const theirRoom = await newRoom(other, theirs.id, FIXTURE_ROOMS[2]);
    const r1 = await sales.agent.get(`/api/jobs/${mine.id}/loads`);
    const r2 = await other.agent.get(`/api/jobs/${theirs.id}/loads`);
    expect(r1.body.jobId).toBe(mine.id);
    expect(r2.body.jobId).toBe(theirs.id);
    expect(r1.body.loads.rooms.map((x: { roomId: string }) => x.roomId)).toEqual([myRoom.id]);
    expect(r2.body.loads.rooms.map((x: { roomId: string }) => x.roomId)).toEqual([theirRoom.id]);
    expectProblem(await other.agent.get(`/api/jobs/${mine.id}/loads`), 404);
  });

  it('422 with a clear message when design conditions or rooms are missing', async () => {
    const bare = await post(sales, '/api/jobs').send({ customerId: await newCustomer(sales), ...SITE });
    expect(bare.status).toBe(201);
    expect(bare.body.job.designConditions).toBeNull();
    const noDesign = await sales.agent.get(`/api/jobs/${bare.body.job.id}/loads`);
    expectProblem(noDesign, 422);
    expect(noDesign.body.detail).toBe('Enter the design conditions for the site before the loads can be worked out.');
    const noRooms = await sales.agent.get(`/api/jobs/${(await newJob(sales)).id}/loads`);
    expectProblem(noRooms, 422);
    expect(noRooms.body.detail).toBe('Add at least one room before the loads can be worked out.');
  });

  it('flags implausible inputs as warnings (a 2 ft ceiling)', async () => {
    const job = await newJob(sales);
    const low = await newRoom(sales, job.id, { name: 'Crawl loft', areaFt2: 80, ceilingHeightFt: 2 });
    const r = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(r.body.warnings.rooms[low.id]).toContainEqual({
      path: ['ceilingHeightFt'],
      message: 'A 2 ft ceiling is unusually low — check the measurement.',
    });
  });

  it('the whole-house facts (bedrooms, blower door, ventilation) are saved with the job and used by the loads; bad ones are refused', async () => {
    const job = await newJob(sales);
    await newRoom(sales, job.id, { name: 'Main bedroom', areaFt2: 200, above: { kind: 'attic' } });
    const house = { bedrooms: 3, blowerDoorCfm50: 900, ventilation: { kind: 'balanced' as const } };
    const saved = await patch(sales, `/api/jobs/${job.id}`, job.version).send({ house });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body.job.house).toEqual(house);
    const r = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    // 62.2: 0.03 × 200 + 7.5 × (3 + 1) = 36 cfm [MEM: ASHRAE 62.2]; blower door 900 CFM50 = 0.42475 m³/s at 50 Pa,
    // c = 0.42475 / 50^0.65 = 0.033403, A_L = 10,000 × c × 4^0.65 × √(1.2/8) = 318.6 cm² = 49.4 in² [PUB: ASHRAE
    // Fundamentals 2021 ch. 16 eqs. (40)–(41), n 0.65]
    expect(r.body.loads.air).toMatchObject({
      ventilationKind: 'balanced',
      ventilationCfm: 36,
      leakageBasis: 'blower-door',
      leakageAreaIn2: 49.4,
    });
    expect(r.body.house).toEqual(house);
    // Refused whole, nothing changed: out of bounds, an unknown key, an unknown system
    for (const bad of [{ bedrooms: 25 }, { bedrooms: 2, pets: 1 }, { ventilation: { kind: 'window' } }]) {
      const res = await patch(sales, `/api/jobs/${job.id}`, saved.body.job.version).send({ house: bad });
      expectProblem(res, 400);
    }
    const again = await sales.agent.get(`/api/jobs/${job.id}`);
    expect(again.body.job.house).toEqual(house);
  });

  it('the house’s heat storage class is saved with the job and names the radiant time factors the loads use; a bad one is refused', async () => {
    const job = await newJob(sales);
    await newRoom(sales, job.id, { name: 'Sun room', areaFt2: 200, above: { kind: 'attic' } });
    const before = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(before.body.loads.designDay).toMatchObject({ thermalMass: 'medium', thermalMassAssumed: true });
    const saved = await patch(sales, `/api/jobs/${job.id}`, job.version).send({ house: { thermalMass: 'heavy' } });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body.job.house).toEqual({ thermalMass: 'heavy' });
    const r = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(r.body.loads.designDay).toMatchObject({ thermalMass: 'heavy', thermalMassAssumed: false });
    // [PUB: ASHRAE Fundamentals ch. 18 Tables 19/20 — a heavy room gives back less of each hour's gain at once]
    expect(r.body.loads.totals.sensibleBtuh).toBeLessThan(before.body.loads.totals.sensibleBtuh);
    const bad = await patch(sales, `/api/jobs/${job.id}`, saved.body.job.version).send({
      house: { thermalMass: 'granite' },
    });
    expectProblem(bad, 400);
    expect((await sales.agent.get(`/api/jobs/${job.id}`)).body.job.house).toEqual({ thermalMass: 'heavy' });
  });

  it('a ducted system in the house (ducts in the attic) is saved and its duct gains and losses are in the loads', async () => {
    const job = await newJob(sales);
    await newRoom(sales, job.id, { name: 'Main bedroom', areaFt2: 200, above: { kind: 'attic' } });
    const house = { ducts: { location: 'attic' as const, insulationR: 6, leakage: 'typical' as const } };
    const saved = await patch(sales, `/api/jobs/${job.id}`, job.version).send({ house });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body.job.house).toEqual(house);
    const r = await sales.agent.get(`/api/jobs/${job.id}/loads`);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.loads.ducts).toMatchObject({ location: 'attic', insulationR: 6, supplyLeakageFraction: 0.1 });
    expect(r.body.loads.heatLoss.ducts).toBe(r.body.loads.ducts.heating.btuh);
    expect(r.body.loads.heatLoss.ducts).toBeGreaterThan(0);
    const bad = await patch(sales, `/api/jobs/${job.id}`, saved.body.job.version).send({
      house: { ducts: { location: 'roof-top' } },
    });
    expectProblem(bad, 400);
  });

  it('the database refuses a house that bypasses the API (CHECK constraints mirror calc’s bounds)', async () => {
    const job = await newJob(sales);
    const conn = t.orm.em.fork().getConnection();
    await expect(
      conn.execute(`update "job" set "house" = '{"bedrooms": 99}'::jsonb where "id" = '${job.id}'`),
    ).rejects.toThrow();
    await expect(
      conn.execute(
        `update "job" set "house" = '{"ventilation": {"kind": "open-window"}}'::jsonb where "id" = '${job.id}'`,
      ),
    ).rejects.toThrow();
  });
});
