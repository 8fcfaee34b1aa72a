import { z } from 'zod';
import { refrigerantSchema, tubeOdSchema } from '../schemas/equipment';
import { bounded, boundedInt, keyField, nameField } from '../schemas/fields';
import { sellRuleSchema } from './sell-rule';

/**
 * One model in a company's equipment catalog: an outdoor unit (single-zone, multi-zone or
 * ducted condenser / heat pump), an indoor unit, or an electric heat kit. One flat shape
 * with per-kind rules, so the catalog table, the CSV and the edit form share it. Units are
 * imperial (Btu/h, °F, oz, ft, in, lb, A); money in integer cents.
 */
export const MODEL_KINDS = [
  'outdoor-single-zone',
  'outdoor-multi-zone',
  'outdoor-ducted',
  'indoor',
  'heat-kit',
] as const;
export const INDOOR_TYPES = ['wall', 'ceiling-cassette', 'floor-console', 'slim-ducted', 'air-handler'] as const;
export const MODEL_KIND_LABELS: Record<(typeof MODEL_KINDS)[number], string> = {
  'outdoor-single-zone': 'Single-zone outdoor',
  'outdoor-multi-zone': 'Multi-zone outdoor',
  'outdoor-ducted': 'Ducted condenser / heat pump',
  indoor: 'Indoor unit',
  'heat-kit': 'Electric heat kit',
};
export const INDOOR_TYPE_LABELS: Record<(typeof INDOOR_TYPES)[number], string> = {
  wall: 'Wall',
  'ceiling-cassette': 'Ceiling cassette',
  'floor-console': 'Floor console',
  'slim-ducted': 'Slim ducted',
  'air-handler': 'Air handler',
};
/** Outdoor dry bulbs (°F) the CSV carries a cooling column for; 95 °F is the AHRI 210/240 "A" rating point. */
export const COOLING_TEMPS_F = [75, 82, 95, 105, 115] as const;
/** Outdoor dry bulbs (°F) the CSV carries a heating column for: 47, 17 and 5 °F are the AHRI 210/240 heating points. */
export const HEATING_TEMPS_F = [47, 17, 5, -5, -13] as const;
export const LIQUID_SIZES_IN = [0.25, 0.375, 0.5] as const;
export const VOLTAGES = ['115', '208-230', '460'] as const;

export const modelKindSchema = z.enum(MODEL_KINDS, { error: 'Choose a kind of equipment' });
export const indoorTypeSchema = z.enum(INDOOR_TYPES, { error: 'Choose an indoor unit type' });

const btuh = (label: string) => bounded(label, 0, 300000, 'Btu/h');
const money = (label: string) => boundedInt(label, 0, 100_000_000, 'cents');

/** Capacity at one outdoor dry bulb, optionally with the indoor wet bulb and the sensible part. */
export const ratedPointSchema = z.object({
  outdoorF: bounded('Outdoor temperature', -30, 130, '°F'),
  btuh: btuh('Capacity'),
  indoorWbF: bounded('Indoor wet bulb', 50, 80, '°F').optional(),
  sensibleBtuh: btuh('Sensible capacity').optional(),
});

export const chargeAdderSchema = z.object({
  liquidOdIn: tubeOdSchema,
  ozPerFt: bounded('Charge adder', 0, 3, 'oz/ft'),
});

const points = (label: string) => z.array(ratedPointSchema).max(12, `At most 12 ${label} points`).default([]);

