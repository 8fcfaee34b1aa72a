import { z } from 'zod';
import { PAYMENT_STATES } from './payments';

/**
 * After the signature (issue 14): the deposit on the customer's page and the buyer's cancellation within
 * three business days (16 CFR 429.1(a)). The bodies the routes take and the record the customer's page
 * and the office read. Money in integer cents; dates YYYY-MM-DD on the job site's calendar.
 */

const localDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'Enter the date as YYYY-MM-DD.' });

export const CANCELLATION_REASON_MAX = 1000;

/** Optional words the buyer or the office adds; kept as plain text (never markup). */
const reason = z
  .string({ message: 'The reason is text.' })
  .trim()
  .max(CANCELLATION_REASON_MAX, { message: `Keep the reason to ${CANCELLATION_REASON_MAX} characters.` })
  .optional()
  .transform((s) => (s ? s : undefined));

/** The buyer on the proposal's page: nothing but an optional reason (the time, IP and browser come from the request). */
export const customerCancellationBody = z.strictObject({ reason });
export type CustomerCancellationBody = z.input<typeof customerCancellationBody>;

/** How the office heard of a cancellation the buyer did not make on the page. */
export const OFFICE_CANCELLATION_METHODS = ['mail', 'delivered'] as const;
export const OFFICE_CANCELLATION_METHOD_LABELS: Record<(typeof OFFICE_CANCELLATION_METHODS)[number], string> = {
  mail: 'Mailed by the buyer',
  delivered: 'Handed or sent to the office by the buyer',
};

/**
 * The office records a notice the buyer mailed or delivered: the date on the postmark, or the day it
 * reached the office (429.1(b): a notice mailed before midnight of the last day counts).
 */
export const officeCancellationBody = z.strictObject({
  method: z.enum(OFFICE_CANCELLATION_METHODS, { message: 'Say how the buyer sent the cancellation.' }),
  sentOn: localDate,
  reason,
});
export type OfficeCancellationBody = z.input<typeof officeCancellationBody>;

/** A deposit as the customer's page sees it: no intent made yet, or the payment's own state. */
export const DEPOSIT_STATES = ['not-started', ...PAYMENT_STATES] as const;

/**
 * How the customer's page pays: the payment service's address and publishable key, from the server's
 * configuration. `testMode` is the local fake, whose test payment methods the page offers; null when
 * this server has no card form for the configured service.
 */
export const payWithRecord = z.object({
  apiUrl: z.string(),
  publishableKey: z.string(),
  testMode: z.boolean(),
});
export type PayWithRecord = z.infer<typeof payWithRecord>;

export const afterSigningRecord = z.object({
  proposalId: z.string(),
  /** When the buyer signed the current version; null when it is not signed. */
  signedAt: z.string().nullable(),
  /** The right-to-cancel window from the signing, on the job site's calendar; null before signing. */
  window: z
    .object({
      transactionDate: localDate,
      lastDayToCancel: localDate,
      open: z.boolean(),
    })
    .nullable(),
  deposit: z.object({
    /** The chosen option's deposit in the frozen version (0: none is due). */
    amountCents: z.number().int().min(0),
    state: z.enum(DEPOSIT_STATES),
    /** Why the last payment attempt failed, in the payment service's words. */
    failure: z.string().nullable(),
    paidAt: z.string().nullable(),
    refundedAt: z.string().nullable(),
    /** A refund has been asked of the payment service and its confirmation has not come back yet. */
    refundPending: z.boolean(),
  }),
  cancellation: z
    .object({
      at: z.string(),
      method: z.enum(['page', ...OFFICE_CANCELLATION_METHODS]),
      sentOn: localDate.nullable(),
      reason: z.string().nullable(),
    })
    .nullable(),
  payWith: payWithRecord.nullable(),
});
export type AfterSigningRecord = z.infer<typeof afterSigningRecord>;
