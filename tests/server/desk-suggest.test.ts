import {
  checkSizing,
  computeDesign,
  DEFAULT_SIZING_POLICY,
  equipmentTypeOf,
  pricingSchema,
  sizingMiss,
  type HomeInput,
  type LoadToMeet,
  type RoomInput,
  type Suggestion,
} from '@calc';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { engineData, type EngineData } from '../../server/src/modules/desk/desk-compute';
import { loadCompanyDesk } from '../../server/src/modules/desk/desk-inputs';
import { login, makeCompany, type Session } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, post } from './jobs-helpers';
import { deskJob, seedData } from './desk-helpers';

let t: TestApp;
let estimator: Session;
let other: Session;

beforeAll(async () => {
  t = await buildTestApp();
  const a = await makeCompany(t.orm.em.fork(), 'DeskSuggest');
  await seedData(t.orm.em.fork(), a.id);
  const b = await makeCompany(t.orm.em.fork(), 'DeskSuggestB');
  await seedData(t.orm.em.fork(), b.id);
  estimator = await login(t.app, a.users.estimator.email);
  other = await login(t.app, b.users.estimator.email);
});
afterAll(async () => t.close());

/** The demo ranch's rooms (fixtures/demo-jobs.ts), as the desk journey finds the job. */
const RANCH = ['Great room', 'Kitchen and dining', 'Main bedroom', 'Bedroom two', 'Bedroom three'];

describe('suggest keeps what the estimator entered', () => {
  it('the zones and the line sets already entered come back as they were; bad ones are refused on their field', async () => {
    const { job, rooms } = await deskJob(estimator);
    const zones = [
      { key: 'z1', name: 'Living', roomIds: [rooms[0]] },
      { key: 'z2', name: 'Bedroom and office', roomIds: [rooms[1], rooms[2]], lowestDuctOpeningFt: 8 },
    ];
    const entered = { zoneKey: 'z1', lengthFt: 58, liftFt: 14, lineSet: 'field-cut' };
    const r = await post(estimator, `/api/jobs/${job.id}/suggest`).send({ zones, circuits: [entered] });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const circuits = (r.body.design.systems as { circuits: { zoneKey: string; lengthFt: number }[] }[]).flatMap(
      (s) => s.circuits,
    );
    expect(circuits.find((c) => c.zoneKey === 'z1')).toMatchObject(entered);
    expect(circuits.find((c) => c.zoneKey === 'z2')?.lengthFt).toBe(25);
    const z2 = (r.body.design.zones as { key: string; lowestDuctOpeningFt?: number }[]).find((z) => z.key === 'z2');
    expect(z2?.lowestDuctOpeningFt).toBe(8);
    // A two-room zone of closed rooms gets a ducted head, not a wall head.
    expect(r.body.design.zones.find((z: { key: string }) => z.key === 'z2').indoorUnitKey).toMatch(/-D$/);

    const bad = await post(estimator, `/api/jobs/${job.id}/suggest`).send({
      zones,
      circuits: [{ zoneKey: 'z1', lengthFt: 0 }],
    });
    expectProblem(bad, 400);
    expect(bad.body.errors.map((e: { path: string }) => e.path)).toContain('circuits.0.lengthFt');
    expectProblem(await post(other, `/api/jobs/${job.id}/suggest`).send({ zones }), 404);
  });
});

/** calc's sizing verdict for a unit of the catalog on a load: the same check computeDesign makes. */
function sizingOf(data: EngineData, key: string, load: LoadToMeet, designF: { cooling: number; heating: number }) {
  const model = data.desk.models.get(key);
  const unit =
    data.catalog.indoorUnits.find((u) => u.key === key) ?? data.catalog.outdoorUnits.find((u) => u.key === key);
  if (!model || !unit) throw new Error(`${key} is in the catalog`);
  return checkSizing({
    unit,
    equipmentType: equipmentTypeOf(model),
    load,
    coolingDesignF: designF.cooling,
    heatingDesignF: designF.heating,
    policy: DEFAULT_SIZING_POLICY,
  });
}

