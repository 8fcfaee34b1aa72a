import { useEffect, useId, useState, type ReactNode } from 'react';
import { FieldShell, inputClass } from '../../../components/ui/field-shell';

/** Text of a number as the person typed it; '' is "not entered yet". */
const show = (v: number | null) => (v === null ? '' : String(v));

/**
 * A number field for gloved hands: big, numeric keypad, the unit beside it and the refusal under it.
 * `onValue` gets null for an empty box and `undefined` while the text is not a number (the caller shows
 * the field as not saved and sends nothing for it).
 */
export function NumberBox({
  label,
  unit,
  value,
  error,
  hint,
  onValue,
  className,
}: {
  label: string;
  unit?: string;
  value: number | null;
  error?: string | undefined;
  hint?: ReactNode;
  onValue: (v: number | null | undefined) => void;
  className?: string;
}) {
  const id = useId();
  const [text, setText] = useState(show(value));
  // A value changed from outside (a conflict resolved, the record reloaded) replaces the text shown.
  useEffect(() => {
    setText((t) => (Number(t) === value || (t.trim() === '' && value === null) ? t : show(value)));
  }, [value]);
  const parsed = text.trim() === '' ? null : Number(text.replace(',', '.'));
  const notNumber = parsed !== null && !Number.isFinite(parsed);
  const message = notNumber ? 'Enter a number.' : error;
  return (
    <FieldShell id={id} label={label} unit={unit} error={message} hint={hint} className={className}>
      <input
        id={id}
        className={`${inputClass} text-lg`}
        inputMode="decimal"
        autoComplete="off"
        value={text}
        aria-invalid={message ? true : undefined}
        aria-describedby={
          [message ? `${id}-error` : '', hint ? `${id}-hint` : '', unit ? `${id}-unit` : '']
            .filter(Boolean)
            .join(' ') || undefined
        }
        onChange={(e) => {
          const t = e.target.value;
          setText(t);
          const v = t.trim() === '' ? null : Number(t.replace(',', '.'));
          onValue(v !== null && !Number.isFinite(v) ? undefined : v);
        }}
      />
    </FieldShell>
  );
}

export function TextBox({
  label,
  value,
  error,
  hint,
  onValue,
  multiline = false,
  className,
}: {
  label: string;
  value: string;
  error?: string | undefined;
  hint?: ReactNode;
  onValue: (v: string) => void;
  multiline?: boolean;
  className?: string;
}) {
  const id = useId();
  const common = {
    id,
    value,
    'aria-invalid': error ? true : undefined,
    'aria-describedby': error ? `${id}-error` : hint ? `${id}-hint` : undefined,
  } as const;
  return (
    <FieldShell id={id} label={label} error={error} hint={hint} className={className}>
      {multiline ? (
        <textarea {...common} rows={4} className={`${inputClass} py-2`} onChange={(e) => onValue(e.target.value)} />
      ) : (
        <input {...common} className={inputClass} onChange={(e) => onValue(e.target.value)} />
      )}
    </FieldShell>
  );
}

/** The cautions beside pressure and refrigerant fields (DESIGN.md Safety), deferring to the maker and codes. */
export function Cautions({ items, title = 'Before you start' }: { items: readonly string[]; title?: string }) {
  return (
    <aside aria-label={title} className="rounded-md border-2 border-amber-line bg-amber-soft p-3 text-amber-deep">
      <p className="font-semibold">⚠ {title}</p>
      <ul className="mt-1 list-disc pl-5 text-sm">
        {items.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </aside>
  );
}

/** calc's verdict on a step, in words, pass or not. */
export function Verdict({ pass, words, detail }: { pass: boolean | null; words: string; detail?: string }) {
  const look =
    pass === null
      ? 'border-line bg-ink-50 text-ink-800'
      : pass
        ? 'border-ok bg-ok-soft text-ok'
        : 'border-danger bg-danger-soft text-danger';
  return (
    <div className={`rounded-md border-2 p-3 ${look}`} role="note">
      <p className="font-semibold">{pass === null ? words : `${pass ? '✓ Passes' : '✗ Does not pass'} — ${words}`}</p>
      {detail ? <p className="mt-1 text-sm text-ink-800">{detail}</p> : null}
    </div>
  );
}
