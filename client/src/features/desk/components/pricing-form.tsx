import { useFieldArray, useFormContext } from 'react-hook-form';
import { useState } from 'react';
import { z } from 'zod';
import { optionPricingSchema, type OptionPricingInput, type OptionRecord } from '@contract';
import { Button } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { SelectField, TextField } from '../../../components/ui/form-fields';
import { useUpdateOption } from '../api/update-option';
import { AmountField } from './amount-field';
import { SaveState } from './save-state';

/** The contract's pricing rules; the plan select's "Every plan" ('') is no plan (null). */
const pricingFormSchema = optionPricingSchema.extend({
  financingPlanKey: z.preprocess((v) => (v === '' ? null : v), optionPricingSchema.shape.financingPlanKey),
});

/** The option's pricing inputs as stored (the office reads them whole), or the company's rules. */
export function pricingValues(option: OptionRecord): OptionPricingInput {
  const p = optionPricingSchema.safeParse(option.pricing ?? {});
  return p.success ? p.data : optionPricingSchema.parse({});
}

function Discounts() {
  const { control } = useFormContext<OptionPricingInput>();
  const discounts = useFieldArray({ control, name: 'discounts' });
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="text-sm font-semibold text-ink-900">Discounts (percent of the price)</legend>
      {discounts.fields.map((f, i) => (
        <div key={f.id} className="grid grid-cols-[2fr_1fr_auto] items-end gap-2">
          <TextField name={`discounts.${i}.label`} label="Discount name" autoComplete="off" />
          <AmountField name={`discounts.${i}.value`} label="Percent" />
          <Button variant="ghost" onClick={() => discounts.remove(i)} aria-label={`Remove discount ${i + 1}`}>
            Remove
          </Button>
        </div>
      ))}
      <Button
        variant="secondary"
        className="self-start"
        onClick={() => discounts.append({ label: '', kind: 'percent', value: Number.NaN })}
      >
        Add a discount
      </Button>
    </fieldset>
  );
}

/**
 * Markup or margin (the company's rule unless set here), discounts, deposit and the financing plan shown.
 * The office's form (salespeople cannot change the sell rule or tax; the server refuses it). A discount beyond
 * the person's limit is not applied: the server records it for the owner's approval and says so.
 */
export function PricingForm({
  jobId,
  option,
  plans,
}: {
  jobId: string;
  option: OptionRecord;
  plans: readonly { key: string; name: string }[];
}) {
  const update = useUpdateOption(jobId);
  const [savedVersion, setSavedVersion] = useState<number | null>(null);
  return (
    <Form
      schema={pricingFormSchema}
      defaultValues={pricingValues(option)}
      aria-label={`Pricing of ${option.name}`}
      onSubmit={async (pricing, form) => {
        const sent = JSON.stringify(form.getValues());
        const saved = await update.mutateAsync({ option, changes: { pricing } });
        // What was typed while the save was on its way stays (and stays unsaved); otherwise the form
        // shows what the server stored (a discount beyond the limit is not applied, for one).
        const typedMeanwhile = JSON.stringify(form.getValues()) !== sent;
        form.reset(pricingValues(saved), { keepDirtyValues: typedMeanwhile });
        setSavedVersion(saved.version);
      }}
    >
      {(form) => {
        const rule = form.watch('sellRule');
        return (
          <>
            <div className="grid gap-3 sm:grid-cols-2">
              <label className="flex min-h-touch items-center gap-2 sm:col-span-2">
                <input
                  type="checkbox"
                  className="h-5 w-5"
                  checked={rule === null || rule === undefined}
                  onChange={(e) =>
                    form.setValue('sellRule', e.target.checked ? null : { method: 'margin', percent: Number.NaN }, {
                      shouldDirty: true,
                    })
                  }
                />
                Use the company’s markup or margin from the price book
              </label>
              {rule ? (
                <>
                  <SelectField
                    name="sellRule.method"
                    label="Sell by"
                    options={[
                      { value: 'margin', label: 'Margin (of the price)' },
                      { value: 'markup', label: 'Markup (on cost)' },
                    ]}
                  />
                  <AmountField name="sellRule.percent" label="Percent" />
                </>
              ) : null}
            </div>
            <Discounts />
            <div className="grid gap-3 sm:grid-cols-2">
              <AmountField name="deposit.value" label="Deposit (percent of the total)" />
              <SelectField
                name="financingPlanKey"
                label="Monthly payment shown for"
                options={[{ value: '', label: 'Every plan' }, ...plans.map((p) => ({ value: p.key, label: p.name }))]}
              />
            </div>
            <SaveState
              label="Save pricing"
              dirty={form.formState.isDirty}
              saving={form.formState.isSubmitting}
              saved={savedVersion === option.version && !form.formState.isDirty}
            />
          </>
        );
      }}
    </Form>
  );
}
