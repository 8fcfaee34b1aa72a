import { z } from 'zod';
import { coolingOffWindow } from '@calc';
import { formatUsDate } from './dates';

/**
 * The buyer's right-to-cancel texts for a sale made at the home (FTC Cooling-Off Rule, 16 CFR Part 429),
 * as data: the PDF (pdf14's renderer) and the customer's page lay them out; nothing here knows about pages.
 *
 * - `statement`: the 16 CFR 429.1(a) sentence, which the rule wants in bold type of at least 10 points, in
 *   immediate proximity to the space for the buyer's signature. Its last sentence names where the form is;
 *   429.1(a) says to change it to the form's actual location when the forms are not attached.
 * - `form`: the 16 CFR 429.1(b) "NOTICE OF CANCELLATION", completed (transaction date, seller's name and
 *   address, the last day to cancel) and given to the buyer in duplicate, in bold type of at least 10 points.
 *   The legal wording below follows 429.1(b); the seller's blanks are filled in; nothing else is changed.
 * - `stateWording`: whatever the company's settings add for its state (16 CFR 429.2 keeps stricter state
 *   laws in force); printed after the federal form, as the company wrote it.
 *
 * The last day to cancel is always computed here with calc's `coolingOffWindow` from the transaction's local
 * date (the job site's date when the buyer signed), never taken from a caller. Before the buyer signs there is
 * no transaction date: `buildUnsignedCoolingOffNotice` gives the same texts with blank lines for both dates
 * (the unsigned PDF); the signing fills them by calling `buildCoolingOffNotice` with the date.
 *
 * Wording checked (5 December 2026; the eCFR itself was not reachable from here) against copies of the rule's
 * text: the 429.1(a) statement, the sentence on the forms' location, the (b) caption choice, the ten-point bold
 * face and "in duplicate" against the rule as reproduced on a legal-publisher page ("16 C.F.R. § 429.1, current
 * through September 30, 2024") and a law firm's page quoting § 429.1; the form's first three paragraphs against
 * the Wisconsin Department of Financial Institutions' page "Three Day Right To Cancel — Federal Notice" ("the
 * following notices are required by 16 CFR 429.1"); its fourth and fifth paragraphs and the buyer's part
 * ("I HEREBY CANCEL THIS TRANSACTION.", "(Date)", "(Buyer's signature)") against independent public copies of
 * the federal form that agree word for word, and against state statutes that repeat it (New York Personal
 * Property Law § 428, Delaware Code tit. 6 § 4404). The last session's "from memory" for the later paragraphs
 * is confirmed: no word differed. Differences seen only in some copies, and not taken: "traded-in",
 * "canceled", "when received by you" (Wisconsin's page); "within TEN DAYS" (a seller's own copy; the rule
 * says TEN BUSINESS DAYS). The texts are English, the
 * language the proposal is written in (429.1(a), (b) ask for the language of the sales presentation/contract).
 */

/** One line of a name: printable text with no control characters (CR/LF would break the form's layout). */
const oneLine = (max: number) =>
  z
    .string()
    .trim()
    .min(1)
    .max(max)
    .refine((s) => !/[\p{Cc}]/u.test(s), 'Use one line without control characters.');

export const coolingOffNoticeInputSchema = z
  .object({
    sellerName: oneLine(160),
    /** The seller's place of business; lines may be separated by line breaks (joined with commas). */
    sellerAddress: z
      .string()
      .trim()
      .min(1, 'The seller’s address is required on the notice (16 CFR 429.1(a)).')
      .max(400),
    /** The transaction's local date at the job site, YYYY-MM-DD. */
    transactionDate: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter the date as YYYY-MM-DD.'),
    /** Where the two copies of the form are, relative to the contract; 'attached' unless they travel apart. */
    formLocation: z.enum(['attached', 'accompanying']).default('attached'),
    /** The company's extra state wording (settings), '' when none. */
    stateWording: z.string().max(20000).default(''),
  })
  .strict();

export type CoolingOffNoticeInput = z.input<typeof coolingOffNoticeInputSchema>;

/** Minimum type for both texts: 10-point bold face (16 CFR 429.1(a) and (b)). */
export const COOLING_OFF_TYPE = { minPoints: 10, bold: true } as const;

/** The captions 429.1(b) allows; we use the first listed in the form below. */
export const NOTICE_CAPTIONS = ['NOTICE OF CANCELLATION', 'NOTICE OF RIGHT TO CANCEL'] as const;

