/**
 * Numbers as the load figures show them: digits grouped by thousands, US style (12,756.25), exactly as
 * `Intl.NumberFormat('en-US')` writes them (the shortest decimal that reads back as the value, rounded
 * to at most three decimals, halves away from zero, trailing zeros dropped). Written out here rather
 * than by `Intl`: on a phone the first `Intl.NumberFormat` made costs the locale's data (50–80 ms of
 * main thread at 4× slowdown, a task of its own while the room form is first typed into; issue 11).
 * Values JavaScript writes with an exponent from 10²¹ up, and ones not finite, go to `Intl`, on a
 * formatter made on first use.
 */
let formatter: Intl.NumberFormat | null = null;

export function groupedNumber(value: number): string {
  const size = Math.abs(value);
  if (!(size < 1e21)) {
    formatter ??= new Intl.NumberFormat('en-US');
    return formatter.format(value);
  }
  const [whole, fraction] = roundedTo3(size);
  let out = whole.slice(0, whole.length % 3 || 3);
  for (let i = out.length; i < whole.length; i += 3) out += `,${whole.slice(i, i + 3)}`;
  if (fraction) out += `.${fraction}`;
  // Intl keeps the sign of a negative value that rounds to zero ("-0"), as it does for -0 itself.
  return value < 0 || Object.is(value, -0) ? `-${out}` : out;
}

/** A size below 10²¹ as its whole digits and up to three decimals, as Intl rounds it: from its shortest decimal. */
function roundedTo3(size: number): [string, string] {
  const text = String(size);
  // Below 10⁻⁶ JavaScript writes an exponent; such a value rounds to 0 at three decimals.
  if (text.includes('e')) return ['0', ''];
  const [whole = '0', decimals = ''] = text.split('.');
  if (decimals.length <= 3) return [whole, decimals.replace(/0+$/, '')];
  let digits = whole + decimals.slice(0, 3);
  if ((decimals[3] ?? '0') >= '5') digits = plusOne(digits);
  return [digits.slice(0, -3) || '0', digits.slice(-3).replace(/0+$/, '')];
}

/** A string of decimal digits plus one ("0999" → "1000"). */
function plusOne(digits: string): string {
  let i = digits.length - 1;
  while (i >= 0 && digits[i] === '9') i -= 1;
  const carried = '0'.repeat(digits.length - 1 - i);
  return i < 0 ? `1${carried}` : `${digits.slice(0, i)}${Number(digits[i]) + 1}${carried}`;
}
