import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobSchema } from '../../server/src/modules/jobs/job.entity';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { DESIGN, expectProblem, newCustomer, newJob, patch, post, SITE } from './jobs-helpers';

let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let sales: Session;
let owner: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'JobsA');
  b = await makeCompany(t.orm.em.fork(), 'JobsB');
  sales = await login(t.app, a.users.salesperson.email);
  owner = await login(t.app, a.users.owner.email);
});
afterAll(async () => t.close());

describe('jobs: access', () => {
  it('401 signed out; 403 for an installer writing', async () => {
    expectProblem(await browserAgent(t.app).get('/api/jobs').set(HTTPS), 401);
    const inst = await login(t.app, a.users.installer.email);
    expectProblem(await post(inst, '/api/jobs').send({}), 403);
  });

  it('a salesperson cannot see or change another salesperson’s job (404); estimator and owner can', async () => {
    const job = await newJob(owner, { salespersonId: a.users.estimator.id });
    expectProblem(await sales.agent.get(`/api/jobs/${job.id}`), 404);
    expectProblem(await patch(sales, `/api/jobs/${job.id}`, job.version).send({ notes: 'mine now' }), 404);
    expect((await sales.agent.get('/api/jobs')).body.items.map((j: { id: string }) => j.id)).not.toContain(job.id);
    const est = await login(t.app, a.users.estimator.email);
    expect((await est.agent.get(`/api/jobs/${job.id}`)).status).toBe(200);
    // A salesperson may not hand a job to someone else either.
    expectProblem(
      await post(sales, '/api/jobs').send({
        customerId: await newCustomer(sales),
        ...SITE,
        salespersonId: a.users.estimator.id,
      }),
      403,
    );
  });

  it('company B gets 404 for everything of company A', async () => {
    const job = await newJob(sales);
    const other = await login(t.app, b.users.owner.email);
    expectProblem(await other.agent.get(`/api/jobs/${job.id}`), 404);
    expectProblem(await patch(other, `/api/jobs/${job.id}`, job.version).send({ notes: 'x' }), 404);
    expectProblem(await other.agent.get(`/api/jobs/${job.id}/rooms`), 404);
    expectProblem(await other.agent.get(`/api/jobs/${job.id}/loads`), 404);
    const cust = await newCustomer(sales);
    const r = await post(other, '/api/jobs').send({ customerId: cust, ...SITE });
    expectProblem(r, 400);
    expect(r.body.errors).toContainEqual({ path: 'customerId', message: 'Choose a customer of your company.' });
  });

  it('an installer sees only the jobs assigned to them, read-only', async () => {
    const job = await newJob(sales);
    const inst = await login(t.app, a.users.installer.email);
    expectProblem(await inst.agent.get(`/api/jobs/${job.id}`), 404);
    expectProblem(
      await patch(sales, `/api/jobs/${job.id}`, job.version).send({ assignedInstallerId: a.users.installer.id }),
      403,
    );
    const assigned = await patch(owner, `/api/jobs/${job.id}`, job.version).send({
      assignedInstallerId: a.users.installer.id,
    });
    expect(assigned.status, JSON.stringify(assigned.body)).toBe(200);
    expect(assigned.body.job.assignedInstaller).toEqual({ id: a.users.installer.id, name: a.users.installer.name });
    expect((await inst.agent.get(`/api/jobs/${job.id}`)).status).toBe(200);
    const list = await inst.agent.get('/api/jobs');
    expect(list.body.items.map((j: { id: string }) => j.id)).toEqual([job.id]);
    expectProblem(await patch(inst, `/api/jobs/${job.id}`, assigned.body.job.version).send({ notes: 'x' }), 403);
  });
});

