import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CustomerSchema } from '../../server/src/modules/customers/customer.entity';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { del, expectProblem, newJob, patch, post } from './jobs-helpers';

let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let sales: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'CustA');
  b = await makeCompany(t.orm.em.fork(), 'CustB');
  sales = await login(t.app, a.users.salesperson.email);
});
afterAll(async () => t.close());

describe('customers', () => {
  it('401 when signed out', async () => {
    expectProblem(await browserAgent(t.app).get('/api/customers').set(HTTPS), 401);
    expectProblem(await browserAgent(t.app).post('/api/customers').set(HTTPS).send({ name: 'X' }), 403); // no CSRF token before sign-in
  });

  it('403 for an installer (they meet customers only through assigned jobs)', async () => {
    const s = await login(t.app, a.users.installer.email);
    expectProblem(await s.agent.get('/api/customers'), 403);
    expectProblem(await post(s, '/api/customers').send({ name: 'Installer Made' }), 403);
  });

  it('400 per invalid field, naming it', async () => {
    const cases: Array<[Record<string, unknown>, string, string]> = [
      [{ name: '' }, 'name', 'Enter the customer name.'],
      [{ name: 'x'.repeat(161) }, 'name', 'Name must be at most 160 characters.'],
      [{ name: 'Ok', email: 'not-mail' }, 'email', 'Enter a valid e-mail address.'],
      [
        { name: 'Ok', phone: 'call me' },
        'phone',
        'Enter a phone number using digits, spaces, dashes, dots or brackets.',
      ],
      [{ name: 'Ok', notes: 'n'.repeat(4001) }, 'notes', 'Notes must be at most 4000 characters.'],
      [{ name: 'Ok', companyId: b.id }, '(body)', 'Unrecognized key: "companyId"'],
    ];
    for (const [body, path, message] of cases) {
      const r = await post(sales, '/api/customers').send(body);
      expectProblem(r, 400);
      expect(r.body.errors).toContainEqual({ path, message });
    }
  });

  it('creates, reads, lists, searches and updates within the company', async () => {
    const c = await post(sales, '/api/customers').send({
      name: 'Gwendolyn Starkweather-Ibe',
      email: 'Gwen@Example.com',
      phone: '555-0117',
      notes: 'Side gate',
    });
    expect(c.status).toBe(201);
    const id = String(c.body.customer.id);
    expect(c.body.customer).toMatchObject({
      name: 'Gwendolyn Starkweather-Ibe',
      email: 'gwen@example.com',
      phone: '555-0117',
      notes: 'Side gate',
    });
    const row = await t.orm.em.fork().findOneOrFail(CustomerSchema, { id });
    expect(row.company.id).toBe(a.id);

    const est = await login(t.app, a.users.estimator.email);
    expect((await est.agent.get(`/api/customers/${id}`)).body.customer.name).toBe('Gwendolyn Starkweather-Ibe');
    const list = await est.agent.get('/api/customers').query({ search: 'starkweather', pageSize: 5 });
    expect(list.status).toBe(200);
    expect(list.body).toMatchObject({ total: 1, page: 1, pageSize: 5 });
    expect(list.body.items[0].id).toBe(id);
    expect((await est.agent.get('/api/customers').query({ search: '%' })).body.total).toBe(0);
    expectProblem(await est.agent.get('/api/customers').query({ pageSize: 101 }), 400);

    const u = await patch(sales, `/api/customers/${id}`, 1).send({ phone: null, notes: 'Front door' });
    expect(u.status).toBe(200);
    const fresh = await t.orm.em.fork().findOneOrFail(CustomerSchema, { id });
    expect([fresh.phone, fresh.notes]).toEqual([null, 'Front door']);
  });

  it('404 for another company, for read, write and delete; nothing changes', async () => {
    const c = await post(sales, '/api/customers').send({ name: 'Ambrose Pilkington-Reyes' });
    const id = String(c.body.customer.id);
    const other = await login(t.app, b.users.owner.email);
    expectProblem(await other.agent.get(`/api/customers/${id}`), 404);
    expectProblem(await patch(other, `/api/customers/${id}`, 1).send({ name: 'Taken' }), 404);
    expectProblem(await del(other, `/api/customers/${id}`, 1), 404);
    expect((await other.agent.get('/api/customers')).body.items.map((x: { id: string }) => x.id)).not.toContain(id);
    expect((await t.orm.em.fork().findOneOrFail(CustomerSchema, { id })).name).toBe('Ambrose Pilkington-Reyes');
  });

  it('deletes (office roles only) and refuses while jobs exist', async () => {
    const c = await post(sales, '/api/customers').send({ name: 'Temporary Customer' });
    const id = String(c.body.customer.id);
    expectProblem(await del(sales, `/api/customers/${id}`, 1), 403);
    const owner = await login(t.app, a.users.owner.email);
    expect((await del(owner, `/api/customers/${id}`, 1)).status).toBe(204);
    expect(await t.orm.em.fork().count(CustomerSchema, { id })).toBe(0);

    const job = await newJob(sales);
    const withJob = await t.orm.em
      .fork()
      .findOneOrFail((await import('../../server/src/modules/jobs/job.entity')).JobSchema, { id: job.id });
    expectProblem(await del(owner, `/api/customers/${withJob.customer.id}`, 1), 409);
  });

  it('versions like jobs and rooms: ETag out, 428 without If-Match, 409 on a stale one with the customer as now', async () => {
    const c = await post(sales, '/api/customers').send({ name: 'Odalys Fenwick-Arbuthnot', phone: '555-0190' });
    expect(c.body.customer.version).toBe(1);
    expect(c.headers.etag).toBe('"1"');
    const id = String(c.body.customer.id);
    const got = await sales.agent.get(`/api/customers/${id}`);
    expect([got.headers.etag, got.body.customer.version]).toEqual(['"1"', 1]);

    const none = await patch(sales, `/api/customers/${id}`).send({ name: 'No version' });
    expectProblem(none, 428);
    expect(none.body.type).toBe('/problems/precondition-required');
    expectProblem(await del(await login(t.app, a.users.owner.email), `/api/customers/${id}`), 428);

    const first = await patch(sales, `/api/customers/${id}`, 1).send({ phone: '555-0191' });
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect([first.headers.etag, first.body.customer.version]).toEqual(['"2"', 2]);

    // A second device still holding version 1.
    const stale = await patch(sales, `/api/customers/${id}`, 1).send({ phone: '555-0000', name: 'Overwritten' });
    expectProblem(stale, 409);
    expect(stale.body).toMatchObject({
      type: '/problems/conflict',
      currentVersion: 2,
      current: { id, name: 'Odalys Fenwick-Arbuthnot', phone: '555-0191', version: 2 },
    });
    const row = await t.orm.em.fork().findOneOrFail(CustomerSchema, { id });
    expect([row.name, row.phone, row.version]).toEqual(['Odalys Fenwick-Arbuthnot', '555-0191', 2]);
    const owner = await login(t.app, a.users.owner.email);
    expectProblem(await del(owner, `/api/customers/${id}`, 1), 409);
    expect(await t.orm.em.fork().count(CustomerSchema, { id })).toBe(1);
  });
});

