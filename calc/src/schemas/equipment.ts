import { z } from 'zod';
import { bounded, boundedInt, keyField, nameField } from './fields';

/** Capacity at one outdoor temperature (manufacturer expanded data), Btu/h. */
export const capacityPointSchema = z.object({
  outdoorF: bounded('Rating outdoor temperature', -30, 130, '°F'),
  btuh: bounded('Capacity', 0, 300000, 'Btu/h'),
});

const capacityCurve = (label: string) =>
  z
    .array(capacityPointSchema)
    .min(1, `Enter at least one ${label} capacity point`)
    .max(20, `At most 20 ${label} capacity points`);

/** Equipment types that carry a sizing policy. */
export const equipmentTypeSchema = z.enum(
  [
    'ac-single-speed',
    'ac-two-stage',
    'ac-variable-speed',
    'heat-pump-single-speed',
    'heat-pump-two-stage',
    'heat-pump-variable-speed',
  ],
  { error: 'Choose an equipment type' },
);
export const refrigerantSchema = z.enum(['R-410A', 'R-32', 'R-454B'], { error: 'Choose a refrigerant' });
/**
 * The indoor unit's kind. A slim ducted head and an air handler both move air through ducts (duct loads, the A2L
 * space of the rooms they serve) but are mounted differently, and only an air handler takes a heat kit.
 */
export const indoorUnitTypeSchema = z.enum(
  ['wall-head', 'ceiling-cassette', 'floor-console', 'slim-ducted', 'ducted-air-handler'],
  { error: 'Choose an indoor unit type' },
);

/** An indoor unit whose air goes through ducts: an air handler or a slim ducted head. */
export const isDuctedUnit = (unit: { readonly unitType: z.output<typeof indoorUnitTypeSchema> }): boolean =>
  unit.unitType === 'ducted-air-handler' || unit.unitType === 'slim-ducted';
export const tubeOdSchema = z.union(
  [
    z.literal(0.25),
    z.literal(0.3125),
    z.literal(0.375),
    z.literal(0.5),
    z.literal(0.625),
    z.literal(0.75),
    z.literal(0.875),
  ],
  { error: 'Choose a tube size: 1/4, 5/16, 3/8, 1/2, 5/8, 3/4 or 7/8 in' },
);

/** An indoor unit in the catalog (invented models in fixtures). */
export const indoorUnitSchema = z.object({
  key: keyField('Indoor unit key'),
  description: nameField('Description', 120),
  unitType: indoorUnitTypeSchema,
  nominalBtuh: bounded('Nominal capacity', 3000, 120000, 'Btu/h'),
  cooling: capacityCurve('cooling'),
  heating: capacityCurve('heating').optional(),
  sensibleHeatRatio: bounded('Sensible heat ratio', 0.5, 1).optional(),
  liquidOdIn: tubeOdSchema,
  suctionOdIn: tubeOdSchema,
  needsCondensatePump: z.boolean().default(false),
  /** The maker fits refrigerant detection with mitigation (circulation airflow, shut-off) at the factory (A2L). */
  refrigerantDetection: z.boolean().optional(),
});

