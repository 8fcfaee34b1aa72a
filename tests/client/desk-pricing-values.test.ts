import { describe, expect, it } from 'vitest';
import { fieldPathIn } from '../../client/src/features/desk/model/field-paths';
import {
  pricingFormSchema,
  pricingFormValues,
  type PricingFormValues,
} from '../../client/src/features/desk/model/pricing-values';

const base: PricingFormValues = {
  sellRule: null,
  discounts: [],
  taxChoice: 'company',
  tax: { taxRatePercent: Number.NaN, taxOn: 'materials', reason: '' },
  deposit: { kind: 'percent', value: 0 },
  financingPlanKey: '',
};

/** Every message the form would show, by field path. */
function problems(values: PricingFormValues): Record<string, string> {
  const r = pricingFormSchema.safeParse(values);
  if (r.success) return {};
  return Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message]));
}

describe('the desk’s pricing form: dollars on screen, cents in the contract', () => {
  it('sends amounts in cents, percents as typed, the exemption as tax on nothing with its reason', () => {
    const out = pricingFormSchema.parse({
      ...base,
      discounts: [
        { label: 'Neighbour referral', kind: 'amount', value: 250.5 },
        { label: 'Spring offer', kind: 'percent', value: 5 },
      ],
      taxChoice: 'exempt',
      tax: { taxRatePercent: Number.NaN, taxOn: 'materials', reason: 'Exemption certificate on file' },
      deposit: { kind: 'amount', value: 1000 },
    });
    expect(out.discounts).toEqual([
      { label: 'Neighbour referral', kind: 'amount', value: 25_050 },
      { label: 'Spring offer', kind: 'percent', value: 5 },
    ]);
    expect(out.tax).toEqual({ taxRatePercent: 0, taxOn: 'none', reason: 'Exemption certificate on file' });
    expect(out.deposit).toEqual({ kind: 'amount', value: 100_000 });
    expect(out.financingPlanKey).toBeNull();
  });

  it('reads a stored option back into the form (cents to dollars) and round-trips it', () => {
    const stored = {
      sellRule: { method: 'markup' as const, percent: 30 },
      discounts: [{ label: 'Loyalty', kind: 'amount' as const, value: 12_345 }],
      tax: { taxRatePercent: 6.5, taxOn: 'total' as const, reason: 'Work site in another county' },
      deposit: { kind: 'percent' as const, value: 25 },
      financingPlanKey: 'plan-60',
    };
    const values = pricingFormValues({ pricing: stored });
    expect(values.discounts[0]?.value).toBe(123.45);
    expect(values.taxChoice).toBe('rate');
    expect(pricingFormSchema.parse(values)).toEqual(stored);
  });

  it('says what is wrong beside each field', () => {
    expect(
      problems({
        ...base,
        discounts: [
          { label: 'Too much', kind: 'percent', value: 120 },
          { label: 'Fractions of a cent', kind: 'amount', value: 12.345 },
          { label: 'Empty', kind: 'amount', value: Number.NaN },
        ],
        deposit: { kind: 'amount', value: 2_000_000 },
      }),
    ).toEqual({
      'discounts.0.value': 'A percent discount must be between 0 and 100 %',
      'discounts.1.value': 'A discount: enter dollars and cents (two decimals at most)',
      'discounts.2.value': 'Discount: enter a number',
      'deposit.value': 'Deposit must be between $0 and $1,000,000',
    });
    // The contract's own checks run next, on the same paths.
    expect(problems({ ...base, taxChoice: 'rate', tax: { taxRatePercent: 25, taxOn: 'total', reason: ' ' } })).toEqual({
      'tax.taxRatePercent': 'Tax rate must be between 0 and 20 %',
      'tax.reason': 'Enter a reason for the tax change',
    });
    expect(problems({ ...base, discounts: [{ label: '', kind: 'percent', value: 5 }] })).toEqual({
      'discounts.0.label': 'Enter a discount name',
    });
    // The company's rule needs no reason, whatever was typed in the hidden fields.
    expect(problems(base)).toEqual({});
  });

  it('puts the server’s field errors on the form’s fields', () => {
    expect(fieldPathIn('pricing', 'pricing.tax.reason')).toBe('tax.reason');
    expect(fieldPathIn('pricing', 'pricing.discounts.0.value')).toBe('discounts.0.value');
    expect(fieldPathIn('design', 'design.systems.0.heatKitKey')).toBe('systems.0.heatKitKey');
    // A path outside the member stays as it was (the form lists it above its fields).
    expect(fieldPathIn('design', 'name')).toBe('name');
  });
});
