import { z } from 'zod';
import { designConditionsSchema, houseSchema, type DesignConditions } from '@calc';
import type { DesignValueSource } from './enums';

/**
 * Design-condition resolution, one copy for both ends: the job keeps what was typed; a value not typed
 * comes from the company defaults, then calc's standard defaults, and every value records its source.
 * The walk-through form shows the result as the person types; the server stores it.
 */

export type DesignField = Exclude<keyof DesignConditions, 'source' | 'clearSkySource'>;

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
  'latitudeDeg',
  'designMonth',
  'clearSkyTauB',
  'clearSkyTauD',
  'groundDesignF',
] as const satisfies readonly DesignField[];

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
  latitudeDeg: value,
  designMonth: value,
  clearSkyTauB: value,
  clearSkyTauD: value,
  groundDesignF: value,
  source: z.string().trim().max(200, { message: 'Source must be at most 200 characters' }).optional(),
  /** Where τb and τd come from (e.g. the climatic table's station and month). */
  clearSkySource: z.string().trim().max(200, { message: 'Source must be at most 200 characters' }).optional(),
});
export type EnteredDesign = z.output<typeof enteredDesignSchema>;

export const designNotesSchema = z.partialRecord(
  z.enum(DESIGN_FIELDS, { message: 'Unknown design condition' }),
  z.string().trim().max(200, { message: 'A source note must be at most 200 characters' }),
);
export type DesignNotes = z.output<typeof designNotesSchema>;

/** Design conditions as a record holds them (stored values are read back without calc's bounds). */
export type StoredDesign = Readonly<Record<string, unknown>>;

const HUMIDITY: readonly DesignField[] = ['outdoorCoolingWetBulbF', 'outdoorCoolingGrains'];
/** τb and τd come from one climatic table: typing either drops the company default of both, and of their source. */
const SKY: readonly DesignField[] = ['clearSkyTauB', 'clearSkyTauD'];

export interface DesignResolution {
  /** The merged values before calc's defaults: what the form shows in each field. */
  readonly shown: Partial<Record<DesignField, number>> & { source?: string; clearSkySource?: string };
  /** Where each field's value comes from (standard-default: calc's default, or none). */
  readonly origin: Record<DesignField, DesignValueSource>;
  /** calc's verdict on the merged values: the conditions with its defaults applied, or the issues. */
  readonly conditions: DesignConditions | null;
  readonly issues: ReadonlyArray<{ path: string; message: string }>;
}

/**
 * Merges entered values over the company defaults and checks them with calc. Typing one of wet bulb /
 * grains drops the default of the other (they are alternatives); the source text, when none is typed,
 * is the company default's source, since the values are the company's.
 */
export function resolveDesign(entered: EnteredDesign, companyDefault: StoredDesign | null): DesignResolution {
  const shown: Partial<Record<DesignField, number>> & { source?: string; clearSkySource?: string } = {};
  const origin = {} as Record<DesignField, DesignValueSource>;
  const humidityEntered = HUMIDITY.some((f) => entered[f] !== undefined);
  const skyEntered = SKY.some((f) => entered[f] !== undefined);
  for (const f of DESIGN_FIELDS) {
    const typed = entered[f];
    const dropped = (humidityEntered && HUMIDITY.includes(f)) || (skyEntered && SKY.includes(f));
    const fallback = dropped ? undefined : companyDefault?.[f];
    if (typed !== undefined) [shown[f], origin[f]] = [typed, 'entered'];
    else if (typeof fallback === 'number') [shown[f], origin[f]] = [fallback, 'company-default'];
    else origin[f] = 'standard-default';
  }
  const typedSource = entered.source?.trim();
  const defaultSource = companyDefault?.source;
  const source = typedSource || (typeof defaultSource === 'string' ? defaultSource : undefined);
  if (source) shown.source = source;
  const typedSky = entered.clearSkySource?.trim();
  const defaultSky = companyDefault?.clearSkySource;
  const skySource = typedSky || (!skyEntered && typeof defaultSky === 'string' ? defaultSky : undefined);
  if (skySource) shown.clearSkySource = skySource;
  const parsed = designConditionsSchema.safeParse(shown);
  if (parsed.success) return { shown, origin, conditions: parsed.data, issues: [] };
  const issues = parsed.error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
  return { shown, origin, conditions: null, issues };
}

/** Each resolved value's source with the person's note: what a job stores beside its conditions. */
export function designSourcesOf(
  conditions: DesignConditions,
  origin: DesignResolution['origin'],
  notes: DesignNotes,
): DesignSources {
  const sources: DesignSources = {};
  for (const f of DESIGN_FIELDS) {
    if (conditions[f] === undefined) continue;
    sources[f] = { source: origin[f], note: notes[f] ?? '' };
  }
  return sources;
}

/** The values a job's person typed, read back from its recorded sources (so an edit of only the notes keeps them). */
export function enteredOf(conditions: StoredDesign | null, sources: DesignSources): EnteredDesign {
  const out: EnteredDesign = {};
  if (!conditions) return out;
  for (const f of DESIGN_FIELDS) {
    const v = conditions[f];
    if (sources[f]?.source === 'entered' && typeof v === 'number') out[f] = v;
  }
  if (typeof conditions.source === 'string' && conditions.source) out.source = conditions.source;
  if (typeof conditions.clearSkySource === 'string' && conditions.clearSkySource)
    out.clearSkySource = conditions.clearSkySource;
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

/**
 * The whole-house facts a job stores beside its design conditions (bedrooms, blower door, ventilation):
 * calc's houseSchema with unknown keys refused. Sent whole on each save.
 */
export const houseInputSchema = z.strictObject(houseSchema.shape);
export type HouseFields = z.output<typeof houseInputSchema>;
