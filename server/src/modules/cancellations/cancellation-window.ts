import { canStillCancel, coolingOffWindow } from '@calc';
import { siteLocalDate } from '../../lib/site-date';
import { siteTimeZones } from '../../lib/site-time-zones';

/**
 * The buyer's window to cancel a signed proposal (16 CFR 429.1(a)): from the signing instant, counted on
 * the job site's local calendar with calc's `coolingOffWindow` (business days of 429.0(g)), open until
 * midnight at the end of its last day. The site's zone comes from its state (lib/site-time-zones.ts);
 * with several candidate zones each is worked out and the buyer gets the latest close.
 */
export interface CancelWindow {
  /** The site's local date of the signing (the transaction date of 429.1(a)). */
  transactionDate: string;
  /** The last local date the buyer may cancel on (until midnight at its end). */
  lastDayToCancel: string;
  /** The site's local date now, in the zone the answer was worked out in. */
  today: string;
  /** Whether `now` is still inside the window. */
  open: boolean;
  /** False when the site's state was not recognised and every US zone was tried. */
  zoneKnown: boolean;
}

export function cancelWindow(signedAt: Date, now: Date, region: string): CancelWindow {
  const { zones, known } = siteTimeZones(region);
  let best: CancelWindow | null = null;
  for (const zone of zones) {
    const transactionDate = siteLocalDate(signedAt, zone);
    const { lastDayToCancel } = coolingOffWindow(transactionDate);
    const today = siteLocalDate(now, zone);
    // A clock behind the signing (today before the transaction date) is not "closed": the window has
    // not even started counting, so the buyer may cancel.
    const open = today < transactionDate || canStillCancel(transactionDate, today);
    const candidate = { transactionDate, lastDayToCancel, today, open, zoneKnown: known };
    if (!best || (open && !best.open) || (open === best.open && candidate.lastDayToCancel > best.lastDayToCancel))
      best = candidate;
  }
  if (!best) throw new Error('No time zone to count the cancellation window in.');
  return best;
}
