import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { useState } from 'react';
import { optionDesignSchema, type OptionRecord, type RoomRecord } from '@contract';
import type { DesignInput } from '@calc';
import { Button } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { SelectField, TextField } from '../../../components/ui/form-fields';
import { AmountField } from './amount-field';
import type { DeskModel } from '../api/get-models';
import { useUpdateOption } from '../api/update-option';
import { designValues, modelOptions, nextKey, roomName } from '../model/design-values';
import { SaveState } from './save-state';

const LIFT_DIRECTIONS = [
  { value: 'indoor-above', label: 'Indoor unit above the outdoor unit' },
  { value: 'indoor-below', label: 'Indoor unit below the outdoor unit' },
];

function Zones({
  rooms,
  models,
  disabled,
}: {
  rooms: readonly RoomRecord[];
  models: readonly DeskModel[];
  disabled: boolean;
}) {
  const { control, register } = useFormContext<DesignInput>();
  const zones = useFieldArray({ control, name: 'zones' });
  const keys = useWatch({ control, name: 'zones' }).map((z) => z.key);
  return (
    <fieldset className="flex flex-col gap-3" disabled={disabled}>
      <legend className="text-base font-semibold text-ink-900">Zones: rooms → indoor unit</legend>
      {zones.fields.map((f, i) => (
        <div key={f.id} className="grid gap-3 rounded-md border border-line p-3 lg:grid-cols-[1fr_2fr]">
          <TextField name={`zones.${i}.name`} label="Zone name" autoComplete="off" />
          <SelectField name={`zones.${i}.indoorUnitKey`} label="Indoor unit" options={modelOptions(models, false)} />
          <div
            role="group"
            aria-label={`Rooms of zone ${i + 1}`}
            className="flex flex-wrap gap-x-4 gap-y-1 lg:col-span-2"
          >
            {rooms.map((r) => (
              <label key={r.id} className="flex min-h-touch items-center gap-2">
                <input type="checkbox" value={r.id} className="h-5 w-5" {...register(`zones.${i}.roomIds`)} />
                {roomName(r)}
              </label>
            ))}
          </div>
          {zones.fields.length > 1 ? (
            <Button variant="ghost" className="justify-self-start" onClick={() => zones.remove(i)}>
              Remove this zone
            </Button>
          ) : null}
        </div>
      ))}
      <Button
        variant="secondary"
        className="self-start"
        onClick={() => {
          const key = nextKey('zone', keys);
          zones.append({ key, name: `Zone ${zones.fields.length + 1}`, roomIds: [], indoorUnitKey: '' });
        }}
      >
        Add a zone
      </Button>
    </fieldset>
  );
}

function Circuits({ s }: { s: number }) {
  const { control } = useFormContext<DesignInput>();
  const circuits = useFieldArray({ control, name: `systems.${s}.circuits` });
  const zones = useWatch({ control, name: 'zones' });
  const zoneOptions = zones.map((z) => ({ value: z.key, label: z.name || z.key }));
  return (
    <div className="flex flex-col gap-2">
      {circuits.fields.map((f, c) => (
        <div key={f.id} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <SelectField name={`systems.${s}.circuits.${c}.zoneKey`} label="Circuit to zone" options={zoneOptions} />
          <AmountField name={`systems.${s}.circuits.${c}.lengthFt`} label="Line-set length (ft)" />
          <AmountField name={`systems.${s}.circuits.${c}.liftFt`} label="Vertical lift (ft)" />
          <SelectField
            name={`systems.${s}.circuits.${c}.liftDirection`}
            label="Indoor unit is"
            options={LIFT_DIRECTIONS}
          />
          {circuits.fields.length > 1 ? (
            <Button variant="ghost" className="justify-self-start" onClick={() => circuits.remove(c)}>
              Remove this circuit
            </Button>
          ) : null}
        </div>
      ))}
      <Button
        variant="secondary"
        className="self-start"
        onClick={() => circuits.append({ zoneKey: zones[0]?.key ?? '', lengthFt: Number.NaN, liftFt: 0 })}
      >
        Add a circuit
      </Button>
    </div>
  );
}

function Systems({ models, disabled }: { models: readonly DeskModel[]; disabled: boolean }) {
  const { control } = useFormContext<DesignInput>();
  const systems = useFieldArray({ control, name: 'systems' });
  const keys = useWatch({ control, name: 'systems' }).map((x) => x.key);
  return (
    <fieldset className="flex flex-col gap-3" disabled={disabled}>
      <legend className="text-base font-semibold text-ink-900">Systems: outdoor unit, line sets, electrical</legend>
      {systems.fields.map((f, s) => (
        <div key={f.id} className="flex flex-col gap-3 rounded-md border border-line p-3">
          <div className="grid gap-3 lg:grid-cols-[1fr_2fr_1fr]">
            <TextField name={`systems.${s}.name`} label="System name" autoComplete="off" />
            <SelectField
              name={`systems.${s}.outdoorUnitKey`}
              label="Outdoor unit"
              options={modelOptions(models, true)}
            />
            <AmountField name={`systems.${s}.electrical.circuitLengthFt`} label="Branch circuit length (ft)" />
          </div>
          <Circuits s={s} />
          {systems.fields.length > 1 ? (
            <Button variant="ghost" className="self-start" onClick={() => systems.remove(s)}>
              Remove this system
            </Button>
          ) : null}
        </div>
      ))}
      <Button
        variant="secondary"
        className="self-start"
        onClick={() =>
          systems.append({
            key: nextKey('sys', keys),
            name: `Outdoor unit ${systems.fields.length + 1}`,
            outdoorUnitKey: '',
            circuits: [{ zoneKey: '', lengthFt: Number.NaN, liftFt: 0 }],
            electrical: { circuitLengthFt: Number.NaN },
          })
        }
      >
        Add a system
      </Button>
    </fieldset>
  );
}

/**
 * The option's design: zones of rooms with their indoor unit, systems with their outdoor unit, circuits
 * (length, lift) and branch circuit. Checked with calc's design schema (the server's), saved with If-Match;
 * the server works out every number from what it stored.
 */
export function DesignForm({
  jobId,
  option,
  rooms,
  models,
  canEdit,
}: {
  jobId: string;
  option: OptionRecord;
  rooms: readonly RoomRecord[];
  models: readonly DeskModel[];
  canEdit: boolean;
}) {
  const update = useUpdateOption(jobId);
  const [savedVersion, setSavedVersion] = useState<number | null>(null);
  return (
    <Form
      schema={optionDesignSchema}
      defaultValues={designValues(option)}
      aria-label={`Design of ${option.name}`}
      onSubmit={async (design, form) => {
        const sent = JSON.stringify(form.getValues());
        const saved = await update.mutateAsync({ option, changes: { design } });
        // What was typed while the save was on its way stays (and stays unsaved); otherwise the form
        // shows what the server stored (a discount beyond the limit is not applied, for one).
        const typedMeanwhile = JSON.stringify(form.getValues()) !== sent;
        form.reset(designValues(saved), { keepDirtyValues: typedMeanwhile });
        setSavedVersion(saved.version);
      }}
    >
      {(form) => (
        <>
          <Zones rooms={rooms} models={models} disabled={!canEdit} />
          <Systems models={models} disabled={!canEdit} />
          {canEdit ? (
            <SaveState
              label="Save design"
              dirty={form.formState.isDirty}
              saving={form.formState.isSubmitting}
              saved={savedVersion === option.version && !form.formState.isDirty}
            />
          ) : null}
        </>
      )}
    </Form>
  );
}
