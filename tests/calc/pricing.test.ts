import { describe, it, expect } from 'vitest';
import {
  priceFromMarginCents,
  priceFromMarkupCents,
  monthlyPaymentCents,
  roundHalfUp,
  roundCentsHalfUp,
  priceOption,
  pricingSchema,
  compareOptions,
  CALC_ERROR_MESSAGES,
  type PricedLine,
} from '@calc';
import { pricedLine } from './price-fixtures';

const line = (category: PricedLine['category'], cents: number) => pricedLine(`x:${category}:${cents}`, category, cents);

describe('money helpers (integer cents, half-up)', () => {
  it('roundHalfUp rounds .5 up, including binary near-misses (1.005 → 1.01)', () => {
    expect(roundHalfUp(2.5)).toBe(3);
    expect(roundHalfUp(1.005, 2)).toBe(1.01);
    expect(roundCentsHalfUp(1234.5)).toBe(1235);
    expect(roundHalfUp(-2.5)).toBe(-3);
  });
  it('margin 40 % on $1,000.00 → $1,666.67; markup 40 % → $1,400.00', () => {
    // arithmetic: 100000 / 0.6 = 166666.67 → 166667
    expect(priceFromMarginCents({ costCents: 100000, marginPercent: 40 })).toBe(166667);
    expect(priceFromMarkupCents({ costCents: 100000, markupPercent: 40 })).toBe(140000);
  });
  it('margin of 100 % or more and fractional cents are errors', () => {
    expect(() => priceFromMarginCents({ costCents: 100, marginPercent: 100 })).toThrow(
      CALC_ERROR_MESSAGES.MARGIN_TOO_HIGH,
    );
    expect(() => priceFromMarkupCents({ costCents: 10.5, markupPercent: 10 })).toThrow(CALC_ERROR_MESSAGES.NOT_INTEGER);
  });
  it('monthly payment: $10,000 at 6 % for 60 months = $193.33; 0 % divides evenly', () => {
    // [PUB: standard annuity formula] 1,000,000 × 0.005 / (1 − 1.005^−60) = 19,332.80 → 19,333
    expect(monthlyPaymentCents({ principalCents: 1000000, aprPercent: 6, months: 60 })).toBe(19333);
    expect(monthlyPaymentCents({ principalCents: 1000000, aprPercent: 0, months: 48 })).toBe(20833);
    expect(() => monthlyPaymentCents({ principalCents: 1000, aprPercent: 5, months: 0 })).toThrow(
      CALC_ERROR_MESSAGES.NOT_POSITIVE,
    );
  });
});

describe('option price roll-up', () => {
  const lines = [line('equipment', 300000), line('material', 50000), line('labor', 95000)];
  it('margin, percent + amount discounts, tax on goods share, deposit, financing — each step hand-checked', () => {
    const pricing = pricingSchema.parse({
      method: 'margin',
      percent: 40,
      discounts: [
        { label: 'Ten off', kind: 'percent', value: 10 },
        { label: 'Coupon', kind: 'amount', value: 10000 },
      ],
      taxRatePercent: 6,
      taxOn: 'materials',
      deposit: { kind: 'percent', value: 30 },
      financing: { aprPercent: 0, months: 12 },
    });
    const p = priceOption({ lines, pricing });
    // goods cost 350,000 / 0.6 = 583,333.33 → 583,333; labor 95,000 / 0.6 = 158,333.33 → 158,333
    expect(p.goodsSellCents).toBe(583333);
    expect(p.laborSellCents).toBe(158333);
    expect(p.sellCents).toBe(741666);
    // 10 % of 741,666 = 74,166.6 → 74,167; + 10,000 = 84,167
    expect(p.discountCents).toBe(84167);
    expect(p.subtotalCents).toBe(657499);
    // taxable goods share: 583,333 × 657,499 / 741,666 = 517,134.21 → 517,134; tax 6 % = 31,028.04 → 31,028
    expect(p.taxableCents).toBe(517134);
    expect(p.taxCents).toBe(31028);
    expect(p.totalCents).toBe(688527);
    // deposit 30 % = 206,558.1 → 206,558; balance 481,969; 0 % over 12 = 40,164.08 → 40,164
    expect(p.depositCents).toBe(206558);
    expect(p.balanceCents).toBe(481969);
    expect(p.monthlyPaymentCents).toBe(40164);
    expect(p.costCents).toBe(445000);
  });
  it('tax on the total and markup', () => {
    const p = priceOption({
      lines,
      pricing: pricingSchema.parse({ method: 'markup', percent: 50, taxRatePercent: 5, taxOn: 'total' }),
    });
    // 350,000 × 1.5 = 525,000; 95,000 × 1.5 = 142,500; total base 667,500; tax 33,375
    expect(p.subtotalCents).toBe(667500);
    expect(p.taxCents).toBe(33375);
    expect(p.totalCents).toBe(700875);
    expect(p.monthlyPaymentCents).toBeNull();
  });
  it('discounts never exceed the sell price; amount deposits are capped at the total', () => {
    const p = priceOption({
      lines,
      pricing: pricingSchema.parse({
        percent: 10,
        discounts: [{ label: 'Huge', kind: 'amount', value: 99999999 }],
        deposit: { kind: 'amount', value: 50000 },
      }),
    });
    expect(p.subtotalCents).toBe(0);
    expect(p.depositCents).toBe(0);
  });
  it('options side by side show the difference from the first', () => {
    const a = priceOption({ lines, pricing: pricingSchema.parse({ percent: 30 }) });
    const b = priceOption({ lines, pricing: pricingSchema.parse({ percent: 40 }) });
    const rows = compareOptions({
      options: [
        { key: 'good', name: 'Good', price: a },
        { key: 'better', name: 'Better', price: b },
      ],
    });
    expect(rows[0]?.differenceFromFirstCents).toBe(0);
    expect(rows[1]?.differenceFromFirstCents).toBe(b.totalCents - a.totalCents);
  });
  it('pricing schema messages', () => {
    const r = pricingSchema.safeParse({ method: 'margin', percent: 120 });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.message)).toContain('Margin must be below 100 %');
  });
});
