import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RoomSchema } from '../../server/src/modules/rooms/room.entity';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, newJob, newRoom, patch, post, sampleRoom } from './jobs-helpers';

/** A change queued on a shared device names its maker (X-Gaugeline-Person); anyone else's session cannot send it. */
let t: TestApp;
let a: TestCompany;
let sales: Session;
let estimator: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'PersonA');
  sales = await login(t.app, a.users.salesperson.email);
  estimator = await login(t.app, a.users.estimator.email);
});
afterAll(async () => t.close());

describe('replays carry the person who made them', () => {
  it('403 other-person when the session is someone else; nothing changes', async () => {
    const job = await newJob(sales);
    const room = await newRoom(sales, job.id);
    const url = `/api/jobs/${job.id}/rooms/${room.id}`;
    const r = await patch(estimator, url, room.version)
      .set('X-Gaugeline-Person', a.users.salesperson.id)
      .send({ input: { ...sampleRoom('Renamed by the wrong person') } });
    expectProblem(r, 403);
    expect(r.body.type).toBe('/problems/other-person');
    const stored = await t.orm.em.fork().findOneOrFail(RoomSchema, { id: room.id });
    expect(stored.version).toBe(room.version);
    // A create under the wrong person is refused too.
    expectProblem(
      await post(estimator, `/api/jobs/${job.id}/rooms`)
        .set('X-Gaugeline-Person', a.users.salesperson.id)
        .send({ input: sampleRoom('Wrong') }),
      403,
    );
  });

  it('the same person’s replay goes through', async () => {
    const job = await newJob(sales);
    const room = await newRoom(sales, job.id);
    const r = await patch(sales, `/api/jobs/${job.id}/rooms/${room.id}`, room.version)
      .set('X-Gaugeline-Person', a.users.salesperson.id)
      .send({ input: { ...sampleRoom('Den') } });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.room.input.name).toBe('Den');
  });
});
