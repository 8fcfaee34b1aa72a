import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  checkDiscount,
  explainMonthlyPayment,
  explainOptionPrice,
  explainSellRule,
  marginFromMarkup,
  markupFromMargin,
  monthlyPaymentCents,
  preliminaryPriceRange,
  priceFromMarginCents,
  priceFromMarkupCents,
  priceOption,
  pricingSchema,
  type PricedLine,
} from '@calc';
import { m, pricedLine } from './price-fixtures';

// Outside reference: mathjs with 64-digit BigNumbers evaluating the standard annuity formula
// A = P·r / (1 − (1 + r)^−n), r = APR/12 [PUB: standard annuity (amortised loan) formula].
function annuityCents(principalCents: number, apr: number, months: number): number {
  if (apr === 0) return Number(m.evaluate(`round(${principalCents} / ${months})`).toString());
  const a = m.evaluate(`p * r / (1 - (1 + r)^(-n))`, {
    p: m.bignumber(principalCents),
    r: m.divide(m.bignumber(apr), m.bignumber(1200)),
    n: m.bignumber(months),
  });
  return Number(m.round(a).toString());
}

const line = (category: PricedLine['category'], cents: number) => pricedLine(`x:${category}`, category, cents);

describe('monthly payment against mathjs (to the cent)', () => {
  it('the demo plans: 60 months at 7.99 % and 120 at 9.99 % on $12,345.67', () => {
    for (const [apr, n] of [
      [7.99, 60],
      [9.99, 120],
      [0, 12],
    ] as const)
      expect(monthlyPaymentCents({ principalCents: 1234567, aprPercent: apr, months: n })).toBe(
        annuityCents(1234567, apr, n),
      );
  });
  it('any principal, APR and term', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 20_000_000 }),
        fc.integer({ min: 0, max: 4000 }).map((x) => x / 100),
        fc.integer({ min: 1, max: 240 }),
        (p, apr, n) => {
          // binary floating point can land a half-cent the other way only at an exact .5 cent; allow ±1 there
          expect(
            Math.abs(monthlyPaymentCents({ principalCents: p, aprPercent: apr, months: n }) - annuityCents(p, apr, n)),
          ).toBeLessThanOrEqual(1);
        },
      ),
      { numRuns: 300 },
    );
  });
  it('explains the formula with the inputs and the result', () => {
    const e = explainMonthlyPayment({
      key: 'k',
      planName: '60 months',
      principalCents: 900000,
      aprPercent: 7.99,
      months: 60,
    });
    expect(e.value).toBe(annuityCents(900000, 7.99, 60));
    // r = 7.99 / 12 = 0.665833… % → "0.6658 %"
    expect(e.text).toBe(
      `$9,000.00 × 0.6658 % ÷ (1 − (1 + 0.6658 %)^−60) = $${(e.value / 100).toFixed(2)} a month for 60 months at 7.99 % APR`,
    );
  });
});

describe('margin vs markup [PUB: markup = (P − C)/C, margin = (P − C)/P]', () => {
  it('round trip: the price from a margin equals the price from its markup, within a cent', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 10_000_000 }),
        fc.integer({ min: 0, max: 9500 }).map((x) => x / 100),
        (cost, g) => {
          const viaMargin = priceFromMarginCents({ costCents: cost, marginPercent: g });
          const viaMarkup = priceFromMarkupCents({ costCents: cost, markupPercent: markupFromMargin(g) });
          expect(Math.abs(viaMargin - viaMarkup)).toBeLessThanOrEqual(1);
          expect(marginFromMarkup(markupFromMargin(g))).toBeCloseTo(g, 9);
        },
      ),
    );
  });
  it('40 % margin is a 66.67 % markup (0.4 / 0.6), 50 % markup a 33.33 % margin (0.5 / 1.5)', () => {
    expect(explainSellRule({ method: 'margin', percent: 40 })).toContain('markup 66.67 %');
    expect(explainSellRule({ method: 'markup', percent: 50 })).toContain('margin 33.33 %');
  });
});

