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

/** One reason as the owner types it: one line of text, trimmed, 1–80 characters. */
export const lossReasonText = z
  .string({ message: 'A reason is text.' })
  .trim()
  .min(1, { message: 'A reason cannot be empty.' })
  .max(LOSS_REASON_MAX, { message: `A reason is at most ${LOSS_REASON_MAX} characters.` })
  .refine((s) => ![...s].some((ch) => ch.charCodeAt(0) < 32 || ch.charCodeAt(0) === 127), {
    message: 'A reason is one line of text.',
  });

export const LOSS_REASONS_MESSAGES = {
  none: 'Keep at least one reason, so a job can be marked lost.',
  tooMany: `At most ${LOSS_REASONS_MAX} reasons.`,
  system: `“${CANCELLED_BY_BUYER}” is kept for cancellations the system records; choose other words.`,
  twice: (r: string) => `“${r}” is on the list twice.`,
} as const;

/**
 * What is wrong across the list (each problem at the position of the reason it is about): the system's own
 * reason typed by hand, or the same words twice (ignoring case and outer spaces; the later one is named).
 * The server's schema and the settings screen's form both use it, so they say the same thing.
 */
export function lossReasonListProblems(list: readonly string[]): Array<{ index: number; message: string }> {
  const out: Array<{ index: number; message: string }> = [];
  list.forEach((r, i) => {
    if (r.trim() === '') return;
    if (sameReason(r, CANCELLED_BY_BUYER)) out.push({ index: i, message: LOSS_REASONS_MESSAGES.system });
    else if (list.findIndex((o) => sameReason(o, r)) < i)
      out.push({ index: i, message: LOSS_REASONS_MESSAGES.twice(r.trim()) });
  });
  return out;
}

/** What the owner sends: the whole list, in the order to offer it. */
export const lossReasonsInput = z.strictObject({
  reasons: z
    .array(lossReasonText, { message: 'Send the reasons as a list.' })
    .min(1, { message: LOSS_REASONS_MESSAGES.none })
    .max(LOSS_REASONS_MAX, { message: LOSS_REASONS_MESSAGES.tooMany })
    .superRefine((list, ctx) => {
      for (const p of lossReasonListProblems(list))
        ctx.addIssue({ code: 'custom', path: [p.index], message: p.message });
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
