/**
 * Numbers as the load figures show them: digits grouped by thousands, US style (12,756), as
 * `toLocaleString('en-US')` writes them. One formatter for the page: on a phone the first formatter
 * made costs the locale's data (66 ms of main thread at 4× slowdown, in the first figures' render before
 * this; issue 11), so it is made once, and the live figures make it ahead of their first render.
 */
let formatter: Intl.NumberFormat | null = null;

export function groupedNumber(value: number): string {
  formatter ??= new Intl.NumberFormat('en-US');
  return formatter.format(value);
}
