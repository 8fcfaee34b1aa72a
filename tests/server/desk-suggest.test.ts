import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
