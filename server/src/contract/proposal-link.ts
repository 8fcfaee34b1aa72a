import { z } from 'zod';
import { emailRule } from './fields';

/**
 * Sending a proposal to its customer (issue 14): the office's link records and request bodies, the
 * customer's own view of the version they were sent, and the words both ends show when a link no longer
 * works. The customer's view is its own schema, built from the frozen snapshot by picking what a homeowner
 * is offered: it has no field for costs, margins, discount approvals, takeoff lines, internal notes or
 * anyone else's data (the objects are strict, so the server cannot send a key it does not name here).
 */

/** How long a link works after it is sent (days), unless it is revoked or its version replaced first. */
export const PROPOSAL_LINK_DAYS = 30;
/** How long one opening of a link lets the customer's browser in before the link is needed again (hours). */
export const PROPOSAL_LINK_SESSION_HOURS = 12;

/** A link's state as the office sees it. */
export const PROPOSAL_LINK_STATES = [
  'waiting-to-send',
  'sent',
  'not-sent',
  'revoked',
  'expired',
  'superseded',
] as const;
export type ProposalLinkState = (typeof PROPOSAL_LINK_STATES)[number];

export const proposalLinkRecord = z.strictObject({
  id: z.string(),
  state: z.enum(PROPOSAL_LINK_STATES),
  versionNumber: z.number().int(),
  to: z.string(),
  createdAt: z.string(),
  createdBy: z.string().nullable(),
  expiresAt: z.string(),
  sentAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  /** The mail queue's words while it has not gone out (the last error), or null. */
  mailProblem: z.string().nullable(),
  /** When the queue tries again, while it is retrying. */
  nextAttemptAt: z.string().nullable(),
});
export type ProposalLinkRecord = z.infer<typeof proposalLinkRecord>;

/** GET /api/jobs/:jobId/proposal/links (and the answer to sending and revoking). */
export const proposalLinksResponse = z.strictObject({
  /** The customer's e-mail on the job, offered as the recipient (null when the job has none). */
  customerEmail: z.string().nullable(),
  /** Whether the current version may be sent now, and if not, why. */
  canSend: z.discriminatedUnion('ok', [
    z.strictObject({ ok: z.literal(true), versionNumber: z.number().int() }),
    z.strictObject({ ok: z.literal(false), reason: z.string() }),
  ]),
  links: z.array(proposalLinkRecord),
});
export type ProposalLinksResponse = z.infer<typeof proposalLinksResponse>;

/** POST /api/jobs/:jobId/proposal/links: send the current version to this address (a new link each time). */
export const sendProposalBody = z.strictObject({ to: emailRule });
export type SendProposalBody = z.infer<typeof sendProposalBody>;

// ---- the customer's view -------------------------------------------------------------------------

const model = z.strictObject({
  modelNumber: z.string(),
  name: z.string(),
  coolingBtuh: z.number().nullable(),
  heatingBtuh: z.number().nullable(),
  seer2: z.number().nullable(),
  eer2: z.number().nullable(),
  hspf2: z.number().nullable(),
});

const customerOption = z.strictObject({
  position: z.number().int().min(1).max(3),
  name: z.string(),
  systems: z.array(
    z.strictObject({
      name: z.string(),
      outdoor: model,
      zones: z.array(z.strictObject({ name: z.string(), rooms: z.array(z.string()), indoor: model })),
      heatKit: model.nullable(),
    }),
  ),
  included: z.array(z.string()),
  price: z.strictObject({
    /** The price before the discount, shown only when there is a discount. */
    beforeDiscountCents: z.number().int(),
    discountCents: z.number().int(),
    subtotalCents: z.number().int(),
    taxCents: z.number().int(),
    totalCents: z.number().int(),
    depositCents: z.number().int(),
    balanceCents: z.number().int(),
  }),
  monthly: z.array(
    z.strictObject({
      name: z.string(),
      aprPercent: z.number(),
      months: z.number().int(),
      monthlyPaymentCents: z.number().int(),
    }),
  ),
});
export type CustomerOption = z.infer<typeof customerOption>;

/** GET /api/proposals/:proposalId: the version this customer was sent, as they may read it. */
export const customerProposalView = z.strictObject({
  proposalId: z.string(),
  version: z.strictObject({ number: z.number().int(), issuedAt: z.string() }),
  company: z.strictObject({
    name: z.string(),
    address: z.string().nullable(),
    phone: z.string().nullable(),
    email: z.string().nullable(),
    licence: z.string().nullable(),
  }),
  customer: z.strictObject({ name: z.string() }),
  site: z.strictObject({
    street: z.string(),
    unit: z.string(),
    city: z.string(),
    region: z.string(),
    postalCode: z.string(),
  }),
  loads: z.strictObject({
    method: z.string(),
    rooms: z.array(
      z.strictObject({ name: z.string(), floorAreaFt2: z.number(), coolingBtuh: z.number(), heatingBtuh: z.number() }),
    ),
    home: z.strictObject({ floorAreaFt2: z.number(), coolingBtuh: z.number(), heatingBtuh: z.number() }),
  }),
  options: z.array(customerOption).min(1).max(3),
  terms: z.string(),
  warranty: z.string(),
  cautions: z.array(z.string()),
  /** What changed since the version sent before this one (null for a first version). */
  changes: z
    .strictObject({
      sinceNumber: z.number().int(),
      sinceIssuedAt: z.string(),
      sentences: z.array(z.string()),
    })
    .nullable(),
  /** The option the customer chose last (null before a choice). */
  chosen: z.strictObject({ position: z.number().int(), at: z.string() }).nullable(),
  /** Whether the PDF is ready to download. */
  pdfReady: z.boolean(),
});
export type CustomerProposalView = z.infer<typeof customerProposalView>;

/** POST /api/proposals/:proposalId/option (the audit event's data carries the same `position`). */
export const chooseOptionBody = z.strictObject({
  position: z
    .number({ error: 'Choose one of the options.' })
    .int({ error: 'Choose one of the options.' })
    .min(1, { error: 'Choose one of the options.' })
    .max(3, { error: 'Choose one of the options.' }),
});

/** Said on every page that shows the loads: they are an estimate, and by which method. */
export const LOADS_ESTIMATE_NOTE =
  'These figures are an estimate worked out from what was measured and seen at your home; final equipment sizing is confirmed by the installer.';

/** The words of a link that no longer works (the server's page and the customer's page say the same). */
export const LINK_ENDED = {
  title: 'This link no longer works',
  unknown:
    'The link may have expired, been replaced by a newer proposal, or been mistyped. Ask the company that sent it for a new one.',
  expired: 'The link has expired.',
  revoked: 'The company that sent it has withdrawn this link.',
  superseded: 'The company has sent a newer version of this proposal; the newest e-mail has the link to it.',
  sessionEnded: 'Your viewing time has ended. Open the link in your e-mail again to carry on.',
  contact: 'To get a new link, contact',
  tooManyTitle: 'Please wait a few minutes',
  tooMany:
    'Many links that do not work were opened from this connection. Wait a few minutes, then open the link in your e-mail again.',
} as const;
export type LinkEndedReason = 'expired' | 'revoked' | 'superseded';
