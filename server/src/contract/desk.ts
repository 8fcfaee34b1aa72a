import { z } from 'zod';
import {
  bounded,
  boundedInt,
  circuitSchema,
  designSchema,
  discountSchema,
  keyField,
  nameField,
  sellRuleSchema,
  TAX_RULES,
  zoneSchema,
} from '@calc';
import type { Role } from './enums';

/**
 * The estimator's desk (issue 13): what both ends agree on about priced options — the inputs an option
 * stores, the records the server answers with, who may do what, and why a job cannot be marked ready.
 * The server recomputes every number from these inputs with calc; no total is ever taken from a browser.
 */

/** A job holds at most this many options (a basic, a better and a best). */
export const MAX_OPTIONS = 3;

/** Who may read the desk (installers read equipment, lines and electrical only: no money). */
export const DESK_EDITOR_ROLES = ['owner', 'estimator', 'salesperson'] as const satisfies readonly Role[];
/** Who reviews a first price, edits the takeoff and marks a job ready to propose: the office. */
export const DESK_OFFICE_ROLES = ['owner', 'estimator'] as const satisfies readonly Role[];
/** Who decides a discount beyond a person's limit. */
export const DISCOUNT_APPROVER_ROLES = ['owner'] as const satisfies readonly Role[];

const has = (list: readonly Role[], role: Role) => list.includes(role);
export const mayEditOptions = (role: Role): boolean => has(DESK_EDITOR_ROLES, role);
export const mayEditTakeoff = (role: Role): boolean => has(DESK_OFFICE_ROLES, role);
export const mayReviewOption = (role: Role): boolean => has(DESK_OFFICE_ROLES, role);
export const mayMarkReady = (role: Role): boolean => has(DESK_OFFICE_ROLES, role);
export const mayDecideDiscount = (role: Role): boolean => has(DISCOUNT_APPROVER_ROLES, role);
/** Cost, markup/margin and the takeoff's unit costs: the office only (as in the price book). */
export const maySeeCost = (role: Role): boolean => has(DESK_OFFICE_ROLES, role);
/** Prices, discounts and monthly payments: everyone but installers. */
export const maySeePrice = (role: Role): boolean => role !== 'installer';

// ---- Inputs ------------------------------------------------------------------------------------------

export const optionNameRule = nameField('Option name', 60);

export const depositSchema = z
  .strictObject({
    kind: z.enum(['percent', 'amount'], { error: 'Choose percent or amount' }),
    value: bounded('Deposit', 0, 100_000_000),
  })
  .superRefine((d, ctx) => {
    if (d.kind === 'percent' && d.value > 100)
      ctx.addIssue({ code: 'custom', path: ['value'], message: 'Deposit must be between 0 and 100 %' });
  });

/**
 * This option's own tax instead of the company's rule (a tax-exempt customer is taxOn 'none'), always with
 * the reason, which the office reads back beside the tax line (an exemption certificate, another county).
 */
export const taxOverrideSchema = z.strictObject({
  taxRatePercent: bounded('Tax rate', 0, 20, '%'),
  taxOn: z.enum(TAX_RULES, { error: 'Choose what is taxed' }),
  reason: nameField('Reason for the tax change', 120),
});

/** A discount as typed: calc's shape, a percent at most 100. Amounts are cents. */
export const optionDiscountSchema = discountSchema.superRefine((d, ctx) => {
  if (d.kind === 'percent' && d.value > 100)
    ctx.addIssue({ code: 'custom', path: ['value'], message: 'A percent discount must be between 0 and 100 %' });
});

/** How one option is priced. null = the company's rule from the price book. */
export const optionPricingSchema = z.strictObject({
  sellRule: sellRuleSchema.nullable().default(null),
  discounts: z.array(optionDiscountSchema).max(10, 'At most 10 discounts').default([]),
  tax: taxOverrideSchema.nullable().default(null),
  deposit: depositSchema.default({ kind: 'percent', value: 0 }),
  financingPlanKey: keyField('Financing plan').nullable().default(null),
});
export type OptionPricing = z.output<typeof optionPricingSchema>;
export type OptionPricingInput = z.input<typeof optionPricingSchema>;

