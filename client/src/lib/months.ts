import { MONTH_NAMES } from '@contract';

export { MONTH_NAMES };

export function monthName(month: unknown): string | null {
  return typeof month === 'number' && Number.isInteger(month) ? (MONTH_NAMES[month - 1] ?? null) : null;
}