describe('tax by rule (hand-worked)', () => {
  const lines = [line('equipment', 300000), line('material', 100000), line('labor', 100000)];
  const base = { method: 'markup', percent: 50, taxRatePercent: 8 } as const;
  it('materials only, at sell: materials get their cost share of the goods sell', () => {
    const p = priceOption({ lines, pricing: pricingSchema.parse({ ...base, taxOn: 'materials-only' }) });
    // goods sell 400,000 × 1.5 = 600,000; materials share 600,000 × 100,000 / 400,000 = 150,000
    // no discount → taxable 150,000 × 750,000 / 750,000 = 150,000; 8 % = 12,000
    expect(p.taxableCents).toBe(150000);
    expect(p.taxCents).toBe(12000);
    expect(p.totalCents).toBe(762000);
  });
  it('on our cost of materials: the contractor pays it, it is a cost, the customer sees no tax', () => {
    const p = priceOption({ lines, pricing: pricingSchema.parse({ ...base, taxOn: 'materials-cost' }) });
    // 8 % of (300,000 + 100,000) cost = 32,000, added to cost 500,000 → 532,000
    expect(p.taxCents).toBe(0);
    expect(p.contractorTaxCents).toBe(32000);
    expect(p.costCents).toBe(532000);
    expect(p.totalCents).toBe(750000);
    // gross margin (750,000 − 532,000) / 750,000 = 29.0666… % → 29.07
    expect(p.grossMarginPercent).toBe(29.07);
  });
});

describe('discount against the per-role limit (company policy)', () => {
  const limits = [
    { key: 'owner', maxPercent: 25 },
    { key: 'estimator', maxPercent: 15 },
    { key: 'salesperson', maxPercent: 10 },
  ] as const;
  it('exactly at the limit is allowed; a cent beyond it is not', () => {
    // 10 % of $1,000.00 = $100.00
    expect(checkDiscount({ role: 'salesperson', discountCents: 10000, sellCents: 100000, limits }).withinLimit).toBe(
      true,
    );
    const over = checkDiscount({ role: 'salesperson', discountCents: 10001, sellCents: 100000, limits });
    expect(over.withinLimit).toBe(false);
    expect(over.needsOwnerApproval).toBe(true);
    expect(over.explanation.status).toBe('blocker');
    expect(over.explanation.text).toBe('$100.01 off $1,000.00 = 10 % of the sell price; limit for a salesperson 10 %');
  });
  it('a role with no row may give nothing; the owner is never sent for approval', () => {
    expect(checkDiscount({ role: 'installer', discountCents: 1, sellCents: 100000, limits }).withinLimit).toBe(false);
    expect(checkDiscount({ role: 'owner', discountCents: 90000, sellCents: 100000, limits }).needsOwnerApproval).toBe(
      false,
    );
  });
});

describe('preliminary range', () => {
  it('5 % under the short-run total, 10 % over the long-run total, outward to $100 (method in calc/README)', () => {
    // 1,250,000 × 0.95 = 1,187,500 → down to 1,180,000; 1,260,000 × 1.10 = 1,386,000 → up to 1,390,000
    const r = preliminaryPriceRange({ lowTotalCents: 1250000, highTotalCents: 1260000 });
    expect([r.lowCents, r.highCents]).toEqual([1180000, 1390000]);
    expect(r.text).toBe("about $11,800 – $13,900, subject to the estimator's review");
    expect(r.preliminary).toBe(true);
  });
});

describe('option price explanations', () => {
  it('each term is its own arithmetic: subtotal = sell − discount, total = subtotal + tax, balance = total − deposit', () => {
    const pricing = pricingSchema.parse({
      method: 'margin',
      percent: 40,
      discounts: [{ label: 'Spring', kind: 'percent', value: 5 }],
      taxRatePercent: 7.25,
      deposit: { kind: 'percent', value: 30 },
    });
    const price = priceOption({
      lines: [line('equipment', 500000), line('material', 80000), line('labor', 120000)],
      pricing,
    });
    const ex = explainOptionPrice({
      price,
      pricing,
      plans: [{ key: 'p60', name: '60 months', aprPercent: 7.99, months: 60 }],
    });
    const get = (k: string) => ex.find((e) => e.key === k);
    // goods 580,000 / 0.6 = 966,666.67 → 966,667; labor 120,000 / 0.6 = 200,000; sell 1,166,667
    expect(get('price:sell')?.value).toBe(1166667);
    // 5 % = 58,333.35 → 58,333
    expect(get('price:discount')?.text).toBe('Spring 5 % = $583.33');
    expect(get('price:subtotal')?.text).toBe('$11,666.67 − $583.33 = $11,083.34');
    expect(get('price:monthly:p60')?.value).toBe(annuityCents(price.balanceCents, 7.99, 60));
    expect(get('price:gross-margin')?.value).toBe(1108334 - 700000);
    expect(new Set(ex.map((e) => e.key)).size).toBe(ex.length);
  });
});