/** calc's design (zones → indoor units, systems → outdoor unit, circuits, electrical), checked by calc's schema. */
export const optionDesignSchema = designSchema;

const TAKEOFF_UNITS = ['each', 'ft', 'h', 'cylinder', 'roll', 'lb', 'oz'] as const;
const TAKEOFF_CATEGORIES = ['equipment', 'material', 'labor'] as const;
const quantity = bounded('Quantity', 0, 100_000);
const unitCost = boundedInt('Unit cost', 0, 100_000_000, 'cents');

/**
 * One change to the generated takeoff, as the desk sends it: a new quantity or unit cost for a generated
 * line (by its item key), a generated line removed, or a line of the estimator's own (`id` theirs, unique in
 * the option). The server stores each with the generated value it replaced (calc's `TakeoffEdit`), so a
 * later design change can tell whether the edit still applies (calc's `regenerateTakeoff`).
 */
export const takeoffEditSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('quantity'), itemKey: keyField('Item'), quantity }),
    z.strictObject({ kind: z.literal('unit-price'), itemKey: keyField('Item'), unitCostCents: unitCost }),
    z.strictObject({ kind: z.literal('remove'), itemKey: keyField('Item') }),
    z.strictObject({
      kind: z.literal('add'),
      id: keyField('Line id'),
      description: nameField('Description', 120),
      quantity,
      unit: z.enum(TAKEOFF_UNITS, { error: `Unit must be one of ${TAKEOFF_UNITS.join(', ')}` }),
      category: z.enum(TAKEOFF_CATEGORIES, { error: 'Choose equipment, material or labor' }),
      unitCostCents: unitCost,
    }),
  ],
  { error: 'An edit is a quantity, a unit price, a removal or an added line' },
);
export type TakeoffEditInput = z.output<typeof takeoffEditSchema>;

/** The item key an added line gets: never one calc generates. */
export const addedLineKey = (id: string): string => `added:${id}`;

/** What names an edit in answers and in `regenerate`'s accept/drop: its kind and the line it is about. */
export function takeoffEditKey(
  e: { kind: 'add'; id: string } | { kind: 'add'; line: { itemKey: string } } | { kind: string; itemKey: string },
): string {
  if (e.kind !== 'add') return 'itemKey' in e ? `${e.kind}:${e.itemKey}` : e.kind;
  return `add:${'id' in e ? addedLineKey(e.id) : 'line' in e ? e.line.itemKey : ''}`;
}

export const takeoffEditsSchema = z
  .array(takeoffEditSchema)
  .max(200, 'At most 200 takeoff edits')
  .superRefine((edits, ctx) => {
    const seen = new Set<string>();
    edits.forEach((e, i) => {
      const k = takeoffEditKey(e);
      if (seen.has(k))
        ctx.addIssue({
          code: 'custom',
          path: [i, e.kind === 'add' ? 'id' : 'itemKey'],
          message: 'This line is edited twice',
        });
      seen.add(k);
    });
  });

/** POST /api/jobs/:jobId/options: a new option, empty, filled, or a copy of another option of the job. */
export const createOptionBody = z.strictObject({
  name: optionNameRule,
  design: optionDesignSchema.optional(),
  pricing: optionPricingSchema.optional(),
  copyFromOptionId: z.uuid({ message: 'Choose an option of this job to copy.' }).optional(),
});
/** PATCH an option: any of its inputs (If-Match). Totals are never inputs. */
export const updateOptionBody = z.strictObject({
  name: optionNameRule.optional(),
  design: optionDesignSchema.optional(),
  pricing: optionPricingSchema.optional(),
});
export const takeoffEditsBody = z.strictObject({ edits: takeoffEditsSchema });
export const discountDecisionBody = z.strictObject({
  approve: z.boolean({ error: 'Say whether the discount is approved' }),
});
/** Of the edits that no longer apply (by `takeoffEditKey`): accept = keep on the line as generated now; drop = remove. */
export const regenerateBody = z.strictObject({
  accept: z.array(z.string().max(200)).max(200).default([]),
  drop: z.array(z.string().max(200)).max(200).default([]),
});

