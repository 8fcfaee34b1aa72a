import { z } from 'zod';
import { assert, num } from '../errors';
import { priceFromMarginCents, priceFromMarkupCents } from '../pricing/money';
import { roundHalfUp } from '../rounding';
import { bounded } from '../schemas/fields';

/**
 * How a cost becomes a sell price. Markup is a percent of cost; margin (gross margin) is a
 * percent of the sell price, so a margin of 100 % or more is impossible:
 *   markup = (price − cost) / cost,   margin = (price − cost) / price
 * [PUB: the standard definitions of markup and gross margin, e.g. any managerial
 * accounting text; price = cost × (1 + markup) and price = cost / (1 − margin)].
 */
export const SELL_METHODS = ['markup', 'margin'] as const;

export const sellRuleSchema = z
  .object({
    method: z.enum(SELL_METHODS, { error: 'Choose markup or margin' }),
    percent: bounded('Markup or margin', 0, 1000, '%'),
  })
  .superRefine((r, ctx) => {
    if (r.method === 'margin' && r.percent >= 100)
      ctx.addIssue({ code: 'custom', path: ['percent'], message: 'A margin must be below 100 %' });
  });

export type SellRule = z.output<typeof sellRuleSchema>;
export type SellRuleSource = 'item' | 'category' | 'company';

/** The rule that applies: the item's own override, else its category's, else the company default. */
export function resolveSellRule({
  item,
  category,
  companyDefault,
}: {
  readonly item?: SellRule | undefined;
  readonly category?: SellRule | undefined;
  readonly companyDefault: SellRule;
}): { readonly rule: SellRule; readonly source: SellRuleSource } {
  if (item) return { rule: item, source: 'item' };
  if (category) return { rule: category, source: 'category' };
  return { rule: companyDefault, source: 'company' };
}

/** Sell price in cents from a cost and a rule, half-up to the cent. */
export function sellPriceCents({ costCents, rule }: { readonly costCents: number; readonly rule: SellRule }): number {
  return rule.method === 'margin'
    ? priceFromMarginCents({ costCents, marginPercent: rule.percent })
    : priceFromMarkupCents({ costCents, markupPercent: rule.percent });
}

/** Gross margin of a sale, % = (price − cost) / price × 100, 2 decimals half-up. Price > 0. */
export function marginPercentOf({
  costCents,
  priceCents,
}: {
  readonly costCents: number;
  readonly priceCents: number;
}) {
  const price = num(priceCents, 'positive');
  return roundHalfUp(((price - num(costCents, 'nonNegative')) / price) * 100, 2);
}

/** Markup of a sale, % = (price − cost) / cost × 100, 2 decimals half-up. Cost > 0. */
export function markupPercentOf({
  costCents,
  priceCents,
}: {
  readonly costCents: number;
  readonly priceCents: number;
}) {
  const cost = num(costCents, 'positive');
  return roundHalfUp(((num(priceCents, 'nonNegative') - cost) / cost) * 100, 2);
}

/** The margin that gives the same price as a markup: g = m / (1 + m) (percents in, percent out, unrounded). */
export function marginFromMarkup(markupPercent: number): number {
  const m = num(markupPercent, 'nonNegative') / 100;
  return (m / (1 + m)) * 100;
}

/** The markup that gives the same price as a margin: m = g / (1 − g). Margin < 100 % (unrounded). */
export function markupFromMargin(marginPercent: number): number {
  const g = num(marginPercent, 'nonNegative') / 100;
  assert(g < 1, 'MARGIN_TOO_HIGH');
  return (g / (1 - g)) * 100;
}
