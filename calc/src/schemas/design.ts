import { z } from 'zod';
import { bounded, boundedInt, keyField, nameField } from './fields';
import { tubeOdSchema } from './equipment';
import { ductSystemSchema } from './ducts';

/** The message when tested leakage is entered without saying when and how the ducts were tested. */
export const LEAKAGE_TEST_NEEDED = 'Say when and how the ducts were tested (date and method)';

/**
 * A ducted system's ducts (air handler or ducted unit): where they run, their insulation and leakage — the
 * tightness in words, or the fractions a duct-leakage test measured (supply and return leakage to outside as
 * fractions of the blower airflow, with when and how it was tested), used instead of the tightness's defaults.
 * The rooms they serve are the system's zones' rooms, so the home's own list is not taken here.
 */
export const systemDuctsSchema = ductSystemSchema
  .pick({
    location: true,
    insulationR: true,
    leakage: true,
    supplyLeakageFraction: true,
    returnLeakageFraction: true,
  })
  .extend({
    /** When and how the fractions were measured, as text ("2026-11-12, leakage to outside at 25 Pa"). */
    leakageTest: nameField('Leakage test', 120).optional(),
  })
  .superRefine((d, ctx) => {
    const tested = d.supplyLeakageFraction !== undefined || d.returnLeakageFraction !== undefined;
    if (tested && d.leakageTest === undefined)
      ctx.addIssue({ code: 'custom', path: ['leakageTest'], message: LEAKAGE_TEST_NEEDED });
    if (!tested && d.leakageTest !== undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['supplyLeakageFraction'],
        message: 'Enter the tested supply or return leakage, or clear the test',
      });
  });

/** A zone: the rooms one indoor unit serves. */
export const zoneSchema = z.object({
  key: keyField('Zone key'),
  name: nameField('Zone name'),
  roomIds: z
    .array(keyField('Room id'))
    .min(1, 'Choose at least one room for the zone')
    .max(50, 'At most 50 rooms per zone'),
  indoorUnitKey: keyField('Indoor unit'),
  /** The room the indoor unit is installed in (one of roomIds); absent → the zone's first room. */
  headRoomId: keyField('Room with the indoor unit').optional(),
  /**
   * The zone's rooms are one open space (no doors or full walls between them), so refrigerant leaked
   * from a ductless head spreads over all of them (A2L room size); absent → the head's room alone.
   */
  openSpace: z.boolean().optional(),
  /** Ducted units: height above the floor of the lowest duct opening into the served rooms, ft (A2L h0); absent → 0.6 m. */
  lowestDuctOpeningFt: bounded('Lowest duct opening', 0, 20, 'ft').optional(),
});

/** One line-set circuit from the outdoor unit to a zone's indoor unit. Lengths in ft. */
export const circuitSchema = z.object({
  zoneKey: keyField('Zone'),
  lengthFt: bounded('Line-set length', 1, 300, 'ft'),
  liftFt: bounded('Vertical lift', 0, 200, 'ft').default(0),
  /** Whether the indoor unit sits above or below the outdoor unit (for the height between heads); absent → above. */
  liftDirection: z
    .enum(['indoor-above', 'indoor-below'], { error: 'Choose above or below the outdoor unit' })
    .optional(),
  /**
   * 'kit': a pre-flared, pre-insulated kit in a stock length (the surplus is coiled and holds refrigerant);
   * 'field-cut': copper cut to the run. Absent → a kit when one is long enough (as the takeoff buys).
   */
  lineSet: z.enum(['kit', 'field-cut'], { error: 'Choose a kit or field-cut copper' }).optional(),
  /** The kit length when the estimator picks one, ft (else the shortest stock kit at least as long as the run). */
  kitLengthFt: bounded('Kit length', 1, 200, 'ft').optional(),
  liquidOdIn: tubeOdSchema.optional(),
  suctionOdIn: tubeOdSchema.optional(),
  wallPenetrations: boundedInt('Wall penetrations', 0, 6).default(1),
  lineCoverFt: bounded('Line cover length', 0, 300, 'ft').default(0),
  condensate: z.enum(['gravity', 'pump'], { error: 'Choose gravity drain or pump' }).default('gravity'),
  condensateLengthFt: bounded('Condensate line length', 0, 200, 'ft').default(10),
});

