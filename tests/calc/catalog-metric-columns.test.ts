import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  DATASETS,
  G_PER_OZ,
  KG_PER_LB,
  MM_PER_IN,
  M_PER_FT,
  columnsForUnits,
  diffImport,
  metricVariant,
  recordFromCells,
  recordToCells,
  type CsvColumn,
} from '@calc';

const col = (dataset: keyof typeof DATASETS, name: string): CsvColumn => {
  const c = DATASETS[dataset].columns.find((x) => x.name === name);
  if (!c) throw new Error(`no column ${name}`);
  return c;
};
const metricOf = (dataset: keyof typeof DATASETS, name: string): CsvColumn => {
  const m = metricVariant(col(dataset, name));
  if (!m) throw new Error(`no metric variant of ${name}`);
  return m;
};
const writeCell = (c: CsvColumn, cell: string) => {
  const d: Record<string, unknown> = {};
  expect(c.write(d, cell)).toBeNull();
  return d;
};

describe('metric CSV columns', () => {
  it('use the exact definitions of the foot, inch, pound and ounce', () => {
    // [PUB: international yard and pound agreement 1959; NIST SP 811 appendix B]
    expect(M_PER_FT).toBe(0.3048);
    expect(MM_PER_IN).toBe(25.4);
    expect(KG_PER_LB).toBe(0.45359237);
    // 1 oz = 1/16 lb = 453.59237 g / 16 [PUB: NIST SP 811 appendix B]
    expect(G_PER_OZ).toBeCloseTo(453.59237 / 16, 12);
  });

  it('read metres, millimetres, kilograms and grams into the stored imperial values', () => {
    // 7.62 m ÷ 0.3048 m/ft = 25 ft exactly [PUB: 1 ft = 0.3048 m]
    expect(writeCell(metricOf('kits', 'length_ft'), '7.62')).toEqual({ lengthFt: 25 });
    // 20 m ÷ 0.3048 = 65.6168 ft [PUB: 1 ft = 0.3048 m]
    expect(writeCell(metricOf('models', 'max_line_ft'), '20')['maxLineFt']).toBeCloseTo(65.6168, 4);
    // 800 mm ÷ 25.4 mm/in = 31.4961 in [PUB: 1 in = 25.4 mm]
    expect(writeCell(metricOf('models', 'width_in'), '800')['widthIn']).toBeCloseTo(31.4961, 4);
    // 10 kg ÷ 0.45359237 kg/lb = 22.0462 lb [PUB: 1 lb = 0.45359237 kg]
    expect(writeCell(metricOf('models', 'weight_lb'), '10')['weightLb']).toBeCloseTo(22.0462, 4);
    // 1000 g ÷ 28.349523125 g/oz = 35.2740 oz [PUB: 1 oz = 28.349523125 g]
    expect(writeCell(metricOf('models', 'factory_charge_oz'), '1000')['factoryChargeOz']).toBeCloseTo(35.274, 3);
    // 1 oz/ft = 28.349523125 g ÷ 0.3048 m = 93.0102 g/m, so 18.6 g/m = 0.19998 oz/ft
    const adder = writeCell(metricOf('models', 'adder_oz_per_ft_liquid_1_4'), '18.6')['chargeAdders'];
    expect(adder).toEqual([{ liquidOdIn: 0.25, ozPerFt: expect.closeTo(18.6 / 93.0102, 5) as number }]);
    // $24.25 per kg × 0.45359237 kg/lb = $10.9996 per lb → 1100 cents (whole cents are stored)
    expect(writeCell(metricOf('refrigerants', 'cost_usd_per_lb'), '24.25')).toEqual({ costCentsPerLb: 1100 });
    // $2.65 per 100 g × 28.349523125 g/oz ÷ 100 = $0.7513/oz → 75 whole cents [PUB: 1 oz = 28.349523125 g]
    expect(writeCell(metricOf('refrigerants', 'cost_usd_per_oz'), '2.65')).toEqual({ costCentsPerOz: 75 });
  });

  it('write the stored imperial values as metric cells at the column precision', () => {
    expect(metricOf('kits', 'length_ft').read({ lengthFt: 25 })).toBe('7.62'); // 25 × 0.3048
    expect(metricOf('models', 'height_in').read({ heightIn: 12 })).toBe('305'); // 12 × 25.4 = 304.8 → mm
    expect(metricOf('models', 'weight_lb').read({ weightLb: 100 })).toBe('45.36'); // 100 × 0.45359237
    expect(metricOf('refrigerants', 'cost_usd_per_lb').read({ costCentsPerLb: 1100 })).toBe('24.25'); // 11 ÷ 0.45359237
    expect(metricOf('refrigerants', 'cost_usd_per_oz').read({ costCentsPerOz: 75 })).toBe('2.65'); // 0.75 ÷ 0.28349523125 = 2.6455
    expect(metricOf('models', 'weight_lb').read({})).toBe('');
  });

  it('capacities, tube sizes and money without a unit keep their columns', () => {
    for (const name of ['cooling_btuh_95f', 'nominal_cooling_btuh', 'liquid_in', 'cost_usd'])
      expect(metricVariant(col('models', name))).toBeNull();
  });

  it('metric cell → imperial record → metric cell returns the same cell (property)', () => {
    const cases: Array<[keyof typeof DATASETS, string, number, number]> = [
      ['models', 'max_line_ft', 3, 91],
      ['models', 'factory_charge_oz', 0, 28000],
      ['models', 'adder_oz_per_ft_liquid_3_8', 2, 270],
      ['models', 'weight_lb', 2, 450],
      ['models', 'depth_in', 0, 3000],
      ['kits', 'length_ft', 3, 60],
    ];
    for (const [dataset, name, decimals, max] of cases) {
      const m = metricOf(dataset, name);
      fc.assert(
        fc.property(fc.integer({ min: 1, max: max * 10 ** decimals }), (units) => {
          const cell = String(units / 10 ** decimals);
          const record = writeCell(m, cell);
          expect(m.read(record)).toBe(cell);
        }),
      );
    }
  });

  const kits = DATASETS.kits;
  const held = new Map([
    [
      'LS-25',
      {
        key: 'LS-25',
        description: 'Line set 25 ft',
        kind: 'line-set',
        lengthFt: 25,
        liquidOdIn: 0.25,
        suctionOdIn: 0.375,
        components: [],
        category: 'line-sets',
        costCents: 6500,
        active: true,
      },
    ],
  ]);
  const metricHeader = columnsForUnits(kits.columns, 'metric').map((c) => c.name);
  const row = ['LS-25', 'Line set 25 ft', 'line-set', '7.62', '1/4', '3/8', '', 'line-sets', '65.00', '', '', 'yes'];

  it('a metric company file in metric columns compares unchanged with the held imperial record', () => {
    expect(metricHeader).toContain('length_m');
    expect(metricHeader).not.toContain('length_ft');
    const d = diffImport({
      dataset: kits,
      header: metricHeader,
      rows: [{ line: 2, cells: row }],
      current: held,
      units: 'metric',
    });
    expect(d.fileErrors).toEqual([]);
    expect(d.rows.map((r) => r.status)).toEqual(['unchanged']);
  });

  it('a file giving both length_ft and length_m is refused as a whole', () => {
    const d = diffImport({
      dataset: kits,
      header: [...metricHeader, 'length_ft'],
      rows: [{ line: 2, cells: [...row, '30'] }],
      current: held,
      units: 'metric',
    });
    expect(d.fileErrors).toEqual([
      'The same value is given in both units: length_ft and length_m. Keep one column of each pair (metric or imperial).',
    ]);
    expect(d.rows).toEqual([]);
    expect(d.canApply).toBe(false);
  });

  it('an imperial company is told metric columns need the metric setting', () => {
    const d = diffImport({ dataset: kits, header: metricHeader, rows: [], current: held });
    expect(d.fileErrors.join(' ')).toMatch(/Metric columns are read only when the company uses metric/);
    expect(d.fileErrors.join(' ')).toMatch(/Missing columns: length_ft/);
  });

  it('a metric company may still send an imperial file', () => {
    const header = kits.columns.map((c) => c.name);
    const cells = [...row];
    cells[3] = '25';
    const d = diffImport({ dataset: kits, header, rows: [{ line: 2, cells }], current: held, units: 'metric' });
    expect(d.rows.map((r) => r.status)).toEqual(['unchanged']);
  });
});

