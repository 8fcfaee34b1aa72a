import { useController, useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { useState } from 'react';
import { optionDesignSchema, type OptionRecord, type RoomRecord } from '@contract';
import { DUCT_LOCATION_WORDS, ductLocationSchema, ductLeakageSchema, type DesignInput } from '@calc';
import { Form } from '../../../components/ui/form';
import { NumberField, TextField } from '../../../components/ui/form-fields';
import { AmountField, OptionalTextField } from './amount-field';
import type { DeskModel } from '../api/get-models';
import { useUpdateOption } from '../api/update-option';
import {
  designValues,
  DUCTED_INDOOR_TYPES,
  heatKitOptions,
  modelOptions,
  nextKey,
  roomName,
} from '../model/design-values';
import type { ExplanationView } from '../model/result-view';
import { errorOnFields } from '../model/field-paths';
import { Choice, OptionalSelect } from './optional-select';
import { RowList } from './row-list';
import { SaveState } from './save-state';
import { Why } from './why';

const LIFT_DIRECTIONS = [
  { value: 'indoor-above', label: 'Above the outdoor unit' },
  { value: 'indoor-below', label: 'Below the outdoor unit' },
];
const DUCT_CHOICES = [
  { value: '', label: 'No ducts (ductless indoor units)' },
  ...ductLocationSchema.options.map((l) => ({ value: l, label: `Ducts ${DUCT_LOCATION_WORDS[l]}` })),
];
const LEAKAGE_WORDS: Record<(typeof ductLeakageSchema.options)[number], string> = {
  sealed: 'Sealed and tested tight',
  typical: 'Typical',
  leaky: 'Leaky (old or unsealed)',
};
const LEAKAGE = ductLeakageSchema.options.map((l) => ({ value: l, label: LEAKAGE_WORDS[l] }));

/**
 * "One open space" is true or absent (never false): an unticked box leaves the design as saved, so the form
 * does not call itself changed after a save.
 */
function OpenSpace({ name }: { name: `zones.${number}.openSpace` }) {
  const { control } = useFormContext<DesignInput>();
  const { field } = useController({ control, name });
  return (
    <label className="flex min-h-touch items-center gap-2">
      <input
        type="checkbox"
        className="h-5 w-5"
        ref={field.ref}
        name={field.name}
        checked={field.value === true}
        onChange={(e) => field.onChange(e.target.checked ? true : undefined)}
        onBlur={field.onBlur}
      />
      These rooms are one open space (no doors or full walls between them)
    </label>
  );
}

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
  const values = useWatch({ control, name: 'zones' });
  const nameOf = (id: string) => {
    const r = rooms.find((x) => x.id === id);
    return r ? roomName(r) : id;
  };
  return (
    <RowList
      legend="Zones: rooms → indoor unit"
      rows={zones.fields}
      rowLabel={(i) => `Zone ${i + 1}`}
      addLabel="Add a zone"
      minRows={1}
      maxRows={40}
      disabled={disabled}
      onAdd={() =>
        zones.append({
          key: nextKey(
            'zone',
            values.map((z) => z.key),
          ),
          name: `Zone ${zones.fields.length + 1}`,
          roomIds: [],
          indoorUnitKey: '',
        })
      }
      onRemove={(i) => zones.remove(i)}
      rowClassName="grid gap-3 lg:grid-cols-[1fr_2fr]"
    >
      {(i) => {
        const chosen = values[i]?.roomIds ?? [];
        const ducted = DUCTED_INDOOR_TYPES.includes(
          models.find((m) => m.key === values[i]?.indoorUnitKey)?.indoorType ?? '',
        );
        return (
          <>
            <TextField name={`zones.${i}.name`} label="Zone name" autoComplete="off" />
            <Choice name={`zones.${i}.indoorUnitKey`} label="Indoor unit" options={modelOptions(models, false)} />
            {ducted ? (
              <NumberField
                name={`zones.${i}.lowestDuctOpeningFt`}
                label="Lowest duct opening above the floor (ft)"
                hint="Supply or return grille, for the refrigerant room-size check; empty counts as 2 ft (0.6 m)."
              />
            ) : null}
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
            {/* A ducted unit's leak spreads over every room it serves: which room holds it does not matter. */}
            {chosen.length > 1 && !ducted ? (
              <div className="grid items-end gap-3 sm:grid-cols-2 lg:col-span-2">
                <OptionalSelect
                  name={`zones.${i}.headRoomId`}
                  label="Indoor unit is in"
                  hint="For the refrigerant room-size check."
                  options={[
                    { value: '', label: `The zone’s first room (${nameOf(chosen[0] ?? '')})` },
                    ...chosen.map((id) => ({ value: id, label: nameOf(id) })),
                  ]}
                />
                <OpenSpace name={`zones.${i}.openSpace`} />
              </div>
            ) : null}
          </>
        );
      }}
    </RowList>
  );
}

