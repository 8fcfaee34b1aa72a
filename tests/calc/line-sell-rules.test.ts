import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  designPriceBookFromCompany,
  explainLineSell,
  priceBookSchema,
  priceOption,
  pricingSchema,
  refrigerantCostSchema,
  type PriceBook,
} from '@calc';
import { demoPriceBookRows, exactCents, pricedLine as line } from './price-fixtures';

// Outside reference: mathjs with 64-digit BigNumbers evaluating the definitions
//   markup = (P − C) / C  →  P = C × (1 + markup)
//   margin = (P − C) / P  →  P = C / (1 − margin)
// [PUB: the standard definitions of markup and gross margin, any managerial accounting text],
// each line rounded half-up to the cent, as the line-by-line rule says.
const sellCentsExact = (costCents: number, rule: { method: 'markup' | 'margin'; percent: number }): number =>
  exactCents(rule.method === 'markup' ? 'c * (1 + p / 100)' : 'c / (1 - p / 100)', { c: costCents, p: rule.percent });

const { categories, models, materials, labor, refrigerants } = demoPriceBookRows();

describe('price-book rules reach each item: own override → category → company default (issue 13)', () => {
  const withOverride = labor.map((t) =>
    t.key === 'charge-startup' ? { ...t, sellRule: { method: 'markup' as const, percent: 120 } } : t,
  );
  const book = priceBookSchema.parse(
    designPriceBookFromCompany({
      models,
      materials,
      labor: withOverride,
      refrigerants,
      categories,
    }),
  );
  const equipment = categories.find((c) => c.key === 'equipment');
  it("a model sells at its category's rule, named", () => {
    const item = book.items['equipment:TSL-S12H-O'];
    expect(item?.sellRule).toEqual(equipment?.sellRule);
    expect(item?.ruleSource).toBe('category');
    expect(item?.ruleFrom).toBe(equipment?.name);
  });
  it("an item's own rule wins over its category's", () => {
    const nut = materials.find((x) => x.key === 'NUT-14');
    expect(nut?.sellRule).toBeDefined();
    expect(book.items['NUT-14']?.sellRule).toEqual(nut?.sellRule);
    expect(book.items['NUT-14']?.ruleSource).toBe('item');
    expect(book.items['labor:charge-startup']?.sellRule).toEqual({ method: 'markup', percent: 120 });
    expect(book.items['labor:charge-startup']?.ruleSource).toBe('item');
  });
  it("refrigerant sells at its category's rule; an item with neither carries no rule: the company default applies", () => {
    const refrigerant = categories.find((c) => c.key === 'refrigerant');
    expect(book.items['refrigerant:R-32']).toMatchObject({ sellRule: refrigerant?.sellRule, ruleSource: 'category' });
    const bare = designPriceBookFromCompany({
      models: [],
      refrigerants: [refrigerantCostSchema.parse({ key: 'R-32', costCentsPerLb: 1100 })],
      categories,
    });
    expect(bare.items['refrigerant:R-32']?.sellRule).toBeUndefined();
    expect(bare.items['refrigerant:R-32']?.ruleSource).toBeUndefined();
  });
});