const modelObject = z.object({
  key: keyField('Model number'),
  name: nameField('Description', 120),
  kind: modelKindSchema,
  indoorType: indoorTypeSchema.optional(),
  heatPump: z.boolean().default(false),
  variableSpeed: z.boolean().default(false),
  nominalCoolingBtuh: bounded('Nominal cooling', 3000, 120000, 'Btu/h').optional(),
  nominalHeatingBtuh: bounded('Nominal heating', 3000, 150000, 'Btu/h').optional(),
  minCoolingBtuh: btuh('Minimum cooling').optional(),
  maxCoolingBtuh: btuh('Maximum cooling').optional(),
  minHeatingBtuh: btuh('Minimum heating').optional(),
  maxHeatingBtuh: btuh('Maximum heating').optional(),
  coolingPoints: points('cooling'),
  heatingPoints: points('heating'),
  sensibleHeatRatio: bounded('Sensible heat ratio', 0.5, 1).optional(),
  seer2: bounded('SEER2', 8, 40).optional(),
  eer2: bounded('EER2', 5, 25).optional(),
  hspf2: bounded('HSPF2', 4, 15).optional(),
  certificateRef: z.string().trim().max(60, 'Certificate reference must be at most 60 characters').optional(),
  refrigerant: refrigerantSchema.optional(),
  factoryChargeOz: bounded('Factory charge', 0, 1000, 'oz').optional(),
  prechargedLengthFt: bounded('Pre-charged length', 0, 300, 'ft').optional(),
  prechargeBasis: z.enum(['per-circuit', 'system-total'], { error: 'Choose per-circuit or system-total' }).optional(),
  chargeAdders: z.array(chargeAdderSchema).max(7, 'At most 7 charge adders').default([]),
  minLineFt: bounded('Minimum line length', 0, 100, 'ft').optional(),
  maxLineFt: bounded('Maximum line length', 10, 300, 'ft').optional(),
  maxTotalLineFt: bounded('Maximum total line length', 10, 1000, 'ft').optional(),
  maxLiftFt: bounded('Maximum lift', 0, 200, 'ft').optional(),
  maxIndoorHeightDiffFt: bounded('Maximum height between indoor units', 0, 100, 'ft').optional(),
  /**
   * Outdoor units: the field pressure test the nameplate or installation manual gives, psig (the standing
   * nitrogen test of the line sets and indoor units must never go above it; reference §9).
   */
  testPressurePsig: bounded('Test pressure', 50, 1000, 'psig').optional(),
  liquidOdIn: tubeOdSchema.optional(),
  suctionOdIn: tubeOdSchema.optional(),
  ports: boundedInt('Ports', 2, 8).optional(),
  connectedMinPercent: bounded('Minimum connected capacity', 10, 100, '%').optional(),
  connectedMaxPercent: bounded('Maximum connected capacity', 100, 200, '%').optional(),
  /** Indoor nominal sizes (Btu/h) each port accepts, port A first. */
  portSizesBtuh: z
    .array(
      z
        .array(bounded('Port size', 3000, 60000, 'Btu/h'))
        .min(1, 'Each port accepts at least one size')
        .max(8),
    )
    .max(8, 'At most 8 ports')
    .default([]),
  /** Models this one is matched with (the indoor of a single-zone pair, the air handlers of a ducted unit, what a heat kit fits). */
  matchedKeys: z.array(keyField('Matched model')).max(20, 'At most 20 matched models').default([]),
  heatKitKw: bounded('Heat kit', 1, 30, 'kW').optional(),
  /** Indoor units: the maker fits refrigerant detection with mitigation at the factory (A2L room-size rules). */
  refrigerantDetection: z.boolean().default(false),
  mcaA: bounded('Minimum circuit ampacity', 0.1, 150, 'A').optional(),
  mocpA: bounded('Maximum overcurrent protection', 1, 200, 'A').optional(),
  voltage: z.enum(VOLTAGES, { error: 'Choose 115, 208-230 or 460 V' }).optional(),
  phase: z.union([z.literal(1), z.literal(3)], { error: 'Phase must be 1 or 3' }).optional(),
  soundDba: bounded('Sound level', 10, 90, 'dB(A)').optional(),
  widthIn: bounded('Width', 1, 120, 'in').optional(),
  heightIn: bounded('Height', 1, 120, 'in').optional(),
  depthIn: bounded('Depth', 1, 120, 'in').optional(),
  weightLb: bounded('Weight', 1, 1000, 'lb').optional(),
  costCents: money('Cost'),
  listCents: money('List price').optional(),
  /** The price-book category whose sell rule prices this model (issue 13); none: the company default. */
  category: keyField('Category').optional(),
  /** Overrides the category's rule for this model. */
  sellRule: sellRuleSchema.optional(),
  active: z.boolean().default(true),
});