describe('jobs: bad input', () => {
  it('400 per invalid field, with the field and message', async () => {
    const customerId = await newCustomer(sales);
    const ok = { customerId, ...SITE };
    const cases: Array<[Record<string, unknown>, string, string]> = [
      [{ ...ok, customerId: 'nope' }, 'customerId', 'Choose a customer.'],
      [{ ...ok, street: ' ' }, 'street', 'Enter the street address.'],
      [{ ...ok, city: 'c'.repeat(101) }, 'city', 'The city or town must be at most 100 characters.'],
      [{ ...ok, postalCode: '!!' }, 'postalCode', 'Enter a postal code (letters, digits, spaces or dashes).'],
      [
        { ...ok, tightness: 'airtight' },
        'tightness',
        'Tightness must be one of: very-tight, tight, average, leaky, very-leaky.',
      ],
      [
        { ...ok, designConditions: { ...DESIGN, outdoorCoolingDryBulbF: 400 } },
        'designConditions.outdoorCoolingDryBulbF',
        'Outdoor cooling dry bulb must be between 50 and 130 °F',
      ],
      [
        { ...ok, designConditions: { ...DESIGN, outdoorCoolingWetBulbF: 99 } },
        'designConditions.outdoorCoolingWetBulbF',
        'Outdoor coincident wet bulb must be between 30 and 95 °F',
      ],
      [
        { ...ok, designConditions: { ...DESIGN, outdoorHeatingDryBulbF: '15' } },
        'designConditions.outdoorHeatingDryBulbF',
        'Enter a number',
      ],
      [{ ...ok, designConditions: { ...DESIGN, windSpeed: 3 } }, 'designConditions', 'Unrecognized key: "windSpeed"'],
      [
        { ...ok, designConditions: { indoorCoolingF: 75 } },
        'designConditions.outdoorCoolingDryBulbF',
        'Outdoor cooling dry bulb: enter a number',
      ],
      [
        { ...ok, designSourceNotes: { outdoorCoolingDryBulbF: 'n'.repeat(201) } },
        'designSourceNotes.outdoorCoolingDryBulbF',
        'A source note must be at most 200 characters',
      ],
      [{ ...ok, status: 'won' }, '(body)', 'Unrecognized key: "status"'],
    ];
    for (const [body, path, message] of cases) {
      const r = await post(sales, '/api/jobs').send(body);
      expectProblem(r, 400);
      expect(r.body.errors, JSON.stringify(body)).toContainEqual({ path, message });
    }
    expect(await t.orm.em.fork().count(JobSchema, { customer: customerId })).toBe(0);
  });

  it('list query params are validated', async () => {
    for (const q of [{ page: 0 }, { pageSize: 101 }, { status: 'open' }, { page: 'x' }, { sort: 'name' }]) {
      expectProblem(await sales.agent.get('/api/jobs').query(q), 400);
    }
  });
});

describe('jobs: design conditions, company defaults and sources', () => {
  it('company settings: all staff read, the owner writes with If-Match; defaults prefill new jobs', async () => {
    const c = await makeCompany(t.orm.em.fork(), 'JobsC');
    const o = await login(t.app, c.users.owner.email);
    const s = await login(t.app, c.users.salesperson.email);
    const first = await s.agent.get('/api/company/settings');
    expect(first.status).toBe(200);
    expect(first.body.settings).toMatchObject({ unitSystem: 'imperial', defaultDesignConditions: null, version: 0 });
    expect(first.headers.etag).toBe('"0"');
    const body = { unitSystem: 'metric', defaultDesignConditions: { ...DESIGN, source: 'County code table' } };
    expectProblem(
      await s.agent.put('/api/company/settings').set('X-CSRF-Token', s.csrf).set('If-Match', '"0"').send(body),
      403,
    );
    expectProblem(await o.agent.put('/api/company/settings').set('X-CSRF-Token', o.csrf).send(body), 428);
    const bad = await o.agent
      .put('/api/company/settings')
      .set('X-CSRF-Token', o.csrf)
      .set('If-Match', '"0"')
      .send({ ...body, defaultDesignConditions: { ...DESIGN, indoorHeatingF: 99 } });
    expectProblem(bad, 400);
    expect(bad.body.errors).toContainEqual({
      path: 'defaultDesignConditions.indoorHeatingF',
      message: 'Indoor heating set point must be between 50 and 85 °F',
    });
    const put = await o.agent
      .put('/api/company/settings')
      .set('X-CSRF-Token', o.csrf)
      .set('If-Match', '"0"')
      .send(body);
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(put.body.settings.version).toBe(1);
    expectProblem(
      await o.agent.put('/api/company/settings').set('X-CSRF-Token', o.csrf).set('If-Match', '"0"').send(body),
      409,
    );

    const customerId = await newCustomer(s);
    const job = await post(s, '/api/jobs').send({
      customerId,
      ...SITE,
      designConditions: { outdoorCoolingDryBulbF: 97 },
      designSourceNotes: { outdoorCoolingDryBulbF: 'Site is in a heat island' },
    });
    expect(job.status, JSON.stringify(job.body)).toBe(201);
    expect(job.body.job.designConditions).toMatchObject({
      ...DESIGN,
      outdoorCoolingDryBulbF: 97,
      source: 'County code table',
    });
    expect(job.body.job.designSources.outdoorCoolingDryBulbF).toEqual({
      source: 'entered',
      note: 'Site is in a heat island',
    });
    expect(job.body.job.designSources.outdoorHeatingDryBulbF).toEqual({ source: 'company-default', note: '' });
    const fresh = await t.orm.em.fork().findOneOrFail(JobSchema, { id: job.body.job.id });
    expect(fresh.designConditions?.outdoorCoolingDryBulbF).toBe(97);
    expect(fresh.designSources.elevationFt?.source).toBe('company-default');
  });

  it('without company defaults, calc’s standard defaults are recorded as such', async () => {
    const { outdoorCoolingDryBulbF, outdoorCoolingWetBulbF, outdoorHeatingDryBulbF } = DESIGN;
    const job = await newJob(sales, {
      designConditions: { outdoorCoolingDryBulbF, outdoorCoolingWetBulbF, outdoorHeatingDryBulbF },
    });
    const r = await sales.agent.get(`/api/jobs/${job.id}`);
    expect(r.body.job.designSources.indoorCoolingF).toEqual({ source: 'standard-default', note: '' });
    expect(r.body.job.designSources.outdoorHeatingDryBulbF.source).toBe('entered');
    expect(r.body.job.designConditions.indoorCoolingF).toBe(75);
  });

  it('editing only the source notes keeps the entered values, and later value edits keep the notes', async () => {
    const job = await newJob(sales, { designConditions: { ...DESIGN, outdoorCoolingDryBulbF: 99 } });
    const r = await patch(sales, `/api/jobs/${job.id}`, job.version).send({
      designSourceNotes: { outdoorCoolingDryBulbF: 'Local code table, row 12' },
    });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.job.designConditions.outdoorCoolingDryBulbF).toBe(99);
    expect(r.body.job.designSources.outdoorCoolingDryBulbF).toEqual({
      source: 'entered',
      note: 'Local code table, row 12',
    });
    const back = await patch(sales, `/api/jobs/${job.id}`, r.body.job.version).send({
      designConditions: { ...DESIGN, source: 'Re-checked on site' },
    });
    expect(back.body.job.designConditions).toMatchObject({ ...DESIGN, source: 'Re-checked on site' });
    expect(back.body.job.designSources.outdoorCoolingDryBulbF).toEqual({
      source: 'entered',
      note: 'Local code table, row 12',
    });
  });
});

