import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  catalogModelSchema,
  chargeAdderOzPerFt,
  DATASET_IDS,
  DATASETS,
  metricVariant,
  hiddenFields,
  marginFromMarkup,
  marginPercentOf,
  markupFromMargin,
  markupPercentOf,
  modelCapacityAt,
  recordFromCells,
  recordToCells,
  resolveSellRule,
  sellPriceCents,
  sellRuleSchema,
  visibleColumns,
  type CatalogModelInput,
} from '@calc';
import { demoCompanyData } from '../../fixtures/demo-company-data';

const wall9k: CatalogModelInput = {
  key: 'T-9',
  name: 'Test 9k single-zone outdoor',
  kind: 'outdoor-single-zone',
  heatPump: true,
  variableSpeed: true,
  nominalCoolingBtuh: 9000,
  minCoolingBtuh: 3000,
  maxCoolingBtuh: 11000,
  coolingPoints: [
    { outdoorF: 82, btuh: 9500 },
    { outdoorF: 95, btuh: 9000 },
  ],
  heatingPoints: [
    { outdoorF: 47, btuh: 12000 },
    { outdoorF: 17, btuh: 9000 },
    { outdoorF: 5, btuh: 7200 },
  ],
  refrigerant: 'R-32',
  factoryChargeOz: 30,
  prechargedLengthFt: 25,
  chargeAdders: [{ liquidOdIn: 0.25, ozPerFt: 0.2 }],
  maxLineFt: 65,
  maxLiftFt: 33,
  mcaA: 10,
  mocpA: 15,
  costCents: 120000,
};

const issues = (input: unknown) => {
  const r = catalogModelSchema.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
};

describe('sell rules (markup vs margin)', () => {
  // Definitions [PUB: standard markup and gross-margin definitions]: margin = (price − cost) / price,
  // markup = (price − cost) / cost. So price = cost / (1 − margin) and price = cost × (1 + markup).
  it('a 40 % margin on a $600.00 cost sells at $1,000.00, and (1000 − 600) / 1000 = 40 %', () => {
    const price = sellPriceCents({ costCents: 60000, rule: { method: 'margin', percent: 40 } });
    expect(price).toBe(100000);
    expect(marginPercentOf({ costCents: 60000, priceCents: price })).toBe(40);
  });
  it('a 40 % markup on a $600.00 cost sells at $840.00, and (840 − 600) / 600 = 40 %', () => {
    const price = sellPriceCents({ costCents: 60000, rule: { method: 'markup', percent: 40 } });
    expect(price).toBe(84000);
    expect(markupPercentOf({ costCents: 60000, priceCents: price })).toBe(40);
  });
  it('a 50 % margin is a 100 % markup and a 25 % markup is a 20 % margin (g = m/(1+m), m = g/(1−g))', () => {
    expect(markupFromMargin(50)).toBeCloseTo(100, 10);
    expect(marginFromMarkup(25)).toBeCloseTo(20, 10);
  });
  it('property: pricing by margin g and by the equivalent markup g/(1−g) agree to the cent', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.double({ min: 0, max: 90, noNaN: true }), (cost, g) => {
        const byMargin = sellPriceCents({ costCents: cost, rule: { method: 'margin', percent: g } });
        const byMarkup = sellPriceCents({ costCents: cost, rule: { method: 'markup', percent: markupFromMargin(g) } });
        expect(Math.abs(byMargin - byMarkup)).toBeLessThanOrEqual(1);
        expect(byMargin).toBeGreaterThanOrEqual(cost);
      }),
    );
  });
  it('a margin of 100 % or more is refused; a markup above 100 % is fine', () => {
    const r = sellRuleSchema.safeParse({ method: 'margin', percent: 100 });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toBe('A margin must be below 100 %');
    expect(sellRuleSchema.safeParse({ method: 'markup', percent: 150 }).success).toBe(true);
  });
  it('the item override wins over the category, the category over the company default', () => {
    const item = { method: 'markup', percent: 100 } as const;
    const category = { method: 'margin', percent: 45 } as const;
    const companyDefault = { method: 'margin', percent: 40 } as const;
    expect(resolveSellRule({ item, category, companyDefault })).toEqual({ rule: item, source: 'item' });
    expect(resolveSellRule({ category, companyDefault })).toEqual({ rule: category, source: 'category' });
    expect(resolveSellRule({ companyDefault })).toEqual({ rule: companyDefault, source: 'company' });
  });
});

describe('catalog model schema', () => {
  it('accepts a complete single-zone heat pump', () => {
    expect(issues(wall9k)).toEqual([]);
  });
  it('a 9,000 Btu/h unit cannot list 90,000 Btu/h at 95 °F', () => {
    const bad = { ...wall9k, coolingPoints: [{ outdoorF: 95, btuh: 90000 }] };
    expect(issues(bad)).toContainEqual({
      path: 'coolingPoints.0.btuh',
      message: '90000 Btu/h at 95 °F is not plausible for a 9000 Btu/h unit (expected 2250–14400)',
    });
  });
  it('minimum ≤ nominal ≤ maximum', () => {
    expect(issues({ ...wall9k, minCoolingBtuh: 9500, maxCoolingBtuh: 8000 })).toEqual([
      { path: 'minCoolingBtuh', message: 'Minimum cooling must not exceed the nominal 9000 Btu/h' },
      { path: 'maxCoolingBtuh', message: 'Maximum cooling must be at least the nominal 9000 Btu/h' },
    ]);
  });
  it('outdoor units need their refrigerant and line data; a heat pump needs heating points', () => {
    const { refrigerant: _r, maxLineFt: _m, ...rest } = wall9k;
    expect(issues({ ...rest, heatingPoints: [] })).toEqual([
      { path: 'refrigerant', message: 'Choose the refrigerant' },
      { path: 'maxLineFt', message: 'Enter the maximum line length' },
      { path: 'heatingPoints', message: 'A heat pump needs heating capacity points' },
    ]);
  });
  it('a multi-zone unit lists the accepted sizes for each port', () => {
    const multi = {
      ...wall9k,
      kind: 'outdoor-multi-zone',
      ports: 3,
      connectedMinPercent: 50,
      connectedMaxPercent: 130,
      portSizesBtuh: [[9000, 12000]],
    };
    expect(issues(multi)).toEqual([
      { path: 'portSizesBtuh', message: 'List the accepted sizes for each of the 3 ports' },
    ]);
  });
  it('MCA above MOCP, points off the rating temperatures and repeated adders are refused', () => {
    const bad = {
      ...wall9k,
      mcaA: 20,
      coolingPoints: [{ outdoorF: 90, btuh: 9000 }],
      chargeAdders: [
        { liquidOdIn: 0.25, ozPerFt: 0.2 },
        { liquidOdIn: 0.25, ozPerFt: 0.3 },
      ],
    };
    expect(issues(bad).map((i) => i.path)).toEqual(['coolingPoints.0.outdoorF', 'mocpA', 'chargeAdders.1.liquidOdIn']);
  });
});

