import { z } from 'zod';
import type { OptionResultRecord } from '@contract';
import type { SystemResult, ZoneResult } from '@calc';

/**
 * calc's results pass through the contract as loose objects (zones, systems); this is the parse
 * boundary for the parts the desk shows. A field calc renames shows as absent here, never as a crash.
 */
export const explanationView = z.object({
  key: z.string(),
  label: z.string(),
  valueText: z.string(),
  text: z.string(),
  inputs: z.array(z.object({ label: z.string(), text: z.string() })).default([]),
  verdict: z.string().optional(),
  status: z.enum(['ok', 'note', 'warning', 'blocker']).default('ok'),
  source: z.string().optional(),
});
export type ExplanationView = z.output<typeof explanationView>;

const sizingView = z.object({
  coolingLoadBtuh: z.number(),
  coolingCapacityBtuh: z.number(),
  coolingRatio: z.number().nullable(),
  allowedPercent: z.object({ min: z.number(), max: z.number() }),
  withinRange: z.boolean(),
  heatingLoadBtuh: z.number(),
  heatingCapacityBtuh: z.number().nullable(),
  heatingRatio: z.number().nullable(),
  warnings: z.array(z.string()).default([]),
});
export type SizingView = z.output<typeof sizingView>;

const circuitView = z.object({
  zoneKey: z.string(),
  lengthFt: z.number(),
  liftFt: z.number(),
  liquidLabel: z.string().optional(),
  suctionLabel: z.string().optional(),
  extraChargeOz: z.number(),
  warnings: z.array(z.string()).default([]),
  blockers: z.array(z.string()).default([]),
  explanation: explanationView.optional(),
});

const refrigerantView = z.object({
  refrigerant: z.string(),
  safetyClass: z.string().optional(),
  circuits: z.array(circuitView),
  totalLengthFt: z.number(),
  extraChargeOz: z.number(),
  factoryChargeOz: z.number(),
  totalChargeOz: z.number(),
  warnings: z.array(z.string()).default([]),
  blockers: z.array(z.string()).default([]),
  notes: z.array(z.string()).default([]),
  cautions: z.array(z.string()).default([]),
  explanations: z.array(explanationView).default([]),
});

const electricalView = z.object({
  mcaA: z.number(),
  mocpA: z.number(),
  breakerA: z.number().nullable(),
  wireAwg: z.number().nullable(),
  disconnectA: z.number().optional(),
  disconnectRun: z
    .object({ kind: z.enum(['whip', 'field-run']), size: z.string(), lengthFt: z.number() })
    .nullable()
    .optional(),
  voltageDropPercent: z.number().nullable().optional(),
  /** The run the drop is worked over, ft, and why it is assumed when it was not entered. */
  circuitLengthFt: z.number().optional(),
  circuitLengthAssumed: z.string().nullable().optional(),
  warnings: z.array(z.string()).default([]),
  explanations: z.array(explanationView).default([]),
  caution: z.string().optional(),
});

const combinationView = z.object({
  heads: z.number(),
  maxHeads: z.number(),
  /** false: a one-to-one pair, whose connected capacity is not a check (calc's checkCombination). */
  multiZone: z.boolean().default(true),
  connectedPercent: z.number(),
  allowedPercent: z.object({ min: z.number(), max: z.number() }),
  ok: z.boolean(),
  warnings: z.array(z.string()).default([]),
});

export const zoneView = z.object({
  zoneKey: z.string(),
  name: z.string(),
  indoorUnitKey: z.string(),
  sizing: sizingView.optional(),
  /** calc's whys for the zone: load against capacity, the sizing verdict, latent check, heating coverage. */
  explanations: z.array(explanationView).default([]),
});
export type ZoneView = z.output<typeof zoneView>;

export const systemView = z.object({
  systemKey: z.string(),
  name: z.string(),
  outdoorUnitKey: z.string(),
  sizing: sizingView.optional(),
  combination: combinationView.optional(),
  refrigerant: refrigerantView.optional(),
  electrical: electricalView.optional(),
  /** The heat kit's own branch circuit (null without a kit). */
  heatKitElectrical: electricalView.nullable().optional(),
  /** calc's whys for the system: sizing, combination, charge, electrical. */
  explanations: z.array(explanationView).default([]),
});
export type SystemView = z.output<typeof systemView>;

/** Each zone and system as far as it parses (a part that does not is left out of the view, not guessed). */
export function viewOf(result: OptionResultRecord): { zones: ZoneView[]; systems: SystemView[] } {
  return {
    zones: result.zones.flatMap((z) => {
      const p = zoneView.safeParse(z);
      return p.success ? [p.data] : [];
    }),
    systems: result.systems.flatMap((s) => {
      const p = systemView.safeParse(s);
      return p.success ? [p.data] : [];
    }),
  };
}

/**
 * The views above are calc's results as the desk reads them; a calc result that no longer fits its view (a
 * field renamed or retyped) fails the typecheck here instead of quietly dropping out of the screen.
 */
type Frozen<T> = T extends readonly (infer U)[]
  ? readonly Frozen<U>[]
  : T extends object
    ? { readonly [K in keyof T]: Frozen<T[K]> }
    : T;
type Fits<Result extends Frozen<View>, View> = Result;
export type ZoneResultFitsView = Fits<ZoneResult, z.input<typeof zoneView>>;
export type SystemResultFitsView = Fits<SystemResult, z.input<typeof systemView>>;