describe('jobs: CRUD, states, list', () => {
  it('creates, reads back, updates with the lock, and moves through states', async () => {
    const job = await newJob(sales, { notes: 'Dog in yard' });
    const got = await sales.agent.get(`/api/jobs/${job.id}`);
    expect(got.status).toBe(200);
    expect(got.headers.etag).toBe(`"${job.version}"`);
    expect(got.body.job).toMatchObject({
      status: 'walkthrough',
      notes: 'Dog in yard',
      salesperson: { id: a.users.salesperson.id },
      site: { ...SITE, unit: '' },
      version: 1,
    });

    expectProblem(await patch(sales, `/api/jobs/${job.id}`).send({ notes: 'no version' }), 428);
    expectProblem(await patch(sales, `/api/jobs/${job.id}`).set('If-Match', 'one').send({ notes: 'bad' }), 400);
    const u = await patch(sales, `/api/jobs/${job.id}`, 1).send({ status: 'design', notes: 'Gate code 0000' });
    expect(u.status, JSON.stringify(u.body)).toBe(200);
    expect(u.body.job).toMatchObject({ status: 'design', version: 2 });

    const stale = await patch(owner, `/api/jobs/${job.id}`, 1).send({ notes: 'Office note' });
    expectProblem(stale, 409);
    expect(stale.body.currentVersion).toBe(2);
    expect(stale.body.current.notes).toBe('Gate code 0000');
    const fresh = await t.orm.em.fork().findOneOrFail(JobSchema, { id: job.id });
    expect([fresh.notes, fresh.version, fresh.status]).toEqual(['Gate code 0000', 2, 'design']);

    const jump = await patch(sales, `/api/jobs/${job.id}`, 2).send({ status: 'installed' });
    expectProblem(jump, 422);
    expect(jump.body.errors[0].path).toBe('status');
  });

  it('lists with search, status filter, last activity first, and server-side pages', async () => {
    const c = await makeCompany(t.orm.em.fork(), 'JobsList');
    const s = await login(t.app, c.users.salesperson.email);
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push((await newJob(s, { street: `${i + 1} Larchwhistle Row` })).id);
    const special = await post(s, '/api/jobs').send({
      customerId: await newCustomer(s, 'Zebedee Farthingale'),
      ...SITE,
      city: 'Nethercombe',
    });
    expect(special.status).toBe(201);
    const all = await s.agent.get('/api/jobs').query({ pageSize: 4 });
    expect(all.body).toMatchObject({ total: 6, page: 1, pageSize: 4 });
    expect(all.body.items.map((j: { id: string }) => j.id)).toEqual([special.body.job.id, ...ids.slice(-3).reverse()]);
    const page2 = await s.agent.get('/api/jobs').query({ pageSize: 4, page: 2 });
    expect(page2.body.items.map((j: { id: string }) => j.id)).toEqual(ids.slice(0, 2).reverse());
    expect(
      (await s.agent.get('/api/jobs').query({ search: 'farthing' })).body.items.map((j: { id: string }) => j.id),
    ).toEqual([special.body.job.id]);
    expect((await s.agent.get('/api/jobs').query({ search: 'nethercombe' })).body.total).toBe(1);
    expect((await s.agent.get('/api/jobs').query({ search: '3 Larchwhistle' })).body.total).toBe(1);
    // Activity on an older job moves it to the top.
    const oldest = ids[0] ?? '';
    await post(s, `/api/jobs/${oldest}/rooms`).send({ input: { name: 'Den', areaFt2: 120 } });
    expect((await s.agent.get('/api/jobs')).body.items[0].id).toBe(oldest);
    const moved = await patch(s, `/api/jobs/${oldest}`, 1).send({ status: 'design' });
    expect(moved.status, JSON.stringify(moved.body)).toBe(200);
    const design = await s.agent.get('/api/jobs').query({ status: 'design' });
    expect(design.body.items.map((j: { id: string }) => j.id)).toEqual([oldest]);
  });
});
