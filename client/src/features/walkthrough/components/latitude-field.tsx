import { useState, type ReactNode } from 'react';
import { NumberInput } from './field-kit';

type Hemisphere = 'N' | 'S';

const toggleClass = (on: boolean) =>
  `min-h-touch min-w-14 rounded-md border px-4 text-base font-semibold ${
    on ? 'border-ink-900 bg-ink-900 text-white' : 'border-line bg-white text-ink-900'
  }`;

/**
 * Latitude as people read it off a map: degrees and N or S (two large buttons, usable in gloves).
 * Stored signed (south negative), which is what calc's schema takes.
 */
export function LatitudeField({
  value,
  error,
  hint,
  onChange,
}: {
  value: number | undefined;
  error: string | undefined;
  hint: ReactNode;
  onChange: (signed: number | undefined) => void;
}) {
  const [picked, setPicked] = useState<Hemisphere>(value !== undefined && value < 0 ? 'S' : 'N');
  const hemisphere: Hemisphere =
    value !== undefined && value < 0 ? 'S' : value !== undefined && value > 0 ? 'N' : picked;
  const magnitude = value === undefined || Number.isNaN(value) ? value : Math.abs(value);
  const send = (m: number | undefined, h: Hemisphere) =>
    onChange(m === undefined || Number.isNaN(m) ? m : h === 'S' ? -m : m);
  // calc's bounds are signed (−60 … 70); say them the way the field is read
  const shownError = error?.startsWith('Latitude must be between') ? 'Latitude must be between 60° S and 70° N' : error;
  return (
    <div className="flex flex-col gap-2">
      <NumberInput
        label="Latitude"
        unit="°"
        value={magnitude}
        error={shownError}
        hint={hint}
        onChange={(m) => send(m, hemisphere)}
      />
      <div role="group" aria-label="Hemisphere" className="flex gap-2">
        {(['N', 'S'] as const).map((h) => (
          <button
            key={h}
            type="button"
            aria-pressed={hemisphere === h}
            className={toggleClass(hemisphere === h)}
            onClick={() => {
              setPicked(h);
              send(magnitude, h);
            }}
          >
            {h === 'N' ? 'North (N)' : 'South (S)'}
          </button>
        ))}
      </div>
    </div>
  );
}
