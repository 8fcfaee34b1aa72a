import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DATASET_IDS } from '@calc';
import { CompanyDataRowSchema } from '../../server/src/modules/company-data/company-data.entity';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, post } from './jobs-helpers';
import { BASE, put, seedData } from './company-data-helpers';

let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let owner: Session;
let estimator: Session;
let sales: Session;
let installer: Session;
let ownerB: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'DataA');
  b = await makeCompany(t.orm.em.fork(), 'DataB');
  await seedData(t.orm.em.fork(), a.id);
  [owner, estimator, sales, installer, ownerB] = await Promise.all([
    login(t.app, a.users.owner.email),
    login(t.app, a.users.estimator.email),
    login(t.app, a.users.salesperson.email),
    login(t.app, a.users.installer.email),
    login(t.app, b.users.owner.email),
  ]);
});
afterAll(async () => t.close());

const COST_WORDS = /costCents|sellRule|rateCentsPerHour|costCentsPerLb|defaultSellRule|margin|markup/;

describe('company data: who reads what', () => {
  it('401 when signed out', async () => {
    expectProblem(await browserAgent(t.app).get(`${BASE}/models`).set(HTTPS), 401);
  });

  it('salespeople and installers never receive cost, sell rules or margins anywhere', async () => {
    for (const s of [sales, installer]) {
      for (const id of DATASET_IDS) {
        const list = await s.agent.get(`${BASE}/${id}`);
        expect([200, 403]).toContain(list.status);
        expect(JSON.stringify(list.body)).not.toMatch(COST_WORDS);
        if (list.status === 200 && list.body.rows.length > 0) {
          const one = await s.agent.get(`${BASE}/${id}/${encodeURIComponent(list.body.rows[0].key)}`);
          expect(one.status).toBe(200);
          expect(JSON.stringify(one.body)).not.toMatch(COST_WORDS);
          expectProblem(await s.agent.get(`${BASE}/${id}/${encodeURIComponent(list.body.rows[0].key)}/history`), 403);
        }
        expectProblem(await s.agent.get(`${BASE}/${id}/csv/export`), 403);
        expectProblem(await s.agent.get(`${BASE}/${id}/csv/template`), 403);
      }
      const settings = await s.agent.get(`${BASE}/settings`);
      expect(JSON.stringify(settings.body)).not.toMatch(COST_WORDS);
    }
  });

  it('installers read the catalog without prices; salespeople see list prices; the office sees cost', async () => {
    const key = 'TSL-S12H-O';
    const asInstaller = await installer.agent.get(`${BASE}/models/${key}`);
    expect(asInstaller.body.row.record).toMatchObject({ key, nominalCoolingBtuh: 12000, refrigerant: 'R-32' });
    expect(asInstaller.body.row.record).not.toHaveProperty('listCents');
    const asSales = await sales.agent.get(`${BASE}/models/${key}`);
    expect(asSales.body.row.record.listCents).toBeGreaterThan(0);
    expect(asSales.body.row.record).not.toHaveProperty('costCents');
    const asEstimator = await estimator.agent.get(`${BASE}/models/${key}`);
    expect(asEstimator.body.row.record.costCents).toBeGreaterThan(0);
    expectProblem(await installer.agent.get(`${BASE}/refrigerants`), 403);
    expectProblem(await installer.agent.get(`${BASE}/financing`), 403);
  });

  it('only the owner and the estimator write', async () => {
    for (const s of [sales, installer]) {
      expectProblem(
        await post(s, `${BASE}/financing`).send({ record: { key: 'x', name: 'X', aprPercent: 1, months: 12 } }),
        403,
      );
      expectProblem(await put(s, `${BASE}/financing/low-rate-60`, 1).send({ record: {} }), 403);
      expectProblem(await post(s, `${BASE}/financing/import/preview`).send({ csv: 'a' }), 403);
    }
  });

  it('another company sees none of it: lists are empty and a known key is 404', async () => {
    const list = await ownerB.agent.get(`${BASE}/models`);
    expect(list.status).toBe(200);
    expect(list.body.rows).toEqual([]);
    expectProblem(await ownerB.agent.get(`${BASE}/models/TSL-S12H-O`), 404);
    expectProblem(await put(ownerB, `${BASE}/models/TSL-S12H-O`, 1).send({ record: { key: 'TSL-S12H-O' } }), 400);
    const r = await ownerB.agent.get(`${BASE}/materials/CU-38/history`);
    expectProblem(r, 404);
  });
});