/** An outdoor unit in the catalog, with its charge and line-set data from the maker. */
export const outdoorUnitSchema = z.object({
  key: keyField('Outdoor unit key'),
  description: nameField('Description', 120),
  equipmentType: equipmentTypeSchema,
  refrigerant: refrigerantSchema,
  nominalBtuh: bounded('Nominal capacity', 6000, 120000, 'Btu/h'),
  cooling: capacityCurve('cooling'),
  heating: capacityCurve('heating').optional(),
  /** Equipment sensible heat ratio at design (for the latent check of the whole system). */
  sensibleHeatRatio: bounded('Sensible heat ratio', 0.5, 1).optional(),
  maxHeads: boundedInt('Maximum indoor units', 1, 8).default(1),
  connectedRatioPercent: z
    .object({
      min: bounded('Minimum connected capacity', 10, 100, '%'),
      max: bounded('Maximum connected capacity', 100, 200, '%'),
    })
    .default({ min: 50, max: 130 }),
  factoryChargeOz: bounded('Factory charge', 0, 1000, 'oz'),
  prechargedLengthFt: bounded('Pre-charged length', 0, 200, 'ft'),
  /** Maker's adder, oz per ft of liquid line, for the unit's own liquid size; absent → tube-volume estimate. */
  adderOzPerFt: bounded('Charge adder', 0, 3, 'oz/ft').optional(),
  /** Maker's adders per liquid-line size (win over adderOzPerFt for their size). */
  chargeAdders: z
    .array(z.object({ liquidOdIn: tubeOdSchema, ozPerFt: bounded('Charge adder', 0, 3, 'oz/ft') }))
    .max(7, 'At most 7 charge adders')
    .optional(),
  /** The liquid size the single adderOzPerFt belongs to (the unit's service-valve size); absent → any. */
  liquidOdIn: tubeOdSchema.optional(),
  /** Largest height difference between two indoor units of this outdoor unit, ft. */
  maxIndoorHeightDiffFt: bounded('Maximum height between indoor units', 0, 100, 'ft').optional(),
  /** Indoor nominal sizes (Btu/h) each port accepts, port A first (multi-zone). */
  portSizesBtuh: z
    .array(
      z
        .array(bounded('Port size', 3000, 60000, 'Btu/h'))
        .min(1)
        .max(8),
    )
    .max(8)
    .optional(),
  prechargeBasis: z.enum(['per-circuit', 'system-total']).default('per-circuit'),
  minLineLengthFt: bounded('Minimum line length', 0, 50, 'ft').default(10),
  maxLineLengthFt: bounded('Maximum line length', 10, 300, 'ft'),
  maxTotalLineLengthFt: bounded('Maximum total line length', 10, 600, 'ft').optional(),
  maxLiftFt: bounded('Maximum lift', 0, 200, 'ft'),
  mcaA: bounded('Minimum circuit ampacity', 1, 100, 'A'),
  mocpA: bounded('Maximum overcurrent protection', 15, 150, 'A'),
});

/** An electric heat kit (backup heat in an air handler), with its own branch circuit. */
export const heatKitSchema = z.object({
  key: keyField('Heat kit key'),
  description: nameField('Description', 120),
  kw: bounded('Heat kit', 1, 30, 'kW'),
  /**
   * The models the kit is listed for (the catalog's matched models): air handlers, or a ducted outdoor unit whose
   * air handler takes it; absent → any air handler.
   */
  fitsModelKeys: z.array(keyField('Matched model')).max(20, 'At most 20 matched models').optional(),
  mcaA: bounded('Minimum circuit ampacity', 1, 150, 'A'),
  mocpA: bounded('Maximum overcurrent protection', 15, 200, 'A'),
});

/** The equipment catalog the design chooses from. */
export const equipmentCatalogSchema = z.object({
  indoorUnits: z.array(indoorUnitSchema).max(500, 'At most 500 indoor units'),
  outdoorUnits: z.array(outdoorUnitSchema).max(500, 'At most 500 outdoor units'),
  heatKits: z.array(heatKitSchema).max(100, 'At most 100 heat kits').optional(),
});

export type CapacityPoint = z.output<typeof capacityPointSchema>;
export type EquipmentType = z.output<typeof equipmentTypeSchema>;
export type IndoorUnit = z.output<typeof indoorUnitSchema>;
export type OutdoorUnit = z.output<typeof outdoorUnitSchema>;
export type IndoorUnitInput = z.input<typeof indoorUnitSchema>;
export type OutdoorUnitInput = z.input<typeof outdoorUnitSchema>;
export type HeatKit = z.output<typeof heatKitSchema>;
export type EquipmentCatalog = z.output<typeof equipmentCatalogSchema>;
export type EquipmentCatalogInput = z.input<typeof equipmentCatalogSchema>;
