import { z } from 'zod';
import { refrigerantSchema, tubeOdSchema } from '../schemas/equipment';
import { bounded, boundedInt, keyField, nameField } from '../schemas/fields';
import { sellRuleSchema } from './sell-rule';

/** The company's price book: each table's row shape. Money in integer cents. */

const money = (label: string) => boundedInt(label, 0, 100_000_000, 'cents');

export const MATERIAL_UNITS = ['each', 'ft', 'lb', 'roll', 'box', 'gal', 'pair', 'set'] as const;
export const materialUnitSchema = z.enum(MATERIAL_UNITS, { error: `Unit must be one of ${MATERIAL_UNITS.join(', ')}` });

/** A category groups items under one sell rule and one tax treatment. */
export const categorySchema = z.object({
  key: keyField('Category key'),
  name: nameField('Category name', 60),
  sellRule: sellRuleSchema,
  taxable: z.boolean().default(true),
});

export const materialSchema = z.object({
  key: keyField('SKU'),
  description: nameField('Description', 120),
  unit: materialUnitSchema,
  category: keyField('Category'),
  costCents: money('Cost'),
  /** Overrides the category's rule for this item. */
  sellRule: sellRuleSchema.optional(),
  /**
   * The takeoff item this material prices (a takeoff key such as `wall-sleeve` or
   * `wire:nm-b:10awg`), when its SKU is the company's own. A design's line of that key is costed
   * at this material's cost (issue 13).
   */
  takeoffItem: keyField('Takeoff item').optional(),
  active: z.boolean().default(true),
});

/** A labor task: hours per unit at an hourly rate (the company's cost of an hour of that trade). */
export const laborTaskSchema = z.object({
  key: keyField('Task key'),
  description: nameField('Description', 120),
  unit: z.enum(['each', 'ft', 'circuit', 'system', 'hour'], {
    error: 'Unit must be each, ft, circuit, system or hour',
  }),
  hoursPerUnit: bounded('Hours per unit', 0, 100, 'h'),
  rateCentsPerHour: money('Labor rate'),
  category: keyField('Category'),
  /** Overrides the category's rule for this task's hours. */
  sellRule: sellRuleSchema.optional(),
  active: z.boolean().default(true),
});

export const KIT_KINDS = ['line-set', 'install', 'electrical', 'condensate'] as const;

/** A kit sold as one line: a line-set kit is a copper pair, insulation and flare nuts in a stock length. */
export const kitSchema = z
  .object({
    key: keyField('Kit key'),
    description: nameField('Description', 120),
    kind: z.enum(KIT_KINDS, { error: `Kind must be one of ${KIT_KINDS.join(', ')}` }),
    lengthFt: bounded('Length', 1, 200, 'ft').optional(),
    liquidOdIn: tubeOdSchema.optional(),
    suctionOdIn: tubeOdSchema.optional(),
    /** What the kit holds, by SKU and quantity (informational; the kit is priced as one). */
    components: z
      .array(z.object({ sku: keyField('Component SKU'), quantity: bounded('Quantity', 0.01, 10000) }))
      .max(20, 'At most 20 components')
      .default([]),
    category: keyField('Category'),
    costCents: money('Cost'),
    sellRule: sellRuleSchema.optional(),
    active: z.boolean().default(true),
  })
  .superRefine((k, ctx) => {
    if (k.kind !== 'line-set') return;
    for (const f of ['lengthFt', 'liquidOdIn', 'suctionOdIn'] as const)
      if (k[f] === undefined)
        ctx.addIssue({ code: 'custom', path: [f], message: 'A line-set kit needs its length and both tube sizes' });
    if (k.liquidOdIn !== undefined && k.suctionOdIn !== undefined && k.liquidOdIn >= k.suctionOdIn)
      ctx.addIssue({
        code: 'custom',
        path: ['suctionOdIn'],
        message: 'The suction tube must be larger than the liquid',
      });
  });

export const financingPlanSchema = z.object({
  key: keyField('Plan key'),
  name: nameField('Plan name', 80),
  aprPercent: bounded('APR', 0, 40, '%'),
  months: boundedInt('Term', 1, 240, 'months'),
  active: z.boolean().default(true),
});

/**
 * What the company pays for a refrigerant, by the pound or by the ounce (exactly one: the extra charge is
 * then counted and priced in that unit), and the category that gives its sell rule and tax (issue 13).
 */
export const refrigerantCostSchema = z
  .object({
    key: refrigerantSchema,
    costCentsPerLb: money('Refrigerant cost per lb').optional(),
    costCentsPerOz: money('Refrigerant cost per oz').optional(),
    category: keyField('Category').optional(),
  })
  .superRefine((r, ctx) => {
    if ((r.costCentsPerLb === undefined) === (r.costCentsPerOz === undefined))
      ctx.addIssue({
        code: 'custom',
        path: [r.costCentsPerLb === undefined ? 'costCentsPerLb' : 'costCentsPerOz'],
        message: 'Give the cost either per lb or per oz (one of the two)',
      });
  });

export const discountLimitSchema = z.object({
  key: z.enum(['owner', 'estimator', 'salesperson', 'installer'], { error: 'Choose a role' }),
  maxPercent: bounded('Discount limit', 0, 100, '%'),
});

/** Company-wide pricing settings: the tax and the default sell rule. */
export const priceBookSettingsSchema = z.object({
  taxRatePercent: bounded('Tax rate', 0, 20, '%'),
  taxAppliesTo: z.enum(['materials', 'total', 'none'], { error: 'Choose what the tax applies to' }),
  defaultSellRule: sellRuleSchema,
});

export type Category = z.output<typeof categorySchema>;
export type Material = z.output<typeof materialSchema>;
export type LaborTask = z.output<typeof laborTaskSchema>;
export type Kit = z.output<typeof kitSchema>;
export type FinancingPlan = z.output<typeof financingPlanSchema>;
export type RefrigerantCost = z.output<typeof refrigerantCostSchema>;
export type DiscountLimit = z.output<typeof discountLimitSchema>;
export type PriceBookSettings = z.output<typeof priceBookSettingsSchema>;
