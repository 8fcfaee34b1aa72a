import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { useState } from 'react';
import { TAX_RULE_LABELS, TAX_RULES } from '@calc';
import type { OptionRecord } from '@contract';
import { Form } from '../../../components/ui/form';
import { TextField } from '../../../components/ui/form-fields';
import { errorOnFields } from '../model/field-paths';
import { useUpdateOption } from '../api/update-option';
import { pricingFormSchema, pricingFormValues, type PricingFormValues } from '../model/pricing-values';
import { AmountField } from './amount-field';
import { Choice } from './optional-select';
import { RowList } from './row-list';
import { SaveState } from './save-state';

const KINDS = [
  { value: 'percent', label: 'Percent of the price' },
  { value: 'amount', label: 'Amount in dollars' },
];
const DEPOSIT_KINDS = [
  { value: 'percent', label: 'Percent of the total' },
  { value: 'amount', label: 'Amount in dollars' },
];
const TAX_CHOICE_OPTIONS = [
  { value: 'company', label: 'The company’s tax rule (price book)' },
  { value: 'exempt', label: 'Tax exempt for this option' },
  { value: 'rate', label: 'Another rate for this option' },
];
const TAXED = TAX_RULES.filter((r) => r !== 'none').map((r) => ({ value: r, label: TAX_RULE_LABELS[r] }));

const valueLabel = (kind: string | undefined, what: string) => (kind === 'amount' ? `${what} ($)` : `${what} (%)`);

function Discounts() {
  const { control } = useFormContext<PricingFormValues>();
  const discounts = useFieldArray({ control, name: 'discounts' });
  const kinds = useWatch({ control, name: 'discounts' }).map((d) => d.kind);
  return (
    <RowList
      legend="Discounts"
      rows={discounts.fields}
      rowLabel={(i) => `Discount ${i + 1}`}
      addLabel="Add a discount"
      onAdd={() => discounts.append({ label: '', kind: 'percent', value: Number.NaN })}
      onRemove={(i) => discounts.remove(i)}
      rowClassName="grid gap-2 sm:grid-cols-[2fr_1.4fr_1fr]"
    >
      {(i) => (
        <>
          <TextField name={`discounts.${i}.label`} label="Discount name" autoComplete="off" />
          <Choice name={`discounts.${i}.kind`} label="Kind" options={KINDS} />
          <AmountField name={`discounts.${i}.value`} label={valueLabel(kinds[i], 'Discount')} />
        </>
      )}
    </RowList>
  );
}

function TaxFields() {
  const choice = useWatch<PricingFormValues, 'taxChoice'>({ name: 'taxChoice' });
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="text-base font-semibold text-ink-900">Tax</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <Choice name="taxChoice" label="Tax for this option" options={TAX_CHOICE_OPTIONS} />
        {choice === 'rate' ? <AmountField name="tax.taxRatePercent" label="Tax rate (%)" /> : null}
        {choice === 'rate' ? (
          <div className="sm:col-span-2">
            <Choice name="tax.taxOn" label="What is taxed" options={TAXED} />
          </div>
        ) : null}
        {choice !== 'company' ? (
          <div className="sm:col-span-2">
            <TextField
              name="tax.reason"
              label="Reason for the tax change"
              hint="For example the exemption certificate on file, or the county of the work site."
              autoComplete="off"
            />
          </div>
        ) : null}
      </div>
    </fieldset>
  );
}

/**
 * Markup or margin (the company's rule unless set here), discounts and the deposit as a percent or an
 * amount, the option's own tax (exempt or another rate, with the reason) and the financing plan shown.
 * The office's form (salespeople cannot change the sell rule or tax; the server refuses it). A discount
 * beyond the person's limit is not applied: the server records it for the owner's approval and says so.
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
      defaultValues={pricingFormValues(option)}
      aria-label={`Pricing of ${option.name}`}
      onSubmit={async (pricing, form) => {
        const sent = JSON.stringify(form.getValues());
        const saved = await update.mutateAsync({ option, changes: { pricing } }).catch((e: unknown) => {
          throw errorOnFields(e, 'pricing');
        });
        // What was typed while the save was on its way stays (and stays unsaved); otherwise the form
        // shows what the server stored (a discount beyond the limit is not applied, for one).
        const typedMeanwhile = JSON.stringify(form.getValues()) !== sent;
        form.reset(pricingFormValues(saved), { keepDirtyValues: typedMeanwhile });
        setSavedVersion(saved.version);
      }}
    >
      {(form) => {
        const rule = form.watch('sellRule');
        const depositKind = form.watch('deposit.kind');
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
                  <Choice
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
            <TaxFields />
            <fieldset className="grid gap-3 sm:grid-cols-2">
              <legend className="text-base font-semibold text-ink-900">Deposit and financing</legend>
              <Choice name="deposit.kind" label="Deposit as" options={DEPOSIT_KINDS} />
              <AmountField name="deposit.value" label={valueLabel(depositKind, 'Deposit')} />
              <div className="sm:col-span-2">
                <Choice
                  name="financingPlanKey"
                  label="Monthly payment shown for"
                  options={[{ value: '', label: 'Every plan' }, ...plans.map((p) => ({ value: p.key, label: p.name }))]}
                />
              </div>
            </fieldset>
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
