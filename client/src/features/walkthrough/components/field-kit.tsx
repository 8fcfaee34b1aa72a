import { formatTape, formatTapeCm, parseTape } from '@calc';
import type { UnitSystem } from '@contract';
import { memo, useEffect, useId, useState, type ReactNode } from 'react';
import { FieldShell, inputClass, SelectOptions } from '../../../components/ui/field-shell';
import { fromDisplay, localiseBound, toDisplay, unitLabel, type Quantity } from '../../../lib/unit-display';
import { useUnitSystem } from './unit-system';

const aria = (id: string, error: string | undefined, hint: boolean, unit = false) => ({
  'aria-invalid': error ? true : undefined,
  // The unit is read with the field ("Length, ft") without becoming part of its name.
  'aria-describedby':
    [unit ? `${id}-unit` : '', error ? `${id}-error` : '', hint ? `${id}-hint` : ''].filter(Boolean).join(' ') ||
    undefined,
});

interface NumberProps {
  label: string;
  value: number | undefined;
  onChange: (value: number | undefined) => void;
  quantity?: Quantity;
  /** Unit of a plain quantity (count, Btu/h, W). */
  unit?: string;
  error?: string | undefined;
  hint?: ReactNode;
  integer?: boolean;
}

const format = (v: number | undefined) => (v === undefined || Number.isNaN(v) ? '' : String(v));

/**
 * What the text in a field means, in canonical units: undefined when empty, NaN (with the
 * reason) when it cannot be read. Lengths in feet go through calc's tape-measure parser
 * (`12'6"`, `12 ft 6 in`, `380 cm`); other quantities are plain numbers.
 */
function readField(
  raw: string,
  quantity: Quantity,
  system: UnitSystem,
): { value: number | undefined; refusal?: string; understood?: string } {
  const t = raw.trim();
  if (t === '') return { value: undefined };
  if (quantity === 'ft') {
    const r = parseTape(t, system);
    if (!r.ok) return { value: Number.NaN, refusal: r.message };
    if (system === 'metric')
      return { value: r.feet, understood: `= ${formatTape(r.feet, 'metric')} (${formatTapeCm(r.feet)})` };
    // Whole feet typed as a number need no echo: the unit beside the field already says "ft".
    return { value: r.feet, understood: /^\d+$/.test(t) ? undefined : `= ${formatTape(r.feet)}` };
  }
  if (quantity === 'in') {
    // A plain number is inches (cm for a metric company), as the unit beside the field says;
    // anything else is read as a tape measure reads (3' 2", 3 ft 2 in, 38", 96 cm).
    if (/^\d+(\.\d+)?$/.test(t)) return { value: fromDisplay(quantity, system, Number(t)) };
    if (/^\d+,\d+$/.test(t))
      return {
        value: Number.NaN,
        refusal: `Did you mean ${t.replace(',', '.')} ${system === 'metric' ? 'cm' : 'in'}?`,
      };
    const r = parseTape(t, system);
    if (!r.ok) return { value: Number.NaN, refusal: r.message };
    const inches = r.feet * 12;
    return {
      value: inches,
      understood: system === 'metric' ? `= ${formatTapeCm(r.feet)}` : `= ${formatTape(r.feet)}`,
    };
  }
  const n = Number(t.replace(',', '.'));
  return { value: Number.isNaN(n) ? Number.NaN : fromDisplay(quantity, system, n) };
}

const sameValue = (a: number | undefined, b: number | undefined) =>
  a === b || (a !== undefined && b !== undefined && Number.isNaN(a) && Number.isNaN(b));

/*
 * The fields are memoised: one whose props are all the same as last time (the room editor hands each a setter
 * that keeps its identity) is skipped when another field's key re-renders the form around it (issue 11).
 */

/**
 * A number on the phone's decimal keypad, shown in the company's units. Empty → undefined,
 * text → NaN, so calc's schema says what is wrong. Keeps the typed text while it parses
 * to the same number ("8." stays "8.").
 */
