import { useState } from 'react';
import { useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { UNIT_SYSTEMS } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SelectField, SubmitButton } from '../../../components/ui/form-fields';
import { companySettingsQueryOptions } from '../../../entities/job/queries';
import { useSaveCompanySettings } from '../api/save-company-settings';

const schema = z.object({ unitSystem: z.enum(UNIT_SYSTEMS, { message: 'Unit system must be imperial or metric.' }) });
const OPTIONS = [
  { value: 'imperial', label: 'Imperial (ft, °F)' },
  { value: 'metric', label: 'Metric (m, °C)' },
];

/** The units every screen of the company shows and takes; values are kept in calc's units either way. */
export function UnitSystemForm() {
  const settings = useSuspenseQuery(companySettingsQueryOptions()).data;
  const save = useSaveCompanySettings();
  const [savedVersion, setSavedVersion] = useState<number | null>(null);
  return (
    <Form
      key={settings.version}
      aria-label="Units"
      schema={schema}
      defaultValues={{ unitSystem: settings.unitSystem }}
      onSubmit={async ({ unitSystem }) => {
        const next = await save.mutateAsync({
          body: { unitSystem, defaultDesignConditions: settings.defaultDesignConditions },
          version: settings.version,
        });
        setSavedVersion(next.version);
      }}
    >
      <div className="flex flex-col gap-3 sm:flex-row sm:items-end">
        <div className="sm:w-72">
          <SelectField
            name="unitSystem"
            label="Units"
            options={OPTIONS}
            hint="Changing them changes what every screen shows, not the saved values."
          />
        </div>
        <SubmitButton variant="secondary">Save units</SubmitButton>
      </div>
      {savedVersion === settings.version ? <Alert tone="ok">Saved.</Alert> : null}
    </Form>
  );
}
