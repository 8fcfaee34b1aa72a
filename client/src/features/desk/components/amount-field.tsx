import { useId, useState } from 'react';
import { useController, useFormContext } from 'react-hook-form';
import { FieldShell, inputClass } from '../../../components/ui/field-shell';

/**
 * A number the estimator types, held as a number in the form. A value not entered yet is NaN in the
 * form (the schema's "enter a number" names it) and an empty box on screen, never the text "NaN". An
 * `optional` field left empty is absent (undefined): the schema's default or "not given" applies.
 */
export function AmountField({
  name,
  label,
  hint,
  optional = false,
}: {
  name: string;
  label: string;
  hint?: string;
  optional?: boolean;
}) {
  const id = useId();
  const { control } = useFormContext();
  const { field, fieldState } = useController({ name, control });
  const shown = typeof field.value === 'number' && Number.isFinite(field.value) ? String(field.value) : '';
  const [typed, setTyped] = useState<string | null>(null);
  const error = fieldState.error?.message;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <input
        id={id}
        ref={field.ref}
        name={field.name}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        className={inputClass}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        value={typed ?? shown}
        onChange={(e) => {
          setTyped(e.target.value);
          const empty = e.target.value.trim() === '';
          field.onChange(empty ? (optional ? undefined : Number.NaN) : Number(e.target.value));
        }}
        onBlur={() => {
          setTyped(null);
          field.onBlur();
        }}
      />
    </FieldShell>
  );
}

/** A short text the estimator may leave empty: empty is absent (undefined), so the schema's "not given" applies. */
export function OptionalTextField({ name, label, hint }: { name: string; label: string; hint?: string }) {
  const id = useId();
  const { control } = useFormContext();
  const { field, fieldState } = useController({ name, control });
  const error = fieldState.error?.message;
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <input
        id={id}
        ref={field.ref}
        name={field.name}
        type="text"
        autoComplete="off"
        className={inputClass}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        value={typeof field.value === 'string' ? field.value : ''}
        onChange={(e) => field.onChange(e.target.value === '' ? undefined : e.target.value)}
        onBlur={field.onBlur}
      />
    </FieldShell>
  );
}
