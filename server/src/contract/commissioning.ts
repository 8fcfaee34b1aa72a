import { z } from 'zod';

/**
 * The installer's commissioning record (issue 15): what the phone sends step by step and what the
 * server answers (the record, calc's verdicts beside each step, the refrigerant entries, the sign-offs,
 * amendments). Installers' answers carry no price, cost or customer other than the job's own.
 */

/** Why only nitrogen: the words the form and the server both give (ASHRAE 15 §10.1.2 text, reference §9). */
export const TEST_GAS_REASON: Record<'oxygen' | 'air' | 'other', string> = {
  oxygen:
    'Never oxygen: oxygen meeting compressor oil under pressure can explode. Use dry nitrogen through a regulator.',
  air: 'Never compressed air: it carries oxygen and moisture into the system. Use dry nitrogen through a regulator.',
  other:
    'Only dry nitrogen is accepted for the standing pressure test (never oxygen, air or a combustible gas). Use dry nitrogen through a regulator.',
};

/** The test gas as typed or chosen: refused with the reason unless it is nitrogen. */
export const testGasRule = z
  .string({ message: 'Say which gas the test used.' })
  .trim()
  .max(40, { message: 'The test gas must be at most 40 characters.' })
  .superRefine((v, ctx) => {
    const g = v.toLowerCase().replace(/^dry\s+/, '');
    if (g === 'nitrogen' || g === 'n2') return;
    const key = /oxygen|^o2$/.test(g) ? 'oxygen' : /air/.test(g) ? 'air' : 'other';
    ctx.addIssue({ code: 'custom', message: TEST_GAS_REASON[key] });
  });

const reading = (label: string, min: number, max: number, unit: string, minWords?: string) =>
  z
    .number({ message: `Enter the ${label} as a number.` })
    .refine(Number.isFinite, { message: `Enter the ${label} as a number.` })
    .refine((v) => v >= min, { message: minWords ?? `The ${label} must be at least ${min} ${unit}.` })
    .refine((v) => v <= max, { message: `The ${label} must be at most ${max} ${unit}.` })
    .nullable();

const MICRONS_NEGATIVE = 'A micron reading cannot be below zero: 0 microns is a perfect vacuum.';
export const micronReading = (label: string) => reading(label, 0, 760_000, 'microns', MICRONS_NEGATIVE);
const psig = (label: string) =>
  reading(label, -14.6, 1000, 'psig', `The ${label} cannot be below a perfect vacuum (−14.7 psig).`);
const tempF = (label: string) => reading(label, -40, 160, '°F');
const shortText = (label: string, max: number) =>
  z
    .string({ message: `The ${label} must be text.` })
    .trim()
    .max(max, { message: `The ${label} must be at most ${max} characters.` });

export const pressureTestInput = z.strictObject({
  testGas: testGasRule.nullable(),
  /** The pressure the system was brought to, psig (never above the equipment's test pressure). */
  testPsig: psig('test pressure'),
  /** The gauge's smallest division, psi (≤ 5 % of the test pressure: UL-derived instructions, reference §9). */
  gaugeResolutionPsi: reading('gauge division', 0.1, 50, 'psi'),
  startPsig: psig('start reading'),
  startF: tempF('start temperature'),
  endPsig: psig('end reading'),
  endF: tempF('end temperature'),
  holdMinutes: reading('hold time', 0, 10_080, 'minutes'),
});
export type PressureTestInput = z.infer<typeof pressureTestInput>;

export const leakInput = z.strictObject({
  where: shortText('place of the leak', 200).min(1, { message: 'Say where the leak was.' }),
  how: shortText('repair', 300).min(1, { message: 'Say how it was fixed (a flare re-made, a valve core replaced…).' }),
});

export const holdReadingInput = z.strictObject({
  minute: z.number({ message: 'Enter the minute of the reading.' }).min(0).max(1440),
  microns: micronReading('reading').unwrap(),
});

export const evacuationInput = z.strictObject({
  reachedMicrons: micronReading('lowest reading'),
  afterHoldMicrons: micronReading('reading after the hold'),
  holdMinutes: reading('hold time', 0, 1440, 'minutes'),
  holdReadings: z.array(holdReadingInput).max(30, { message: 'At most 30 readings during the hold.' }),
});
export type EvacuationInput = z.infer<typeof evacuationInput>;

