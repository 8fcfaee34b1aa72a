import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { CompanySchema } from '../../server/src/modules/companies/company.entity';
import { CompanyDataRowSchema } from '../../server/src/modules/company-data/company-data.entity';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, post } from './jobs-helpers';
import { BASE, csvText, exportText, seedData } from './company-data-helpers';

let t: TestApp;
let a: TestCompany;
let owner: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'Metric');
  await t.orm.em.fork().nativeUpdate(CompanySchema, { id: a.id }, { unitSystem: 'metric' });
  await seedData(t.orm.em.fork(), a.id);
  owner = await login(t.app, a.users.owner.email);
});
afterAll(async () => t.close());

const preview = (dataset: string, csv: string) => post(owner, `${BASE}/${dataset}/import/preview`).send({ csv });
const apply = (dataset: string, csv: string, token: string) =>
  post(owner, `${BASE}/${dataset}/import/apply`).send({ csv, token });
const readCsv = (text: string): string[][] => parse(text, { bom: true });
async function snapshot(dataset: string) {
  const rows = await t.orm.em.fork().find(CompanyDataRowSchema, { company: a.id, dataset: dataset as never });
  return new Map(rows.map((r) => [r.key, JSON.stringify([r.version, r.data])]));
}
const stored = async (dataset: string, key: string) =>
  (await t.orm.em.fork().findOneOrFail(CompanyDataRowSchema, { company: a.id, dataset: dataset as never, key }))
    .data as Record<string, unknown>;

describe('CSV files of a metric company', () => {
  it('export writes metric headers and export → import reports every row unchanged', async () => {
    const expected: Record<string, string[]> = {
      models: ['factory_charge_g', 'max_line_m', 'adder_g_per_m_liquid_1_4', 'width_mm', 'weight_kg'],
      kits: ['length_m'],
      refrigerants: ['cost_usd_per_kg'],
    };
    for (const dataset of ['models', 'materials', 'labor', 'kits', 'categories', 'financing', 'refrigerants']) {
      const text = await exportText(owner, dataset);
      const header = readCsv(text)[0] ?? [];
      for (const name of expected[dataset] ?? []) expect(header).toContain(name);
      expect(
        header.filter((h) => /_(ft|oz|lb|in)$|_per_lb$|oz_per_ft/.test(h) && h !== 'liquid_in' && h !== 'suction_in'),
      ).toEqual([]);
      const r = await preview(dataset, text);
      expect(r.status, JSON.stringify(r.body)).toBe(200);
      expect(r.body.preview.fileErrors).toEqual([]);
      const { counts } = r.body.preview;
      expect(counts.changed + counts.added + counts.refused).toBe(0);
      expect(counts.unchanged).toBeGreaterThan(0);
    }
  });

  it('a metric file is stored as the imperial equivalents', async () => {
    const rows = readCsv(await exportText(owner, 'models'));
    const header = rows[0] ?? [];
    const key = rows[1]?.[0] ?? '';
    const set = { max_line_m: '20', weight_kg: '10', factory_charge_g: '1000' } as Record<string, string>;
    const edited = rows.map((r, i) => (i === 1 ? r.map((c, j) => set[header[j] ?? ''] ?? c) : r));
    const csv = csvText(edited);
    const p = await preview('models', csv);
    expect(p.status, JSON.stringify(p.body)).toBe(200);
    expect(p.body.preview.counts.refused, JSON.stringify(p.body.preview.rows)).toBe(0);
    expect(p.body.preview.counts.changed).toBe(1);
    const done = await apply('models', csv, p.body.preview.token);
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    const data = await stored('models', key);
    // 20 m ÷ 0.3048 m/ft [PUB: 1 ft = 0.3048 m exactly]
    expect(data['maxLineFt']).toBeCloseTo(20 / 0.3048, 4);
    // 10 kg ÷ 0.45359237 kg/lb [PUB: 1 lb = 0.45359237 kg exactly]
    expect(data['weightLb']).toBeCloseTo(10 / 0.45359237, 4);
    // 1000 g ÷ 28.349523125 g/oz [PUB: 1 oz = 1/16 lb = 28.349523125 g]
    expect(data['factoryChargeOz']).toBeCloseTo(1000 / 28.349523125, 4);
    // and the new values round-trip unchanged
    const again = await preview('models', await exportText(owner, 'models'));
    expect(again.body.preview.counts.changed + again.body.preview.counts.refused).toBe(0);

    const kits = readCsv(await exportText(owner, 'kits'));
    const kh = kits[0] ?? [];
    const added = (kits[1] ?? []).map((c, j) => (kh[j] === 'kit' ? 'METRIC-LS' : kh[j] === 'length_m' ? '7.62' : c));
    const kp = await preview('kits', csvText([kh, added]));
    expect(kp.body.preview.counts.added, JSON.stringify(kp.body.preview.rows)).toBe(1);
    expect((await apply('kits', csvText([kh, added]), kp.body.preview.token)).status).toBe(200);
    // 7.62 m ÷ 0.3048 m/ft = 25 ft exactly [PUB: 1 ft = 0.3048 m]
    expect((await stored('kits', 'METRIC-LS'))['lengthFt']).toBe(25);

    const refr = readCsv(await exportText(owner, 'refrigerants'));
    const rh = refr[0] ?? [];
    const rk = refr[1]?.[0] ?? '';
    const priced = refr.map((r, i) => (i === 1 ? r.map((c, j) => (rh[j] === 'cost_usd_per_kg' ? '30.00' : c)) : r));
    const rp = await preview('refrigerants', csvText(priced));
    expect((await apply('refrigerants', csvText(priced), rp.body.preview.token)).status).toBe(200);
    // $30.00/kg × 0.45359237 kg/lb = $13.6078/lb → 1361 whole cents per lb
    expect((await stored('refrigerants', rk))['costCentsPerLb']).toBe(1361);
  });

  it('a file with both length_ft and length_m is refused and changes nothing', async () => {
    const rows = readCsv(await exportText(owner, 'kits'));
    const header = [...(rows[0] ?? []), 'length_ft'];
    const csv = csvText([header, ...rows.slice(1).map((r) => [...r, '99'])]);
    const before = await snapshot('kits');
    const p = await preview('kits', csv);
    expect(p.status).toBe(200);
    expect(p.body.preview.fileErrors).toEqual([
      'The same value is given in both units: length_ft and length_m. Keep one column of each pair (metric or imperial).',
    ]);
    expect(p.body.preview.canApply).toBe(false);
    const refused = await apply('kits', csv, p.body.preview.token);
    expectProblem(refused, 422);
    expect(await snapshot('kits')).toEqual(before);
  });

  it('the template uses the metric headers', async () => {
    const r = await owner.agent.get(`${BASE}/kits/csv/template`);
    expect(r.status).toBe(200);
    expect(readCsv(String(r.text))[0]).toContain('length_m');
  });
});
