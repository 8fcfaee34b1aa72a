import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  DATASETS,
  centsToDollars,
  diffImport,
  dollarsToCents,
  neutraliseCell,
  recordToCells,
  restoreCell,
  type ImportRowIn,
} from '@calc';

const ds = DATASETS.financing;
const header = ds.columns.map((c) => c.name); // plan,name,apr_percent,months,active
const held = new Map<string, Record<string, unknown>>([
  ['p12', { key: 'p12', name: '12 months', aprPercent: 0, months: 12, active: true }],
  ['p60', { key: 'p60', name: '60 months', aprPercent: 7.99, months: 60, active: true }],
  ['p99', { key: 'p99', name: 'Old plan', aprPercent: 5, months: 36, active: false }],
]);
const rows = (...r: string[][]): ImportRowIn[] => r.map((cells, i) => ({ line: i + 2, cells }));

describe('diffImport', () => {
  it('sorts rows into added, changed (old → new per column), unchanged; lists held keys not in the file', () => {
    const d = diffImport({
      dataset: ds,
      header,
      current: held,
      rows: rows(
        ['p12', '12 months', '0.00', '12', 'yes'],
        ['p60', '60 months', '6.99', '60', 'yes'],
        ['p120', '120 months', '9.99', '120', 'yes'],
      ),
    });
    expect(d.fileErrors).toEqual([]);
    expect(d.rows.map((r) => [r.line, r.key, r.status])).toEqual([
      [2, 'p12', 'unchanged'],
      [3, 'p60', 'changed'],
      [4, 'p120', 'added'],
    ]);
    expect(d.rows[1]?.status === 'changed' && d.rows[1].changes).toEqual([
      { column: 'apr_percent', before: '7.99', after: '6.99' },
    ]);
    expect(d.notInFile).toEqual(['p99']);
    expect(d.counts).toEqual({ added: 1, changed: 1, unchanged: 1, refused: 0 });
    expect(d.canApply).toBe(true);
  });

  it('a refused row names its line and column, and the file cannot be applied', () => {
    const d = diffImport({
      dataset: ds,
      header,
      current: held,
      rows: rows(['p12', '12 months', 'abc', '12', 'yes'], ['p13', '13', '3', '999', 'maybe'], ['p14', 'x']),
    });
    expect(d.rows).toEqual([
      { line: 2, key: 'p12', status: 'refused', errors: [{ column: 'apr_percent', message: '"abc" is not a number' }] },
      {
        line: 3,
        key: 'p13',
        status: 'refused',
        errors: [{ column: 'active', message: 'Enter yes or no' }],
      },
      {
        line: 4,
        key: 'p14',
        status: 'refused',
        errors: [{ column: '(row)', message: 'The row has 2 cells; the header has 5' }],
      },
    ]);
    expect(d.canApply).toBe(false);
  });

  it('schema bounds come back under the column that holds the field', () => {
    const d = diffImport({ dataset: ds, header, current: held, rows: rows(['p13', '13', '3', '999', 'yes']) });
    expect(d.rows[0]).toEqual({
      line: 2,
      key: 'p13',
      status: 'refused',
      errors: [{ column: 'months', message: 'Term must be between 1 and 240 months' }],
    });
  });

  it('a key listed twice is refused on its second line', () => {
    const d = diffImport({
      dataset: ds,
      header,
      current: held,
      rows: rows(['p1', 'A', '1', '12', 'yes'], ['p1', 'B', '1', '12', 'yes']),
    });
    expect(d.rows[1]).toEqual({
      line: 3,
      key: 'p1',
      status: 'refused',
      errors: [{ column: 'plan', message: 'p1 is also on line 2' }],
    });
  });

  it('unknown, missing and repeated columns are file errors; a BOM and header case are tolerated', () => {
    const bad = diffImport({ dataset: ds, header: ['plan', 'name', 'name', 'rate'], current: held, rows: [] });
    expect(bad.fileErrors).toEqual([
      'Unknown columns: rate.',
      'Missing columns: apr_percent, months, active. Start from the template.',
      'Columns listed twice: name.',
    ]);
    const ok = diffImport({
      dataset: ds,
      header: ['\uFEFFPLAN', ...header.slice(1)],
      current: held,
      rows: rows(['p12', '12 months', '0', '12', 'yes']),
    });
    expect(ok.fileErrors).toEqual([]);
    expect(ok.rows[0]?.status).toBe('unchanged');
    expect(ok.canApply).toBe(false); // nothing to change
  });

  it('export → import of every held record reports every row unchanged', () => {
    const cells = [...held.values()].map((r) => recordToCells(ds, r).map(neutraliseCell));
    const d = diffImport({ dataset: ds, header, current: held, rows: rows(...cells) });
    expect(d.counts).toEqual({ added: 0, changed: 0, unchanged: 3, refused: 0 });
  });

  it('property: random cells never throw; a row is accepted only if the schema accepts its record', () => {
    const cell = fc.oneof(
      fc.string({ maxLength: 12 }),
      fc.constantFrom('', 'yes', 'no', '12', '0', '-1', '1e5', '=1+1', '"', '\r\n', '\uFEFF'),
    );
    fc.assert(
      fc.property(fc.array(fc.array(cell, { minLength: 0, maxLength: 7 }), { maxLength: 6 }), (raw) => {
        const d = diffImport({ dataset: ds, header, current: held, rows: rows(...raw) });
        for (const r of d.rows) {
          if (r.status === 'added' || r.status === 'changed') expect(ds.schema.safeParse(r.record).success).toBe(true);
          if (r.status === 'refused') expect(r.errors.length).toBeGreaterThan(0);
        }
        expect(d.canApply).toBe(d.counts.refused === 0 && d.counts.added + d.counts.changed > 0);
      }),
    );
  });
});

describe('CSV cells', () => {
  // OWASP "CSV Injection": cells beginning with =, +, -, @, tab or carriage return are run as
  // formulas by spreadsheets; prefixing an apostrophe makes them text.
  it('neutralises every formula lead character and leaves other cells alone', () => {
    for (const lead of ['=', '+', '-', '@', '\t', '\r'])
      expect(neutraliseCell(`${lead}HYPERLINK("x")`)).toBe(`'${lead}HYPERLINK("x")`);
    expect(neutraliseCell('Line set 3/8')).toBe('Line set 3/8');
    expect(neutraliseCell("O'Brien")).toBe("O'Brien");
  });
  it('property: restoring a neutralised cell gives the original back', () => {
    fc.assert(
      fc.property(fc.string(), (s) => {
        expect(restoreCell(neutraliseCell(s))).toBe(s);
      }),
    );
  });
  it('dollars are read to exact cents, with $ and thousands commas; other text is refused', () => {
    expect(dollarsToCents('1,234.5')).toBe(123450);
    expect(dollarsToCents('$0.07')).toBe(7);
    expect(dollarsToCents('19.99')).toBe(1999);
    expect(dollarsToCents('12.345')).toBe('"12.345" is not an amount in dollars (e.g. 1234.50)');
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999 }), (c) => {
        expect(dollarsToCents(centsToDollars(c))).toBe(c);
      }),
    );
  });
});