/** The branch circuit feeding an outdoor unit. */
export const electricalInputSchema = z.object({
  terminationC: z
    .union([z.literal(60), z.literal(75)], { error: 'Termination rating must be 60 or 75 °C' })
    .default(60),
  wiringMethod: z.enum(['nm-b', 'thhn-conduit', 'uf-b'], { error: 'Choose a wiring method' }).default('nm-b'),
  circuitLengthFt: bounded('Circuit length', 1, 300, 'ft'),
  disconnectDistanceFt: bounded('Disconnect distance', 0, 500, 'ft').default(5),
  disconnectVisible: z.boolean().default(true),
  /**
   * The heat kit's disconnect from the air handler, ft (a system with a heat kit); absent → beside it, within
   * a whip's reach. Beyond 50 ft it is not within sight.
   */
  heatKitDisconnectDistanceFt: bounded('Heat kit disconnect distance', 0, 500, 'ft').optional(),
  /**
   * The heat kit's own branch circuit, from the panel to the air handler, ft (a system with a heat kit): its
   * voltage drop, wire length and labor. Absent → the outdoor unit's run is assumed, and the plan says so.
   */
  heatKitCircuitLengthFt: bounded('Panel to air handler', 1, 300, 'ft').optional(),
  /** Supply voltage for the voltage-drop check, V; absent → 240. */
  supplyVoltage: z
    .union([z.literal(208), z.literal(230), z.literal(240)], { error: 'Choose 208, 230 or 240 V' })
    .optional(),
});

/** One outdoor unit and what it feeds. */
export const systemSchema = z.object({
  key: keyField('System key'),
  name: nameField('System name'),
  outdoorUnitKey: keyField('Outdoor unit'),
  mounting: z.enum(['pad', 'wall-bracket'], { error: 'Choose pad or wall bracket' }).default('pad'),
  circuits: z.array(circuitSchema).min(1, 'Add at least one line-set circuit').max(8, 'At most 8 circuits per system'),
  electrical: electricalInputSchema,
  /** An electric heat kit from the catalog for backup heat (ducted systems), on its own circuit of the same run. */
  heatKitKey: keyField('Heat kit').optional(),
  /** The ducts of a ducted system: they add the duct loads to this option's rooms (design-ducts.ts). */
  ducts: systemDuctsSchema.optional(),
});

/** The refusal of a room on two ducted systems' ducts: each system's duct loads go to the rooms it alone serves. */
export const roomOnTwoDuctedSystems = (roomId: string, other: string): string =>
  `Room "${roomId}" is already served by the ducts of ${other}: a room is on one ducted system's ducts`;

/** The design: zones and systems. */
export const designSchema = z
  .object({
    zones: z.array(zoneSchema).min(1, 'Add at least one zone').max(40, 'At most 40 zones'),
    systems: z.array(systemSchema).min(1, 'Add at least one system').max(10, 'At most 10 systems'),
    /** Planned install date (YYYY-MM-DD), for dated refrigerant rules; calc has no clock, so the caller gives it. */
    installDate: z
      .string()
      .regex(/^\d{4}-\d{2}-\d{2}$/, 'Install date must be written YYYY-MM-DD')
      .optional(),
    /** All the system's components were made or imported before 1 Jan 2025 (the rule's one-year allowance). */
    componentsMadeBefore2025: z.boolean().optional(),
  })
  .superRefine((d, ctx) => {
    // Each ducted system's ducts serve the rooms of the zones its circuits reach (design-ducts.ts); a room on
    // two systems' ducts would take two systems' duct loads.
    const byRoom = new Map<string, string>();
    d.systems.forEach((s, i) => {
      if (!s.ducts) return;
      for (const id of ductedRoomIds(d, s)) {
        const other = byRoom.get(id);
        if (other === undefined) byRoom.set(id, s.name);
        else {
          ctx.addIssue({ code: 'custom', path: ['systems', i, 'ducts'], message: roomOnTwoDuctedSystems(id, other) });
          return;
        }
      }
    });
  });

/** The rooms a system serves: those of the zones its circuits reach, each once, in the zones' order. */
export function ductedRoomIds(
  design: { readonly zones: readonly { readonly key: string; readonly roomIds: readonly string[] }[] },
  system: { readonly circuits: readonly { readonly zoneKey: string }[] },
): string[] {
  const zones = new Set(system.circuits.map((c) => c.zoneKey));
  return [...new Set(design.zones.filter((z) => zones.has(z.key)).flatMap((z) => z.roomIds))];
}

export type Zone = z.output<typeof zoneSchema>;
export type Circuit = z.output<typeof circuitSchema>;
export type CircuitInput = z.input<typeof circuitSchema>;
export type ElectricalInput = z.output<typeof electricalInputSchema>;
export type System = z.output<typeof systemSchema>;
export type DesignInput = z.input<typeof designSchema>;
export type Design = z.output<typeof designSchema>;
