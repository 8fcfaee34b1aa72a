import { z } from 'zod';
import { designConditionsSchema, type DesignConditions } from '@calc';
import { ValidationError } from '../../lib/errors';
import { zodToFieldErrors } from '../../lib/validate';

export type DesignField = Exclude<keyof DesignConditions, 'source'>;

/** Every numeric design value, in calc's order. `satisfies` keeps it in step with calc's schema. */
export const DESIGN_FIELDS = [
  'outdoorCoolingDryBulbF',
  'outdoorCoolingWetBulbF',
  'outdoorCoolingGrains',
  'outdoorHeatingDryBulbF',
  'indoorCoolingF',
  'indoorHeatingF',
  'indoorCoolingRhPercent',
  'dailyRangeF',
  'elevationFt',
] as const satisfies readonly DesignField[];

/**
 * entered: typed for this job; company-default: taken from the company settings;
 * standard-default: neither gave a value, so calc's built-in default (e.g. 75 °F indoor cooling) applies.
 */
export const DESIGN_VALUE_SOURCES = ['entered', 'company-default', 'standard-default'] as const;
export type DesignValueSource = (typeof DESIGN_VALUE_SOURCES)[number];
export type DesignSources = Partial<Record<DesignField, { source: DesignValueSource; note: string }>>;

const value = z.number({ error: 'Enter a number' }).optional();
/** What the person typed; omitted fields fall back to the company default. calc applies the bounds. */
export const enteredDesignSchema = z.strictObject({
  outdoorCoolingDryBulbF: value,
  outdoorCoolingWetBulbF: value,
  outdoorCoolingGrains: value,
  outdoorHeatingDryBulbF: value,
  indoorCoolingF: value,
  indoorHeatingF: value,
  indoorCoolingRhPercent: value,
  dailyRangeF: value,
  elevationFt: value,
  source: z.string().trim().max(200, { message: 'Source must be at most 200 characters' }).optional(),
});
export type EnteredDesign = z.output<typeof enteredDesignSchema>;

export const designNotesSchema = z.partialRecord(
  z.enum(DESIGN_FIELDS, { message: 'Unknown design condition' }),
  z.string().trim().max(200, { message: 'A source note must be at most 200 characters' }),
);
export type DesignNotes = z.output<typeof designNotesSchema>;

const HUMIDITY: readonly DesignField[] = ['outdoorCoolingWetBulbF', 'outdoorCoolingGrains'];

/** Merges entered values over the company defaults, validates with calc and records each value's source. */
export function resolveDesignConditions(
  entered: EnteredDesign,
  notes: DesignNotes,
  companyDefault: DesignConditions | null,
): { conditions: DesignConditions; sources: DesignSources } {
  const candidate: Partial<Record<DesignField, number>> = {};
  const origin: Partial<Record<DesignField, DesignValueSource>> = {};
  // Wet bulb and grains are alternatives: typing one must not keep the default of the other.
  const humidityEntered = HUMIDITY.some((f) => entered[f] !== undefined);
  for (const f of DESIGN_FIELDS) {
    const typed = entered[f];
    const fallback = humidityEntered && HUMIDITY.includes(f) ? undefined : companyDefault?.[f];
    if (typed !== undefined) [candidate[f], origin[f]] = [typed, 'entered'];
    else if (fallback !== undefined) [candidate[f], origin[f]] = [fallback, 'company-default'];
  }
  const source = entered.source ?? companyDefault?.source;
  const parsed = designConditionsSchema.safeParse({ ...candidate, ...(source ? { source } : {}) });
  if (!parsed.success) {
    throw new ValidationError(
      zodToFieldErrors(parsed.error).map((e) => ({ ...e, path: `designConditions.${e.path}` })),
    );
  }
  const sources: DesignSources = {};
  for (const f of DESIGN_FIELDS) {
    if (parsed.data[f] === undefined) continue;
    sources[f] = { source: origin[f] ?? 'standard-default', note: notes[f] ?? '' };
  }
  return { conditions: parsed.data, sources };
}

/** The values a job's person typed, so a later edit of only the notes keeps them. */
export function enteredOf(conditions: DesignConditions | null, sources: DesignSources): EnteredDesign {
  const out: EnteredDesign = {};
  if (!conditions) return out;
  for (const f of DESIGN_FIELDS) if (sources[f]?.source === 'entered') out[f] = conditions[f];
  if (conditions.source) out.source = conditions.source;
  return out;
}

export function notesOf(sources: DesignSources): DesignNotes {
  const out: DesignNotes = {};
  for (const f of DESIGN_FIELDS) {
    const note = sources[f]?.note;
    if (note) out[f] = note;
  }
  return out;
}