export const measuredLineInput = z.strictObject({
  systemKey: shortText('system', 80),
  zoneKey: shortText('circuit', 80),
  measuredFt: reading('measured length', 0, 1000, 'ft'),
});

export const startupReadingInput = z.strictObject({
  name: shortText('reading name', 80).min(1, { message: 'Name the reading.' }),
  value: reading('reading', -1000, 10_000, ''),
  unit: shortText('unit', 20),
});

/** A step as entered: any of the record's parts; only those sent change. */
export const commissioningPatch = z.strictObject({
  pressureTest: pressureTestInput.optional(),
  leaks: z.array(leakInput).max(30, { message: 'At most 30 leaks.' }).optional(),
  evacuation: evacuationInput.optional(),
  measuredLines: z.array(measuredLineInput).max(40).optional(),
  startup: z.array(startupReadingInput).max(30, { message: 'At most 30 start-up readings.' }).optional(),
  notes: shortText('notes', 4000).optional(),
});
export type CommissioningPatch = z.infer<typeof commissioningPatch>;

/** One weighing of refrigerant in or out; the id is made on the phone so a replay is not a second entry. */
export const refrigerantEntryInput = z.strictObject({
  id: z.uuid({ message: 'Entry id must be a uuid.' }),
  systemKey: shortText('system', 80).min(1, { message: 'Choose the system.' }),
  refrigerant: shortText('refrigerant', 20).min(1, { message: 'Say which refrigerant.' }),
  addedOz: z
    .number({ message: 'Enter the weight added in oz.' })
    .min(0, { message: 'Weight added cannot be negative.' })
    .max(2000, { message: 'Weight added must be at most 2,000 oz.' }),
  recoveredOz: z
    .number({ message: 'Enter the weight recovered in oz.' })
    .min(0, { message: 'Weight recovered cannot be negative.' })
    .max(2000, { message: 'Weight recovered must be at most 2,000 oz.' }),
  lot: shortText('cylinder or lot', 60).nullable(),
  additives: shortText('additives', 200).nullable(),
});
export type RefrigerantEntryInput = z.infer<typeof refrigerantEntryInput>;

export const ADDITIVE_CAUTION =
  'Some additives (leak sealants in particular) can harm recovery equipment and other systems later: name what was put in, and the maker’s instructions govern whether any may be used.';

/** The installer signs off and the customer acknowledges, on the same phone. */
export const commissioningSignOffInput = z.strictObject({
  customerName: shortText('customer’s name', 120).min(1, { message: 'Enter the name of the person signing.' }),
  /** The drawing (data:image/png;base64,…), checked like a proposal signature. */
  signature: z.string({ message: 'Draw the signature.' }).max(400_000, { message: 'The drawing is too large.' }),
});

export const amendmentInput = z.strictObject({
  what: shortText('part corrected', 120).min(1, { message: 'Say what is corrected.' }),
  correction: shortText('correction', 1000).min(1, { message: 'Write the corrected value or words.' }),
  reason: shortText('reason', 1000).min(1, { message: 'Say why it is corrected.' }),
});

export const certificationInput = z.strictObject({
  certNumber: shortText('certification number', 40).refine((v) => v === '' || /^[A-Za-z0-9 ./-]+$/.test(v), {
    message: 'Use letters, digits, spaces, dots, dashes or slashes.',
  }),
});

export const evacuationPolicyInput = z.strictObject({
  targetMicrons: z.number().int().min(50, { message: 'At least 50 microns.' }).max(5000),
  maxRiseToMicrons: z.number().int().min(100).max(5000, { message: 'At most 5,000 microns.' }),
  holdMinutes: z.number().int().min(1, { message: 'At least 1 minute.' }).max(240),
  startupReadings: z.array(shortText('reading name', 80).min(1)).max(20),
  askLot: z.boolean(),
});
export type EvacuationPolicyInput = z.infer<typeof evacuationPolicyInput>;

export const evacuationPolicyRecord = evacuationPolicyInput.extend({
  version: z.number().int().min(0),
  isDefault: z.boolean(),
  basis: z.string(),
});
export type EvacuationPolicyRecord = z.infer<typeof evacuationPolicyRecord>;

