import { num } from '../errors';
import { explanation, input, type Explanation } from '../explain/explanation';
import { formatMoney, formatPercent } from '../explain/format';
import { roundHalfUp } from '../rounding';

export type DiscountRole = 'owner' | 'estimator' | 'salesperson' | 'installer';

/** Whether a discount is within the giver's limit from the price book, and why. */
export interface DiscountCheck {
  readonly role: DiscountRole;
  /** The discount as a percent of the sell price, 2 decimals half-up. */
  readonly percent: number;
  readonly limitPercent: number;
  readonly withinLimit: boolean;
  /** Beyond the limit the owner's approval is needed (recorded by the server). */
  readonly needsOwnerApproval: boolean;
  readonly explanation: Explanation;
}

/**
 * Checks the total discount on an option against the per-role limit of the price book
 * (`discount-limits` rows: role → max % of the sell price). A discount in cents is turned
 * into its percent of the sell price first. A role with no row gets 0 % (no discount without
 * approval). The comparison uses the unrounded percent, so $100.01 off $1,000.00 against a
 * 10 % limit is beyond it. [OWN: company policy; the server enforces it]
 */
export function checkDiscount({
  role,
  discountCents,
  sellCents,
  limits,
}: {
  readonly role: DiscountRole;
  readonly discountCents: number;
  readonly sellCents: number;
  readonly limits: readonly { readonly key: DiscountRole; readonly maxPercent: number }[];
}): DiscountCheck {
  const off = num(discountCents, 'nonNegative');
  const sell = num(sellCents, 'nonNegative');
  const limit = limits.find((l) => l.key === role)?.maxPercent ?? 0;
  const exact = sell === 0 ? (off > 0 ? Infinity : 0) : (off / sell) * 100;
  const within = exact <= limit + 1e-9;
  const percent = Number.isFinite(exact) ? roundHalfUp(exact, 2) : 100;
  const verdict = within
    ? `within the ${formatPercent(limit, 2)} a ${role} may give`
    : `beyond the ${formatPercent(limit, 2)} a ${role} may give: it needs the owner's approval`;
  return {
    role,
    percent,
    limitPercent: limit,
    withinLimit: within,
    needsOwnerApproval: !within && role !== 'owner',
    explanation: explanation({
      key: 'price:discount-limit',
      label: 'Discount against the limit',
      value: percent,
      unit: '%',
      valueText: formatPercent(percent, 2),
      text: `${formatMoney(off)} off ${formatMoney(sell)} = ${formatPercent(percent, 2)} of the sell price; limit for a ${role} ${formatPercent(limit, 2)}`,
      inputs: [
        input('Discount', off, 'cents', formatMoney(off)),
        input('Sell price before discounts', sell, 'cents', formatMoney(sell)),
        input('Limit', limit, '%', formatPercent(limit, 2)),
      ],
      verdict,
      status: within ? 'ok' : 'blocker',
      source: "The company's price book (discount limits per role)",
    }),
  };
}
