import { z } from 'zod';
import { formatUsDate } from './dates';

/**
 * Proposals (issue 14): the frozen snapshot a version holds, and the records the proposal routes answer
 * with. The snapshot is built on the server from the saved inputs with calc (modules/proposals) — never
 * from the browser — and is what the PDF, the customer's page and "what changed" read. Money is integer
 * cents; loads are Btu/h; lengths are feet; charge is ounces.
 */

export const PDF_STATES = ['waiting', 'rendering', 'ready', 'failed'] as const;
export type PdfState = (typeof PDF_STATES)[number];

/** The audit trail's kinds, shown to the office in `seq` order. */
export const PROPOSAL_EVENT_KINDS = [
  'issued',
  'superseded',
  'sent',
  'send-failed',
  'opened',
  'viewed',
  'downloaded',
  'option-chosen',
  'consented',
  'signed',
  'paid',
  'refunded',
  'cancelled',
  'link-revoked',
  'marked-lost',
  /** The version's PDF was rendered and its SHA-256 recorded (data: sha256, bytes). */
  'pdf-ready',
  /** The PDF could not be made after the queue's last try (data: reason). */
  'pdf-failed',
] as const;
export type ProposalEventKind = (typeof PROPOSAL_EVENT_KINDS)[number];

const text = (max: number) => z.string().max(max);
const cents = z.number().int();
const btuh = z.number();

const snapshotCompany = z.object({
  name: text(160),
  address: text(400).nullable(),
  phone: text(40).nullable(),
  email: text(254).nullable(),
  licence: text(400).nullable(),
  /** The logo's storage key at issue time (services/storage), or null without a logo. */
  logoKey: text(300).nullable(),
  terms: text(20000),
  warranty: text(20000),
  /** State wording the company adds to the right-to-cancel notice (16 CFR 429 allows it), '' when none. */
  cancellationExtra: text(20000),
});

const snapshotRoomLoad = z.object({
  roomId: text(80),
  name: text(120),
  floorAreaFt2: z.number(),
  sensibleBtuh: btuh,
  latentBtuh: btuh,
  coolingBtuh: btuh,
  heatingBtuh: btuh,
});

const snapshotModel = z.object({
  /** The model number. */
  key: text(80),
  name: text(120),
  kind: text(40),
  nominalCoolingBtuh: btuh.nullable(),
  nominalHeatingBtuh: btuh.nullable(),
  seer2: z.number().nullable(),
  eer2: z.number().nullable(),
  hspf2: z.number().nullable(),
});

const snapshotLineSet = z.object({
  zoneKey: text(80),
  zoneName: text(120),
  liquid: text(40),
  suction: text(40),
  lengthFt: z.number(),
  installedLengthFt: z.number(),
  kind: z.enum(['kit', 'field-cut']),
  extraChargeOz: z.number(),
  /** Vertical lift between the indoor and outdoor units, ft (calc's circuit `liftFt`). */
  liftFt: z.number(),
  /** calc's worked extra-charge formula for this circuit (its explanation's `text`: "65 ft installed − 25 ft pre-charged = …"). */
  extraChargeText: text(600),
  /** How the indoor unit drains (the design's circuit: `condensate`, `condensateLengthFt`). */
  condensate: z.object({ kind: z.enum(['gravity', 'pump']), lengthFt: z.number() }),
});

const snapshotElectrical = z.object({
  supplyVoltage: z.number(),
  mcaA: z.number(),
  mocpA: z.number(),
  breakerA: z.number().nullable(),
  wireAwg: z.number().nullable(),
  circuitLengthFt: z.number(),
  disconnectA: z.number(),
});