// ---- Records -----------------------------------------------------------------------------------------

const id = z.string();
const timestamp = z.string().describe('ISO 8601 date-time');
const personRef = z.object({ id, name: z.string() });

/** A takeoff line as the desk shows it: the generated value beside the edited one. Money only for the office. */
export const takeoffLineRecord = z.object({
  itemKey: z.string(),
  description: z.string(),
  unit: z.string(),
  category: z.enum(TAKEOFF_CATEGORIES),
  derivation: z.string(),
  quantity: z.number(),
  generatedQuantity: z.number().nullable(),
  unitCostCents: z.number().nullable().optional(),
  generatedUnitCostCents: z.number().nullable().optional(),
  extendedCostCents: z.number().optional(),
  /** The line's sell price and the price-book rule behind it (office only; issue 13). */
  sellCents: z.number().optional(),
  sellRule: z
    .object({
      method: z.enum(['markup', 'margin']),
      percent: z.number(),
      /** item: its own override; category: its category's (named in `from`); company: the default; option: the option's own. */
      source: z.enum(['item', 'category', 'company', 'option']),
      from: z.string().nullable(),
    })
    .optional(),
  /** In the tax base: the option's tax rule covers it and its price-book category is taxable (office only). */
  taxed: z.boolean().optional(),
  /** Set by an edit (generated values beside it); 'added' lines are the estimator's own. */
  edited: z.boolean(),
  source: z.enum(['generated', 'added']),
});
export type TakeoffLineRecord = z.output<typeof takeoffLineRecord>;

/** A stored edit (calc's TakeoffEdit, with the generated value it replaced). Office only. */
export const takeoffEditRecord = z.object({
  key: z.string(),
  edit: z.record(z.string(), z.unknown()),
  /** Why it no longer applies, from calc's regenerateTakeoff; null while it applies. */
  stale: z
    .object({ reason: z.string(), message: z.string(), before: z.number().nullable(), now: z.number().nullable() })
    .nullable(),
});

/** The option's price. Cost and margin fields only for the office; no price at all for installers. */
export const optionPriceRecord = z.object({
  sellCents: z.number(),
  discountCents: z.number(),
  discountPercent: z.number(),
  subtotalCents: z.number(),
  /** The tax base: the lines the tax rule covers whose price-book category is taxable, their share of the subtotal. */
  taxableCents: z.number(),
  taxCents: z.number(),
  totalCents: z.number(),
  depositCents: z.number(),
  balanceCents: z.number(),
  monthlyPaymentCents: z.number().nullable(),
  equipmentCostCents: z.number().optional(),
  materialsCostCents: z.number().optional(),
  laborCostCents: z.number().optional(),
  costCents: z.number().optional(),
  grossMarginCents: z.number().optional(),
  grossMarginPercent: z.number().optional(),
  sellRule: z.object({ method: z.enum(['markup', 'margin']), percent: z.number() }).optional(),
  /** 'line': each line at its price-book rule (sellRule is the company default for lines without one); 'option': the option's own rule. */
  sellRulesBy: z.enum(['option', 'line']).optional(),
});
export type OptionPriceRecord = z.output<typeof optionPriceRecord>;

export const monthlyEstimateRecord = z.object({
  planKey: z.string(),
  name: z.string(),
  aprPercent: z.number(),
  months: z.number(),
  monthlyPaymentCents: z.number(),
});

