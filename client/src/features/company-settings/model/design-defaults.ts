import { z } from 'zod';
import { designConditionsSchema } from '@calc';
import { DESIGN_FIELDS, type DesignField, type StoredDesign, type UnitSystem } from '@contract';
import { DESIGN_FIELD_SPECS, type DesignFieldSpec } from '../../../entities/job/design-fields';
import { fromDisplay, toDisplay } from '../../../lib/unit-display';

/**
 * The company design-defaults form: values as the owner reads them (the company's units, latitude as
 * degrees with N or S, the month by name), turned into calc's canonical design conditions on submit and
 * checked with calc's own schema, so the page refuses exactly what the server refuses.
 */

export type Hemisphere = 'N' | 'S';

const number = z.number({ error: 'Enter a number' }).optional();
const text = z.string().trim().max(200, { message: 'Source must be at most 200 characters' });

type NumberFields = Exclude<DesignField, 'designMonth'>;
const numberShape = Object.fromEntries(
  DESIGN_FIELDS.filter((f) => f !== 'designMonth').map((f) => [f, number]),
) as Record<NumberFields, typeof number>;

/** What the form holds: every number in display units, empty = not set. */
export const displayDefaultsSchema = z.object({
  defaultDesignConditions: z.object({
    ...numberShape,
    designMonth: z.string(),
    source: text,
    clearSkySource: text,
  }),
  hemisphere: z.enum(['N', 'S']),
});
export type DisplayDefaults = z.input<typeof displayDefaultsSchema>;
type DisplayConditions = DisplayDefaults['defaultDesignConditions'];

export const specOf = (key: DesignField): DesignFieldSpec => {
  const spec = DESIGN_FIELD_SPECS.find((s) => s.key === key);
  if (!spec) throw new Error(`No field spec for ${key}`);
  return spec;
};

/** calc's bounds of one design field (canonical units), read from its schema so they cannot drift. */
export function boundsOf(key: DesignField): { min: number; max: number } | null {
  let t: z.ZodType = designConditionsSchema.shape[key];
  while (t instanceof z.ZodOptional || t instanceof z.ZodDefault) t = t.unwrap() as z.ZodType;
  if (!(t instanceof z.ZodNumber) || t.minValue === null || t.maxValue === null) return null;
  return { min: t.minValue, max: t.maxValue };
}

const numberOf = (stored: StoredDesign | null, key: DesignField): number | undefined => {
  const v = stored?.[key];
  return typeof v === 'number' ? v : undefined;
};

/** The saved defaults as the form shows them. */
export function toDisplayDefaults(stored: StoredDesign | null, system: UnitSystem): DisplayDefaults {
  const d: DisplayConditions = {
    designMonth: String(numberOf(stored, 'designMonth') ?? ''),
    source: typeof stored?.source === 'string' ? stored.source : '',
    clearSkySource: typeof stored?.clearSkySource === 'string' ? stored.clearSkySource : '',
  };
  for (const f of DESIGN_FIELDS) {
    if (f === 'designMonth') continue;
    const v = numberOf(stored, f);
    d[f] = v === undefined ? undefined : f === 'latitudeDeg' ? Math.abs(v) : toDisplay(specOf(f).quantity, system, v);
  }
  const latitude = numberOf(stored, 'latitudeDeg');
  return { defaultDesignConditions: d, hemisphere: latitude !== undefined && latitude < 0 ? 'S' : 'N' };
}

/**
 * The form's values → calc's input. A value shown unchanged keeps its saved canonical figure, so saving
 * a metric company's page does not move 91 °F to 91.04 °F through a rounded 32.8 °C.
 */
export function toCanonical(
  values: z.output<typeof displayDefaultsSchema>,
  stored: StoredDesign | null,
  system: UnitSystem,
): Record<string, unknown> {
  const shown = toDisplayDefaults(stored, system).defaultDesignConditions;
  const d = values.defaultDesignConditions;
  const out: Record<string, unknown> = {};
  for (const f of DESIGN_FIELDS) {
    if (f === 'designMonth') continue;
    const v = d[f];
    if (v === undefined) continue;
    if (f === 'latitudeDeg') out[f] = values.hemisphere === 'S' ? -v : v;
    else out[f] = v === shown[f] ? numberOf(stored, f) : fromDisplay(specOf(f).quantity, system, v);
  }
  if (d.designMonth !== '') out.designMonth = Number(d.designMonth);
  if (d.source) out.source = d.source;
  if (d.clearSkySource) out.clearSkySource = d.clearSkySource;
  return out;
}

/** The form's schema: display values, then calc's design-conditions check on the canonical figures. */
export function defaultsFormSchema(stored: StoredDesign | null, system: UnitSystem) {
  return displayDefaultsSchema
    .transform((values) => ({ defaultDesignConditions: toCanonical(values, stored, system) }))
    .pipe(z.object({ defaultDesignConditions: designConditionsSchema }));
}

/** "50–130 °F", in the company's units: the hint under each number. */
export function rangeText(key: DesignField, system: UnitSystem, unit: string): string | null {
  const b = boundsOf(key);
  if (!b) return null;
  if (key === 'latitudeDeg') return `Between 60° S and 70° N`;
  const q = specOf(key).quantity;
  const lo = toDisplay(q, system, b.min);
  const hi = toDisplay(q, system, b.max);
  return `Between ${lo} and ${hi}${unit ? ` ${unit}` : ''}`;
}
