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

const DUCT_LOCATIONS = [
  { value: 'none', label: 'No ducted system (ductless or none yet)' },
  { value: 'conditioned', label: 'Ducts inside the conditioned space' },
  { value: 'attic', label: 'Ducts in the attic' },
  { value: 'crawlspace', label: 'Ducts in a crawl space' },
  { value: 'garage', label: 'Ducts in the garage' },
  { value: 'basement', label: 'Ducts in an unheated basement' },
];

const DUCT_LEAKAGE = [
  { value: 'sealed', label: 'Sealed and tested (about 4 % each side)' },
  { value: 'typical', label: 'Typical (about 10 % each side)' },
  { value: 'leaky', label: 'Leaky (about 20 % each side)' },
];

/** The construction classes of the radiant time factors in words a person at the house can tell apart. */
// Short enough to read whole in a phone's select (375 px); what each class means is in the field's hint.
const THERMAL_MASS = [
  { value: 'medium', label: 'Medium (most houses)' },
  { value: 'light', label: 'Light' },
  { value: 'heavy', label: 'Heavy' },
];

const num = (v: unknown) => (typeof v === 'number' ? v : undefined);
const ductsOf = (h: HouseDraft): Record<string, unknown> =>
  typeof h.ducts === 'object' && h.ducts !== null ? (h.ducts as Record<string, unknown>) : {};
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
  const d = ductsOf(value);
  const ductLocation = typeof d.location === 'string' ? d.location : 'none';
  const setDucts = (key: string, x: unknown) => {
    const next: Record<string, unknown> = { ...d, location: ductLocation };
    if (x === undefined) delete next[key];
    else next[key] = x;
    set('ducts', next);
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
        <SelectInput
          label="How much heat the house stores"
          value={typeof value.thermalMass === 'string' ? value.thermalMass : 'medium'}
          options={THERMAL_MASS}
          hint="Light: frame walls, wood floors over a crawl space or basement. Medium: frame or brick-veneer walls on a concrete slab. Heavy: solid masonry or concrete walls and floors. Sets how long the sun through the windows takes to warm the rooms (ASHRAE radiant time series). Not sure: medium."
          onChange={(k) => set('thermalMass', k === 'medium' ? undefined : k)}
        />
        <SelectInput
          label="Ducted system: where the ducts run"
          value={ductLocation}
          options={DUCT_LOCATIONS}
          onChange={(k) => set('ducts', k === 'none' ? undefined : { ...d, location: k })}
        />
        {ductLocation !== 'none' && ductLocation !== 'conditioned' ? (
          <>
            <NumberInput
              label="Duct insulation"
              unit="R"
              value={num(d.insulationR)}
              error={errors.get('ducts.insulationR')}
              hint="0 for bare metal. Empty: R-6."
              onChange={(x) => setDucts('insulationR', x)}
            />
            <SelectInput
              label="Duct leakage"
              value={typeof d.leakage === 'string' ? d.leakage : 'typical'}
              options={DUCT_LEAKAGE}
              onChange={(k) => setDucts('leakage', k)}
            />
          </>
        ) : null}
      </div>
    </fieldset>
  );
}
