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

describe('the API names its version', () => {
  it('every /api answer carries X-Gaugeline-Api; a write from a client of another version is refused (412), nothing changes', async () => {
    const { API_VERSION } = await import('../../server/src/contract/api-version');
    const job = await newJob(sales);
    const room = await newRoom(sales, job.id);
    const url = `/api/jobs/${job.id}/rooms/${room.id}`;
    const read = await sales.agent.get(url).set('X-Gaugeline-Api', String(API_VERSION + 1));
    expect(read.status).toBe(200);
    expect(read.headers['x-gaugeline-api']).toBe(String(API_VERSION));
    const old = await patch(sales, url, room.version)
      .set('X-Gaugeline-Api', String(API_VERSION - 1))
      .send({ input: { ...sampleRoom('From an old page') } });
    expectProblem(old, 412);
    expect(old.body).toMatchObject({ type: '/problems/api-version', currentVersion: API_VERSION });
    expect(old.headers['x-gaugeline-api']).toBe(String(API_VERSION));
    expect((await t.orm.em.fork().findOneOrFail(RoomSchema, { id: room.id })).version).toBe(room.version);
    const same = await patch(sales, url, room.version)
      .set('X-Gaugeline-Api', String(API_VERSION))
      .send({ input: { ...sampleRoom('From this page') } });
    expect(same.status, JSON.stringify(same.body)).toBe(200);
  });
});
