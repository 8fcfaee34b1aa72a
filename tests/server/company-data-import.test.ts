import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parse } from 'csv-parse/sync';
import { CompanyDataRowSchema } from '../../server/src/modules/company-data/company-data.entity';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem, post } from './jobs-helpers';
import { BASE, csvText, exportText, put, seedData } from './company-data-helpers';

let t: TestApp;
let a: TestCompany;
let owner: Session;
let estimator: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'ImportA');
  await seedData(t.orm.em.fork(), a.id);
  [owner, estimator] = await Promise.all([login(t.app, a.users.owner.email), login(t.app, a.users.estimator.email)]);
});
afterAll(async () => t.close());

const preview = (s: Session, dataset: string, csv: string) =>
  post(s, `${BASE}/${dataset}/import/preview`).send({ csv });
const apply = (s: Session, dataset: string, csv: string, token: string) =>
  post(s, `${BASE}/${dataset}/import/apply`).send({ csv, token });

/** Every row of a table, key → [version, data], read straight from the database. */
async function snapshot(dataset: string) {
  const rows = await t.orm.em.fork().find(CompanyDataRowSchema, { company: a.id, dataset: dataset as never });
  return new Map(rows.map((r) => [r.key, JSON.stringify([r.version, r.data])]));
}

const readCsv = (text: string): string[][] => parse(text, { bom: true });

