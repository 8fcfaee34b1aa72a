import type { z } from 'zod';
import {
  compassDirectionSchema,
  CEILING_INSULATION,
  DOOR_TYPES,
  FLOOR_INSULATION,
  GLAZING_TYPES,
  INTERIOR_SHADING_IAC,
  interiorAttenuation,
  SHADED_SUN_RADIANT_FRACTION,
  WALL_CONSTRUCTIONS,
  type aboveSchema,
  type belowSchema,
} from '@calc';

/** Select options built from calc's construction defaults, so labels and keys stay in step with calc. */
const fromTable = (table: Record<string, { readonly label: string }>) =>
  Object.entries(table).map(([value, t]) => ({ value, label: t.label }));

export const directionOptions = compassDirectionSchema.options.map((d) => ({ value: d, label: d }));
export const constructionOptions = fromTable(WALL_CONSTRUCTIONS);
export const glazingOptions = fromTable(GLAZING_TYPES);
export const shadingOptions = fromTable(INTERIOR_SHADING_IAC);
export const doorTypeOptions = fromTable(DOOR_TYPES);
export const ceilingInsulationOptions = fromTable(CEILING_INSULATION);
export const floorInsulationOptions = fromTable(FLOOR_INSULATION);
export const floorLevelOptions = [-2, -1, 0, 1, 2, 3, 4, 5].map((n) => ({
  value: String(n),
  label: n < 0 ? `Basement ${-n}` : n === 0 ? 'Ground (at grade)' : `Floor ${n}`,
}));
/** A label for each of calc's kinds: a kind calc adds fails the typecheck here until it has its words. */
const ABOVE_LABELS: Record<z.output<typeof aboveSchema>['kind'], string> = {
  attic: 'Attic',
  roof: 'Roof (no attic)',
  conditioned: 'Conditioned floor',
};
const BELOW_LABELS: Record<z.output<typeof belowSchema>['kind'], string> = {
  slab: 'Slab on grade',
  crawlspace: 'Crawl space',
  basement: 'Unconditioned basement',
  'basement-floor': 'Ground (a basement room’s own floor)',
  garage: 'Garage',
  conditioned: 'Conditioned floor',
};
const fromLabels = (labels: Record<string, string>) =>
  Object.entries(labels).map(([value, label]) => ({ value, label }));
export const aboveOptions = fromLabels(ABOVE_LABELS);
export const belowOptions = fromLabels(BELOW_LABELS);

export function glazingDefaults(key: string): { u: number; shgc: number; label: string } | null {
  const entry = Object.entries(GLAZING_TYPES).find(([k]) => k === key)?.[1];
  return entry ? { u: entry.value.u, shgc: entry.value.shgc, label: entry.label } : null;
}

export function doorDefault(key: string): { u: number; label: string } | null {
  const entry = Object.entries(DOOR_TYPES).find(([k]) => k === key)?.[1];
  return entry ? { u: entry.value, label: entry.label } : null;
}

/** Where each shade's figures come from, in a few words (calc: INTERIOR_SHADING_IAC, SHADED_SUN_RADIANT_FRACTION). */
const SHADE_WORDS: Record<string, { row: string; delay: string }> = {
  blinds: { row: 'medium blinds half open', delay: '' },
  // The drapes' radiant part (0.63) has no published source: say so where the shade is picked.
  drapes: { row: 'medium curtains', delay: ' Its delay figure is from memory.' },
  shades: { row: 'dark shades', delay: '' },
};

/**
 * The hint under "Interior shading" (short: it sits in a half-width cell on a phone): how much of the sun the chosen
 * shade lets through this glass, the handbook row it is, and for drapes that the delay figure is from memory.
 */
export function shadingHint(kind: string, shgc: number | undefined): string {
  const words = SHADE_WORDS[kind];
  if (!words || !(kind in SHADED_SUN_RADIANT_FRACTION) || shgc === undefined)
    return 'The shade drawn on a hot afternoon.';
  const iac = interiorAttenuation(kind as keyof typeof SHADED_SUN_RADIANT_FRACTION, shgc);
  return `Lets ${Math.round(iac * 100)} % of the sun in (ASHRAE ch. 15, ${words.row}).${words.delay}`;
}
