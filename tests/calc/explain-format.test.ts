import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatMoney, formatNumber, formatPercent, formatQuantity } from '@calc';

// Outside reference: the platform's Intl.NumberFormat('en-US') (ICU). calc does not use Intl itself (ICU data
// differs between browsers and Node), so these tests pin calc's own formatter to the en-US convention.
const intl = (n: number, d: number) =>
  new Intl.NumberFormat('en-US', {
    minimumFractionDigits: d,
    maximumFractionDigits: d,
    roundingMode: 'halfExpand',
  }).format(n);

describe('deterministic formatting', () => {
  it('groups thousands and rounds half-up like en-US Intl (halfExpand)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000_000 }), fc.integer({ min: 0, max: 3 }), (k, d) => {
        // integers scaled so the value is exactly representable to d places: no binary near-misses
        const v = k / 10 ** d;
        expect(formatNumber(v, d)).toBe(intl(v, d));
      }),
    );
  });
  it('money: cents to dollars with groups, whole dollars half-up', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000_000 }), (c) => {
        expect(formatMoney(c)).toBe(`$${intl(c / 100, 2)}`);
      }),
    );
    // from the definition: 1,180,050 cents = $11,800.50 → $11,801 whole (half-up)
    expect(formatMoney(1180050, { whole: true })).toBe('$11,801');
    expect(formatMoney(-1250)).toBe('−$12.50');
  });
  it('quantities and percents trim trailing zeros and keep a space before the unit', () => {
    // the issue's own example figures: 40 ft × 0.16 oz/ft = 6.4 oz
    expect(formatQuantity(6.4, 'oz', 1)).toBe('6.4 oz');
    expect(formatQuantity(40, 'ft', 1)).toBe('40 ft');
    expect(formatPercent(112)).toBe('112 %');
    expect(formatNumber(-0.004, 2)).toBe('0.00');
  });
});
