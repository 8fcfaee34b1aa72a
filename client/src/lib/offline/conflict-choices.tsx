import { useState } from 'react';
import { Button } from '../../components/ui/button';
import type { Choice, FieldDiff } from './conflict';

interface Props {
  title: string;
  diffs: readonly FieldDiff[];
  onResolve: (choices: Record<string, Choice>) => void;
  busy?: boolean;
  /** How a field's value reads to the person. */
  describe?: (key: string, value: unknown) => string;
  /** Where and when the other change was made (`changedLine`). */
  changed: string;
}

function plain(_key: string, v: unknown): string {
  if (v === undefined || v === null || v === '') return '—';
  return typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean' ? String(v) : JSON.stringify(v);
}

/** Yours and theirs side by side, per field, with a choice for each. */
export function ConflictChoices({ title, diffs, onResolve, busy = false, describe = plain, changed }: Props) {
  const [choices, setChoices] = useState<Record<string, Choice>>(() =>
    Object.fromEntries(diffs.map((d) => [d.key, 'mine'])),
  );
  const all = (c: Choice) => Object.fromEntries(diffs.map((d) => [d.key, c]));
  return (
    <section
      aria-label="Resolve conflicting changes"
      className="flex flex-col gap-3 rounded-lg border-2 border-danger bg-white p-4"
    >
      <h2 className="text-lg font-semibold text-danger">{title}</h2>
      <p>
        <strong className="font-semibold">{changed}</strong> Choose which value to keep for each field.
      </p>
      {diffs.length === 0 ? (
        <p className="text-muted">Their version and yours are the same; nothing to choose.</p>
      ) : null}
      {diffs.map((d) => (
        <fieldset key={d.key} className="rounded-md border border-line p-3">
          <legend className="px-1 font-semibold text-ink-900">{d.label}</legend>
          <div className="grid gap-2 sm:grid-cols-2">
            {(['mine', 'theirs'] as const).map((side) => (
              <label
                key={side}
                className="flex min-h-touch cursor-pointer items-start gap-2 rounded-md border border-line p-2 has-[:checked]:border-ink-700 has-[:checked]:bg-ink-50"
              >
                <input
                  type="radio"
                  className="mt-1 size-5"
                  name={`choice-${d.key}`}
                  checked={choices[d.key] === side}
                  onChange={() => setChoices({ ...choices, [d.key]: side })}
                  aria-label={`${d.label}: keep ${side === 'mine' ? 'yours' : 'theirs'}`}
                />
                <span>
                  <span className="block text-sm font-semibold">
                    {side === 'mine' ? 'Yours' : 'Theirs (saved now)'}
                  </span>
                  <span className="block break-words">{describe(d.key, side === 'mine' ? d.mine : d.theirs)}</span>
                </span>
              </label>
            ))}
          </div>
        </fieldset>
      ))}
      <div className="flex flex-wrap gap-2">
        <Button busy={busy} onClick={() => onResolve(choices)}>
          Save my choices
        </Button>
        <Button variant="secondary" disabled={busy} onClick={() => onResolve(all('mine'))}>
          Keep all mine
        </Button>
        <Button variant="secondary" disabled={busy} onClick={() => onResolve(all('theirs'))}>
          Keep all theirs
        </Button>
      </div>
    </section>
  );
}