/** Suggested start-up readings until the owner chooses (common practice on a heat-pump start-up). */
export const DEFAULT_STARTUP_READINGS: readonly string[] = [
  'Outdoor temperature (°F)',
  'Return air temperature (°F)',
  'Supply air temperature (°F)',
  'Suction pressure (psig)',
  'Liquid pressure (psig)',
  'Superheat (°F), from the maker’s chart',
  'Subcooling (°F), from the maker’s chart',
];

const verdict = z.object({ pass: z.boolean(), outcome: z.string(), words: z.string(), text: z.string().optional() });

export const refrigerantEntryRecord = refrigerantEntryInput.extend({
  technicianName: z.string(),
  enteredAt: z.string(),
});

export const commissioningRecord = z.object({
  jobId: z.string(),
  version: z.number().int(),
  state: z.enum(['open', 'installed']),
  jobStatus: z.string(),
  pressureTest: pressureTestInput,
  leaks: z.array(leakInput),
  evacuation: evacuationInput,
  measuredLines: z.array(measuredLineInput),
  startup: z.array(startupReadingInput),
  notes: z.string(),
  /** What was sold, without prices: each system's equipment, refrigerant and circuits. */
  systems: z.array(
    z.object({
      key: z.string(),
      name: z.string(),
      outdoorModel: z.string(),
      refrigerant: z.string(),
      testPressurePsig: z.number().nullable(),
      circuits: z.array(
        z.object({
          zoneKey: z.string(),
          zoneName: z.string(),
          liquid: z.string(),
          plannedInstalledFt: z.number(),
          plannedExtraOz: z.number(),
          /** The charge adder used for the recomputation, oz/ft (the maker's, else the liquid-full estimate). */
          ozPerFt: z.number().nullable(),
        }),
      ),
      /** The outdoor unit's pre-charge (catalog), so the phone recomputes with no signal; null: not in the catalog. */
      precharge: z.object({ lengthFt: z.number(), basis: z.enum(['per-circuit', 'system-total']) }).nullable(),
      charge: z
        .object({
          plannedOz: z.number(),
          extraOz: z.number(),
          weighedInOz: z.number(),
          differenceOz: z.number().nullable(),
          words: z.string(),
        })
        .nullable(),
    }),
  ),
  /** The lowest test pressure of the sold outdoor units (null: the catalog gives none — use the nameplate). */
  testPressureLimitPsig: z.number().nullable(),
  verdicts: z.object({ pressureTest: verdict.nullable(), evacuation: verdict.nullable() }),
  policy: evacuationPolicyRecord,
  refrigerant: z.array(refrigerantEntryRecord),
  technicianCertNumber: z.string().nullable(),
  /** What still stands between the record and the sign-off, in words (empty: ready). */
  missing: z.array(z.string()),
  signOff: z
    .object({
      installerName: z.string(),
      certNumber: z.string(),
      customerName: z.string(),
      signedAt: z.string(),
    })
    .nullable(),
  amendments: z.array(
    z.object({
      id: z.string(),
      what: z.string(),
      correction: z.string(),
      reason: z.string(),
      by: z.string(),
      at: z.string(),
    }),
  ),
  cautions: z.array(z.string()),
});
export type CommissioningRecord = z.infer<typeof commissioningRecord>;
export const commissioningResponse = z.object({ record: commissioningRecord });
export type CommissioningResponse = z.infer<typeof commissioningResponse>;

/** The cautions shown beside pressure and refrigerant fields (DESIGN.md Safety; reference §9). */
export const COMMISSIONING_CAUTIONS: readonly string[] = [
  'Follow the equipment maker’s installation instructions and local codes; they govern over anything shown here.',
  'Refrigerant work only by a technician holding the certification the law asks for (EPA 608 in the US).',
  'Pressure test with dry nitrogen only — never oxygen, compressed air or a combustible gas — through a two-stage regulator with a relief valve, never above the test pressure on the nameplate or in the manual.',
  'Isolate components not rated for the test pressure.',
  'Electrical work by the licensed trade.',
];
export const A2L_CAUTION =
  'A2L refrigerant: no open flames or ignition sources where it may be present, leak detectors suited to it, and the maker’s A2L handling instructions.';
