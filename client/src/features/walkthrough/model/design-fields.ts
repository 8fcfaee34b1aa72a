import { designConditionsSchema } from '@calc';
import type { Quantity } from '../../../lib/unit-display';
import type { JobRecord } from '../../../lib/job-records';
import { pathKey } from './validate-room';

export interface DesignFieldSpec {
  readonly key: string;
  readonly label: string;
  readonly quantity: Quantity;
  readonly unit?: string;
}

/** calc's design-condition fields, in calc's order (the server's DESIGN_FIELDS). */
export const DESIGN_FIELD_SPECS: readonly DesignFieldSpec[] = [
  { key: 'outdoorCoolingDryBulbF', label: 'Outdoor cooling dry bulb', quantity: 'degF' },
  { key: 'outdoorCoolingWetBulbF', label: 'Outdoor coincident wet bulb', quantity: 'degF' },
  {
    key: 'outdoorCoolingGrains',
    label: 'Outdoor humidity (instead of wet bulb)',
    quantity: 'plain',
    unit: 'grains/lb',
  },
  { key: 'outdoorHeatingDryBulbF', label: 'Outdoor heating dry bulb', quantity: 'degF' },
  { key: 'indoorCoolingF', label: 'Indoor cooling set point', quantity: 'degF' },
  { key: 'indoorHeatingF', label: 'Indoor heating set point', quantity: 'degF' },
  { key: 'indoorCoolingRhPercent', label: 'Indoor relative humidity', quantity: 'plain', unit: '%' },
  { key: 'dailyRangeF', label: 'Daily temperature range', quantity: 'deltaF' },
  { key: 'elevationFt', label: 'Elevation', quantity: 'elevation' },
];

const HUMIDITY = ['outdoorCoolingWetBulbF', 'outdoorCoolingGrains'];

export type Entered = Record<string, number | undefined>;

/** What the job's person typed, read back from the job's recorded sources. */
export function enteredFromJob(job: JobRecord): Entered {
  const out: Entered = {};
  for (const f of DESIGN_FIELD_SPECS) {
    const v = job.designConditions?.[f.key];
    if (job.designSources[f.key]?.source === 'entered' && typeof v === 'number') out[f.key] = v;
  }
  return out;
}

export function notesFromJob(job: JobRecord): Record<string, string> {
  const out: Record<string, string> = {};
  for (const f of DESIGN_FIELD_SPECS) {
    const note = job.designSources[f.key]?.note;
    if (note) out[f.key] = note;
  }
  return out;
}

/**
 * Entered values over the company defaults, as the server resolves them (typing one of
 * wet bulb / grains drops the default of the other), checked with calc's schema.
 */
export function resolveDesign(entered: Entered, source: string, defaults: Record<string, unknown> | null) {
  const humidityTyped = HUMIDITY.some((k) => entered[k] !== undefined);
  const merged: Record<string, unknown> = {};
  const origin: Record<string, 'entered' | 'company-default' | 'standard-default'> = {};
  for (const f of DESIGN_FIELD_SPECS) {
    const typed = entered[f.key];
    const fallback = humidityTyped && HUMIDITY.includes(f.key) ? undefined : defaults?.[f.key];
    if (typed !== undefined) [merged[f.key], origin[f.key]] = [typed, 'entered'];
    else if (typeof fallback === 'number') [merged[f.key], origin[f.key]] = [fallback, 'company-default'];
    else origin[f.key] = 'standard-default';
  }
  if (source.trim()) merged.source = source.trim();
  const parsed = designConditionsSchema.safeParse(merged);
  const errors = new Map<string, string>();
  if (!parsed.success)
    for (const i of parsed.error.issues) if (!errors.has(pathKey(i.path))) errors.set(pathKey(i.path), i.message);
  return { values: parsed.success ? parsed.data : null, shown: merged, origin, errors };
}