describe('suggest on the demo ranch (issue 13: "proposes units from the active catalog that fit each zone")', () => {
  it('every suggested unit is within its sizing range when an active unit of its kind is, else the closest one, with the warning saying so', async () => {
    const acct = demoAccounts.find((d) => d.role === 'estimator' && d.company.startsWith('Larkspur'));
    if (!acct) throw new Error('the Larkspur demo estimator exists');
    const s = await login(t.app, acct.email, acct.password);
    const me = await s.agent.get('/api/auth/me');
    const data = engineData(await loadCompanyDesk(t.orm.em.fork(), me.body.company.id));
    const jobs = (await s.agent.get('/api/jobs?page=1&pageSize=50')).body.items as { id: string }[];
    let ranch: { id: string; rooms: { id: string; input: RoomInput }[] } | null = null;
    for (const j of jobs) {
      const rooms = (await s.agent.get(`/api/jobs/${j.id}/rooms`)).body.rooms as { id: string; input: RoomInput }[];
      if (RANCH.every((n) => rooms.some((r) => r.input.name === n))) ranch = { id: j.id, rooms };
    }
    if (!ranch) throw new Error('the demo ranch job exists');
    const job = (await s.agent.get(`/api/jobs/${ranch.id}`)).body.job;
    const home: HomeInput = {
      id: ranch.id,
      designConditions: job.designConditions,
      tightness: job.tightness,
      ...job.house,
      rooms: ranch.rooms.map((r) => r.input),
    };
    const designF = {
      cooling: job.designConditions.outdoorCoolingDryBulbF as number,
      heating: job.designConditions.outdoorHeatingDryBulbF as number,
    };
    const idOf = (n: string) => ranch?.rooms.find((r) => r.input.name === n)?.id ?? n;
    const cases: Record<
      string,
      { zones?: { key: string; name: string; roomIds: string[]; lowestDuctOpeningFt?: number }[] }
    > = {
      'no zones given': {},
      'the whole house as one zone': { zones: [{ key: 'z1', name: 'Whole house', roomIds: RANCH.map(idOf) }] },
      // The desk journey's zones (tests/e2e/desk-journey.test.ts).
      'two zones': {
        zones: [
          // Ducted heads over closed rooms, with their lowest duct opening 7 ft up (the A2L room-size check's h0).
          {
            key: 'z1',
            name: 'Great room and bedroom two',
            roomIds: ['Great room', 'Bedroom two'].map(idOf),
            lowestDuctOpeningFt: 7,
          },
          {
            key: 'z2',
            name: 'Kitchen and bedrooms',
            roomIds: ['Kitchen and dining', 'Main bedroom', 'Bedroom three'].map(idOf),
            lowestDuctOpeningFt: 7,
          },
        ],
      },
    };
    const active = [...data.desk.models.values()].filter((m) => m.active);
    for (const [what, body] of Object.entries(cases)) {
      const r = await post(s, `/api/jobs/${ranch.id}/suggest`).send(body);
      expect(r.status, JSON.stringify(r.body)).toBe(200);
      const suggestion = r.body as Suggestion;
      const result = computeDesign({
        home,
        design: suggestion.design,
        catalog: data.catalog,
        priceBook: data.priceBook,
        pricing: pricingSchema.parse({ method: 'margin', percent: 35 }),
      });
      const units = [
        ...result.zones.map((z) => ({ name: z.name, key: z.indoorUnitKey, sizing: z.sizing })),
        ...result.systems.map((y) => ({ name: y.name, key: y.outdoorUnitKey, sizing: y.sizing })),
      ];
      expect(units.length, what).toBeGreaterThanOrEqual(2);
      // A ductless head serves one room or one open space (common practice: its air does not reach a closed room).
      for (const z of suggestion.design.zones) {
        const t = data.desk.models.get(z.indoorUnitKey)?.indoorType;
        if (z.roomIds.length > 1)
          expect(t === 'slim-ducted' || t === 'air-handler', `${what}: ${z.name} on ${t}`).toBe(true);
      }
      for (const u of units) {
        const kind = data.desk.models.get(u.key)?.kind;
        const load = { sensibleBtuh: u.sizing.coolingLoadBtuh, latentBtuh: 0, heatingBtuh: u.sizing.heatingLoadBtuh };
        // calc's own verdict on every active unit of the same kind for this unit's load.
        const others = active
          .filter((m) => m.kind === kind && m.key !== u.key)
          .map((m) => ({ key: m.key, sizing: sizingOf(data, m.key, load, designF) }));
        const label = `${what}: ${u.name} (${u.key}, ${Math.round((u.sizing.coolingRatio ?? 0) * 100)} %)`;
        // Issue 13: the demo catalog has a unit in range for every zone of the demo ranch (the 30k and 15k models).
        expect(u.sizing.withinRange, label).toBe(true);
        if (others.some((o) => o.sizing.withinRange)) expect(u.sizing.withinRange, label).toBe(true);
        else if (!u.sizing.withinRange) {
          for (const o of others)
            expect(sizingMiss(u.sizing), `${label} against ${o.key}`).toBeLessThanOrEqual(sizingMiss(o.sizing));
          expect(suggestion.warnings.join(' '), label).toContain(`is the closest, at`);
        }
      }
    }
  });
});
