import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RoomSchema } from '../../server/src/modules/rooms/room.entity';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { del, expectProblem, newJob, newRoom, patch, post, sampleRoom, type JobRef } from './jobs-helpers';

let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let sales: Session;
let job: JobRef;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'RoomsA');
  b = await makeCompany(t.orm.em.fork(), 'RoomsB');
  sales = await login(t.app, a.users.salesperson.email);
  job = await newJob(sales);
});
afterAll(async () => t.close());

const rooms = (jobId: string) => `/api/jobs/${jobId}/rooms`;

describe('rooms: access', () => {
  it('401 signed out; installer 403 on writes; other salesperson and other company 404', async () => {
    const room = await newRoom(sales, job.id);
    expectProblem(await browserAgent(t.app).get(rooms(job.id)).set(HTTPS), 401);
    const inst = await login(t.app, a.users.installer.email);
    expectProblem(await post(inst, rooms(job.id)).send({ input: sampleRoom() }), 403);
    expectProblem(await inst.agent.get(rooms(job.id)), 404);
    const c = await makeCompany(t.orm.em.fork(), 'RoomsC');
    for (const email of [b.users.owner.email, c.users.owner.email]) {
      const s = await login(t.app, email);
      expectProblem(await s.agent.get(`${rooms(job.id)}/${room.id}`), 404);
      expectProblem(await post(s, rooms(job.id)).send({ input: sampleRoom() }), 404);
      expectProblem(await patch(s, `${rooms(job.id)}/${room.id}`, room.version).send({ position: 3 }), 404);
      expectProblem(await del(s, `${rooms(job.id)}/${room.id}`, room.version), 404);
    }
    // Another salesperson of the same company: insert one straight into the company.
    const em = t.orm.em.fork();
    const { UserSchema } = await import('../../server/src/modules/users/user.entity');
    const me = await em.findOneOrFail(UserSchema, { id: a.users.salesperson.id });
    const second = em.create(UserSchema, {
      company: me.company,
      name: 'Second seller',
      email: `second-${room.id.slice(0, 8)}@roomsa.example.com`,
      role: 'salesperson',
      active: true,
      passwordHash: me.passwordHash,
    });
    await em.flush();
    const s2 = await login(t.app, second.email);
    expectProblem(await s2.agent.get(rooms(job.id)), 404);
    expectProblem(await patch(s2, `${rooms(job.id)}/${room.id}`, room.version).send({ position: 3 }), 404);
    expect((await t.orm.em.fork().findOneOrFail(RoomSchema, { id: room.id })).position).not.toBe(3);
  });
});

describe('rooms: bad input', () => {
  it('400 per invalid field, naming the field with calc’s message; nothing stored', async () => {
    const before = await t.orm.em.fork().count(RoomSchema, { job: job.id });
    const wall = { direction: 'S', lengthFt: 10, windows: [{ widthIn: 200, heightIn: 144, count: 2 }] };
    const cases: Array<[object, string, string]> = [
      [{ input: { ...sampleRoom(), lengthFt: 0 } }, 'input.lengthFt', 'Length must be between 1 and 200 ft'],
      [{ input: { ...sampleRoom(), lengthFt: 10_000 } }, 'input.lengthFt', 'Length must be between 1 and 200 ft'],
      [
        { input: { ...sampleRoom(), ceilingHeightFt: 'tall' } },
        'input.ceilingHeightFt',
        'Ceiling height: enter a number',
      ],
      [{ input: { ...sampleRoom(), name: '' } }, 'input.name', 'Enter a room name'],
      [{ input: { name: 'Hall' } }, 'input.lengthFt', 'Enter the length and width, or the floor area'],
      [
        { input: { ...sampleRoom(), exposedWalls: [wall] } },
        'input.exposedWalls.0.windows.0.heightIn',
        'The 2 windows (400 ft²) are larger than their wall (80 ft²)',
      ],
      [
        { input: { ...sampleRoom(), exposedWalls: [{ ...wall, direction: 'UP', windows: [] }] } },
        'input.exposedWalls.0.direction',
        'Choose a direction: N, NE, E, SE, S, SW, W or NW',
      ],
      [{ input: { ...sampleRoom(), colour: 'teal' } }, 'input', 'Unrecognized key: "colour"'],
      [{ input: sampleRoom(), position: -1 }, 'position', 'Position must be between 0 and 10000.'],
      [{ input: sampleRoom(), jobId: job.id }, '(body)', 'Unrecognized key: "jobId"'],
      [{}, 'input', 'Invalid input: expected object, received undefined'],
    ];
    for (const [body, path, message] of cases) {
      const r = await post(sales, rooms(job.id)).send(body);
      expectProblem(r, 400);
      expect(r.body.errors, JSON.stringify(r.body.errors)).toContainEqual({ path, message });
    }
    expect(await t.orm.em.fork().count(RoomSchema, { job: job.id })).toBe(before);
  });
});