function Circuits({ s }: { s: number }) {
  const { control } = useFormContext<DesignInput>();
  const circuits = useFieldArray({ control, name: `systems.${s}.circuits` });
  const zones = useWatch({ control, name: 'zones' });
  const zoneOptions = zones.map((z) => ({ value: z.key, label: z.name || z.key }));
  return (
    <RowList
      legend="Line sets"
      nested
      rows={circuits.fields}
      rowLabel={(c) => `Circuit ${c + 1}`}
      addLabel="Add a circuit"
      minRows={1}
      maxRows={8}
      onAdd={() =>
        circuits.append({
          zoneKey: zones[0]?.key ?? '',
          lengthFt: Number.NaN,
          liftFt: 0,
          liftDirection: 'indoor-above',
        })
      }
      onRemove={(c) => circuits.remove(c)}
      rowClassName="grid gap-3 sm:grid-cols-2 lg:grid-cols-4"
    >
      {(c) => (
        <>
          <Choice name={`systems.${s}.circuits.${c}.zoneKey`} label="Circuit to zone" options={zoneOptions} />
          <AmountField name={`systems.${s}.circuits.${c}.lengthFt`} label="Line-set length (ft)" />
          <AmountField name={`systems.${s}.circuits.${c}.liftFt`} label="Vertical lift (ft)" />
          <Choice name={`systems.${s}.circuits.${c}.liftDirection`} label="Indoor unit is" options={LIFT_DIRECTIONS} />
        </>
      )}
    </RowList>
  );
}

/**
 * A ducted system's ducts (they add the duct loads to the rooms it serves) and its backup heat: the heat kit
 * from the catalog with the backup heat the server worked out beside it. Shown when one of the system's
 * zones has a ducted indoor unit, or when either is already set.
 */
function DuctsAndHeat({
  s,
  models,
  whys,
}: {
  s: number;
  models: readonly DeskModel[];
  whys: ReadonlyMap<string, ExplanationView>;
}) {
  const { control } = useFormContext<DesignInput>();
  const system = useWatch({ control, name: `systems.${s}` });
  const zones = useWatch({ control, name: 'zones' });
  const served = new Set(system.circuits.map((c) => c.zoneKey));
  const typeOf = (key: string) => models.find((m) => m.key === key)?.indoorType ?? '';
  const units = zones.filter((z) => served.has(z.key)).map((z) => z.indoorUnitKey);
  const ductedUnit = units.some((k) => DUCTED_INDOOR_TYPES.includes(typeOf(k)));
  // A heat kit goes in an air handler: a system of slim ducted heads has ducts but no heat kit to choose.
  const airHandlers = units.filter((k) => typeOf(k) === 'air-handler');
  const kitShown = airHandlers.length > 0 || Boolean(system.heatKitKey);
  if (!ductedUnit && !system.ducts && !system.heatKitKey) return null;
  const backup = whys.get(`${system.key}:backup-heat`);
  // A ducted unit with no ducts of its own runs on the walk-through's: calc explains their loads on the system
  // ("Duct loads, … (ducts in the attic, R-6)"), so the empty choice names them instead of "no ducts".
  const walked = !system.ducts && ductedUnit ? whys.get(`${system.key}:ducts`) : undefined;
  const walkedWhere = walked ? /\((ducts [^)]*)\)$/.exec(walked.label)?.[1] : undefined;
  const ductChoices = ductedUnit
    ? [
        {
          value: '',
          label: walkedWhere ? 'The walk-through’s' : 'Not set here: the walk-through’s ducts, if it has any',
        },
        ...DUCT_CHOICES.slice(1),
      ]
    : DUCT_CHOICES;
  return (
    <fieldset className="flex flex-col gap-3 border-l-4 border-line pl-3">
      <legend className="text-sm font-semibold text-ink-900">{kitShown ? 'Ducts and backup heat' : 'Ducts'}</legend>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <OptionalSelect
          name={`systems.${s}.ducts`}
          label="Where the ducts run"
          hint={`${walkedWhere ? `The walk-through’s ${walkedWhere}: their` : 'Their'} gains and losses are added to the rooms this system serves.`}
          options={ductChoices}
          fromValue={(v) => (typeof v === 'object' && v !== null ? String(Reflect.get(v, 'location') ?? '') : '')}
          toValue={(chosen, current) =>
            chosen === ''
              ? undefined
              : {
                  insulationR: 6,
                  leakage: 'typical',
                  ...(typeof current === 'object' && current !== null ? current : {}),
                  location: chosen,
                }
          }
        />
        {system.ducts ? (
          <>
            <AmountField name={`systems.${s}.ducts.insulationR`} label="Duct insulation (R-value)" />
            <Choice name={`systems.${s}.ducts.leakage`} label="Duct leakage" options={LEAKAGE} />
          </>
        ) : null}
      </div>
      {walked ? <Why e={walked} label="Duct loads of the walk-through’s ducts" /> : null}
      {system.ducts ? (
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          <AmountField
            name={`systems.${s}.ducts.supplyLeakageFraction`}
            label="Tested supply leakage (fraction of airflow)"
            hint="From a duct-leakage test, e.g. 0.06. Empty: the leakage chosen above."
            optional
          />
          <AmountField
            name={`systems.${s}.ducts.returnLeakageFraction`}
            label="Tested return leakage (fraction of airflow)"
            hint="Leakage to outside, 0 to 0.5."
            optional
          />
          <OptionalTextField
            name={`systems.${s}.ducts.leakageTest`}
            label="Leakage test: date and method"
            hint="e.g. 2026-11-12, leakage to outside at 25 Pa"
          />
        </div>
      ) : null}
      <div className="grid items-start gap-3 lg:grid-cols-2">
        {kitShown ? (
          <OptionalSelect
            name={`systems.${s}.heatKitKey`}
            label="Heat kit (backup heat)"
            hint={
              airHandlers.length === 0
                ? 'A heat kit is installed in an air handler: this system has none.'
                : 'The kits listed for this system’s air handler.'
            }
            options={heatKitOptions(models, airHandlers, system.outdoorUnitKey, system.heatKitKey)}
          />
        ) : null}
        {system.heatKitKey ? (
          <>
            <AmountField
              name={`systems.${s}.electrical.heatKitCircuitLengthFt`}
              label="Panel to air handler, heat kit circuit (ft)"
              hint={`Its own run for the wire and voltage drop. Empty: the outdoor unit’s ${Number.isFinite(system.electrical.circuitLengthFt) ? `${system.electrical.circuitLengthFt} ft` : 'run'} is assumed.`}
              optional
            />
            <AmountField
              name={`systems.${s}.electrical.heatKitDisconnectDistanceFt`}
              label="Heat kit disconnect from the air handler (ft)"
              hint="Leave empty when it sits beside the air handler."
              optional
            />
          </>
        ) : null}
        {backup ? (
          <Why e={backup} label="Backup heat needed at the design temperature" />
        ) : (
          <p className="text-sm text-muted">Save the design to see the backup heat this system needs.</p>
        )}
      </div>
    </fieldset>
  );
}