type Draft = z.output<typeof modelObject>;
type Ctx = z.RefinementCtx;

const need = (ctx: Ctx, m: Draft, field: keyof Draft, message: string) => {
  if (m[field] === undefined) ctx.addIssue({ code: 'custom', path: [field], message });
};

/** Plausible capacity at a rating point: 25 %–160 % of nominal [OWN: a plausibility band, not a maker rule]. */
export const CAPACITY_BAND = { low: 0.25, high: 1.6 } as const;

function checkPoints(
  ctx: Ctx,
  list: Draft['coolingPoints'],
  field: 'coolingPoints' | 'heatingPoints',
  nominal?: number,
) {
  const seen = new Set<number>();
  const temps: readonly number[] = field === 'coolingPoints' ? COOLING_TEMPS_F : HEATING_TEMPS_F;
  list.forEach((p, i) => {
    if (!temps.includes(p.outdoorF))
      ctx.addIssue({
        code: 'custom',
        path: [field, i, 'outdoorF'],
        message: `Capacity points are taken at ${temps.join(', ')} °F`,
      });
    if (seen.has(p.outdoorF))
      ctx.addIssue({ code: 'custom', path: [field, i, 'outdoorF'], message: `Two points at ${p.outdoorF} °F` });
    seen.add(p.outdoorF);
    if (nominal !== undefined) {
      const lo = Math.round(nominal * CAPACITY_BAND.low);
      const hi = Math.round(nominal * CAPACITY_BAND.high);
      if (p.btuh < lo || p.btuh > hi)
        ctx.addIssue({
          code: 'custom',
          path: [field, i, 'btuh'],
          message: `${p.btuh} Btu/h at ${p.outdoorF} °F is not plausible for a ${nominal} Btu/h unit (expected ${lo}–${hi})`,
        });
    }
    if (p.sensibleBtuh !== undefined && p.sensibleBtuh > p.btuh)
      ctx.addIssue({
        code: 'custom',
        path: [field, i, 'sensibleBtuh'],
        message: 'Sensible capacity cannot exceed the total',
      });
  });
}

function checkRange(ctx: Ctx, m: Draft, mode: 'Cooling' | 'Heating') {
  const nominal = mode === 'Cooling' ? m.nominalCoolingBtuh : (m.nominalHeatingBtuh ?? m.nominalCoolingBtuh);
  const min = mode === 'Cooling' ? m.minCoolingBtuh : m.minHeatingBtuh;
  const max = mode === 'Cooling' ? m.maxCoolingBtuh : m.maxHeatingBtuh;
  if (nominal === undefined) return;
  if (min !== undefined && min > nominal)
    ctx.addIssue({
      code: 'custom',
      path: [`min${mode}Btuh`],
      message: `Minimum ${mode.toLowerCase()} must not exceed the nominal ${nominal} Btu/h`,
    });
  if (max !== undefined && max < nominal)
    ctx.addIssue({
      code: 'custom',
      path: [`max${mode}Btuh`],
      message: `Maximum ${mode.toLowerCase()} must be at least the nominal ${nominal} Btu/h`,
    });
}

const isOutdoor = (k: Draft['kind']) => k.startsWith('outdoor-');

