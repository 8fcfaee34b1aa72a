/**
 * The job site's local calendar date at an instant (YYYY-MM-DD), for the right-to-cancel window: calc's
 * `coolingOffWindow` counts from the transaction's local date, so the server turns the signing instant
 * into the site's date here (and "now" the same way before it asks `canStillCancel`). Uses the IANA
 * time-zone database shipped with Node's Intl; daylight-saving changes are Intl's business.
 */

/** Whether `timeZone` is an IANA zone name this runtime knows (e.g. "America/Chicago"). */
export function isKnownTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone });
    return true;
  } catch {
    return false;
  }
}

/** The calendar date at `instant` in `timeZone`. Throws a RangeError naming the zone when it is unknown. */
export function siteLocalDate(instant: Date, timeZone: string): string {
  if (Number.isNaN(instant.getTime())) throw new RangeError('The instant is not a valid time.');
  if (!isKnownTimeZone(timeZone)) throw new RangeError(`Unknown time zone: ${timeZone}`);
  const parts = new Intl.DateTimeFormat('en-US', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    calendar: 'gregory',
    numberingSystem: 'latn',
  }).formatToParts(instant);
  const part = (type: 'year' | 'month' | 'day') => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('year').padStart(4, '0')}-${part('month')}-${part('day')}`;
}