describe('rooms: CRUD and the lock', () => {
  it('creates (input id is the row id), lists in order, updates with If-Match, deletes', async () => {
    const j = await newJob(sales);
    const first = await post(sales, rooms(j.id)).send({ input: { ...sampleRoom('Kitchen'), id: 'whatever' } });
    expect(first.status).toBe(201);
    expect(first.headers.etag).toBe('"1"');
    const id = String(first.body.room.id);
    expect(first.body.room).toMatchObject({
      jobId: j.id,
      position: 0,
      version: 1,
      input: { id, name: 'Kitchen', floorLevel: 1, notes: '' },
      photos: [],
    });
    const second = await newRoom(sales, j.id, { ...sampleRoom('Bedroom'), areaFt2: 130 });
    const list = await sales.agent.get(rooms(j.id));
    expect(list.body.rooms.map((r: { id: string }) => r.id)).toEqual([id, second.id]);
    const row = await t.orm.em.fork().findOneOrFail(RoomSchema, { id });
    expect(row.input.exposedWalls[0]?.windows[0]?.count).toBe(2);

    expectProblem(await patch(sales, `${rooms(j.id)}/${id}`).send({ position: 5 }), 428);
    const up = await patch(sales, `${rooms(j.id)}/${id}`, 1).send({
      input: { ...sampleRoom('Kitchen'), occupants: 5 },
      position: 2,
    });
    expect(up.status, JSON.stringify(up.body)).toBe(200);
    expect(up.body.room).toMatchObject({ version: 2, position: 2, input: { id, occupants: 5 } });
    const stale = await patch(sales, `${rooms(j.id)}/${id}`, 1).send({
      input: { ...sampleRoom('Kitchen'), occupants: 1 },
    });
    expectProblem(stale, 409);
    expect(stale.body).toMatchObject({ currentVersion: 2, current: { id, input: { occupants: 5 } } });
    expect((await t.orm.em.fork().findOneOrFail(RoomSchema, { id })).input.occupants).toBe(5);
    // Room edits do not bump the job's version: the job form stays editable.
    expect((await sales.agent.get(`/api/jobs/${j.id}`)).body.job.version).toBe(j.version);

    expectProblem(await del(sales, `${rooms(j.id)}/${id}`), 428);
    expectProblem(await del(sales, `${rooms(j.id)}/${id}`, 1), 409);
    expect((await del(sales, `${rooms(j.id)}/${id}`, 2)).status).toBe(204);
    expect(await t.orm.em.fork().count(RoomSchema, { id })).toBe(0);
  });

  it('a client-made id makes an offline replay safe (second POST → 409)', async () => {
    const id = '6c1b3a8e-2f7d-4e4b-9a1d-3c2b1a0f9e8d';
    expect((await post(sales, rooms(job.id)).send({ id, input: sampleRoom('Replay') })).status).toBe(201);
    expectProblem(await post(sales, rooms(job.id)).send({ id, input: sampleRoom('Replay') }), 409);
  });
});
