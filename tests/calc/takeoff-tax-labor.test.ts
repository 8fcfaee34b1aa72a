import { describe, expect, it } from 'vitest';
import { all, create } from 'mathjs';
import {
  categorySchema,
  computeDesign,
  designPriceBookFromCompany,
  explainLineTax,
  explainOptionPrice,
  laborTaskSchema,
  materialSchema,
  priceOption,
  pricingSchema,
  type PriceBook,
  type PricedLine,
} from '@calc';
import { design, priceBook, pricing, catalog, threeRoomHome } from './sample-data';

// Outside reference for the money: mathjs BigNumbers, rounded half-up to the cent (mathjs rounds half away
// from zero, the same for these non-negative amounts). Sales tax = rate × taxable base [definition of an ad
// valorem sales tax]; a discount on the whole price falls on every line alike, so the taxable base is the
// taxed lines' share of the discounted subtotal: base = taxed sell × subtotal ÷ sell.
const m = create(all ?? {}, { number: 'BigNumber', precision: 64 });
const cents = (expr: string, scope: Record<string, number>) =>
  Number(
    m
      .round(
        m.evaluate(expr, Object.fromEntries(Object.entries(scope).map(([k, v]) => [k, m.bignumber(v)]))) as ReturnType<
          typeof m.bignumber
        >,
      )
      .toString(),
  );

const line = (itemKey: string, category: PricedLine['category'], c: number): PricedLine => ({
  itemKey,
  description: itemKey,
  quantity: 1,
  unit: 'each',
  category,
  derivation: 'test',
  unitCostCents: c,
  extendedCostCents: c,
});

/** A price book with a taxable and a non-taxable category, as designPriceBookFromCompany makes it. */
const book: PriceBook = {
  items: {
    'equipment:od': { unitCostCents: 0, categoryName: 'Equipment', taxable: true },
    permit: { unitCostCents: 0, categoryName: 'Permits and fees', taxable: false },
    sleeve: { unitCostCents: 0, categoryName: 'Install materials', taxable: true },
    'labor:set': { unitCostCents: 0, categoryName: 'Labor', taxable: false },
  },
  laborRateCents: 6200,
};
const lines = [
  line('equipment:od', 'equipment', 212_345),
  line('permit', 'material', 15_000),
  line('sleeve', 'material', 1_999),
  line('labor:set', 'labor', 18_601),
  line('no-category', 'material', 777),
];

describe("the price book's taxable flag per line (issue 13)", () => {
  it("line by line, tax on the whole price: the non-taxable categories' lines stay out of the base", () => {
    const p = pricingSchema.parse({
      method: 'margin',
      percent: 40,
      sellRulesBy: 'line',
      taxOn: 'total',
      taxRatePercent: 7.25,
      discounts: [{ label: 'Offer', kind: 'amount', value: 20_000 }],
    });
    const price = priceOption({ lines, pricing: p, priceBook: book });
    const sell = (k: string) => price.lineSells.find((l) => l.itemKey === k);
    expect(price.lineSells.map((l) => [l.itemKey, l.taxed])).toEqual([
      ['equipment:od', true],
      ['permit', false],
      ['sleeve', true],
      ['labor:set', false],
      ['no-category', true], // no category in the book: taxable, as the rule says
    ]);
    const taxedSell =
      (sell('equipment:od')?.sellCents ?? 0) + (sell('sleeve')?.sellCents ?? 0) + (sell('no-category')?.sellCents ?? 0);
    const base = cents('t * s / p', { t: taxedSell, s: price.subtotalCents, p: price.sellCents });
    expect(price.taxableCents).toBe(base);
    expect(price.taxCents).toBe(cents('b * r / 100', { b: base, r: 7.25 }));
    expect(price.totalCents).toBe(price.subtotalCents + price.taxCents);
  });

  it('one rule for the option, tax on equipment and materials: a non-taxable material is its share of the goods sell', () => {
    const p = pricingSchema.parse({ method: 'markup', percent: 50, taxOn: 'materials', taxRatePercent: 6 });
    const price = priceOption({ lines, pricing: p, priceBook: book });
    const goodsCost = 212_345 + 15_000 + 1_999 + 777;
    // One markup on all goods: each goods line's sell is its cost share of the goods sell.
    const taxedGoodsSell = cents('g * (c - 15000) / c', { g: price.goodsSellCents, c: goodsCost });
    expect(price.taxableCents).toBe(
      cents('t * s / p', { t: taxedGoodsSell, s: price.subtotalCents, p: price.sellCents }),
    );
    expect(price.taxCents).toBe(cents('b * 6 / 100', { b: price.taxableCents }));
  });

  it('we pay the tax on our cost: only the taxable categories’ cost carries it', () => {
    const p = pricingSchema.parse({ method: 'margin', percent: 30, taxOn: 'materials-cost', taxRatePercent: 8 });
    const price = priceOption({ lines, pricing: p, priceBook: book });
    expect(price.contractorTaxCents).toBe(cents('(212345 + 1999 + 777) * 8 / 100', {}));
    expect(price.taxCents).toBe(0);
  });

  it('every category taxable: the same figures as before the flag (tax on the whole price = the subtotal)', () => {
    const open: PriceBook = { items: {}, laborRateCents: 6200 };
    const p = pricingSchema.parse({
      method: 'margin',
      percent: 40,
      sellRulesBy: 'line',
      taxOn: 'total',
      taxRatePercent: 5,
      discounts: [{ label: 'Offer', kind: 'percent', value: 7 }],
    });
    const price = priceOption({ lines, pricing: p, priceBook: open });
    expect(price.taxableCents).toBe(price.subtotalCents);
  });

  it('each line says why it is or is not taxed, and the tax names the categories left out', () => {
    const p = pricingSchema.parse({
      method: 'margin',
      percent: 40,
      sellRulesBy: 'line',
      taxOn: 'total',
      taxRatePercent: 7.25,
    });
    const price = priceOption({ lines, pricing: p, priceBook: book });
    const why = (k: string) => {
      const l = price.lineSells.find((x) => x.itemKey === k);
      if (!l) throw new Error(k);
      return explainLineTax({ line: l, taxOn: p.taxOn });
    };
    expect(why('labor:set').text).toContain('its price-book category "Labor" is not taxable');
    expect(why('labor:set').valueText).toBe('Not taxed');
    expect(why('sleeve').text).toContain('its category "Install materials" is taxable');
    expect(why('no-category').text).toContain('gives this item no category');
    const onlyMaterials = pricingSchema.parse({ ...p, taxOn: 'materials-only' });
    const equipment = priceOption({ lines, pricing: onlyMaterials, priceBook: book }).lineSells[0];
    if (!equipment) throw new Error('no line');
    expect(explainLineTax({ line: equipment, taxOn: 'materials-only' }).text).toContain('leaves equipment lines out');
    const tax = explainOptionPrice({ price, pricing: p }).find((e) => e.key === 'price:tax');
    expect(tax?.text).toContain('lines of "Permits and fees", "Labor" are left out');
  });

  it("the company's rows give each item its category and flag", () => {
    const b = designPriceBookFromCompany({
      models: [],
      materials: [
        materialSchema.parse({
          key: 'PERMIT',
          description: 'Permit fee',
          unit: 'each',
          category: 'fees',
          costCents: 9000,
          takeoffItem: 'permit',
        }),
      ],
      categories: [
        categorySchema.parse({ key: 'fees', name: 'Fees', sellRule: { method: 'markup', percent: 0 }, taxable: false }),
      ],
    });
    expect(b.items['permit']).toMatchObject({ categoryName: 'Fees', taxable: false });
  });
});

