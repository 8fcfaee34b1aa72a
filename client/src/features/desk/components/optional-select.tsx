import { useId } from 'react';
import { useController, useFormContext } from 'react-hook-form';
import { FieldShell, inputClass, SelectOptions } from '../../../components/ui/field-shell';

/**
 * A select for an optional field: its first choice ('') leaves the field out (undefined), as calc's schema
 * wants for "no heat kit", "no ducts" or "the zone's first room"; `onPick` may set more than the field.
 */
export function OptionalSelect({
  name,
  label,
  hint,
  options,
  toValue = (v) => (v === '' ? undefined : v),
  fromValue = (v) => (typeof v === 'string' ? v : ''),
}: {
  name: string;
  label: string;
  hint?: string;
  options: readonly { value: string; label: string }[];
  toValue?: (chosen: string, current: unknown) => unknown;
  fromValue?: (value: unknown) => string;
}) {
  const id = useId();
  const { control } = useFormContext();
  const { field, fieldState } = useController({ name, control });
  const error = fieldState.error?.message;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <select
        id={id}
        ref={field.ref}
        name={field.name}
        className={inputClass}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        value={fromValue(field.value)}
        onChange={(e) => field.onChange(toValue(e.target.value, field.value))}
        onBlur={field.onBlur}
      >
        <SelectOptions options={options} />
      </select>
    </FieldShell>
  );
}

/**
 * A select that holds its value through the form (controlled). The desk's forms use it rather than a
 * registered select: in field-array rows a registered select took its first choice on mount ("Choose an
 * indoor unit"), so a stored design looked changed right after it was saved.
 */
export function Choice(props: {
  name: string;
  label: string;
  hint?: string;
  options: readonly { value: string; label: string }[];
}) {
  return <OptionalSelect {...props} toValue={(v) => v} />;
}
