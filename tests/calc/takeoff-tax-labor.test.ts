import { describe, expect, it } from 'vitest';
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
  refrigerantCostSchema,
  type PriceBook,
} from '@calc';
import { exactCents as cents, pricedLine as line } from './price-fixtures';
import { design, priceBook, pricing, catalog, threeRoomHome } from './sample-data';

// Outside reference for the money: mathjs BigNumbers, rounded half-up to the cent (mathjs rounds half away
// from zero, the same for these non-negative amounts). Sales tax = rate × taxable base [definition of an ad
// valorem sales tax]; a discount on the whole price falls on every line alike, so the taxable base is the
// taxed lines' share of the discounted subtotal: base = taxed sell × subtotal ÷ sell.

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

describe('refrigerant in the price book: its category, by the lb or the oz (issue 13)', () => {
  const refrigerants = [
    refrigerantCostSchema.parse({ key: 'R-32', costCentsPerOz: 75, category: 'gas' }),
    refrigerantCostSchema.parse({ key: 'R-454B', costCentsPerLb: 1900 }),
  ];
  const categories = [
    categorySchema.parse({
      key: 'gas',
      name: 'Refrigerant',
      sellRule: { method: 'markup', percent: 80 },
      taxable: false,
    }),
  ];
  const company = designPriceBookFromCompany({ models: [], refrigerants, categories });

  it('a row gives its cost per lb or per oz, never both or neither', () => {
    expect(refrigerantCostSchema.safeParse({ key: 'R-32' }).success).toBe(false);
    const both = refrigerantCostSchema.safeParse({ key: 'R-32', costCentsPerLb: 1100, costCentsPerOz: 70 });
    expect(both.success).toBe(false);
    expect(both.error?.issues[0]?.message).toBe('Give the cost either per lb or per oz (one of the two)');
  });

  it("the book's item is in the row's unit, at its category's rule and tax", () => {
    expect(company.items['refrigerant:R-32']).toMatchObject({
      unitCostCents: 75,
      soldBy: 'oz',
      sellRule: { method: 'markup', percent: 80 },
      ruleSource: 'category',
      categoryName: 'Refrigerant',
      taxable: false,
    });
    expect(company.items['refrigerant:R-454B']).toMatchObject({ unitCostCents: 1900, soldBy: 'lb' });
  });

  const withBook = (items: PriceBook['items']) =>
    computeDesign({ home: threeRoomHome, design, catalog, priceBook: { ...priceBook, items }, pricing });

  it('priced by the ounce: the extra charge is counted in oz at the per-oz cost', () => {
    const r = withBook({
      ...priceBook.items,
      'refrigerant:R-32': company.items['refrigerant:R-32'] ?? { unitCostCents: 0 },
    });
    const gas = r.takeoff.find((l) => l.itemKey === 'refrigerant:R-32');
    // The sample design's extra charge is 4.0 oz (design.test: (50 − 25) ft × 0.16 oz/ft); 4 oz × $0.75 = $3.00.
    expect(gas).toMatchObject({ quantity: 4, unit: 'oz', unitCostCents: 75, extendedCostCents: 300 });
    expect(gas?.derivation).toContain('priced by the ounce');
    // Its category is not taxable here: out of the base under the materials rule.
    expect(r.price.lineSells.find((l) => l.itemKey === 'refrigerant:R-32')?.taxed).toBe(false);
  });

  it('priced by the pound: 4 oz ÷ 16 oz/lb = 0.25 lb [1 lb = 16 oz]', () => {
    const gas = withBook(priceBook.items).takeoff.find((l) => l.itemKey === 'refrigerant:R-32');
    expect(gas).toMatchObject({ quantity: 0.25, unit: 'lb', unitCostCents: 1100, extendedCostCents: 275 });
  });

  it('a book without the refrigerant says "No price for" it and counts it at $0', () => {
    const items = { ...priceBook.items };
    delete items['refrigerant:R-32'];
    const r = withBook(items);
    expect(r.takeoff.find((l) => l.itemKey === 'refrigerant:R-32')?.extendedCostCents).toBe(0);
    expect(r.warnings).toContain(
      'No price for "R-32 refrigerant added on site" (refrigerant:R-32) in the price book; it is counted at $0.',
    );
  });
});
