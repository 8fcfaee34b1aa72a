import { num } from '../errors';
import { roundHalfUp } from '../rounding';

/**
 * Deterministic number formatting for explanations: the screen, the proposal PDF and the
 * installer's packet print the same characters on every machine, so no Intl / locale (ICU data
 * differs between Node and browsers). Half-up rounding (calc's `roundHalfUp`), "," thousands
 * groups, "." decimals, "−" (U+2212) for negatives, a plain space before the unit.
 */

const MINUS = '\u2212';

function group(intDigits: string): string {
  let out = '';
  for (let i = 0; i < intDigits.length; i += 1) {
    const fromEnd = intDigits.length - i;
    out += intDigits[i];
    if (fromEnd > 1 && fromEnd % 3 === 1) out += ',';
  }
  return out;
}

/**
 * A number with exactly `decimals` places (half-up) and thousands groups: 12345.678, 1 → "12,345.7".
 * `trim` drops trailing zeros after the point (6.40 → "6.4", 40.0 → "40").
 */
export function formatNumber(value: number, decimals = 0, { trim = false }: { readonly trim?: boolean } = {}): string {
  const r = roundHalfUp(num(value), decimals);
  const negative = r < 0;
  const fixed = Math.abs(r).toFixed(decimals);
  const [intPart = '0', fracPart = ''] = fixed.split('.');
  let frac = fracPart;
  if (trim) frac = frac.replace(/0+$/, '');
  const body = group(intPart) + (frac.length > 0 ? `.${frac}` : '');
  return negative && body.replace(/[0.,]/g, '') !== '' ? `${MINUS}${body}` : body;
}

/** A quantity with its unit: (6.4, 'oz', 1) → "6.4 oz". Decimals trimmed of trailing zeros. */
export function formatQuantity(value: number, unit: string, decimals = 0): string {
  const n = formatNumber(value, decimals, { trim: true });
  return unit === '' ? n : `${n} ${unit}`;
}

/** A percentage: (112.04, 0) → "112 %". Decimals trimmed. */
export function formatPercent(value: number, decimals = 0): string {
  return `${formatNumber(value, decimals, { trim: true })} %`;
}

/** Integer cents as dollars: 1234567 → "$12,345.67"; `whole` rounds half-up to dollars: "$12,346". */
export function formatMoney(cents: number, { whole = false }: { readonly whole?: boolean } = {}): string {
  const c = num(cents);
  const text = whole ? formatNumber(c / 100, 0) : formatNumber(c / 100, 2);
  return text.startsWith(MINUS) ? `${MINUS}$${text.slice(1)}` : `$${text}`;
}