const snapshotSystem = z.object({
  key: text(80),
  name: text(120),
  outdoor: snapshotModel,
  zones: z.array(
    z.object({
      key: text(80),
      name: text(120),
      rooms: z.array(text(120)),
      indoor: snapshotModel,
      coolingLoadBtuh: btuh,
      heatingLoadBtuh: btuh,
    }),
  ),
  refrigerant: text(20),
  lineSets: z.array(snapshotLineSet),
  extraChargeOz: z.number(),
  totalChargeOz: z.number(),
  electrical: snapshotElectrical,
  heatKit: snapshotModel.nullable(),
});

const snapshotLine = z.object({
  itemKey: text(120),
  description: text(300),
  quantity: z.number(),
  unit: text(20),
  category: z.enum(['equipment', 'material', 'labor']),
  /** The line at its sell price, cents (what the customer is charged for it before discount and tax). */
  sellCents: cents,
});

const snapshotOption = z.object({
  position: z.number().int().min(1).max(3),
  name: text(60),
  systems: z.array(snapshotSystem),
  /** What is included, in words (equipment and materials, then labor). */
  included: z.array(text(300)),
  takeoff: z.array(snapshotLine),
  price: z.object({
    sellCents: cents,
    discountCents: cents,
    subtotalCents: cents,
    taxCents: cents,
    totalCents: cents,
    depositCents: cents,
    balanceCents: cents,
  }),
  monthly: z.array(
    z.object({ name: text(120), aprPercent: z.number(), months: z.number().int(), monthlyPaymentCents: cents }),
  ),
});

/** The frozen content of a proposal version (contract between issuing, the PDF, the customer's page and diff). */
export const proposalSnapshot = z.object({
  /** Bumped when this shape changes, so old versions can still be read. */
  schema: z.literal(1),
  company: snapshotCompany,
  customer: z.object({ name: text(160), email: text(254).nullable(), phone: text(40).nullable() }),
  site: z.object({ street: text(200), unit: text(60), city: text(100), region: text(60), postalCode: text(20) }),
  design: z.object({
    /** The design conditions as the job holds them (outdoor/indoor temperatures, humidity, latitude …). */
    conditions: z.record(z.string(), z.unknown()),
    /** Where each design condition came from (field → source text). */
    sources: z.record(z.string(), z.unknown()),
    method: text(2000),
  }),
  loads: z.object({
    rooms: z.array(snapshotRoomLoad),
    block: z.object({
      hour: z.number().int(),
      sensibleBtuh: btuh,
      latentBtuh: btuh,
      coolingBtuh: btuh,
      heatingBtuh: btuh,
      floorAreaFt2: z.number(),
    }),
  }),
  options: z.array(snapshotOption).min(1).max(3),
  cautions: z.array(text(2000)),
  calcVersion: text(40),
  /** ISO 8601 UTC. */
  issuedAt: z.string(),
});
export type ProposalSnapshot = z.infer<typeof proposalSnapshot>;
export type SnapshotOption = ProposalSnapshot['options'][number];

/** One version as the office's list shows it (no snapshot: GET …/versions/:n has it). */
export const proposalVersionRecord = z.object({
  number: z.number().int(),
  issuedAt: z.string(),
  issuedBy: z.object({ id: z.string().nullable(), name: z.string() }),
  supersededAt: z.string().nullable(),
  current: z.boolean(),
  snapshotSha256: z.string(),
  calcVersion: z.string(),
  pdf: z.object({ state: z.enum(PDF_STATES), sha256: z.string().nullable() }),
  /** The options' names and totals (cents), for the list. */
  options: z.array(z.object({ name: z.string(), totalCents: z.number().int() })),
  /**
   * The customer's signature on this version, if any: when, by whom, and the sealed signed copy's SHA-256
   * once the queue has made it (null while it is being made). Absent where the answer does not read it.
   */
  signed: z.object({ at: z.string(), signerName: z.string(), copySha256: z.string().nullable() }).nullable().optional(),
});
export type ProposalVersionRecord = z.infer<typeof proposalVersionRecord>;

