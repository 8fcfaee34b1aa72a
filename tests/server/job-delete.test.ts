import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CustomerSchema } from '../../server/src/modules/customers/customer.entity';
import { JobSchema } from '../../server/src/modules/jobs/job.entity';
import { PhotoSchema } from '../../server/src/modules/photos/photo.entity';
import { RoomSchema } from '../../server/src/modules/rooms/room.entity';
import { UserSchema } from '../../server/src/modules/users/user.entity';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { del, expectProblem, newJob, newRoom, patch, post, type JobRef } from './jobs-helpers';

let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let owner: Session;
let sales: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'DeleteA');
  b = await makeCompany(t.orm.em.fork(), 'DeleteB');
  owner = await login(t.app, a.users.owner.email);
  sales = await login(t.app, a.users.salesperson.email);
});
afterAll(async () => t.close());

const jobUrl = (id: string) => `/api/jobs/${id}`;
const jobCount = (id: string) => t.orm.em.fork().count(JobSchema, { id });
const jpeg = () =>
  sharp({ create: { width: 32, height: 24, channels: 3, background: '#5a8f3c' } })
    .jpeg()
    .toBuffer();

async function addPhoto(s: Session, jobId: string, roomId: string): Promise<string> {
  const r = await post(s, `${jobUrl(jobId)}/rooms/${roomId}/photos`).attach('file', await jpeg(), 'hall.jpg');
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return String(r.body.photo.id);
}

/** Walks a job along the status map by hand; returns its version afterwards. */
async function moveTo(s: Session, job: JobRef, ...statuses: string[]): Promise<number> {
  let version = job.version;
  for (const status of statuses) {
    const r = await patch(s, jobUrl(job.id), version).send({ status });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    version = Number(r.body.job.version);
  }
  return version;
}

/** Proposed needs a proposal, which no job has yet: the database puts a job there (as proposals will). */
async function markProposed(job: JobRef): Promise<number> {
  const em = t.orm.em.fork();
  await em.nativeUpdate(JobSchema, { id: job.id }, { status: 'proposed' });
  return (await em.findOneOrFail(JobSchema, { id: job.id })).version;
}

describe('job delete: who may', () => {
  it('signed out → 403 csrf (the token check comes first for writes); an installer 403, even on their own assigned job', async () => {
    const job = await newJob(owner, { assignedInstallerId: a.users.installer.id });
    const anon = await browserAgent(t.app).delete(jobUrl(job.id)).set(HTTPS).set('If-Match', `"${job.version}"`);
    expectProblem(anon, 403);
    expect(anon.body.type).toBe('/problems/csrf');
    const inst = await login(t.app, a.users.installer.email);
    expect((await inst.agent.get(jobUrl(job.id))).status).toBe(200);
    const r = await del(inst, jobUrl(job.id), job.version);
    expectProblem(r, 403);
    expect(r.body.detail).toBe('Your role does not allow this.');
    expect(await jobCount(job.id)).toBe(1);
  });

  it('a salesperson deletes their own job, gets 404 for another salesperson’s', async () => {
    const mine = await newJob(sales);
    expect((await del(sales, jobUrl(mine.id), mine.version)).status).toBe(204);
    expect(await jobCount(mine.id)).toBe(0);

    const em = t.orm.em.fork();
    const me = await em.findOneOrFail(UserSchema, { id: a.users.salesperson.id });
    const second = em.create(UserSchema, {
      company: me.company,
      name: 'Second Example seller',
      email: `second-${mine.id.slice(0, 8)}@deletea.example.com`,
      role: 'salesperson',
      active: true,
      passwordHash: me.passwordHash,
    });
    await em.flush();
    const theirs = await newJob(owner, { salespersonId: second.id });
    const r = await del(sales, jobUrl(theirs.id), theirs.version);
    expectProblem(r, 404);
    expect(r.body.detail).toBe('The job was not found.');
    expect(await jobCount(theirs.id)).toBe(1);
  });

  it('an estimator deletes a design job of anyone in the company', async () => {
    const job = await newJob(sales);
    const version = await moveTo(sales, job, 'design');
    const est = await login(t.app, a.users.estimator.email);
    expect((await del(est, jobUrl(job.id), version)).status).toBe(204);
    expect(await jobCount(job.id)).toBe(0);
  });

  it('company B gets 404 and nothing of company A changes', async () => {
    const job = await newJob(sales);
    const room = await newRoom(sales, job.id);
    const other = await login(t.app, b.users.owner.email);
    expectProblem(await del(other, jobUrl(job.id), job.version), 404);
    expect(await jobCount(job.id)).toBe(1);
    expect(await t.orm.em.fork().count(RoomSchema, { id: room.id })).toBe(1);
  });
});

