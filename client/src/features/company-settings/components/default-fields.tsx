import { useId, type ReactNode } from 'react';
import { useController, useFormContext, type FieldValues } from 'react-hook-form';
import { DEFAULT_LATITUDE_DEG } from '@calc';
import type { DesignField, UnitSystem } from '@contract';
import { FieldShell, inputClass } from '../../../components/ui/field-shell';
import { localiseBound, unitLabel } from '../../../lib/unit-display';
import { rangeText, specOf, type Hemisphere } from '../model/design-defaults';

const path = (key: string) => `defaultDesignConditions.${key}`;

function useFieldError(name: string): string | undefined {
  const { getFieldState, formState } = useFormContext<FieldValues>();
  return getFieldState(name, formState).error?.message;
}

/** calc's latitude bounds are signed (−60 … 70): say them as the field is read, in degrees N or S. */
const sayBound = (field: DesignField, message: string | undefined) =>
  field === 'latitudeDeg' && message?.startsWith('Latitude must be between')
    ? 'Latitude must be between 60° S and 70° N'
    : message;

/** A design default typed in the company's units; calc's bound message is said in those units. */
export function DefaultNumberField({
  field,
  system,
  extraHint,
}: {
  field: DesignField;
  system: UnitSystem;
  extraHint?: ReactNode;
}) {
  const id = useId();
  const { register } = useFormContext<FieldValues>();
  const spec = specOf(field);
  const name = path(field);
  const unit = unitLabel(spec.quantity, system, spec.unit ?? '');
  const error = sayBound(field, localiseBound(useFieldError(name), spec.quantity, system));
  const range = rangeText(field, system, unit);
  const hint = (
    <>
      {range ? <span className="block">{range}.</span> : null}
      {extraHint ? <span className="block">{extraHint}</span> : null}
    </>
  );
  return (
    <FieldShell id={id} label={spec.label} hint={hint} error={error} unit={unit}>
      <input
        id={id}
        type="text"
        inputMode={spec.integer ? 'numeric' : 'decimal'}
        autoComplete="off"
        className={inputClass}
        aria-invalid={error ? true : undefined}
        aria-describedby={[error ? `${id}-error` : '', `${id}-hint`, unit ? `${id}-unit` : '']
          .filter(Boolean)
          .join(' ')}
        {...register(name, {
          setValueAs: (v: unknown) => (v === '' || v === undefined || v === null ? undefined : Number(v)),
        })}
      />
    </FieldShell>
  );
}

const toggleClass = (on: boolean) =>
  `min-h-touch min-w-14 rounded-md border px-4 text-base font-semibold ${
    on ? 'border-ink-900 bg-ink-900 text-white' : 'border-line bg-white text-ink-900'
  }`;

/** Latitude as read off a map: degrees, then North or South (large buttons); stored signed, south negative. */
export function LatitudeDefault({ system }: { system: UnitSystem }) {
  const { field } = useController<FieldValues>({ name: 'hemisphere' });
  return (
    <div className="flex flex-col gap-2">
      <DefaultNumberField
        field="latitudeDeg"
        system={system}
        extraHint={`Left empty: jobs assume ${DEFAULT_LATITUDE_DEG}° N and their loads say so.`}
      />
      <div role="group" aria-label="Hemisphere" className="flex gap-2">
        {(['N', 'S'] as const satisfies readonly Hemisphere[]).map((h) => (
          <button
            key={h}
            type="button"
            aria-pressed={field.value === h}
            className={toggleClass(field.value === h)}
            onClick={() => field.onChange(h)}
          >
            {h === 'N' ? 'North (N)' : 'South (S)'}
          </button>
        ))}
      </div>
    </div>
  );
}
