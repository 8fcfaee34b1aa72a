import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, newJob, newRoom, patch, post, sampleRoom } from './jobs-helpers';

/**
 * Issue 10: a conflict says which device and when. Every write keeps who made it and the device label
 * it came with (`X-Gaugeline-Device`); the record's `lastChange` gives them back, its `updatedAt` the time.
 */
let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let sales: Session;
let owner: Session;
let otherOwner: Session;
const PHONE = 'phone-3c9e1d77a0b2';
const DESK = 'desk-51f0aa86c4e3';

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'StampA');
  b = await makeCompany(t.orm.em.fork(), 'StampB');
  sales = await login(t.app, a.users.salesperson.email);
  owner = await login(t.app, a.users.owner.email);
  otherOwner = await login(t.app, b.users.owner.email);
});
afterAll(async () => t.close());

const roomUrl = (jobId: string, roomId: string) => `/api/jobs/${jobId}/rooms/${roomId}`;

describe('who changed a record, on which device', () => {
  it('a room keeps the last writer and their device, through the fast save and the 409 answer', async () => {
    const job = await newJob(sales);
    const room = await newRoom(sales, job.id);
    const created = await sales.agent.get(roomUrl(job.id, room.id));
    // Made without a device label (this test's agent sends none): the person, no device.
    expect(created.body.room.lastChange).toEqual({ byName: a.users.salesperson.name, device: null });

    const bySales = await patch(sales, roomUrl(job.id, room.id), room.version)
      .set('X-Gaugeline-Device', PHONE)
      .send({ input: { ...sampleRoom('Den'), id: room.id } });
    expect(bySales.status, JSON.stringify(bySales.body)).toBe(200);
    expect(bySales.body.room.lastChange).toEqual({ byName: a.users.salesperson.name, device: PHONE });

    const byOwner = await patch(owner, roomUrl(job.id, room.id), bySales.body.room.version)
      .set('X-Gaugeline-Device', DESK)
      .send({ position: 4 });
    expect(byOwner.status).toBe(200);
    const read = await sales.agent.get(`/api/jobs/${job.id}/rooms`);
    expect(read.body.rooms[0].lastChange).toEqual({ byName: a.users.owner.name, device: DESK });
    expect(read.body.rooms[0].updatedAt).toBe(byOwner.body.room.updatedAt);

    // The phone's stale edit meets a 409 whose current record names the owner's desk.
    const stale = await patch(sales, roomUrl(job.id, room.id), bySales.body.room.version)
      .set('X-Gaugeline-Device', PHONE)
      .send({ position: 2 });
    expectProblem(stale, 409);
    expect(stale.body.current.lastChange).toEqual({ byName: a.users.owner.name, device: DESK });
  });

  it('a job and a customer keep theirs too', async () => {
    const job = await newJob(sales);
    const updated = await patch(owner, `/api/jobs/${job.id}`, job.version)
      .set('X-Gaugeline-Device', DESK)
      .send({ notes: 'Gate code at the office' });
    expect(updated.status, JSON.stringify(updated.body)).toBe(200);
    const read = await sales.agent.get(`/api/jobs/${job.id}`);
    expect(read.body.job.lastChange).toEqual({ byName: a.users.owner.name, device: DESK });

    const customerId = String(read.body.job.customer.id);
    const before = await sales.agent.get(`/api/customers/${customerId}`);
    const changed = await patch(sales, `/api/customers/${customerId}`, before.body.customer.version)
      .set('X-Gaugeline-Device', PHONE)
      .send({ phone: '555-0199' });
    expect(changed.status).toBe(200);
    const again = await owner.agent.get(`/api/customers/${customerId}`);
    expect(again.body.customer.lastChange).toEqual({ byName: a.users.salesperson.name, device: PHONE });
  });

  it('a malformed device label is refused and nothing changes', async () => {
    const job = await newJob(sales);
    const room = await newRoom(sales, job.id);
    for (const label of ['short', 'x'.repeat(41), 'phone 3c9e1d77', 'phone/3c9e1d77a0']) {
      const r = await patch(sales, roomUrl(job.id, room.id), room.version)
        .set('X-Gaugeline-Device', label)
        .send({ position: 9 });
      expectProblem(r, 400);
      expect(r.body.detail).toBe('X-Gaugeline-Device must be 8 to 40 letters, digits or hyphens.');
    }
    const read = await sales.agent.get(roomUrl(job.id, room.id));
    expect(read.body.room.version).toBe(room.version);
    expect(read.body.room.position).not.toBe(9);
  });

  it('another company never reads the stamp (404, nothing of the record)', async () => {
    const job = await newJob(sales);
    const room = await newRoom(sales, job.id);
    const r = await otherOwner.agent.get(roomUrl(job.id, room.id));
    expectProblem(r, 404);
    expect(JSON.stringify(r.body)).not.toContain(a.users.salesperson.name);
    const made = await post(otherOwner, '/api/customers')
      .set('X-Gaugeline-Device', DESK)
      .send({ name: 'Ottoline Brask' });
    expect(made.body.customer.lastChange).toEqual({ byName: b.users.owner.name, device: DESK });
  });
});
