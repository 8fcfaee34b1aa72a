/**
 * One sheet, A4 or Letter: the page box is the smaller of the two (210 × 279 mm) less
 * margins. Everything but the sheet is hidden when printing, whatever shell surrounds it.
 */
const css = `
@page { size: auto; margin: 12mm; }
@media print {
  body * { visibility: hidden !important; }
  .load-sheet, .load-sheet * { visibility: visible !important; }
  .load-sheet { position: absolute; inset: 0 auto auto 0; width: 186mm; max-height: 255mm; overflow: hidden; font-size: 9pt; color: #000; background: #fff; }
  .load-sheet .no-print { display: none !important; }
  .load-sheet, .load-sheet * { font-size: 7.5pt !important; line-height: 1.25 !important; }
  .load-sheet h1 { font-size: 12pt !important; }
  .load-sheet h2 { font-size: 8.5pt !important; }
  .load-sheet { padding: 0 !important; gap: 2.5mm !important; }
  .load-sheet table { page-break-inside: avoid; }
}
`;

export function PrintStyles() {
  return <style>{css}</style>;
}
