import { num } from '../errors';
import { explanation, input, type Explanation } from '../explain/explanation';
import { formatMoney } from '../explain/format';

/** The words every preliminary price carries, wherever it is shown. */
export const PRELIMINARY_NOTE = "Preliminary: subject to the estimator's review. Not a proposal.";

/** How wide the preliminary range is around the suggested option's totals. [TRADE: common practice; company policy] */
export const PRELIMINARY_BAND = { lowPercent: 5, highPercent: 10, roundToCents: 10000 } as const;

export interface PreliminaryRange {
  readonly lowCents: number;
  readonly highCents: number;
  /** "about $11,800 – $13,900, subject to the estimator's review" */
  readonly text: string;
  readonly preliminary: true;
  readonly note: string;
  readonly explanation: Explanation;
}

/**
 * The "first price before leaving": a range, never one figure. Method (documented in calc/README):
 * the suggestion is priced twice — with short line sets (`lowTotalCents`) and with long ones
 * (`highTotalCents`), as the walk-through does not measure runs — then the low end is taken
 * `lowPercent` below the smaller total and the high end `highPercent` above the larger, for what
 * the estimator typically finds on review (access, electrical service, permits), rounded outward
 * to `roundToCents` ($100). Marked preliminary everywhere.
 */
export function preliminaryPriceRange({
  lowTotalCents,
  highTotalCents,
  band = PRELIMINARY_BAND,
}: {
  readonly lowTotalCents: number;
  readonly highTotalCents: number;
  readonly band?: { readonly lowPercent: number; readonly highPercent: number; readonly roundToCents: number };
}): PreliminaryRange {
  const a = num(lowTotalCents, 'nonNegative');
  const b = num(highTotalCents, 'nonNegative');
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const step = num(band.roundToCents, 'positive');
  const lowCents = Math.floor((lo * (1 - num(band.lowPercent, 'nonNegative') / 100)) / step + 1e-9) * step;
  const highCents = Math.ceil((hi * (1 + num(band.highPercent, 'nonNegative') / 100)) / step - 1e-9) * step;
  const text = `about ${formatMoney(lowCents, { whole: true })} – ${formatMoney(highCents, { whole: true })}, subject to the estimator's review`;
  return {
    lowCents,
    highCents,
    text,
    preliminary: true,
    note: PRELIMINARY_NOTE,
    explanation: explanation({
      key: 'price:preliminary-range',
      label: 'Preliminary price range',
      value: highCents,
      unit: 'cents',
      valueText: text,
      text: `${formatMoney(lo)} (short line sets) − ${band.lowPercent} % = ${formatMoney(lowCents, { whole: true })} rounded down; ${formatMoney(hi)} (long line sets) + ${band.highPercent} % = ${formatMoney(highCents, { whole: true })} rounded up`,
      inputs: [
        input('Total with short line sets', lo, 'cents', formatMoney(lo)),
        input('Total with long line sets', hi, 'cents', formatMoney(hi)),
      ],
      verdict: PRELIMINARY_NOTE,
      status: 'note',
      source: 'Suggested equipment priced from the price book; band: company policy (common practice)',
    }),
  };
}
