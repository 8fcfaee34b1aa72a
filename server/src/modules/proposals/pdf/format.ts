import { formatUsDate } from '@contract';
import { printableText } from './fonts';

/**
 * How the proposal writes what the snapshot holds. Every string from a person (a customer's name, a
 * company's terms) goes through `line` or `paragraphs`: it prints exactly as typed — markup, `{{7*7}}`
 * and the like are just characters to react-pdf, which has no template language — except that a one-line
 * field's CR/LF and other control characters become a space (so a name cannot start a new line of the
 * page) and characters the typeface lacks become '?'.
 */

// eslint-disable-next-line no-control-regex -- control characters are exactly what this removes
const CONTROL = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]+/g;

/** A one-line field as printed: control characters and line breaks → one space each run. */
export function line(text: string): string {
  return printableText(text.replace(CONTROL, ' '));
}

/**
 * A multi-line field (terms, warranty) as paragraphs: a blank line starts a new paragraph, a single line
 * break stays a line break, other control characters become a space.
 */
export function paragraphs(text: string): string[] {
  return text
    .replace(/\r\n?/g, '\n')
    .split(/\n[ \t]*\n+/)
    .map((p) =>
      p
        .split('\n')
        .map((l) => line(l).trimEnd())
        .join('\n')
        .trim(),
    )
    .filter((p) => p !== '');
}

const usd = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });
const whole = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const oneDecimal = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const upToTwo = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });

/** Integer cents as dollars: 1234567 → "$12,345.67". */
export const money = (cents: number): string => usd.format(cents / 100);
/** A load or capacity: 24133.6 → "24,134 Btu/h". */
export const btuh = (value: number): string => `${whole.format(value)} Btu/h`;
export const feet = (value: number): string => `${upToTwo.format(value)} ft`;
export const squareFeet = (value: number): string => `${whole.format(value)} ft²`;
export const ounces = (value: number): string => `${oneDecimal.format(value)} oz`;
export const amps = (value: number): string => `${upToTwo.format(value)} A`;
export const plain = (value: number): string => upToTwo.format(value);

/** An ISO date-time as the day it fell on in UTC, in the contract's one date style: "December 5, 2026". */
export function day(iso: string): string {
  return formatUsDate(new Date(iso).toISOString().slice(0, 10));
}

/** A design-day hour (calc numbers them 1–24, solar time) as the loads screen writes it: 15 → "15:00". */
export const hourOfDay = (hour: number): string => `${String(hour).padStart(2, '0')}:00`;
