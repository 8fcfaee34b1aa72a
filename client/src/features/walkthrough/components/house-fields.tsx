import { houseSchema } from '@calc';
import { NumberInput, SelectInput } from './field-kit';

/** The whole-house facts as the form holds them (calc's houseSchema checks them before they are saved). */
export type HouseDraft = Record<string, unknown>;

const VENTILATION = [
  { value: 'none', label: 'None (leakage only)' },
  { value: 'exhaust', label: 'Exhaust fan(s) running continuously' },
  { value: 'supply', label: 'Supply fan running continuously' },
  { value: 'balanced', label: 'Balanced, no heat recovery' },
  { value: 'erv-hrv', label: 'ERV or HRV (heat recovery)' },
];

const num = (v: unknown) => (typeof v === 'number' ? v : undefined);
const vent = (h: HouseDraft): Record<string, unknown> =>
  typeof h.ventilation === 'object' && h.ventilation !== null ? (h.ventilation as Record<string, unknown>) : {};

/** Each field's message from calc's houseSchema, by its path. */
function houseErrors(h: HouseDraft): Map<string, string> {
  const out = new Map<string, string>();
  const r = houseSchema.safeParse(h);
  if (!r.success) for (const i of r.error.issues) out.set(i.path.join('.'), i.message);
  return out;
}

/** Bedrooms, a blower-door result and the ventilation system: what the loads use beyond the rooms. */
export function HouseFields({ value, onChange }: { value: HouseDraft; onChange: (next: HouseDraft) => void }) {
  const errors = houseErrors(value);
  const v = vent(value);
  const kind = typeof v.kind === 'string' ? v.kind : 'none';
  const set = (key: string, x: unknown) => {
    const next: HouseDraft = { ...value };
    if (x === undefined) delete next[key];
    else next[key] = x;
    onChange(next);
  };
  const setVent = (key: string, x: unknown) => {
    const next: Record<string, unknown> = { ...v, kind };
    if (x === undefined) delete next[key];
    else next[key] = x;
    set('ventilation', next);
  };
  return (
    <fieldset className="flex flex-col gap-4 rounded-md border border-line p-3">
      <legend className="px-1 text-base font-semibold text-ink-900">The whole house</legend>
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberInput
          label="Bedrooms"
          integer
          value={num(value.bedrooms)}
          error={errors.get('bedrooms')}
          hint="Sets the 62.2 ventilation rate and the default occupants (bedrooms + 1). Empty: rooms named “bed…” are counted."
          onChange={(x) => set('bedrooms', x)}
        />
        <NumberInput
          label="Blower-door result at 50 Pa"
          unit="CFM50"
          value={num(value.blowerDoorCfm50)}
          error={errors.get('blowerDoorCfm50')}
          hint="When entered it replaces the tightness guess: winter ACH = CFM50 × 60 ÷ volume ÷ 20."
          onChange={(x) => set('blowerDoorCfm50', x)}
        />
        <SelectInput
          label="Whole-house ventilation"
          value={kind}
          options={VENTILATION}
          onChange={(k) => set('ventilation', k === 'none' ? undefined : { ...v, kind: k })}
        />
        {kind !== 'none' ? (
          <NumberInput
            label="Ventilation airflow"
            unit="cfm"
            value={num(v.cfm)}
            error={errors.get('ventilation.cfm')}
            hint="Empty: the ASHRAE 62.2 rate, 0.03 cfm per ft² + 7.5 cfm × (bedrooms + 1)."
            onChange={(x) => setVent('cfm', x)}
          />
        ) : null}
        {kind === 'erv-hrv' ? (
          <>
            <NumberInput
              label="Sensible recovery (0–0.95)"
              value={num(v.sensibleEffectiveness)}
              error={errors.get('ventilation.sensibleEffectiveness')}
              hint="From the unit’s rating. Empty: 0.6."
              onChange={(x) => setVent('sensibleEffectiveness', x)}
            />
            <NumberInput
              label="Latent recovery (0–0.9; an HRV is 0)"
              value={num(v.latentEffectiveness)}
              error={errors.get('ventilation.latentEffectiveness')}
              hint="Empty: 0 (no moisture recovered)."
              onChange={(x) => setVent('latentEffectiveness', x)}
            />
          </>
        ) : null}
      </div>
    </fieldset>
  );
}