export const NumberInput = memo(function NumberInput({
  label,
  value,
  onChange,
  quantity = 'plain',
  unit = '',
  error: canonicalError,
  hint,
  integer = false,
}: NumberProps) {
  const id = useId();
  const system = useUnitSystem();
  const shown = value === undefined || Number.isNaN(value) ? value : toDisplay(quantity, system, value);
  const [text, setText] = useState(format(shown));
  const read = readField(text, quantity, system);
  // A refusal from the tape parser ("Did you mean 12.5 ft?") says more than the schema's "enter a number".
  const error = read.refusal ?? localiseBound(canonicalError, quantity, system);
  useEffect(() => {
    const typed = readField(text, quantity, system).value;
    const typedShown = typed === undefined || Number.isNaN(typed) ? typed : toDisplay(quantity, system, typed);
    if (!sameValue(typedShown, shown)) setText(format(shown));
    // Only an outside change of the value (copy, conflict choice) rewrites the text.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [shown]);
  const handleChange = (raw: string) => {
    setText(raw);
    onChange(readField(raw, quantity, system).value);
  };
  // Imperial lengths need the ' and " keys, so they get the full keyboard.
  const tapeKeys = (quantity === 'ft' || quantity === 'in') && system === 'imperial';
  const fieldHint =
    read.understood !== undefined && !error ? (
      <>
        <span className="font-semibold text-ink-900">{read.understood}</span>
        {hint ? <> · {hint}</> : null}
      </>
    ) : (
      hint
    );
  return (
    <FieldShell id={id} label={label} error={error} hint={fieldHint} unit={unitLabel(quantity, system, unit)}>
      <input
        id={id}
        type="text"
        inputMode={tapeKeys ? 'text' : integer ? 'numeric' : 'decimal'}
        autoComplete="off"
        className={inputClass}
        value={text}
        onChange={(e) => handleChange(e.target.value)}
        {...aria(id, error, fieldHint !== undefined, unitLabel(quantity, system, unit) !== '')}
      />
    </FieldShell>
  );
});

interface TextProps {
  label: string;
  value: string;
  onChange: (value: string) => void;
  error?: string | undefined;
  multiline?: boolean;
}

export const TextInput = memo(function TextInput({ label, value, onChange, error, multiline = false }: TextProps) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} error={error}>
      {multiline ? (
        <textarea
          id={id}
          rows={3}
          className={`${inputClass} py-2`}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          {...aria(id, error, false)}
        />
      ) : (
        <input
          id={id}
          type="text"
          className={inputClass}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          {...aria(id, error, false)}
        />
      )}
    </FieldShell>
  );
});

interface SelectProps {
  label: string;
  value: string;
  onChange: (value: string) => void;
  options: readonly { readonly value: string; readonly label: string }[];
  error?: string | undefined;
  hint?: ReactNode;
}

/**
 * A phone's select shows about 14 characters in half a row and about 30 in a whole one; a choice longer than
 * that was cut short ("2×4 wood fran…", "Double pan…"). Such a select takes the whole row of a two-column grid,
 * and a choice longer than a whole row is also written out under the box, for the eye only (the select itself
 * tells a screen reader), as the desk's selects do.
 */
const HALF_ROW_CHOICE = 14;
const WHOLE_ROW_CHOICE = 30;

export const SelectInput = memo(function SelectInput({ label, value, onChange, options, error, hint }: SelectProps) {
  const id = useId();
  const longest = options.reduce((n, o) => Math.max(n, o.label.length), 0);
  const chosen = options.find((o) => o.value === value)?.label ?? '';
  return (
    <FieldShell
      id={id}
      label={label}
      error={error}
      hint={hint}
      className={longest > HALF_ROW_CHOICE ? '[.grid-cols-2>&]:col-span-2' : undefined}
    >
      <select
        id={id}
        className={inputClass}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        {...aria(id, error, hint !== undefined)}
      >
        <SelectOptions options={options} />
      </select>
      {chosen.length > WHOLE_ROW_CHOICE ? (
        <p className="text-sm text-ink-900 sm:hidden" aria-hidden="true" data-testid="chosen-in-full">
          {chosen}
        </p>
      ) : null}
    </FieldShell>
  );
});