export const proposalEventRecord = z.object({
  seq: z.number().int(),
  kind: z.enum(PROPOSAL_EVENT_KINDS),
  at: z.string(),
  versionNumber: z.number().int().nullable(),
  /** Who: a person of the company (their name now, or "a former user"), the customer, or nobody (the system). */
  by: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('staff'), id: z.string().nullable(), name: z.string() }),
    z.object({ kind: z.literal('customer') }),
    z.object({ kind: z.literal('system') }),
  ]),
  data: z.record(z.string(), z.unknown()),
});
export type ProposalEventRecord = z.infer<typeof proposalEventRecord>;

/** GET /api/jobs/:jobId/proposal (and the answer to issuing). `proposal` is null before the first version. */
export const proposalResponse = z.object({
  jobId: z.string(),
  /** Whether a version may be issued now by this person, and if not, why. */
  canIssue: z.discriminatedUnion('ok', [
    z.object({ ok: z.literal(true) }),
    z.object({
      ok: z.literal(false),
      reason: z.string(),
      /**
       * Set when the refusal is a signed version not cancelled: a signed contract is not revised here
       * (the lead's decision for issue 14). The screen says so and offers no "Issue version N+1".
       */
      signed: z.object({ versionNumber: z.number().int(), signedOn: z.string(), signerName: z.string() }).optional(),
      /** Where the reason is put right: the desk (the job's options and ready mark) or the company settings. */
      fix: z.enum(['desk', 'settings']).optional(),
    }),
  ]),
  proposal: z
    .object({
      id: z.string(),
      createdAt: z.string(),
      versions: z.array(proposalVersionRecord),
      events: z.array(proposalEventRecord),
    })
    .nullable(),
});
export type ProposalResponse = z.infer<typeof proposalResponse>;

/** GET …/versions/:n. */
export const proposalVersionResponse = z.object({ version: proposalVersionRecord, snapshot: proposalSnapshot });
export type ProposalVersionResponse = z.infer<typeof proposalVersionResponse>;

export const CHANGE_AREAS = [
  'company',
  'customer',
  'site',
  'design',
  'rooms',
  'options',
  'equipment',
  'line sets',
  'takeoff',
  'prices',
  'terms',
  'cautions',
] as const;
export type ChangeArea = (typeof CHANGE_AREAS)[number];

export const proposalChange = z.object({
  area: z.enum(CHANGE_AREAS),
  /** The leaf's path in the snapshot (array items by their key or name). */
  path: z.string(),
  sentence: z.string(),
});
export type ProposalChange = z.infer<typeof proposalChange>;

/** GET …/versions/:a/diff/:b: what changed from version a to version b, as plain sentences. */
export const proposalDiffResponse = z.object({
  from: z.number().int(),
  to: z.number().int(),
  changes: z.array(proposalChange),
});
export type ProposalDiffResponse = z.infer<typeof proposalDiffResponse>;

export const PROPOSAL_MESSAGES = {
  notReady:
    'Mark the job ready to propose on the desk first: a proposal is issued only from a job the office has reviewed.',
  noOptions: 'The job has no priced option to propose.',
  /** The 409 while a version is signed and not cancelled (issue 14: a signed contract is not revised). */
  signed: (versionNumber: number, signedOn: string, signerName: string) =>
    `Version ${versionNumber} was signed on ${formatUsDate(signedOn)} by ${signerName}, and a signed contract is not changed here: a change after signing is agreed with the customer outside this proposal. If the buyer cancels within the cooling-off window, the proposal can be revised and issued again.`,
  /**
   * No business address in the company's proposal details: the notice of cancellation every proposal carries
   * must give the seller's address (16 CFR 429.1(a) and (b)), so nothing is issued without one.
   */
  noBusinessAddress: (mayEditSettings: boolean) =>
    `${mayEditSettings ? 'Add the business address in Settings' : 'Ask the owner to add the business address in Settings'} (On every proposal) first: the notice of the buyer’s right to cancel that every proposal carries must give the seller’s address (16 CFR 429.1).`,
} as const;