describe('job delete: refused', () => {
  it('a proposed or won job → 409 with a plain message; the job and its rooms stay', async () => {
    const proposed = await newJob(owner);
    const room = await newRoom(owner, proposed.id);
    await moveTo(owner, proposed, 'design');
    const pv = await markProposed(proposed);
    const r = await del(owner, jobUrl(proposed.id), pv);
    expectProblem(r, 409);
    expect(r.body.detail).toBe(
      'Only a job still in walk-through or design can be deleted (this one is proposed); mark it lost instead.',
    );
    expect(r.body.currentVersion).toBeUndefined();

    const won = await newJob(owner);
    await moveTo(owner, won, 'design');
    const wv = await moveTo(owner, { id: won.id, version: await markProposed(won) }, 'won');
    const w = await del(owner, jobUrl(won.id), wv);
    expectProblem(w, 409);
    expect(w.body.detail).toMatch(/^Only a job still in walk-through or design can be deleted \(this one is won\)/);

    const em = t.orm.em.fork();
    expect((await em.findOneOrFail(JobSchema, { id: proposed.id })).version).toBe(pv);
    expect((await em.findOneOrFail(JobSchema, { id: won.id })).status).toBe('won');
    expect(await em.count(RoomSchema, { id: room.id })).toBe(1);
  });

  it('no If-Match → 428, a stale one → 409 with the job as it is now; nothing changes', async () => {
    const job = await newJob(owner);
    expectProblem(await del(owner, jobUrl(job.id)), 428);
    const v2 = await moveTo(owner, job, 'design');
    const stale = await del(owner, jobUrl(job.id), job.version);
    expectProblem(stale, 409);
    expect(stale.body).toMatchObject({ currentVersion: v2, current: { id: job.id, status: 'design', version: v2 } });
    const bad = await owner.agent.delete(jobUrl(job.id)).set('X-CSRF-Token', owner.csrf).set('If-Match', 'latest');
    expectProblem(bad, 400);
    expect(await jobCount(job.id)).toBe(1);
  });

  it('a bad id → 400 problem+json naming the field', async () => {
    const r = await del(owner, '/api/jobs/not-a-uuid', 1);
    expectProblem(r, 400);
    expect(r.body.errors).toContainEqual({ path: 'id', message: 'Must be a job id.' });
  });
});

describe('job delete: the happy path', () => {
  it('owner deletes a walk-through job: 204; job, rooms, photos and stored files gone; the customer stays', async () => {
    const job = await newJob(sales);
    const kitchen = await newRoom(sales, job.id);
    const hall = await newRoom(sales, job.id);
    const photoIds = [await addPhoto(sales, job.id, kitchen.id), await addPhoto(sales, job.id, hall.id)];
    const before = t.orm.em.fork();
    const keys = (await before.find(PhotoSchema, { id: { $in: photoIds } })).map((p) => p.storageKey);
    expect(keys).toHaveLength(2);
    for (const k of keys) expect(await t.services.storage.get(k)).not.toBeNull();
    const customerId = (await before.findOneOrFail(JobSchema, { id: job.id })).customer.id;
    // A room or photo write touches the job without bumping its version.
    const { version } = (await owner.agent.get(jobUrl(job.id))).body.job;
    expect(version).toBe(job.version);

    const r = await del(owner, jobUrl(job.id), version);
    expect(r.status, JSON.stringify(r.body)).toBe(204);
    expect(r.text).toBe('');

    const after = t.orm.em.fork();
    expect(await after.count(JobSchema, { id: job.id })).toBe(0);
    expect(await after.count(RoomSchema, { id: { $in: [kitchen.id, hall.id] } })).toBe(0);
    expect(await after.count(PhotoSchema, { id: { $in: photoIds } })).toBe(0);
    for (const k of keys) expect(await t.services.storage.get(k)).toBeNull();
    expect(await after.count(CustomerSchema, { id: customerId })).toBe(1);
    expectProblem(await owner.agent.get(jobUrl(job.id)), 404);
    expect((await owner.agent.get('/api/jobs?pageSize=100')).body.items.map((j: { id: string }) => j.id)).not.toContain(
      job.id,
    );

    // The second delete finds nothing.
    expectProblem(await del(owner, jobUrl(job.id), version), 404);
  });
});
