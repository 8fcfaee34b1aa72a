import { z } from 'zod';

/**
 * The owner's sales reports (issue 15): the query both ends build (the page keeps it in its URL) and the
 * answer. Money is integer cents (revenue: the signed option's subtotal after discount, before tax); rates are
 * 0–1 with null where nothing was decided; days are decimal days.
 */

const isoDate = /^\d{4}-\d{2}-\d{2}$/;

/** Days since 1970-01-01 of a proleptic Gregorian date (H. Hinnant's days_from_civil), or null when it is no real date. */
export function civilDay(iso: string): number | null {
  const [y = 0, m = 0, d = 0] = iso.split('-').map(Number);
  const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
  const inMonth = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][m - 1];
  if (!inMonth || d < 1 || d > inMonth) return null;
  const yy = m <= 2 ? y - 1 : y;
  const era = Math.floor(yy / 400);
  const yoe = yy - era * 400;
  const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

const dateField = (label: string) =>
  z
    .string()
    .regex(isoDate, { message: `${label} must be a date written YYYY-MM-DD.` })
    .refine((s) => civilDay(s) !== null, { message: `${label} is not a real calendar date.` });

/** At most this many days between from and to (ten years: a report, not a data dump). */
export const REPORT_MAX_DAYS = 3660;

export const salesReportQuery = z
  .strictObject({
    /** First day of the range (proposals first issued on or after it), the company's calendar; optional. */
    from: dateField('The start date').optional(),
    /** Last day of the range, inclusive; optional. */
    to: dateField('The end date').optional(),
    /** Only this person's proposals (the job's salesperson). */
    salesperson: z.uuid({ message: 'Choose a salesperson from the list.' }).optional(),
  })
  .superRefine((q, ctx) => {
    if (q.from && q.to) {
      const days = (civilDay(q.to) ?? 0) - (civilDay(q.from) ?? 0);
      if (days < 0)
        ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end date comes before the start date.' });
      else if (days > REPORT_MAX_DAYS)
        ctx.addIssue({ code: 'custom', path: ['to'], message: 'Choose a range of at most ten years.' });
    }
  });
export type SalesReportQuery = z.infer<typeof salesReportQuery>;

export const REPORT_SYSTEM_TYPES = ['single-zone', 'multi-zone', 'ducted', 'mixed'] as const;
export const SYSTEM_TYPE_LABELS: Record<(typeof REPORT_SYSTEM_TYPES)[number], string> = {
  'single-zone': 'Ductless single-zone',
  'multi-zone': 'Ductless multi-zone',
  ducted: 'Ducted',
  mixed: 'Ductless and ducted together',
};

/**
 * Sizing bands: the option's cooling capacity at the design temperature over the home's block cooling load.
 * The edges are calc's default sizing policy's cooling limits (calc/src/sizing/policy.ts: 90 % minimum,
 * 115 % single-speed and 130 % variable-speed maximum, from a secondary summary of ACCA Manual S).
 */
export const SIZING_BANDS = [
  { key: 'under', label: 'Below 90 %', min: null, max: 0.9 },
  { key: 'right', label: '90 – 115 %', min: 0.9, max: 1.15 },
  { key: 'upper', label: '115 – 130 %', min: 1.15, max: 1.3 },
  { key: 'over', label: 'Above 130 %', min: 1.3, max: null },
  { key: 'unknown', label: 'Not known', min: null, max: null },
] as const;
export type SizingBandKey = (typeof SIZING_BANDS)[number]['key'];

/** Outstanding proposals' age, days since the latest version was issued. */
export const AGE_BUCKETS = [
  { key: '0-7', label: 'Up to a week', min: 0, max: 7 },
  { key: '8-30', label: '8 – 30 days', min: 8, max: 30 },
  { key: '31-90', label: '31 – 90 days', min: 31, max: 90 },
  { key: '91+', label: 'Over 90 days', min: 91, max: null },
] as const;

const rate = z.number().min(0).max(1).nullable();
const count = z.number().int().min(0);

/** One group's figures: proposals counted, won, lost, decided (won + lost), win rate = won ÷ decided, revenue. */
export const winGroup = z.object({
  key: z.string(),
  label: z.string(),
  proposals: count,
  won: count,
  lost: count,
  decided: count,
  winRate: rate,
  revenueCents: z.number().int(),
});
export type WinGroup = z.infer<typeof winGroup>;

export const salesReportResponse = z.object({
  filters: z.object({ from: z.string().nullable(), to: z.string().nullable(), salesperson: z.string().nullable() }),
  /** The people the filter offers: everyone of the company who holds proposals, or a salesperson. */
  salespeople: z.array(z.object({ id: z.string(), name: z.string() })),
  totals: winGroup.extend({
    outstanding: count,
    averageTicketCents: z.number().int().nullable(),
    /** Median days from the first visit (the job's creation) to the signature, over the won proposals signed. */
    medianDaysToSignature: z.number().nullable(),
  }),
  bySalesperson: z.array(winGroup),
  byMonth: z.array(winGroup),
  /** Per option position: decided proposals that offered it, and the ones signed at it. */
  byOption: z.array(winGroup),
  bySystemType: z.array(winGroup),
  bySizingBand: z.array(winGroup),
  /** Jobs whose first desk price fell in the range, and how many of them went on to an issued proposal. */
  firstPrice: z.object({ priced: count, proposed: count, conversion: rate }),
  outstanding: z.object({
    count,
    oldestDays: z.number().int().nullable(),
    ages: z.array(z.object({ key: z.string(), label: z.string(), count })),
  }),
  lostReasons: z.array(z.object({ reason: z.string(), count })),
  /** Signed proposals, and those the buyer cancelled within the three-day window. */
  cancellations: z.object({ signed: count, cancelled: count, rate }),
});
export type SalesReport = z.infer<typeof salesReportResponse>;
