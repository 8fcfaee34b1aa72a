/** Month names for a month stored as 1–12 (calc's design month, a date's month): people read "July", not "7". */
export const MONTH_NAMES = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
] as const;

/**
 * A calendar date as US readers write it: 2026-11-30 → "November 30, 2026". No Intl, so the server, the
 * browser and the PDF print the same words; one style for every date a proposal and its notice show.
 */
export function formatUsDate(isoDate: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  return `${MONTH_NAMES[(m ?? 1) - 1]} ${d}, ${y}`;
}
