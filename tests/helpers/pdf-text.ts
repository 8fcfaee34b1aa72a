import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/**
 * The text of each page of a PDF as a reader extracts it (pdf.js, the engine of Firefox's viewer), one
 * string per page with the text runs joined by spaces and line ends by newlines. Tests read PDFs with it
 * the way a homeowner's reader or a search would.
 */
export async function pdfPages(bytes: Uint8Array): Promise<string[]> {
  const doc = await getDocument({
    data: new Uint8Array(bytes),
    isEvalSupported: false,
    useSystemFonts: false,
    verbosity: 0,
  }).promise;
  try {
    const pages: string[] = [];
    for (let i = 1; i <= doc.numPages; i++) {
      const content = await (await doc.getPage(i)).getTextContent();
      pages.push(content.items.map((item) => ('str' in item ? item.str + (item.hasEOL ? '\n' : ' ') : '')).join(''));
    }
    return pages;
  } finally {
    await doc.destroy();
  }
}

/** The whole document's text with runs of white space made one space (phrases split across runs still match). */
export async function pdfText(bytes: Uint8Array): Promise<string> {
  return (await pdfPages(bytes)).join('\n').replace(/\s+/g, ' ');
}
