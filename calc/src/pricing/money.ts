import { assert, num } from '../errors';
import { roundCentsHalfUp } from '../rounding';

/** Sell price from a gross margin, cents = cost / (1 − margin/100), half-up to the cent. Margin < 100 %. */
export function priceFromMarginCents({
  costCents,
  marginPercent,
}: {
  readonly costCents: number;
  readonly marginPercent: number;
}): number {
  const cost = num(costCents, 'nonNegativeInteger');
  const m = num(marginPercent, 'nonNegative');
  assert(m < 100, 'MARGIN_TOO_HIGH');
  return roundCentsHalfUp(cost / (1 - m / 100));
}

/** Sell price from a markup on cost, cents = cost × (1 + markup/100), half-up to the cent. */
export function priceFromMarkupCents({
  costCents,
  markupPercent,
}: {
  readonly costCents: number;
  readonly markupPercent: number;
}): number {
  return roundCentsHalfUp(num(costCents, 'nonNegativeInteger') * (1 + num(markupPercent, 'nonNegative') / 100));
}

/**
 * Level monthly payment of an amortised loan, cents = P·r / (1 − (1 + r)^−n), r = APR/1200,
 * rounded half-up to the cent; at 0 % APR, P / n half-up. [PUB: standard annuity formula]
 */
export function monthlyPaymentCents({
  principalCents,
  aprPercent,
  months,
}: {
  readonly principalCents: number;
  readonly aprPercent: number;
  readonly months: number;
}): number {
  const p = num(principalCents, 'nonNegativeInteger');
  const apr = num(aprPercent, 'nonNegative');
  const n = num(months, 'nonNegativeInteger');
  assert(n > 0, 'NOT_POSITIVE');
  if (apr === 0) return roundCentsHalfUp(p / n);
  const r = apr / 1200;
  return roundCentsHalfUp((p * r) / (1 - (1 + r) ** -n));
}

/** A percentage of an amount in cents, half-up to the cent. */
export function percentOfCents({ cents, percent }: { readonly cents: number; readonly percent: number }): number {
  return roundCentsHalfUp((num(cents, 'nonNegative') * num(percent, 'nonNegative')) / 100);
}

/** Quantity × unit price, cents, half-up to the cent (quantities may be fractional: ft, h, lb). */
export function extendCents({
  quantity,
  unitCents,
}: {
  readonly quantity: number;
  readonly unitCents: number;
}): number {
  return roundCentsHalfUp(num(quantity, 'nonNegative') * num(unitCents, 'nonNegativeInteger'));
}
