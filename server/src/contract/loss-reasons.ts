import { z } from 'zod';

/**
 * Why a job was lost (issue 14). The office marks a job lost by hand with a reason from the company's
 * list (an owner edits it in the settings; a company that never saved one uses the defaults below). The
 * system itself uses one fixed reason, when a buyer cancels a signed proposal within the cooling-off
 * window; it is never on the editable list, so the reports can tell the two apart.
 */

/** The reason the system writes when the buyer cancels (16 CFR 429 cancellation); never chosen by hand. */
export const CANCELLED_BY_BUYER = 'Cancelled by buyer';

/** The list a company starts with (our own wording; common reasons in residential sales, common practice). */
export const DEFAULT_LOSS_REASONS: readonly string[] = [
  'Price too high',
  'Went with another contractor',
  'Decided not to do the work now',
  'Financing not approved',
  'No answer after the proposal',
  'Repaired the old system instead',
];

export const LOSS_REASON_MAX = 80;
export const LOSS_REASONS_MAX = 20;

const sameReason = (a: string, b: string) =>
  a.trim().toLocaleLowerCase('en-US') === b.trim().toLocaleLowerCase('en-US');

/** What the owner sends: the whole list, in the order to offer it. */
export const lossReasonsInput = z.strictObject({
  reasons: z
    .array(
      z
        .string({ message: 'A reason is text.' })
        .trim()
        .min(1, { message: 'A reason cannot be empty.' })
        .max(LOSS_REASON_MAX, { message: `A reason is at most ${LOSS_REASON_MAX} characters.` })
        .refine((s) => ![...s].some((ch) => ch.charCodeAt(0) < 32 || ch.charCodeAt(0) === 127), {
          message: 'A reason is one line of text.',
        }),
      { message: 'Send the reasons as a list.' },
    )
    .min(1, { message: 'Keep at least one reason, so a job can be marked lost.' })
    .max(LOSS_REASONS_MAX, { message: `At most ${LOSS_REASONS_MAX} reasons.` })
    .superRefine((list, ctx) => {
      list.forEach((r, i) => {
        if (sameReason(r, CANCELLED_BY_BUYER))
          ctx.addIssue({
            code: 'custom',
            path: [i],
            message: `“${CANCELLED_BY_BUYER}” is kept for cancellations the system records; choose other words.`,
          });
        else if (list.findIndex((o) => sameReason(o, r)) < i)
          ctx.addIssue({ code: 'custom', path: [i], message: `“${r}” is on the list twice.` });
      });
    }),
});
export type LossReasonsInput = z.output<typeof lossReasonsInput>;

/** GET/PUT /api/settings/loss-reasons. `version` is 0 until the owner first saves (send it as If-Match). */
export const lossReasonsRecord = z.object({
  reasons: z.array(z.string()),
  /** The fixed reason the system uses for a buyer's cancellation (shown, not editable). */
  systemReason: z.literal(CANCELLED_BY_BUYER),
  /** Whether the list is still the defaults (never saved). */
  isDefault: z.boolean(),
  version: z.number().int(),
});
export type LossReasonsRecord = z.output<typeof lossReasonsRecord>;
export const lossReasonsResponse = z.object({ lossReasons: lossReasonsRecord });

/** Whether a reason is on the list (the same words, ignoring case and outer spaces). */
export const isListedReason = (list: readonly string[], reason: string): boolean =>
  list.some((r) => sameReason(r, reason));
