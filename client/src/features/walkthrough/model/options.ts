import {
  CEILING_INSULATION,
  DOOR_TYPES,
  FLOOR_INSULATION,
  GLAZING_TYPES,
  INTERIOR_SHADING_IAC,
  WALL_CONSTRUCTIONS,
} from '@calc';

/** Select options built from calc's construction defaults, so labels and keys stay in step with calc. */
const fromTable = (table: Record<string, { readonly label: string }>) =>
  Object.entries(table).map(([value, t]) => ({ value, label: t.label }));

export const directionOptions = ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'].map((d) => ({ value: d, label: d }));
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
export const aboveOptions = [
  { value: 'attic', label: 'Attic' },
  { value: 'roof', label: 'Roof (no attic)' },
  { value: 'conditioned', label: 'Conditioned floor' },
];
export const belowOptions = [
  { value: 'slab', label: 'Slab on grade' },
  { value: 'crawlspace', label: 'Crawl space' },
  { value: 'basement', label: 'Unconditioned basement' },
  { value: 'basement-floor', label: 'Ground (a basement room’s own floor)' },
  { value: 'garage', label: 'Garage' },
  { value: 'conditioned', label: 'Conditioned floor' },
];

export function glazingDefaults(key: string): { u: number; shgc: number; label: string } | null {
  const entry = Object.entries(GLAZING_TYPES).find(([k]) => k === key)?.[1];
  return entry ? { u: entry.value.u, shgc: entry.value.shgc, label: entry.label } : null;
}

export function doorDefault(key: string): { u: number; label: string } | null {
  const entry = Object.entries(DOOR_TYPES).find(([k]) => k === key)?.[1];
  return entry ? { u: entry.value, label: entry.label } : null;
}
