import { z } from 'zod';
import { sellRuleSchema, TAX_RULES } from '@calc';
import { optionPricingSchema, type OptionPricing, type OptionRecord } from '@contract';

/**
 * The pricing form edits money in dollars (what the office types) while the contract stores cents. This is
 * the one place the two meet: `pricingFormValues` reads a stored option into the form, `pricingFormSchema`
 * checks what is typed (per field, beside the field) and hands the contract's shape on, checked again by the
 * contract's own schema so every bound the server keeps is said here first with the same words.
 */

/** An amount typed in dollars: at most this much, to the cent. */
export const MAX_AMOUNT_DOLLARS = 1_000_000;

export const TAX_CHOICES = ['company', 'exempt', 'rate'] as const;
export type TaxChoice = (typeof TAX_CHOICES)[number];

const kindSchema = z.enum(['percent', 'amount'], { error: 'Choose percent or amount' });

/** A percent 0–100 or a dollar amount to the cent; `what` names it in the message. */
function checkValue(kind: 'percent' | 'amount', value: number, what: string, ctx: z.RefinementCtx) {
  if (kind === 'percent') {
    if (value < 0 || value > 100)
      ctx.addIssue({ code: 'custom', path: ['value'], message: `${what} must be between 0 and 100 %` });
    return;
  }
  if (value < 0 || value > MAX_AMOUNT_DOLLARS)
    ctx.addIssue({
      code: 'custom',
      path: ['value'],
      message: `${what} must be between $0 and $${MAX_AMOUNT_DOLLARS.toLocaleString('en-US')}`,
    });
  else if (Math.abs(value * 100 - Math.round(value * 100)) > 1e-6)
    ctx.addIssue({
      code: 'custom',
      path: ['value'],
      message: `${what}: enter dollars and cents (two decimals at most)`,
    });
}

const discountForm = z
  .object({
    label: z.string(),
    kind: kindSchema,
    value: z.number({ error: 'Discount: enter a number' }),
  })
  .superRefine((d, ctx) =>
    checkValue(d.kind, d.value, d.kind === 'percent' ? 'A percent discount' : 'A discount', ctx),
  );

const depositForm = z
  .object({ kind: kindSchema, value: z.number({ error: 'Deposit: enter a number' }) })
  .superRefine((d, ctx) => checkValue(d.kind, d.value, 'Deposit', ctx));

const toCents = (kind: 'percent' | 'amount', value: number) => (kind === 'amount' ? Math.round(value * 100) : value);
const toDollars = (kind: 'percent' | 'amount', value: number) => (kind === 'amount' ? value / 100 : value);

const formShape = z.object({
  sellRule: sellRuleSchema.nullable(),
  discounts: z.array(discountForm),
  taxChoice: z.enum(TAX_CHOICES),
  /** Kept in the form whichever choice is shown, so switching back does not lose what was typed. */
  tax: z.object({ taxRatePercent: z.number().or(z.nan()), taxOn: z.enum(TAX_RULES), reason: z.string() }),
  deposit: depositForm,
  /** '' = every plan. */
  financingPlanKey: z.string(),
});
export type PricingFormValues = z.input<typeof formShape>;

/** The form's values as the contract's pricing: dollars → cents, the tax choice → the override or null. */
function toPricing(v: z.output<typeof formShape>): unknown {
  const tax =
    v.taxChoice === 'company'
      ? null
      : v.taxChoice === 'exempt'
        ? { taxRatePercent: 0, taxOn: 'none', reason: v.tax.reason }
        : { taxRatePercent: v.tax.taxRatePercent, taxOn: v.tax.taxOn, reason: v.tax.reason };
  return {
    sellRule: v.sellRule,
    discounts: v.discounts.map((d) => ({ label: d.label, kind: d.kind, value: toCents(d.kind, d.value) })),
    tax,
    deposit: { kind: v.deposit.kind, value: toCents(v.deposit.kind, v.deposit.value) },
    financingPlanKey: v.financingPlanKey === '' ? null : v.financingPlanKey,
  };
}

/**
 * Typed values → the contract's pricing. The contract's schema runs last (same paths as the form's fields:
 * discounts.0.label, tax.reason, tax.taxRatePercent …), so its messages land beside the fields too.
 */
export const pricingFormSchema = formShape.transform(toPricing).pipe(optionPricingSchema);

/** The option's stored pricing (cents) as the form shows it (dollars), or the company's rules. */
export function pricingFormValues(option: Pick<OptionRecord, 'pricing'>): PricingFormValues {
  const parsed = optionPricingSchema.safeParse(option.pricing ?? {});
  const p: OptionPricing = parsed.success ? parsed.data : optionPricingSchema.parse({});
  const tax = p.tax;
  return {
    sellRule: p.sellRule,
    discounts: p.discounts.map((d) => ({ label: d.label, kind: d.kind, value: toDollars(d.kind, d.value) })),
    taxChoice: !tax ? 'company' : tax.taxOn === 'none' ? 'exempt' : 'rate',
    tax: tax
      ? {
          taxRatePercent: tax.taxRatePercent,
          taxOn: tax.taxOn === 'none' ? 'materials' : tax.taxOn,
          reason: tax.reason,
        }
      : { taxRatePercent: Number.NaN, taxOn: 'materials', reason: '' },
    deposit: { kind: p.deposit.kind, value: toDollars(p.deposit.kind, p.deposit.value) },
    financingPlanKey: p.financingPlanKey ?? '',
  };
}
