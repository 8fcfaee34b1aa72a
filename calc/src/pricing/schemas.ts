import { z } from 'zod';
import { bounded, boundedInt, keyField, nameField } from '../schemas/fields';
import { sellRuleSchema } from '../catalog/sell-rule';
import { LABOR_HOURS, type LaborHoursKey, type LaborTable } from '../takeoff/defaults';

/** The tax rules an option can use (see pricingSchema.taxOn). */
export const TAX_RULES = ['materials', 'materials-only', 'total', 'materials-cost', 'none'] as const;
export type TaxRule = (typeof TAX_RULES)[number];
/** The rules in plain words, for the screen and the proposal. */
export const TAX_RULE_LABELS: Record<TaxRule, string> = {
  materials: 'Tax on equipment and materials at the sell price',
  'materials-only': 'Tax on materials only, at the sell price',
  total: 'Tax on the whole price',
  'materials-cost': 'We pay the tax on our cost of equipment and materials (no tax line for the customer)',
  none: 'No tax',
};

const LABOR_HOURS_KEYS = Object.keys(LABOR_HOURS) as [LaborHoursKey, ...LaborHoursKey[]];

const cents = (label: string) => boundedInt(label, 0, 100_000_000, 'cents');

/**
 * The company's price book: cost per item key, labor rate per hour. All cents. An item may carry the
 * sell rule the price book gives it (its own override, or its category's: `ruleSource`, with the
 * category's name in `ruleFrom`); an item without one sells at the company default (issue 13).
 */
export const priceBookSchema = z.object({
  items: z.record(
    keyField('Item key'),
    z.object({
      unitCostCents: cents('Unit cost'),
      description: nameField('Description', 120).optional(),
      sellRule: sellRuleSchema.optional(),
      ruleSource: z.enum(['item', 'category']).optional(),
      ruleFrom: nameField('Rule from', 120).optional(),
      /** The price-book category the item belongs to (its name), when it names one the book has. */
      categoryName: nameField('Category', 60).optional(),
      /** false: its category is not taxable, so the line stays out of the tax base whatever the rule. */
      taxable: z.boolean().optional(),
      /** A refrigerant's unit in the book: its extra charge is counted and priced by the lb (default) or the oz. */
      soldBy: z.enum(['lb', 'oz']).optional(),
    }),
  ),
  laborRateCents: cents('Labor rate'),
  /**
   * The company's labor tasks as the takeoff's labor table: hours per entry and the task's description,
   * for the entries the price book has a task for (the rest count at the default table).
   */
  labor: z
    .object({
      hours: z.partialRecord(z.enum(LABOR_HOURS_KEYS), bounded('Hours per unit', 0, 100, 'h')),
      from: z.partialRecord(z.enum(LABOR_HOURS_KEYS), nameField('Labor task', 120)),
    })
    .optional(),
});

/** The labor table a price book counts with: its tasks' hours over the defaults. */
export function laborTableOf(priceBook: PriceBook): LaborTable | undefined {
  const l = priceBook.labor;
  if (!l) return undefined;
  return { hours: { ...LABOR_HOURS, ...l.hours }, from: l.from };
}

/** A discount: a percent of the sell price or a fixed amount in cents. */
export const discountSchema = z.object({
  label: nameField('Discount name', 60),
  kind: z.enum(['percent', 'amount'], { error: 'Choose percent or amount' }),
  value: bounded('Discount', 0, 100_000_000),
});

/** How an option is priced. */
export const pricingSchema = z
  .object({
    method: z.enum(['markup', 'margin'], { error: 'Choose markup or margin' }).default('margin'),
    percent: bounded('Markup or margin', 0, 500, '%'),
    /**
     * 'option': `method`/`percent` price all goods together and all labor together (one rule for
     * the option). 'line': every line sells at the price book's rule for its item (item override →
     * category → `method`/`percent` as the company default), rounded per line, and the sums are
     * the option's sell (issue 13).
     */
    sellRulesBy: z.enum(['option', 'line'], { error: 'Choose option or line' }).default('option'),
    discounts: z.array(discountSchema).max(10, 'At most 10 discounts').default([]),
    taxRatePercent: bounded('Tax rate', 0, 20, '%').default(0),
    /**
     * What the tax falls on: 'materials' = equipment and materials at their sell price (their share of the
     * discounted price); 'materials-only' = materials alone at sell (equipment exempt); 'total' = the whole
     * price; 'materials-cost' = the contractor pays the tax on its cost of equipment and materials (a cost,
     * no tax line for the customer); 'none'. Names in plain words: TAX_RULE_LABELS.
     */
    taxOn: z.enum(TAX_RULES, { error: 'Choose what is taxed' }).default('materials'),
    deposit: z
      .object({ kind: z.enum(['percent', 'amount']), value: bounded('Deposit', 0, 100_000_000) })
      .default({ kind: 'percent', value: 0 }),
    financing: z
      .object({ aprPercent: bounded('APR', 0, 40, '%'), months: boundedInt('Term', 1, 240, 'months') })
      .optional(),
  })
  .superRefine((p, ctx) => {
    if (p.method === 'margin' && p.percent >= 100)
      ctx.addIssue({ code: 'custom', path: ['percent'], message: 'Margin must be below 100 %' });
    for (const [i, d] of p.discounts.entries()) {
      if (d.kind === 'percent' && d.value > 100)
        ctx.addIssue({
          code: 'custom',
          path: ['discounts', i, 'value'],
          message: 'A percent discount must be between 0 and 100 %',
        });
    }
    if (p.deposit.kind === 'percent' && p.deposit.value > 100)
      ctx.addIssue({ code: 'custom', path: ['deposit', 'value'], message: 'Deposit must be between 0 and 100 %' });
  });

export type PriceBook = z.output<typeof priceBookSchema>;
export type PriceBookInput = z.input<typeof priceBookSchema>;
export type Pricing = z.output<typeof pricingSchema>;
export type PricingInput = z.input<typeof pricingSchema>;
