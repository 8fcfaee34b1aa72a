import { z } from 'zod';
import { bounded, boundedInt, keyField, nameField } from './fields';
import { designConditionsSchema } from './design-conditions';
import { roomInputSchema } from './room-input';
import { ductSystemSchema } from './ducts';

/** Envelope tightness keys of the construction defaults. */
export const tightnessSchema = z.enum(['very-tight', 'tight', 'average', 'leaky', 'very-leaky'], {
  error: 'Choose how tight the house is',
});

/** Whole-house mechanical ventilation system. */
export const ventilationKindSchema = z.enum(['none', 'exhaust', 'supply', 'balanced', 'erv-hrv'], {
  error: 'Choose the ventilation system',
});

/**
 * Whole-house ventilation: the kind, its airflow (default: the ASHRAE 62.2 rate) and, for an
 * ERV/HRV, its sensible and latent effectiveness (an HRV recovers no moisture: latent 0).
 */
export const ventilationSchema = z.object({
  kind: ventilationKindSchema.default('none'),
  cfm: bounded('Ventilation airflow', 0, 2000, 'cfm').optional(),
  sensibleEffectiveness: bounded('Sensible effectiveness', 0, 0.95).optional(),
  latentEffectiveness: bounded('Latent effectiveness', 0, 0.9).optional(),
});

/**
 * How much heat the house's walls, floors and furnishings store: the construction class of the radiant time
 * factors (ASHRAE Handbook—Fundamentals ch. 18 Tables 19 and 20, light / medium / heavy). Unset: medium.
 */
export const THERMAL_MASS_CLASSES = ['light', 'medium', 'heavy'] as const;
export const thermalMassSchema = z.enum(THERMAL_MASS_CLASSES, { error: 'Choose light, medium or heavy' });

/** What the walk-through records about the whole house beyond its rooms (all optional). */
export const houseSchema = z.object({
  /** Blower-door airflow at 50 Pa; when given it replaces the tightness guess. */
  blowerDoorCfm50: bounded('Blower-door CFM50', 50, 20000, 'cfm').optional(),
  bedrooms: boundedInt('Bedrooms', 0, 20).optional(),
  ventilation: ventilationSchema.optional(),
  /** A ducted system's ducts (location, insulation, leakage); absent when no ducted system serves the home. */
  ducts: ductSystemSchema.optional(),
  /** The construction class for heat storage (radiant time series); absent: medium. */
  thermalMass: thermalMassSchema.optional(),
});

/** The most rooms one home may have. */
export const MOST_ROOMS_IN_HOME = 200;

/** A home: its design conditions, its tightness and its rooms (unique ids). */
export const homeInputSchema = z
  .object({
    id: keyField('Home id').optional(),
    name: nameField('Home name').optional(),
    designConditions: designConditionsSchema,
    tightness: tightnessSchema.default('average'),
    ...houseSchema.shape,
    /**
     * The ducts of each ducted system of an option (design-ducts.ts), each with the rooms it serves; in place
     * of `ducts` (the walk-through's one entry), never beside it. A room is on one system's ducts at most.
     */
    ductSystems: z.array(ductSystemSchema).max(10, 'At most 10 ducted systems').optional(),
    rooms: z
      .array(roomInputSchema)
      .min(1, 'Add at least one room')
      .max(MOST_ROOMS_IN_HOME, `At most ${MOST_ROOMS_IN_HOME} rooms`),
  })
  .superRefine((home, ctx) => {
    for (const issue of homeRoomIssues(home)) ctx.addIssue({ code: 'custom', ...issue });
  });

/**
 * What a home's rooms must agree on beyond each room's own fields: every room its own id, and the ducts
 * serving only rooms of the home. The home schema refuses a home with any of these; the walk-through's
 * live totals, which parse each room once and never the whole home, ask this directly.
 */
export function homeRoomIssues(home: {
  readonly rooms: readonly { readonly id: string }[];
  readonly ducts?: { readonly roomIds?: readonly string[] | undefined } | undefined;
  readonly ductSystems?: readonly { readonly roomIds?: readonly string[] | undefined }[] | undefined;
}): Array<{ path: Array<string | number>; message: string }> {
  const issues: Array<{ path: Array<string | number>; message: string }> = [];
  const seen = new Set<string>();
  home.rooms.forEach((room, i) => {
    if (seen.has(room.id)) issues.push({ path: ['rooms', i, 'id'], message: 'Each room needs its own id' });
    seen.add(room.id);
  });
  home.ducts?.roomIds?.forEach((id, i) => {
    if (!seen.has(id)) issues.push({ path: ['ducts', 'roomIds', i], message: `Room "${id}" is not in the home` });
  });
  const systems = home.ductSystems ?? [];
  if (systems.length > 0 && home.ducts)
    issues.push({ path: ['ductSystems'], message: 'Give the ducts once: the house ducts or each system’s, not both' });
  const onDucts = new Map<string, number>();
  systems.forEach((d, s) => {
    if (!d.roomIds && systems.length > 1)
      issues.push({ path: ['ductSystems', s, 'roomIds'], message: 'Each ducted system names the rooms it serves' });
    d.roomIds?.forEach((id, i) => {
      const path = ['ductSystems', s, 'roomIds', i];
      if (!seen.has(id)) issues.push({ path, message: `Room "${id}" is not in the home` });
      const other = onDucts.get(id);
      if (other !== undefined && other !== s)
        issues.push({ path, message: `Room "${id}" is already on the ducts of ducted system ${other + 1}` });
      else onDucts.set(id, s);
    });
  });
  return issues;
}

export type HomeInput = z.input<typeof homeInputSchema>;
export type Home = z.output<typeof homeInputSchema>;
export type Tightness = z.output<typeof tightnessSchema>;
export type Ventilation = z.output<typeof ventilationSchema>;
export type House = z.output<typeof houseSchema>;
export type HouseInput = z.input<typeof houseSchema>;
export type VentilationKind = z.output<typeof ventilationKindSchema>;
export type ThermalMass = z.output<typeof thermalMassSchema>;
