/** Month names for a month stored as 1–12 (calc's design month): people read "July", not "7". */
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

export function monthName(month: unknown): string | null {
  return typeof month === 'number' && Number.isInteger(month) ? (MONTH_NAMES[month - 1] ?? null) : null;
}
