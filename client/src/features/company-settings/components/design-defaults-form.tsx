import { useState, type ReactNode } from 'react';
import { useFormState } from 'react-hook-form';
import { useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import type { CompanySettingsRecord, DesignField } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SelectField, SubmitButton, TextField } from '../../../components/ui/form-fields';
import { companySettingsQueryOptions } from '../../../entities/job/queries';
import { jobKeys } from '../../../entities/job/query-keys';
import { isApiError } from '../../../lib/api-error';
import { MONTH_NAMES } from '../../../lib/months';
import { useSaveCompanySettings } from '../api/save-company-settings';
import { defaultsFormSchema, specOf, toDisplayDefaults } from '../model/design-defaults';
import { DefaultNumberField, LatitudeDefault } from './default-fields';

const MONTH_OPTIONS = [
  { value: '', label: 'Usual for the latitude (July north, January south)' },
  ...MONTH_NAMES.map((name, i) => ({ value: String(i + 1), label: name })),
];

const CONFLICT =
  'Someone else saved the company settings while you were editing. Their values are shown now; make your change again.';

function Group({ title, lead, children }: { title: string; lead?: string; children: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-4 rounded-md border border-line p-4">
      <legend className="px-1 text-base font-semibold text-ink-900">{title}</legend>
      {lead ? <p className="-mt-2 text-sm text-muted">{lead}</p> : null}
      <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">{children}</div>
    </fieldset>
  );
}

/**
 * "Saved" only when the server's answer for this version is in and nothing on screen changed since:
 * a change after saving says so until it is saved too.
 */
function SaveState({ savedVersion, version }: { savedVersion: number | null; version: number }) {
  const { isDirty, isSubmitting } = useFormState();
  if (isSubmitting) return <p className="text-base text-muted">Saving…</p>;
  if (isDirty) return <p className="text-base font-semibold text-amber-deep">Changes not saved yet.</p>;
  if (savedVersion === version) return <Alert tone="ok">Saved. New jobs start from these values.</Alert>;
  return null;
}

const numberFields = (keys: readonly DesignField[], system: CompanySettingsRecord['unitSystem']) =>
  keys.map((k) => (
    <DefaultNumberField key={k} field={k} system={system} extraHint={specOf(k).whenEmpty ?? undefined} />
  ));

/** The owner's design defaults: every new job's design conditions start from them. */
export function DesignDefaultsForm() {
  const settings = useSuspenseQuery(companySettingsQueryOptions()).data;
  const queryClient = useQueryClient();
  const save = useSaveCompanySettings();
  const [savedVersion, setSavedVersion] = useState<number | null>(null);
  const [conflict, setConflict] = useState(false);
  const system = settings.unitSystem;
  const stored = settings.defaultDesignConditions;
  return (
    <div className="flex flex-col gap-4">
      {settings.designConditionsNotice ? (
        <p className="rounded-md border-l-4 border-amber-line bg-amber-soft px-4 py-3 text-ink-950">
          {settings.designConditionsNotice}
        </p>
      ) : null}
      {conflict ? <Alert tone="warning">{CONFLICT}</Alert> : null}
      <Form
        key={settings.version}
        aria-label="Design defaults"
        schema={defaultsFormSchema(stored, system)}
        defaultValues={toDisplayDefaults(stored, system)}
        onSubmit={async (values) => {
          setConflict(false);
          try {
            const next = await save.mutateAsync({
              body: { unitSystem: system, defaultDesignConditions: values.defaultDesignConditions },
              version: settings.version,
            });
            setSavedVersion(next.version);
          } catch (e) {
            if (isApiError(e) && e.status === 409) {
              setConflict(true);
              await queryClient.invalidateQueries({ queryKey: jobKeys.settings() });
              return;
            }
            throw e;
          }
        }}
      >
        <Group title="Summer (cooling)">
          {numberFields(['outdoorCoolingDryBulbF', 'outdoorCoolingWetBulbF', 'outdoorCoolingGrains'], system)}
          {numberFields(['dailyRangeF'], system)}
        </Group>
        <Group title="Winter (heating)">{numberFields(['outdoorHeatingDryBulbF', 'groundDesignF'], system)}</Group>
        <Group title="Indoors">
          {numberFields(['indoorCoolingF', 'indoorHeatingF', 'indoorCoolingRhPercent'], system)}
        </Group>
        <Group
          title="Sun and sky"
          lead="The hour-by-hour design day uses these. Enter τb and τd together, from one climatic table for the site and month."
        >
          <LatitudeDefault system={system} />
          <SelectField
            name="defaultDesignConditions.designMonth"
            label="Cooling design month"
            options={MONTH_OPTIONS}
          />
          {numberFields(['elevationFt', 'clearSkyTauB', 'clearSkyTauD'], system)}
          <TextField
            name="defaultDesignConditions.clearSkySource"
            label="Source of τb and τd"
            hint="The climatic table, its station and month."
          />
        </Group>
        <TextField
          name="defaultDesignConditions.source"
          label="Source of the design values"
          hint="For example the local code’s climate table for the county. Printed on every load summary."
        />
        <div className="flex flex-col gap-3 sm:flex-row sm:items-center">
          <SubmitButton>Save design defaults</SubmitButton>
          <SaveState savedVersion={savedVersion} version={settings.version} />
        </div>
      </Form>
    </div>
  );
}
