import { computeDesign, priceOption, pricingSchema } from '@calc';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { loadCompanyDesk } from '../../server/src/modules/desk/desk-inputs';
import { engineData } from '../../server/src/modules/desk/desk-compute';
import { del, expectProblem, patch, post } from './jobs-helpers';
import { deskJob, multiZone, newOption, seedData, singleZone } from './desk-helpers';

let t: TestApp;
let a: TestCompany;
let owner: Session;
let estimator: Session;
let sales: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'DeskA');
  await seedData(t.orm.em.fork(), a.id);
  owner = await login(t.app, a.users.owner.email);
  estimator = await login(t.app, a.users.estimator.email);
  sales = await login(t.app, a.users.salesperson.email);
});
afterAll(async () => t.close());

describe('options: create, read, update, delete', () => {
  it('creates up to three options, moves the job to design, copies one, and refuses a fourth', async () => {
    const { job, rooms } = await deskJob(sales);
    const first = await newOption(sales, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    expect(first.position).toBe(1);
    const j = await sales.agent.get(`/api/jobs/${job.id}`);
    expect(j.body.job.status).toBe('design');
    const copy = await newOption(estimator, job.id, { name: 'Quiet comfort', copyFromOptionId: first.id });
    expect(copy.design).toEqual(first.design);
    await newOption(estimator, job.id, { name: 'Whole-home', design: multiZone(rooms) });
    expectProblem(await post(estimator, `/api/jobs/${job.id}/options`).send({ name: 'Fourth' }), 409);
    const desk = await estimator.agent.get(`/api/jobs/${job.id}/desk`);
    expect(desk.status).toBe(200);
    expect(desk.body.options.map((o: { name: string }) => o.name)).toEqual([
      'Essential',
      'Quiet comfort',
      'Whole-home',
    ]);
    for (const o of desk.body.options) expect(o.result.price.totalCents).toBeGreaterThan(0);
  });

  it('PATCH needs If-Match; a stale one is 409 with the option now; DELETE removes it', async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    expectProblem(await patch(estimator, url).send({ name: 'Renamed' }), 428);
    const ok = await patch(estimator, url, o.version).send({ name: 'Renamed' });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.headers.etag).toBe(`"${ok.body.option.version}"`);
    const stale = await patch(estimator, url, o.version).send({ name: 'Again' });
    expectProblem(stale, 409);
    expect(stale.body.current.name).toBe('Renamed');
    expectProblem(await del(estimator, url, o.version), 409);
    expect((await del(estimator, url, ok.body.option.version)).status).toBe(204);
    expectProblem(await estimator.agent.get(url), 404);
  });
});

describe('bad input: problem+json with field paths, nothing stored', () => {
  it('refuses a bad design field, an unknown model and an unknown room', async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const long = await patch(estimator, url, o.version).send({ design: singleZone(rooms[0] ?? '', 999) });
    expectProblem(long, 400);
    expect(long.body.errors).toContainEqual({
      path: 'design.systems.0.circuits.0.lengthFt',
      message: 'Line-set length must be between 1 and 300 ft',
    });
    const design = singleZone(rooms[0] ?? '');
    design.zones[0] = { ...design.zones[0], indoorUnitKey: 'NO-SUCH-MODEL' } as (typeof design.zones)[0];
    const unknown = await patch(estimator, url, o.version).send({ design });
    expectProblem(unknown, 400);
    expect(unknown.body.errors[0].path).toBe('design.zones.0.indoorUnitKey');
    const kit = singleZone(rooms[0] ?? '');
    const noKit = await patch(estimator, url, o.version).send({
      design: { ...kit, systems: [{ ...kit.systems[0], heatKitKey: 'NO-SUCH-KIT' }] },
    });
    expectProblem(noKit, 400);
    expect(noKit.body.errors[0].path).toBe('design.systems.0.heatKitKey');
    const ghost = singleZone('00000000-0000-4000-8000-000000000000');
    const noRoom = await patch(estimator, url, o.version).send({ design: ghost });
    expectProblem(noRoom, 400);
    expect(noRoom.body.errors[0].path).toMatch(/^design\.zones\.0/);
    const now = await estimator.agent.get(url);
    expect(now.body.option.version).toBe(o.version);
    expect(now.body.option.design).toEqual(o.design);
  });

  it('refuses bad pricing fields with their paths and an unknown financing plan; nothing changes', async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const bad = await patch(estimator, url, o.version).send({
      pricing: { deposit: { kind: 'percent', value: 150 }, discounts: [{ label: '', kind: 'percent', value: 5 }] },
    });
    expectProblem(bad, 400);
    expect(bad.body.errors).toContainEqual({
      path: 'pricing.deposit.value',
      message: 'Deposit must be between 0 and 100 %',
    });
    expect(bad.body.errors.map((e: { path: string }) => e.path)).toContain('pricing.discounts.0.label');
    const plan = await patch(estimator, url, o.version).send({ pricing: { financingPlanKey: 'no-such-plan' } });
    expectProblem(plan, 400);
    expect(plan.body.errors[0].path).toBe('pricing.financingPlanKey');
    const now = await estimator.agent.get(url);
    expect(now.body.option.version).toBe(o.version);
    expect(now.body.option.pricing).toEqual(o.pricing);
  });

  it('ignores a total sent by the browser: the strict body refuses it and the stored figures are calc’s', async () => {
    const { job, rooms } = await deskJob(estimator);
    const r = await post(estimator, `/api/jobs/${job.id}/options`).send({
      name: 'Essential',
      design: singleZone(rooms[0] ?? ''),
      totalCents: 100,
    });
    expectProblem(r, 400);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const sneaky = await patch(estimator, url, o.version).send({
      pricing: { discounts: [], price: { totalCents: 1 } },
    });
    expectProblem(sneaky, 400);
    const read = await estimator.agent.get(url);
    expect(read.body.option.result.price.totalCents).toBeGreaterThan(100_000);
  });
});

