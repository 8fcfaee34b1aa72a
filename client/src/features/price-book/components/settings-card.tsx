import { useState } from 'react';
import { priceBookSettingsSchema } from '@calc';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { NumberField, SelectField, SubmitButton } from '../../../components/ui/form-fields';
import { useSaveSettings, useSettings } from '../api/settings';

const APPLIES = [
  { value: 'materials', label: 'Equipment and materials (not labor)' },
  { value: 'total', label: 'The whole price' },
  { value: 'none', label: 'Nothing (no sales tax)' },
];
const METHODS = [
  { value: 'margin', label: 'Margin (% of the sell price)' },
  { value: 'markup', label: 'Markup (% of cost)' },
];

/** The tax and the sell rule for items whose category has none; read-only outside the office. */
export function SettingsCard({ canEdit }: { canEdit: boolean }) {
  const settings = useSettings();
  const save = useSaveSettings();
  const [saved, setSaved] = useState(false);
  const applies = APPLIES.find((a) => a.value === settings.taxAppliesTo)?.label ?? '';
  if (!canEdit || !settings.defaultSellRule)
    return (
      <p className="text-base">
        Sales tax: <strong>{settings.taxRatePercent} %</strong> on {applies.toLowerCase()}.
      </p>
    );
  return (
    <section aria-label="Tax and default sell rule" className="rounded-lg border border-line bg-white p-4">
      <h2 className="mb-2 text-base font-semibold text-ink-900">Tax and default sell rule</h2>
      <Form
        key={settings.version}
        schema={priceBookSettingsSchema}
        defaultValues={{
          taxRatePercent: settings.taxRatePercent,
          taxAppliesTo: settings.taxAppliesTo,
          defaultSellRule: settings.defaultSellRule,
        }}
        onSubmit={async (values) => {
          setSaved(false);
          await save.mutateAsync({ settings: values, version: settings.version });
          setSaved(true);
        }}
      >
        <div className="grid grid-cols-1 gap-3 md:grid-cols-4">
          <NumberField name="taxRatePercent" label="Tax rate, %" />
          <SelectField name="taxAppliesTo" label="Tax applies to" options={APPLIES} />
          <SelectField name="defaultSellRule.method" label="Default sell rule" options={METHODS} />
          <NumberField
            name="defaultSellRule.percent"
            label="Percent"
            hint="Used where neither the item nor its category has a rule."
          />
        </div>
        <div className="flex items-center gap-3">
          <SubmitButton>Save tax and rule</SubmitButton>
          {saved ? <Alert tone="ok">Saved.</Alert> : null}
        </div>
      </Form>
    </section>
  );
}