function checkModel(m: Draft, ctx: Ctx): void {
  if (m.kind !== 'heat-kit') need(ctx, m, 'nominalCoolingBtuh', 'Enter the nominal cooling capacity');
  if (m.kind === 'indoor') need(ctx, m, 'indoorType', 'Choose the indoor unit type');
  if (m.kind !== 'indoor' && m.indoorType !== undefined)
    ctx.addIssue({ code: 'custom', path: ['indoorType'], message: 'Only an indoor unit has an indoor type' });
  if (m.kind !== 'indoor' && m.refrigerantDetection)
    ctx.addIssue({
      code: 'custom',
      path: ['refrigerantDetection'],
      message: 'Only an indoor unit has refrigerant detection',
    });
  if (m.kind === 'heat-kit') need(ctx, m, 'heatKitKw', 'Enter the heat kit size in kW');
  if (isOutdoor(m.kind)) {
    need(ctx, m, 'refrigerant', 'Choose the refrigerant');
    need(ctx, m, 'factoryChargeOz', 'Enter the factory charge');
    need(ctx, m, 'prechargedLengthFt', 'Enter the pre-charged line length');
    need(ctx, m, 'maxLineFt', 'Enter the maximum line length');
    need(ctx, m, 'maxLiftFt', 'Enter the maximum lift');
    need(ctx, m, 'mcaA', 'Enter the minimum circuit ampacity');
    need(ctx, m, 'mocpA', 'Enter the maximum overcurrent protection');
    if (m.coolingPoints.length === 0)
      ctx.addIssue({ code: 'custom', path: ['coolingPoints'], message: 'Enter at least one cooling capacity point' });
    if (m.heatPump && m.heatingPoints.length === 0)
      ctx.addIssue({ code: 'custom', path: ['heatingPoints'], message: 'A heat pump needs heating capacity points' });
  }
  if (m.kind === 'outdoor-multi-zone') {
    need(ctx, m, 'ports', 'Enter the number of ports');
    need(ctx, m, 'connectedMinPercent', 'Enter the minimum connected capacity');
    need(ctx, m, 'connectedMaxPercent', 'Enter the maximum connected capacity');
    if (m.ports !== undefined && m.portSizesBtuh.length !== m.ports)
      ctx.addIssue({
        code: 'custom',
        path: ['portSizesBtuh'],
        message: `List the accepted sizes for each of the ${m.ports} ports`,
      });
  } else if (m.ports !== undefined || m.portSizesBtuh.length > 0) {
    ctx.addIssue({ code: 'custom', path: ['ports'], message: 'Only a multi-zone outdoor unit has ports' });
  }
  checkRange(ctx, m, 'Cooling');
  checkRange(ctx, m, 'Heating');
  checkPoints(ctx, m.coolingPoints, 'coolingPoints', m.nominalCoolingBtuh);
  checkPoints(ctx, m.heatingPoints, 'heatingPoints', m.nominalHeatingBtuh ?? m.nominalCoolingBtuh);
  if (m.mcaA !== undefined && m.mocpA !== undefined && m.mcaA > m.mocpA)
    ctx.addIssue({
      code: 'custom',
      path: ['mocpA'],
      message: 'Maximum overcurrent protection must be at least the MCA',
    });
  if (m.minLineFt !== undefined && m.maxLineFt !== undefined && m.minLineFt > m.maxLineFt)
    ctx.addIssue({ code: 'custom', path: ['minLineFt'], message: 'Minimum line length exceeds the maximum' });
  if (m.maxLineFt !== undefined && m.maxTotalLineFt !== undefined && m.maxTotalLineFt < m.maxLineFt)
    ctx.addIssue({
      code: 'custom',
      path: ['maxTotalLineFt'],
      message: 'Maximum total line length must be at least the maximum per circuit',
    });
  if (
    m.connectedMinPercent !== undefined &&
    m.connectedMaxPercent !== undefined &&
    m.connectedMinPercent > m.connectedMaxPercent
  )
    ctx.addIssue({
      code: 'custom',
      path: ['connectedMinPercent'],
      message: 'Minimum connected capacity exceeds the maximum',
    });
  const sizes = new Set<number>();
  m.chargeAdders.forEach((a, i) => {
    if (sizes.has(a.liquidOdIn))
      ctx.addIssue({
        code: 'custom',
        path: ['chargeAdders', i, 'liquidOdIn'],
        message: 'Two adders for one liquid size',
      });
    sizes.add(a.liquidOdIn);
  });
  if (m.matchedKeys.includes(m.key))
    ctx.addIssue({ code: 'custom', path: ['matchedKeys'], message: 'A model cannot be matched with itself' });
}

export const catalogModelSchema = modelObject.superRefine(checkModel);

export type CatalogModel = z.output<typeof catalogModelSchema>;
export type CatalogModelInput = z.input<typeof catalogModelSchema>;
export type RatedPoint = z.output<typeof ratedPointSchema>;
export type ModelKind = z.output<typeof modelKindSchema>;