describe('the materials takeoff_item column (issue 13)', () => {
  const ds = DATASETS.materials;
  const record = {
    key: 'WIRE-10-2',
    description: 'Branch circuit cable 10/2 with ground',
    unit: 'ft',
    category: 'electrical',
    costCents: 145,
    takeoffItem: 'wire:nm-b:10awg',
    active: true,
  };
  it('exports and re-imports the takeoff item, in both unit systems, and empty stays absent', () => {
    for (const units of ['imperial', 'metric'] as const) {
      const columns = columnsForUnits(ds.columns, units);
      expect(columns.map((c) => c.name)).toContain('takeoff_item');
      const read = { ...ds, columns };
      const cells = recordToCells(read, ds.schema.parse(record));
      expect(cells[columns.findIndex((c) => c.name === 'takeoff_item')]).toBe('wire:nm-b:10awg');
      const back = recordFromCells(read, Object.fromEntries(columns.map((c, i) => [c.name, cells[i] ?? ''])));
      expect(back).toEqual({ ok: true, record: ds.schema.parse(record) });
      const blank = recordFromCells(
        read,
        Object.fromEntries(columns.map((c, i) => [c.name, c.name === 'takeoff_item' ? '' : (cells[i] ?? '')])),
      );
      expect(blank.ok && 'takeoffItem' in blank.record).toBe(false);
    }
  });
  it('refuses a takeoff item that breaks the key rule, naming the column', () => {
    const cells = recordToCells(ds, ds.schema.parse(record));
    const named = Object.fromEntries(ds.columns.map((c, i) => [c.name, cells[i] ?? '']));
    expect(recordFromCells(ds, { ...named, takeoff_item: 'wire 10 awg' })).toEqual({
      ok: false,
      errors: [
        {
          column: 'takeoff_item',
          message: 'Takeoff item may use letters, digits, dots, dashes, slashes and colons only',
        },
      ],
    });
  });
});