export interface CoolingOffNotice {
  /** The transaction's local date (YYYY-MM-DD), or null on the notice of a version not yet signed. */
  readonly transactionDate: string | null;
  /** The last day to cancel (YYYY-MM-DD), or null before signing (the text prints a blank line). */
  readonly lastDayToCancel: string | null;
  /** 16 CFR 429.1(a). */
  readonly statement: string;
  /** 16 CFR 429.1(b), completed. */
  readonly form: {
    readonly caption: (typeof NOTICE_CAPTIONS)[number];
    /** The completed date of the transaction, printed above "(Date)"; null before signing (a blank line). */
    readonly dateOfTransaction: string | null;
    readonly paragraphs: readonly string[];
    /** The buyer's part: the sentence to sign and the two blanks under it. */
    readonly buyerPart: { readonly sentence: string; readonly blanks: readonly ['(Date)', "(Buyer's signature)"] };
    /** The form is furnished in duplicate (429.1(b)). */
    readonly copies: 2;
  };
  readonly type: typeof COOLING_OFF_TYPE;
  /** The company's state wording, '' when none. */
  readonly stateWording: string;
  /** Where the wording comes from, for the footnote of our layouts (our words). */
  readonly source: string;
}

/** "2026-11-30" → "November 30, 2026" (the contract's one date style). */
export const formatNoticeDate = formatUsDate;

/** The blank a date is filled in on, before the buyer signs (the signing fills it). */
export const NOTICE_BLANK = '____________________';

type NoticeParties = z.output<typeof coolingOffNoticeInputSchema>;

function noticeTexts(
  parsed: NoticeParties,
  dates: { readonly transactionDate: string; readonly lastDayToCancel: string } | null,
): CoolingOffNotice {
  const address = parsed.sellerAddress
    .split(/\r\n|\r|\n/)
    .map((line) => line.trim())
    .filter((line) => line.length > 0)
    .join(', ');
  const lastDay = dates ? formatNoticeDate(dates.lastDayToCancel) : NOTICE_BLANK;

  return {
    transactionDate: dates?.transactionDate ?? null,
    lastDayToCancel: dates?.lastDayToCancel ?? null,
    statement:
      'You, the buyer, may cancel this transaction at any time prior to midnight of the third business day after the ' +
      `date of this transaction. See the ${parsed.formLocation} notice of cancellation form for an explanation of this right.`,
    form: {
      caption: 'NOTICE OF CANCELLATION',
      dateOfTransaction: dates ? formatNoticeDate(dates.transactionDate) : null,
      paragraphs: [
        'You may CANCEL this transaction, without any penalty or obligation, within THREE BUSINESS DAYS from the above date.',
        'If you cancel, any property traded in, any payments made by you under the contract or sale, and any negotiable ' +
          'instrument executed by you will be returned within TEN BUSINESS DAYS following receipt by the seller of your ' +
          'cancellation notice, and any security interest arising out of the transaction will be cancelled.',
        'If you cancel, you must make available to the seller at your residence, in substantially as good condition as ' +
          'when received, any goods delivered to you under this contract or sale, or you may, if you wish, comply with the ' +
          "instructions of the seller regarding the return shipment of the goods at the seller's expense and risk.",
        'If you do make the goods available to the seller and the seller does not pick them up within 20 days of the date ' +
          'of your Notice of Cancellation, you may retain or dispose of the goods without any further obligation. If you ' +
          'fail to make the goods available to the seller, or if you agree to return the goods to the seller and fail to ' +
          'do so, then you remain liable for performance of all obligations under the contract.',
        'To cancel this transaction, mail or deliver a signed and dated copy of this cancellation notice or any other ' +
          `written notice, or send a telegram, to ${parsed.sellerName}, at ${address} NOT LATER THAN MIDNIGHT OF ${lastDay}.`,
      ],
      buyerPart: { sentence: 'I HEREBY CANCEL THIS TRANSACTION.', blanks: ['(Date)', "(Buyer's signature)"] },
      copies: 2,
    },
    type: COOLING_OFF_TYPE,
    stateWording: parsed.stateWording.trim(),
    source:
      'The statement and the notice of cancellation follow the FTC Cooling-Off Rule, 16 CFR 429.1(a) and (b). ' +
      'Business days exclude Sundays and the federal holidays named in 16 CFR 429.0(g).',
  };
}

/** Builds the completed notice. Throws a ZodError for bad input and calc's CalcError for an impossible date. */
export function buildCoolingOffNotice(input: CoolingOffNoticeInput): CoolingOffNotice {
  const parsed = coolingOffNoticeInputSchema.parse(input);
  const window = coolingOffWindow(parsed.transactionDate);
  return noticeTexts(parsed, { transactionDate: window.transactionDate, lastDayToCancel: window.lastDayToCancel });
}

/**
 * The notice before the buyer signs: the same texts with blank lines (`NOTICE_BLANK`) for the date of the
 * transaction and the last day to cancel, which only the signing fixes. Throws a ZodError for bad input.
 */
export function buildUnsignedCoolingOffNotice(input: Omit<CoolingOffNoticeInput, 'transactionDate'>): CoolingOffNotice {
  // Any valid date satisfies the schema's check of the other fields; no date from it is used.
  const parsed = coolingOffNoticeInputSchema.parse({ ...input, transactionDate: '2000-01-01' });
  return noticeTexts(parsed, null);
}