function Systems({
  models,
  disabled,
  whys,
}: {
  models: readonly DeskModel[];
  disabled: boolean;
  whys: ReadonlyMap<string, ExplanationView>;
}) {
  const { control } = useFormContext<DesignInput>();
  const systems = useFieldArray({ control, name: 'systems' });
  const keys = useWatch({ control, name: 'systems' }).map((x) => x.key);
  return (
    <RowList
      legend="Systems: outdoor unit, line sets, electrical"
      rows={systems.fields}
      rowLabel={(s) => `System ${s + 1}`}
      addLabel="Add a system"
      minRows={1}
      maxRows={10}
      disabled={disabled}
      onAdd={() =>
        systems.append({
          key: nextKey('sys', keys),
          name: `Outdoor unit ${systems.fields.length + 1}`,
          outdoorUnitKey: '',
          circuits: [{ zoneKey: '', lengthFt: Number.NaN, liftFt: 0, liftDirection: 'indoor-above' }],
          electrical: { circuitLengthFt: Number.NaN, disconnectDistanceFt: 5 },
        })
      }
      onRemove={(s) => systems.remove(s)}
      rowClassName="flex flex-col gap-3"
    >
      {(s) => (
        <>
          <div className="grid gap-3 lg:grid-cols-[1fr_2fr_1fr]">
            <TextField name={`systems.${s}.name`} label="System name" autoComplete="off" />
            <Choice name={`systems.${s}.outdoorUnitKey`} label="Outdoor unit" options={modelOptions(models, true)} />
            <AmountField name={`systems.${s}.electrical.circuitLengthFt`} label="Branch circuit length (ft)" />
            <AmountField
              name={`systems.${s}.electrical.disconnectDistanceFt`}
              label="Disconnect distance from the unit (ft)"
            />
          </div>
          <Circuits s={s} />
          <DuctsAndHeat s={s} models={models} whys={whys} />
        </>
      )}
    </RowList>
  );
}

/**
 * The option's design: zones of rooms with their indoor unit, systems with their outdoor unit, circuits
 * (length, lift), branch circuit, and for a ducted system its ducts and heat kit. Checked with calc's design
 * schema (the server's), saved with If-Match; the server works out every number from what it stored.
 */
export function DesignForm({
  jobId,
  option,
  rooms,
  models,
  canEdit,
  whys,
}: {
  jobId: string;
  option: OptionRecord;
  rooms: readonly RoomRecord[];
  models: readonly DeskModel[];
  canEdit: boolean;
  whys: ReadonlyMap<string, ExplanationView>;
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
        const saved = await update.mutateAsync({ option, changes: { design } }).catch((e: unknown) => {
          throw errorOnFields(e, 'design');
        });
        // What was typed while the save was on its way stays (and stays unsaved); otherwise the form
        // shows what the server stored.
        const typedMeanwhile = JSON.stringify(form.getValues()) !== sent;
        form.reset(designValues(saved), { keepDirtyValues: typedMeanwhile });
        setSavedVersion(saved.version);
      }}
    >
      {(form) => (
        <>
          <Zones rooms={rooms} models={models} disabled={!canEdit} />
          <Systems models={models} disabled={!canEdit} whys={whys} />
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
