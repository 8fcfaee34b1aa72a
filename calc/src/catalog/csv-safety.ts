/**
 * CSV formula injection: a spreadsheet runs a cell that begins with =, +, -, @, a tab or a
 * carriage return as a formula. Exported cells that begin so get a leading apostrophe,
 * which spreadsheets show as text [PUB: OWASP, "CSV Injection"
 * (owasp.org/www-community/attacks/CSV_Injection)]. Import strips that apostrophe again
 * when what follows would have been neutralised, so export → import is unchanged.
 */
const DANGEROUS = /^[=+\-@\t\r]/;
/** A cell that already starts with apostrophes before a formula character gets one more, so restoring is exact. */
const QUOTED = /^'+[=+\-@\t\r]/;

export function neutraliseCell(cell: string): string {
  return DANGEROUS.test(cell) || QUOTED.test(cell) ? `'${cell}` : cell;
}

export function restoreCell(cell: string): string {
  return QUOTED.test(cell) ? cell.slice(1) : cell;
}
