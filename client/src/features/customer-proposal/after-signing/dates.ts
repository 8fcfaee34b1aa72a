import { formatUsDate } from '@contract';

const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'] as const;

/** 2026-11-30 → "Monday, November 30, 2026" (a calendar date, no time zone: the job site's date as the server sent it). */
export function longDate(isoDate: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  const weekday = WEEKDAYS[new Date(Date.UTC(y ?? 1970, (m ?? 1) - 1, d ?? 1)).getUTCDay()];
  return `${weekday}, ${formatUsDate(isoDate)}`;
}

/** An instant the server sent, as the day the reader's phone shows it. */
export function dayOf(instant: string): string {
  const at = new Date(instant);
  const iso = `${at.getFullYear()}-${String(at.getMonth() + 1).padStart(2, '0')}-${String(at.getDate()).padStart(2, '0')}`;
  return formatUsDate(iso);
}