export const DISCOUNT_STATES = ['pending', 'approved', 'denied'] as const;
/** A discount beyond the person's limit: not applied until the owner approves. */
export const discountRequestRecord = z.object({
  state: z.enum(DISCOUNT_STATES),
  discounts: z.array(z.object({ label: z.string(), kind: z.enum(['percent', 'amount']), value: z.number() })),
  percent: z.number(),
  limitPercent: z.number(),
  requestedBy: personRef,
  requestedAt: timestamp,
  decidedBy: personRef.nullable(),
  decidedAt: timestamp.nullable(),
  /** Why it waits again after an approval (the price dropped); absent for a first request. */
  reason: z.string().optional(),
});
export type DiscountRequestRecord = z.output<typeof discountRequestRecord>;

/** Why an option (or the job) cannot be proposed yet. */
export const BLOCKER_CODES = [
  'no-options',
  'cannot-calculate',
  'limit-exceeded',
  'combination-refused',
  'discount-pending',
  'preliminary',
  'takeoff-edits-stale',
  /** A unit outside its allowed sizing range: the office may still mark the job ready, giving a reason. */
  'sizing-outside-range',
] as const;
export const blockerRecord = z.object({
  code: z.enum(BLOCKER_CODES),
  optionId: id.nullable(),
  message: z.string(),
});
export type BlockerRecord = z.output<typeof blockerRecord>;

/**
 * calc's results for an option (zones, systems with sizing, refrigerant, electrical; warnings, cautions)
 * pass as calc made them; only what the screens compare is named.
 */
/** calc's Explanation: a computed number with its formula and inputs, the same words on every screen and paper. */
export const explanationRecord = z.looseObject({
  key: z.string(),
  label: z.string(),
  value: z.number(),
  unit: z.string(),
  valueText: z.string(),
  text: z.string(),
  status: z.enum(['ok', 'note', 'warning', 'blocker']),
});

/** A first price's range ("about $11,800 – $13,900, subject to the estimator's review"), marked preliminary. */
export const preliminaryRangeRecord = z.object({
  lowCents: z.number(),
  highCents: z.number(),
  text: z.string(),
  note: z.string(),
  preliminary: z.literal(true),
});
export type PreliminaryRangeRecord = z.output<typeof preliminaryRangeRecord>;

export const optionResultRecord = z.object({
  zones: z.array(z.looseObject({ zoneKey: z.string(), name: z.string(), indoorUnitKey: z.string() })),
  systems: z.array(z.looseObject({ systemKey: z.string(), name: z.string(), outdoorUnitKey: z.string() })),
  takeoff: z.array(takeoffLineRecord),
  price: optionPriceRecord.nullable(),
  monthly: z.array(monthlyEstimateRecord),
  /** Models chosen in this option that the catalog no longer offers (retired or deleted); the option stays valid. */
  discontinued: z.array(z.object({ key: z.string(), name: z.string() })),
  /** The why of each number the role may see. */
  explanations: z.array(explanationRecord),
  /** For a preliminary option (a first price), the range shown to the homeowner; null otherwise and for installers. */
  preliminaryRange: preliminaryRangeRecord.nullable(),
  warnings: z.array(z.string()),
  cautions: z.array(z.string()),
  isEstimate: z.literal(true),
});
export type OptionResultRecord = z.output<typeof optionResultRecord>;

export const optionRecord = z.object({
  id,
  jobId: id,
  position: z.number().int(),
  name: z.string(),
  design: z.record(z.string(), z.unknown()).nullable(),
  /** null for installers. */
  pricing: z.record(z.string(), z.unknown()).nullable(),
  /** Office only (empty for others). */
  takeoffEdits: z.array(takeoffEditRecord),
  discountRequest: discountRequestRecord.nullable(),
  /** A first price from the phone: not sendable until the office reviews it. */
  preliminary: z.boolean(),
  reviewedBy: personRef.nullable(),
  reviewedAt: timestamp.nullable(),
  result: optionResultRecord.nullable(),
  /** Why calc could not work the option out (e.g. a room of a zone was deleted), with field paths. */
  problems: z.array(z.object({ path: z.string(), message: z.string() })),
  blockers: z.array(blockerRecord),
  version: z.number().int(),
  createdBy: personRef.nullable(),
  createdAt: timestamp,
  updatedAt: timestamp,
});
export type OptionRecord = z.output<typeof optionRecord>;

