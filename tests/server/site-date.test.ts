import { describe, expect, it } from 'vitest';
import { coolingOffWindow } from '@calc';
import { isKnownTimeZone, siteLocalDate } from '../../server/src/lib/site-date';

// Offsets from the IANA time-zone database (via Node's Intl): US Eastern is UTC−5 in November (standard
// time) and UTC−4 in July (daylight time); Pacific is UTC−8 / UTC−7; Honolulu UTC−10 all year.
describe('the job site’s local date at a signing instant', () => {
  it('a late-evening signing in New York is still the Friday there though UTC has moved on to Saturday', () => {
    const signed = new Date('2026-12-05T04:30:00Z'); // 23:30 EST on Friday 4 December
    expect(siteLocalDate(signed, 'America/New_York')).toBe('2026-12-04');
    expect(siteLocalDate(signed, 'UTC')).toBe('2026-12-05');
    // Counting from the site's Friday (16 CFR 429.0(g), 429.1(a)): Sat 5, (Sun 6), Mon 7, Tue 8 → Tuesday.
    // Counting from the UTC Saturday would wrongly give (Sun 6), Mon 7, Tue 8, Wed 9.
    expect(coolingOffWindow(siteLocalDate(signed, 'America/New_York')).lastDayToCancel).toBe('2026-12-08');
    expect(coolingOffWindow(siteLocalDate(signed, 'UTC')).lastDayToCancel).toBe('2026-12-09');
  });
  it('daylight time: 06:30 UTC on 4 July is 23:30 on 3 July in Los Angeles (UTC−7)', () => {
    expect(siteLocalDate(new Date('2026-07-04T06:30:00Z'), 'America/Los_Angeles')).toBe('2026-07-03');
    expect(siteLocalDate(new Date('2026-07-04T07:30:00Z'), 'America/Los_Angeles')).toBe('2026-07-04');
  });
  it('Honolulu (UTC−10, no daylight time)', () => {
    expect(siteLocalDate(new Date('2026-12-31T09:59:00Z'), 'Pacific/Honolulu')).toBe('2026-12-30');
    expect(siteLocalDate(new Date('2026-12-31T10:00:00Z'), 'Pacific/Honolulu')).toBe('2026-12-31');
  });
  it('an unknown zone or an invalid instant is refused', () => {
    expect(isKnownTimeZone('America/Chicago')).toBe(true);
    expect(isKnownTimeZone('Mars/Olympus')).toBe(false);
    expect(() => siteLocalDate(new Date(), 'Mars/Olympus')).toThrow('Unknown time zone: Mars/Olympus');
    expect(() => siteLocalDate(new Date('nope'), 'UTC')).toThrow('not a valid time');
  });
});