describe('CSV export and import', () => {
  it('export → import of every table reports every row unchanged (and cannot be applied: nothing to do)', async () => {
    for (const dataset of ['models', 'materials', 'labor', 'kits', 'categories', 'financing', 'refrigerants']) {
      const text = await exportText(owner, dataset);
      const r = await preview(owner, dataset, text);
      expect(r.status, JSON.stringify(r.body)).toBe(200);
      const { counts, fileErrors, canApply } = r.body.preview;
      expect(fileErrors).toEqual([]);
      expect(counts.changed + counts.added + counts.refused).toBe(0);
      expect(counts.unchanged).toBeGreaterThan(0);
      expect(canApply).toBe(false);
    }
  });

  it('exported cells that a spreadsheet would run as a formula start with an apostrophe, and re-import unchanged', async () => {
    const created = await post(owner, `${BASE}/materials`).send({
      record: {
        key: 'TEST-FORMULA',
        description: '=HYPERLINK("http://example.invalid","x")',
        unit: 'each',
        category: 'materials',
        costCents: 100,
      },
    });
    expect(created.status).toBe(201);
    const text = await exportText(owner, 'materials');
    const row = readCsv(text).find((r) => r[0] === 'TEST-FORMULA');
    expect(row?.[1]).toBe(`'=HYPERLINK("http://example.invalid","x")`);
    const r = await preview(owner, 'materials', text);
    expect(r.body.preview.rows.find((x: { key: string }) => x.key === 'TEST-FORMULA').status).toBe('unchanged');
  });

  it('the template has the columns and one example row', async () => {
    const r = await owner.agent.get(`${BASE}/kits/csv/template`);
    expect(r.status).toBe(200);
    const rows = readCsv(String(r.text));
    expect(rows[0]).toEqual([
      'kit',
      'description',
      'kind',
      'length_ft',
      'liquid_in',
      'suction_in',
      'components',
      'category',
      'cost_usd',
      'sell_method',
      'sell_percent',
      'active',
    ]);
    expect(rows).toHaveLength(2);
  });

  it('a file with one bad row among 500 imports nothing and reports that row and column', async () => {
    const header = [
      'sku',
      'description',
      'unit',
      'category',
      'cost_usd',
      'sell_method',
      'sell_percent',
      'takeoff_item',
      'active',
    ];
    const rows = Array.from({ length: 500 }, (_, i) => [
      `BULK-${i}`,
      `Bulk item ${i}`,
      'each',
      'materials',
      i === 249 ? '12,34' : `${(i + 1) / 4}`,
      '',
      '',
      i === 0 ? 'wall-sleeve' : '',
      'yes',
    ]);
    const csv = csvText([header, ...rows]);
    const before = await snapshot('materials');
    const r = await preview(estimator, 'materials', csv);
    expect(r.status).toBe(200);
    expect(r.body.preview.counts).toEqual({ added: 499, changed: 0, unchanged: 0, refused: 1 });
    expect(r.body.preview.canApply).toBe(false);
    expect(r.body.preview.rows.filter((x: { status: string }) => x.status === 'refused')).toEqual([
      {
        line: 251,
        key: 'BULK-249',
        status: 'refused',
        errors: [{ column: 'cost_usd', message: '"12,34" is not an amount in dollars (e.g. 1234.50)' }],
      },
    ]);
    const refused = await apply(estimator, 'materials', csv, r.body.preview.token);
    expectProblem(refused, 422);
    expect(refused.body.detail).toBe('The file has refused rows. Nothing was imported: fix them and preview again.');
    expect(await snapshot('materials')).toEqual(before);
  });

  it('preview then confirm applies exactly the previewed change, with history', async () => {
    const text = await exportText(owner, 'materials');
    const rows = readCsv(text);
    const header = rows[0] ?? [];
    const cost = header.indexOf('cost_usd');
    const edited = rows.map((r, i) => {
      if (i === 0) return r;
      if (r[0] === 'CU-38' || r[0] === 'WS-3') return r.map((c, j) => (j === cost ? '9.99' : c));
      return r;
    });
    const csv = csvText(edited);
    const before = await snapshot('materials');
    const p = await preview(owner, 'materials', csv);
    expect(p.body.preview.counts.changed).toBe(2);
    const changed = p.body.preview.rows.filter((x: { status: string }) => x.status === 'changed');
    expect(changed.map((x: { key: string }) => x.key).sort()).toEqual(['CU-38', 'WS-3']);
    expect(changed[0].changes).toEqual([{ column: 'cost_usd', before: expect.any(String), after: '9.99' }]);

    const done = await apply(owner, 'materials', csv, p.body.preview.token);
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    const after = await snapshot('materials');
    for (const [key, value] of after) {
      if (key === 'CU-38' || key === 'WS-3') {
        const [version, data] = JSON.parse(value) as [number, { costCents: number }];
        expect(data.costCents).toBe(999);
        expect(version).toBe(2);
      } else expect(value).toBe(before.get(key));
    }
    const history = await owner.agent.get(`${BASE}/materials/CU-38/history`);
    expect(history.body.history[0]).toMatchObject({ source: 'import', changedBy: { name: a.users.owner.name } });
  });

  it('an edit between preview and confirm makes the confirm refuse with a clear message, changing nothing', async () => {
    const text = await exportText(owner, 'financing');
    const csv = text.replace('60 months at 7.99 %', '60 months at 6.99 %').replace(',7.99,', ',6.99,');
    const p = await preview(owner, 'financing', csv);
    expect(p.body.preview.counts.changed).toBe(1);
    const current = (await owner.agent.get(`${BASE}/financing/long-term-120`)).body.row;
    const edit = await put(estimator, `${BASE}/financing/long-term-120`, current.version).send({
      record: { ...current.record, aprPercent: 8.99 },
    });
    expect(edit.status).toBe(200);
    const before = await snapshot('financing');
    const r = await apply(owner, 'financing', csv, p.body.preview.token);
    expectProblem(r, 409);
    expect(r.body.detail).toMatch(/changed after your preview .* Nothing was imported: preview the file again/);
    expect(await snapshot('financing')).toEqual(before);
  });

  it('file-level problems are reported, oversize files are refused naming the limit', async () => {
    const unknown = await preview(owner, 'financing', 'plan,name,rate\r\nx,y,1');
    expect(unknown.body.preview.fileErrors).toEqual([
      'Unknown columns: rate.',
      'Missing columns: apr_percent, months, active. Start from the template.',
    ]);
    const broken = await preview(owner, 'financing', 'plan,name\r\n"unclosed,1');
    expect(broken.body.preview.fileErrors[0]).toMatch(/^The file is not valid CSV/);
    const huge = await preview(owner, 'financing', 'x'.repeat(2_000_001));
    expectProblem(huge, 400);
    expect(huge.body.errors).toContainEqual({
      path: 'csv',
      message: 'The file is larger than the 2 MB limit. Split it into smaller files.',
    });
    // Past what the import route's body parser takes at all: still the file's limit, named.
    const past = await preview(owner, 'financing', 'x'.repeat(3_500_000));
    expectProblem(past, 413);
    expect(past.body.detail).toBe('The file is larger than the 2 MB limit. Split it into smaller files.');
    const forged = await apply(owner, 'financing', 'plan\r\n', 'A'.repeat(43));
    expectProblem(forged, 409);
  });

  it('property: random CSV text (quotes, newlines, BOM, CRLF, ragged rows) never gives a 5xx and changes nothing unless valid', async () => {
    const cell = fc.oneof(
      fc.constantFrom('', 'p1', 'Plan', '0', '12', '7.5', 'yes', 'no', '=1+2', '"', '""', ',', '\n', '\r\n', '\uFEFF'),
      fc.string({ maxLength: 8 }),
    );
    const row = fc.array(cell, { minLength: 1, maxLength: 7 });
    const header = fc.oneof(
      fc.constant(['plan', 'name', 'apr_percent', 'months', 'active']),
      fc.array(fc.constantFrom('plan', 'name', 'apr_percent', 'months', 'active', 'x'), { maxLength: 6 }),
    );
    const quote = (c: string) => (/[",\r\n]/.test(c) || c.length % 2 === 0 ? `"${c.replace(/"/g, '""')}"` : c);
    await fc.assert(
      fc.asyncProperty(
        header,
        fc.array(row, { maxLength: 5 }),
        fc.boolean(),
        fc.boolean(),
        async (h, rs, bom, crlf) => {
          const text = (bom ? '\uFEFF' : '') + [h, ...rs].map((r) => r.map(quote).join(',')).join(crlf ? '\r\n' : '\n');
          if (text.length === 0) return;
          const before = await snapshot('financing');
          const p = await preview(owner, 'financing', text);
          expect(p.status).toBeLessThan(500);
          if (p.status !== 200) return;
          const r = await apply(owner, 'financing', text, p.body.preview.token);
          expect(r.status).toBeLessThan(500);
          if (p.body.preview.canApply) expect(r.status).toBe(200);
          else {
            expect([409, 422]).toContain(r.status);
            expect(await snapshot('financing')).toEqual(before);
          }
        },
      ),
      { numRuns: 40 },
    );
  });
});