describe("labor from the price book's tasks, line by line (issue 13)", () => {
  const task = (key: string, hoursPerUnit: number, rate: number, description: string) =>
    laborTaskSchema.parse({ key, description, unit: 'each', hoursPerUnit, rateCentsPerHour: rate, category: 'labor' });
  const tasks = [
    task('mount-wall-head', 2, 7000, 'Hang a wall unit'),
    task('line-set-run', 0.03, 6500, 'Line set by the foot'),
    task('line-set-base', 1, 6500, 'Flare both ends'),
  ];
  const company = designPriceBookFromCompany({ models: [], labor: tasks });

  it("the book's hours replace the default table's entries it has a task for", () => {
    expect(company.labor?.hours).toEqual({ mountWallHead: 2, lineSetPerFt: 0.03, lineSetBase: 1 });
    expect(company.items['labor:mount-indoor:wall-head']?.unitCostCents).toBe(7000);
  });

  it('the takeoff counts those hours, names the task, and prices the line at its rate', () => {
    const r = computeDesign({
      home: threeRoomHome,
      design,
      catalog,
      priceBook: {
        ...priceBook,
        items: { ...priceBook.items, ...company.items },
        labor: company.labor,
      },
      pricing,
    });
    const get = (k: string) => r.takeoff.find((l) => l.itemKey === k);
    // Two wall heads (sample design) × the task's 2 h each.
    expect(get('labor:mount-indoor:wall-head')?.quantity).toBe(4);
    expect(get('labor:mount-indoor:wall-head')?.derivation).toContain('price-book task "Hang a wall unit"');
    expect(get('labor:mount-indoor:wall-head')?.extendedCostCents).toBe(4 * 7000);
    // Runs of 40 and 20 ft: (1 h + 40 × 0.03 h) + (1 h + 20 × 0.03 h) = 2.2 + 1.6 = 3.8 h.
    expect(get('labor:run-line-set')?.quantity).toBe(3.8);
    expect(get('labor:run-line-set')?.derivation).toContain('"Flare both ends" and "Line set by the foot"');
    // An entry with no task keeps the default table and says so.
    expect(get('labor:pressure-test-evacuate')?.derivation).toContain('default labor table');
  });

  it('each kind of indoor unit is its own mounting line (a cassette is not counted as a wall head)', () => {
    const book2 = designPriceBookFromCompany({
      models: [],
      labor: [task('mount-wall-head', 1.5, 6200, 'Wall unit'), task('mount-cassette', 3, 6200, 'Cassette')],
    });
    expect(book2.items['labor:mount-indoor:ceiling-cassette']?.description).toBe('Cassette');
    expect(book2.labor?.hours).toMatchObject({ mountWallHead: 1.5, mountCassette: 3 });
  });
});
