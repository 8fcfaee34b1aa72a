import { formatUsDate } from '@contract';
import { groupedNumber } from '../../../lib/grouped-number';

/** Dollars and cents from integer cents: 545393 → "$5,453.93". */
export function money(cents: number): string {
  const size = Math.abs(Math.round(cents));
  return `${cents < 0 ? '−' : ''}$${groupedNumber(Math.floor(size / 100))}.${String(size % 100).padStart(2, '0')}`;
}

/** A whole number of Btu/h, grouped: 14955 → "14,955 Btu/h". */
export const btuh = (v: number) => `${groupedNumber(Math.round(v))} Btu/h`;

/** An ISO instant as the proposal's dates read (its UTC calendar day, as the PDF writes it). */
export const usDate = (iso: string) => formatUsDate(iso.slice(0, 10));