describe('catalog queries for the estimator', () => {
  const model = catalogModelSchema.parse(wall9k);
  it('heating at 10 °F interpolates linearly between the 17 °F and 5 °F points', () => {
    // Linear interpolation of the maker's expanded data [PUB (secondary): Manual S practice]:
    // 7200 + (10 − 5) / (17 − 5) × (9000 − 7200) = 7950 Btu/h.
    expect(modelCapacityAt({ model, mode: 'heating', outdoorF: 10 })).toMatchObject({
      btuh: 7950,
      extrapolated: false,
    });
  });
  it('outside the rated points the nearest segment is extended and flagged; no points → null', () => {
    // linear extrapolation along 5 → 17 °F: 7200 + (−5 − 5) × (9000 − 7200) / 12 = 5700 Btu/h (issue 9: no longer held flat)
    expect(modelCapacityAt({ model, mode: 'heating', outdoorF: -5 })).toMatchObject({ btuh: 5700, extrapolated: true });
    expect(modelCapacityAt({ model: { ...model, heatingPoints: [] }, mode: 'heating', outdoorF: 17 })).toBeNull();
  });
  it('the charge adder is looked up by liquid-line size', () => {
    expect(chargeAdderOzPerFt({ model, liquidOdIn: 0.25 })).toBe(0.2);
    expect(chargeAdderOzPerFt({ model, liquidOdIn: 0.375 })).toBeNull();
  });
});

describe('demo company data', () => {
  const data = demoCompanyData();
  it('every demo record passes its table schema and round-trips through the CSV cells', () => {
    for (const id of DATASET_IDS) {
      const ds = DATASETS[id];
      for (const raw of data[id]) {
        const parsed = ds.schema.safeParse(raw);
        expect(parsed.success, `${id} ${String(raw['key'])}: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
        if (!parsed.success) continue;
        const cells = recordToCells(ds, parsed.data);
        const named = Object.fromEntries(ds.columns.map((c, i) => [c.name, cells[i] ?? '']));
        const back = recordFromCells(ds, named);
        expect(back.ok).toBe(true);
        if (back.ok) expect(recordToCells(ds, back.record)).toEqual(cells);
      }
    }
  });
  it('the catalog has at least 25 models covering every kind and indoor type', () => {
    const models = data.models.map((m) => catalogModelSchema.parse(m));
    expect(models.length).toBeGreaterThanOrEqual(25);
    expect(new Set(models.map((m) => m.kind)).size).toBe(5);
    expect(new Set(models.filter((m) => m.kind === 'indoor').map((m) => m.indoorType)).size).toBe(5);
    expect(models.some((m) => !m.active)).toBe(true);
  });
});

describe('who sees what', () => {
  it('salespeople lose cost and sell rules, installers also the list price; office sees all', () => {
    expect(hiddenFields(DATASETS.models, 'owner')).toEqual([]);
    expect(hiddenFields(DATASETS.models, 'salesperson')).toEqual(['costCents', 'sellRule']);
    expect(hiddenFields(DATASETS.models, 'installer')).toEqual(['costCents', 'sellRule', 'listCents']);
    // Issue 13: a model's and a labor task's own sell rule is the office's, like a material's.
    for (const d of [DATASETS.models, DATASETS.labor]) {
      const sales = visibleColumns(d, 'salesperson').map((c) => c.name);
      expect(sales).not.toContain('sell_method');
      expect(sales).not.toContain('sell_percent');
      expect(visibleColumns(d, 'owner').map((c) => c.name)).toContain('sell_percent');
    }
    const names = visibleColumns(DATASETS.materials, 'installer').map((c) => c.name);
    expect(names).not.toContain('cost_usd');
    expect(names).not.toContain('sell_method');
    expect(names).not.toContain('sell_percent');
    expect(names).toContain('description');
  });
});

describe('published column list', () => {
  it('README.md lists every CSV column of every table', async () => {
    const { readFileSync } = await import('node:fs');
    const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
    for (const id of DATASET_IDS)
      for (const c of DATASETS[id].columns) expect(readme, `${id}.${c.name}`).toContain(`| \`${c.name}\` |`);
  });

  it('README.md lists the metric variant of every unit-bearing column', async () => {
    const { readFileSync } = await import('node:fs');
    const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
    for (const id of DATASET_IDS)
      for (const c of DATASETS[id].columns) {
        const m = metricVariant(c);
        if (m) expect(readme, `${id}.${m.name}`).toContain(`| \`${c.name}\` | \`${m.name}\` |`);
      }
  });
});