describe('company data: editing one record', () => {
  const material = {
    key: 'TEST-FOAM',
    description: 'Expanding foam, can',
    unit: 'each',
    category: 'materials',
    costCents: 899,
  };

  it('400 names each bad field; nothing is stored', async () => {
    const cases: Array<[Record<string, unknown>, string, string]> = [
      [{ ...material, costCents: -1 }, 'record.costCents', 'Cost must be between 0 and 100000000 cents'],
      [
        { ...material, sellRule: { method: 'margin', percent: 100 } },
        'record.sellRule.percent',
        'A margin must be below 100 %',
      ],
      [{ ...material, unit: 'bucket' }, 'record.unit', 'Unit must be one of each, ft, lb, roll, box, gal, pair, set'],
      [{ ...material, category: 'nope' }, 'record.category', 'No category "nope": add it under categories first'],
    ];
    for (const [record, path, message] of cases) {
      const r = await post(estimator, `${BASE}/materials`).send({ record });
      expectProblem(r, 400);
      expect(r.body.errors).toContainEqual({ path, message });
    }
    expect(await t.orm.em.fork().count(CompanyDataRowSchema, { key: 'TEST-FOAM' })).toBe(0);
  });

  it('a 9,000 Btu/h model cannot list 90,000 Btu/h at 95 °F', async () => {
    const current = (await owner.agent.get(`${BASE}/models/TSL-S9H-O`)).body.row;
    const record = { ...current.record, coolingPoints: [{ outdoorF: 95, btuh: 90000 }] };
    const r = await put(owner, `${BASE}/models/TSL-S9H-O`, current.version).send({ record });
    expectProblem(r, 400);
    expect(r.body.errors).toContainEqual({
      path: 'record.coolingPoints.0.btuh',
      message: '90000 Btu/h at 95 °F is not plausible for a 9000 Btu/h unit (expected 2250–14400)',
    });
  });

  it('creates, updates with If-Match, refuses a stale version and keeps the history', async () => {
    const created = await post(estimator, `${BASE}/materials`).send({ record: material });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.headers.etag).toBe('"1"');
    expectProblem(await post(estimator, `${BASE}/materials`).send({ record: material }), 409);

    expectProblem(await put(owner, `${BASE}/materials/TEST-FOAM`).send({ record: material }), 428);
    const updated = await put(owner, `${BASE}/materials/TEST-FOAM`, 1).send({
      record: { ...material, costCents: 949 },
    });
    expect(updated.status, JSON.stringify(updated.body)).toBe(200);
    expect(updated.body.row).toMatchObject({ version: 2, record: { costCents: 949 } });

    const stale = await put(estimator, `${BASE}/materials/TEST-FOAM`, 1).send({
      record: { ...material, costCents: 1 },
    });
    expectProblem(stale, 409);
    expect(stale.body.currentVersion).toBe(2);
    expect(stale.body.current.record.costCents).toBe(949);

    const renamed = await put(owner, `${BASE}/materials/TEST-FOAM`, 2).send({ record: { ...material, key: 'OTHER' } });
    expectProblem(renamed, 400);

    const history = await owner.agent.get(`${BASE}/materials/TEST-FOAM/history`);
    expect(history.body.history.map((h: { action: string }) => h.action)).toEqual(['changed', 'created']);
    expect(history.body.history[0]).toMatchObject({
      source: 'edit',
      changes: [{ column: 'cost_usd', before: '8.99', after: '9.49' }],
      changedBy: { name: a.users.owner.name },
    });
    const fresh = await t.orm.em.fork().findOneOrFail(CompanyDataRowSchema, { key: 'TEST-FOAM', company: a.id });
    expect(fresh.data['costCents']).toBe(949);
  });

  it('price-book settings: read by sellers, written by the office with If-Match; a margin of 100 % is refused', async () => {
    const got = await owner.agent.get(`${BASE}/settings`);
    expect(got.body.settings).toMatchObject({ taxRatePercent: 7.25, taxAppliesTo: 'materials', version: 1 });
    const bad = await put(owner, `${BASE}/settings`, 1).send({
      settings: { taxRatePercent: 7, taxAppliesTo: 'total', defaultSellRule: { method: 'margin', percent: 100 } },
    });
    expectProblem(bad, 400);
    expect(bad.body.errors).toContainEqual({
      path: 'settings.defaultSellRule.percent',
      message: 'A margin must be below 100 %',
    });
    const ok = await put(owner, `${BASE}/settings`, 1).send({
      settings: { taxRatePercent: 8, taxAppliesTo: 'total', defaultSellRule: { method: 'markup', percent: 50 } },
    });
    expect(ok.body.settings).toMatchObject({ taxRatePercent: 8, version: 2 });
    expect((await sales.agent.get(`${BASE}/settings`)).body.settings).toEqual({
      taxRatePercent: 8,
      taxAppliesTo: 'total',
      version: 2,
    });
    expectProblem(await put(sales, `${BASE}/settings`, 2).send({ settings: {} }), 403);
  });
});