describe('a second customer with the same e-mail or phone (issue 10: "Use the existing customer?")', () => {
  it('asks with a 409 naming the existing customer, by e-mail in any case or by phone digits; nothing is made', async () => {
    const first = await post(sales, '/api/customers').send({
      name: 'Ignatia Ravensworth',
      email: 'ignatia.r@example.com',
      phone: '555 014-7701',
    });
    expect(first.status).toBe(201);
    const existing = {
      id: first.body.customer.id,
      name: 'Ignatia Ravensworth',
      email: 'ignatia.r@example.com',
      phone: '555 014-7701',
    };
    const before = await t.orm.em.fork().count(CustomerSchema, { company: a.id });

    const byEmail = await post(sales, '/api/customers').send({
      name: 'I. Ravensworth',
      email: 'Ignatia.R@Example.COM',
    });
    expectProblem(byEmail, 409);
    expect(byEmail.body).toMatchObject({
      type: '/problems/duplicate',
      title: 'Use the existing customer?',
      existing,
      matched: 'email',
    });
    expect(byEmail.body.detail).toContain('Ignatia Ravensworth already has this e-mail address.');

    const byPhone = await post(sales, '/api/customers').send({ name: 'Iggy R', phone: '555.014.7701' });
    expectProblem(byPhone, 409);
    expect(byPhone.body).toMatchObject({ existing, matched: 'phone' });

    // Both match: the e-mail is named.
    const both = await post(sales, '/api/customers').send({
      name: 'Ignatia',
      email: 'ignatia.r@example.com',
      phone: '5550147701',
    });
    expect(both.body.matched).toBe('email');
    expect(await t.orm.em.fork().count(CustomerSchema, { company: a.id })).toBe(before);
  });

  it('createAnyway: true makes the second one; a flag that is not true or false is a 400', async () => {
    const first = await post(sales, '/api/customers').send({ name: 'Cassius Wendeborn', phone: '555-014-7702' });
    expect(first.status).toBe(201);
    const second = await post(sales, '/api/customers').send({
      name: 'Cassius Wendeborn Jr',
      phone: '555 014 7702',
      createAnyway: true,
    });
    expect(second.status, JSON.stringify(second.body)).toBe(201);
    expect(second.body.customer.id).not.toBe(first.body.customer.id);
    const bad = await post(sales, '/api/customers').send({ name: 'Flagged', createAnyway: 'yes' });
    expectProblem(bad, 400);
    expect(bad.body.errors).toContainEqual({ path: 'createAnyway', message: 'createAnyway must be true or false.' });
  });

  it('another company’s customers never match, and its answer never names them', async () => {
    const inA = await post(sales, '/api/customers').send({
      name: 'Philippa Dunmore',
      email: 'philippa.d@example.com',
      phone: '555-014-7703',
    });
    expect(inA.status).toBe(201);
    const ownerB = await login(t.app, b.users.owner.email);
    const inB = await post(ownerB, '/api/customers').send({
      name: 'P. Dunmore',
      email: 'philippa.d@example.com',
      phone: '555-014-7703',
    });
    expect(inB.status, JSON.stringify(inB.body)).toBe(201);
    // B's own second one is asked about, naming B's customer only.
    const againInB = await post(ownerB, '/api/customers').send({ name: 'Pip', email: 'philippa.d@example.com' });
    expectProblem(againInB, 409);
    expect(againInB.body.existing.id).toBe(inB.body.customer.id);
    expect(JSON.stringify(againInB.body)).not.toContain(inA.body.customer.id);
    expect(JSON.stringify(againInB.body)).not.toContain('Philippa Dunmore');
  });

  it('no e-mail and no phone: nothing to compare, made at once', async () => {
    const a1 = await post(sales, '/api/customers').send({ name: 'Nameonly Person' });
    const a2 = await post(sales, '/api/customers').send({ name: 'Nameonly Person' });
    expect([a1.status, a2.status]).toEqual([201, 201]);
  });
});