/** The office's reason to propose units outside their sizing range, with who, when and the units it covers. */
export const readyOverrideRecord = z.object({
  reason: z.string(),
  by: personRef,
  at: timestamp,
  /** The sizing blockers' messages the reason was given for. */
  units: z.array(z.string()),
});
export type ReadyOverride = z.output<typeof readyOverrideRecord>;

/** POST /api/jobs/:jobId/ready: with units outside their sizing range, the reason to propose them anyway. */
export const readyBody = z.strictObject({
  sizingOverride: z
    .strictObject({
      reason: z
        .string({ error: 'Say why these sizes are right for this home' })
        .trim()
        .min(10, 'Say why these sizes are right for this home (at least 10 characters)')
        .max(500, 'At most 500 characters'),
    })
    .optional(),
});
export type ReadyBody = z.input<typeof readyBody>;

export const readinessRecord = z.object({
  /** Marked ready to propose by the office, and by whom; null when not marked. */
  markedReady: z.object({ at: timestamp, by: personRef }).nullable(),
  /** Marked ready with units outside their sizing range: the office's reason; null otherwise. */
  sizingOverride: readyOverrideRecord.nullable(),
  /** Marked and nothing blocks it now. */
  ready: z.boolean(),
  blockers: z.array(blockerRecord),
});
export type ReadinessRecord = z.output<typeof readinessRecord>;

export const optionResponse = z.object({ option: optionRecord });
export const deskResponse = z.object({
  jobId: id,
  jobStatus: z.string(),
  options: z.array(optionRecord),
  readiness: readinessRecord,
});
export type DeskResponse = z.output<typeof deskResponse>;
/** POST /api/jobs/:jobId/suggest: zones to keep (else calc groups the rooms), and the run to assume. */
export const suggestBody = z.strictObject({
  zones: z
    .array(
      z.strictObject({
        key: keyField('Zone key'),
        name: nameField('Zone name'),
        roomIds: z.array(keyField('Room id')).min(1, 'Choose at least one room for the zone').max(50),
        headRoomId: zoneSchema.shape.headRoomId,
        openSpace: zoneSchema.shape.openSpace,
        lowestDuctOpeningFt: zoneSchema.shape.lowestDuctOpeningFt,
      }),
    )
    .max(40, 'At most 40 zones')
    .optional(),
  lineLengthFt: bounded('Line-set length', 1, 300, 'ft').optional(),
  /** Circuits the estimator already entered (by zone): the suggestion keeps them as they are. */
  circuits: z.array(circuitSchema).max(80, 'At most 80 circuits').optional(),
});
/** calc's suggestion: a design the desk can put into an option, with why each unit was chosen. */
export const suggestResponse = z.object({
  design: z.record(z.string(), z.unknown()),
  reasons: z.array(explanationRecord),
  warnings: z.array(z.string()),
});
/** POST /api/jobs/:jobId/first-price: a salesperson's one tap after the walk-through. */
export const firstPriceBody = z.strictObject({ name: optionNameRule.optional() });
export const firstPriceResponse = z.object({
  option: optionRecord,
  range: preliminaryRangeRecord,
  preliminary: z.literal(true),
  notice: z.string(),
});

// ---- Words both ends show ----------------------------------------------------------------------------

export const DESK_MESSAGES = {
  noOptions: 'Add at least one option before marking the job ready.',
  tooManyOptions: `A job holds at most ${MAX_OPTIONS} options.`,
  discountPending: 'A discount is waiting for the owner’s approval.',
  preliminary: 'This is a first price from the walk-through; an estimator or the owner reviews it first.',
  takeoffStale: 'Some takeoff edits no longer match the design; regenerate the takeoff and accept or drop them.',
  sizingOverrideNeeded:
    'Some units are outside their sizing range. Change them, or give the reason they are right for this home.',
  firstPriceNotice: 'Preliminary price, subject to the estimator’s review. Not a proposal.',
  discontinued: 'discontinued',
} as const;