describe('line-by-line sell price [PUB: P = C(1 + markup), P = C / (1 − margin)], checked with mathjs', () => {
  const book: PriceBook = {
    items: {
      'equipment:od': {
        unitCostCents: 0,
        sellRule: { method: 'margin', percent: 35 },
        ruleSource: 'category',
        ruleFrom: 'Equipment',
      },
      nut: { unitCostCents: 0, sellRule: { method: 'markup', percent: 100 }, ruleSource: 'item', ruleFrom: 'Nut' },
      'labor:set': {
        unitCostCents: 0,
        sellRule: { method: 'margin', percent: 50 },
        ruleSource: 'category',
        ruleFrom: 'Labor',
      },
    },
    laborRateCents: 6200,
  };
  const companyDefault = { method: 'margin' as const, percent: 40 };
  const pricing = pricingSchema.parse({
    ...companyDefault,
    sellRulesBy: 'line',
    taxRatePercent: 7.25,
    taxOn: 'materials-only',
  });
  const lines = [
    line('equipment:od', 'equipment', 212_345),
    line('nut', 'material', 333),
    line('sleeve', 'material', 1_999),
    line('labor:set', 'labor', 18_601),
  ];
  const price = priceOption({ lines, pricing, priceBook: book });
  it('each line at its own rule, to the cent', () => {
    const expected = [
      sellCentsExact(212_345, { method: 'margin', percent: 35 }),
      sellCentsExact(333, { method: 'markup', percent: 100 }),
      sellCentsExact(1_999, companyDefault),
      sellCentsExact(18_601, { method: 'margin', percent: 50 }),
    ];
    expect(price.lineSells.map((l) => l.sellCents)).toEqual(expected);
    expect(price.lineSells.map((l) => l.source)).toEqual(['category', 'item', 'company', 'category']);
  });
  it('goods and labor sell are the sums of their lines; materials-only tax falls on the material lines', () => {
    const [eq = 0, nut = 0, sleeve = 0, lab = 0] = price.lineSells.map((l) => l.sellCents);
    expect(price.goodsSellCents).toBe(eq + nut + sleeve);
    expect(price.laborSellCents).toBe(lab);
    expect(price.sellCents).toBe(eq + nut + sleeve + lab);
    // no discount: the taxable amount is the material lines at sell, tax = taxable × 7.25 % half-up
    expect(price.taxableCents).toBe(nut + sleeve);
    expect(price.taxCents).toBe(exactCents('t * 0.0725', { t: nut + sleeve }));
  });
  it("each line's why names its rule and where the rule came from", () => {
    const [eq, nut, sleeve] = price.lineSells;
    if (!eq || !nut || !sleeve) throw new Error('three lines expected');
    expect(explainLineSell({ line: eq }).text).toContain('margin 35 % of the price');
    expect(explainLineSell({ line: eq }).text).toContain('category "Equipment"');
    expect(explainLineSell({ line: nut }).text).toContain("this item's own rule");
    expect(explainLineSell({ line: sleeve }).text).toContain("company's default rule");
    // 100 % markup = 50 % margin: m / (1 + m) = 1 / 2 [PUB: definitions above]
    expect(explainLineSell({ line: nut }).text).toContain('margin 50 % of the price');
  });
  it('an option with its own rule prices every line by it, as before (one rounding per group)', () => {
    const own = pricingSchema.parse({ method: 'markup', percent: 50 });
    const p = priceOption({ lines, pricing: own, priceBook: book });
    expect(p.sellRulesBy).toBe('option');
    expect(p.lineSells.every((l) => l.source === 'option')).toBe(true);
    expect(p.goodsSellCents).toBe(sellCentsExact(212_345 + 333 + 1_999, { method: 'markup', percent: 50 }));
    expect(p.laborSellCents).toBe(sellCentsExact(18_601, { method: 'markup', percent: 50 }));
  });
});

describe('properties: line-by-line sums to the cent, margin ↔ markup', () => {
  const rule = fc.oneof(
    fc.record({
      method: fc.constant('markup' as const),
      percent: fc.integer({ min: 0, max: 30000 }).map((x) => x / 100),
    }),
    fc.record({
      method: fc.constant('margin' as const),
      percent: fc.integer({ min: 0, max: 9500 }).map((x) => x / 100),
    }),
  );
  it('the option sell is exactly the sum of mathjs line sells, whatever the rules', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            cost: fc.integer({ min: 0, max: 5_000_000 }),
            category: fc.constantFrom('equipment' as const, 'material' as const, 'labor' as const),
            rule: fc.option(rule, { nil: undefined }),
          }),
          { minLength: 1, maxLength: 30 },
        ),
        rule,
        (specs, fallback) => {
          const items: PriceBook['items'] = {};
          const lines = specs.map((s, i) => {
            if (s.rule) items[`i${i}`] = { unitCostCents: s.cost, sellRule: s.rule, ruleSource: 'item' };
            return line(`i${i}`, s.category, s.cost);
          });
          const pricing = pricingSchema.parse({ ...fallback, sellRulesBy: 'line' });
          const p = priceOption({ lines, pricing, priceBook: { items, laborRateCents: 0 } });
          const expected = specs.map((s) => sellCentsExact(s.cost, s.rule ?? fallback));
          expect(p.lineSells.map((l) => l.sellCents)).toEqual(expected);
          expect(p.sellCents).toBe(expected.reduce((a, b) => a + b, 0));
          expect(p.goodsSellCents + p.laborSellCents).toBe(p.sellCents);
        },
      ),
    );
  });
  it('a line sold at markup m and the same line at margin m / (1 + m) agree within a cent', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 5_000_000 }), fc.integer({ min: 0, max: 30000 }), (cost, bp) => {
        const markup = bp / 100;
        const margin = (markup / (100 + markup)) * 100;
        const book = (r: { method: 'markup' | 'margin'; percent: number }): PriceBook => ({
          items: { x: { unitCostCents: cost, sellRule: r, ruleSource: 'item' } },
          laborRateCents: 0,
        });
        const pricing = pricingSchema.parse({ method: 'margin', percent: 0, sellRulesBy: 'line' });
        const a = priceOption({
          lines: [line('x', 'material', cost)],
          pricing,
          priceBook: book({ method: 'markup', percent: markup }),
        });
        const b = priceOption({
          lines: [line('x', 'material', cost)],
          pricing,
          priceBook: book({ method: 'margin', percent: margin }),
        });
        expect(Math.abs(a.sellCents - b.sellCents)).toBeLessThanOrEqual(1);
      }),
    );
  });
});
