import { useState } from 'react';
import { ControlledField, type FieldFrameProps } from './controlled-field';

/**
 * A box the estimator types in, its form value read from and made of the text: what is being typed stays
 * on screen as typed until the box is left, then the form's value shows as `fromValue` writes it.
 */
function TypedField({
  toValue,
  fromValue,
  inputMode,
  ...frame
}: FieldFrameProps & {
  toValue: (typed: string) => unknown;
  fromValue: (value: unknown) => string;
  inputMode?: 'decimal';
}) {
  const [typed, setTyped] = useState<string | null>(null);
  return (
    <ControlledField {...frame}>
      {(field, control) => (
        <input
          {...control}
          type="text"
          inputMode={inputMode}
          autoComplete="off"
          value={typed ?? fromValue(field.value)}
          onChange={(e) => {
            setTyped(e.target.value);
            field.onChange(toValue(e.target.value));
          }}
          onBlur={() => {
            setTyped(null);
            field.onBlur();
          }}
        />
      )}
    </ControlledField>
  );
}

/**
 * A number the estimator types, held as a number in the form. A value not entered yet is NaN in the
 * form (the schema's "enter a number" names it) and an empty box on screen, never the text "NaN". An
 * `optional` field left empty is absent (undefined): the schema's default or "not given" applies.
 */
export function AmountField({ optional = false, ...frame }: FieldFrameProps & { optional?: boolean }) {
  return (
    <TypedField
      {...frame}
      inputMode="decimal"
      fromValue={(v) => (typeof v === 'number' && Number.isFinite(v) ? String(v) : '')}
      toValue={(typed) => (typed.trim() === '' ? (optional ? undefined : Number.NaN) : Number(typed))}
    />
  );
}

/** A short text the estimator may leave empty: empty is absent (undefined), so the schema's "not given" applies. */
export function OptionalTextField(frame: FieldFrameProps) {
  return (
    <TypedField
      {...frame}
      fromValue={(v) => (typeof v === 'string' ? v : '')}
      toValue={(typed) => (typed === '' ? undefined : typed)}
    />
  );
}
