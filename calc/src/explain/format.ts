import { num } from '../errors';
import { roundHalfUp } from '../rounding';

/**
 * Deterministic number formatting for explanations: the screen, the proposal PDF and the
 * installer's packet print the same characters on every machine, so no Intl / locale (ICU data
 * differs between Node and browsers). Half-up rounding (calc's `roundHalfUp`), "," thousands
 * groups, "." decimals, "−" (U+2212) for negatives, a plain space before the unit.
 */

const MINUS = '\u2212';

/**
 * A number with exactly `decimals` places (half-up) and thousands groups: 12345.678, 1 → "12,345.7".
 * `trim` drops trailing zeros after the point (6.40 → "6.4", 40.0 → "40"). Hot (every explanation
 * calls it), so it works on the digit string by index: no regex, no split.
 */
export function formatNumber(value: number, decimals = 0, { trim = false }: { readonly trim?: boolean } = {}): string {
  const r = roundHalfUp(num(value), decimals);
  // r < 0 only when the rounded value is not zero (roundHalfUp gives −0 for a tiny negative), so never "−0".
  const negative = r < 0;
  let s = (negative ? -r : r).toFixed(decimals);
  if (trim && decimals > 0) {
    let end = s.length;
    while (s.charCodeAt(end - 1) === 48) end -= 1;
    if (s.charCodeAt(end - 1) === 46) end -= 1;
    s = s.slice(0, end);
  }
  const dot = s.indexOf('.');
  const intLen = dot < 0 ? s.length : dot;
  if (intLen > 3) {
    const first = intLen % 3 || 3;
    let out = s.slice(0, first);
    for (let i = first; i < intLen; i += 3) out += `,${s.slice(i, i + 3)}`;
    s = out + s.slice(intLen);
  }
  return negative ? `${MINUS}${s}` : s;
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