describe('server totals equal calc’s', () => {
  it('computes each option with calc from the saved inputs', async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Whole-home', design: multiZone(rooms) });
    const em = t.orm.em.fork();
    const data = engineData(await loadCompanyDesk(em, a.id));
    const jobRow = await estimator.agent.get(`/api/jobs/${job.id}`);
    const roomRows = await estimator.agent.get(`/api/jobs/${job.id}/rooms`);
    const settings = data.desk.settings;
    const pricing = pricingSchema.parse({
      method: settings.defaultSellRule.method,
      percent: settings.defaultSellRule.percent,
      taxRatePercent: settings.taxRatePercent,
      taxOn: settings.taxAppliesTo,
    });
    const direct = computeDesign({
      home: {
        id: job.id,
        designConditions: jobRow.body.job.designConditions,
        tightness: jobRow.body.job.tightness,
        ...jobRow.body.job.house,
        rooms: roomRows.body.rooms.map((r: { input: unknown }) => r.input),
      },
      design: multiZone(rooms),
      catalog: data.catalog,
      priceBook: data.priceBook,
      pricing,
    });
    const read = await estimator.agent.get(`/api/jobs/${job.id}/options/${o.id}`);
    const price = read.body.option.result.price;
    expect(price.totalCents).toBe(direct.price.totalCents);
    expect(price.costCents).toBe(direct.price.costCents);
    expect(price.grossMarginPercent).toBe(direct.price.grossMarginPercent);
    expect(priceOption({ lines: direct.takeoff, pricing }).totalCents).toBe(price.totalCents);
    expect(read.body.option.result.systems[0].refrigerant.extraChargeOz).toBe(
      direct.systems[0]?.refrigerant.extraChargeOz,
    );
  });
});

describe('scoping', () => {
  it('401 signed out, 404 for another company, another salesperson’s job and an unassigned installer', async () => {
    const { job, rooms } = await deskJob(owner);
    const o = await newOption(owner, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    expectProblem(await browserAgent(t.app).get(`/api/jobs/${job.id}/desk`).set(HTTPS), 401);
    const b = await makeCompany(t.orm.em.fork(), 'DeskB');
    const bOwner = await login(t.app, b.users.owner.email);
    expectProblem(await bOwner.agent.get(`/api/jobs/${job.id}/desk`), 404);
    expectProblem(await bOwner.agent.get(`/api/jobs/${job.id}/options/${o.id}`), 404);
    expectProblem(await patch(bOwner, `/api/jobs/${job.id}/options/${o.id}`, o.version).send({ name: 'x' }), 404);
    expectProblem(await sales.agent.get(`/api/jobs/${job.id}/desk`), 404);
    const installer = await login(t.app, a.users.installer.email);
    expectProblem(await installer.agent.get(`/api/jobs/${job.id}/desk`), 404);
  });
});
