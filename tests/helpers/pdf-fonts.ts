import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** One font a PDF references, as poppler's `pdffonts` lists it. */
export interface PdfFont {
  readonly name: string;
  readonly type: string;
  readonly embedded: boolean;
  /** The pages (1-based) whose resources name it. */
  readonly pages: number[];
}

/**
 * Every font a PDF's pages reference, read by poppler's `pdffonts` (poppler-utils, installed on the machine)
 * page by page, so a failure says where a font is used. A font that is referenced but not embedded (say the
 * standard Helvetica a PDF maker falls back to) makes a reader substitute its own, with other widths.
 */
export function pdfFonts(bytes: Uint8Array): PdfFont[] {
  const dir = mkdtempSync(join(tmpdir(), 'gaugeline-pdffonts-'));
  try {
    const file = join(dir, 'doc.pdf');
    writeFileSync(file, bytes);
    const run = (args: string[]) => {
      const r = spawnSync('pdffonts', [...args, file], { encoding: 'utf8' });
      if (r.error) throw r.error;
      if (r.status !== 0 || r.stderr !== '') throw new Error(`pdffonts: ${r.stderr || `exit ${r.status}`}`);
      return r.stdout;
    };
    const pages = Number(/^Pages:\s+(\d+)/m.exec(spawnSync('pdfinfo', [file], { encoding: 'utf8' }).stdout)?.[1]);
    if (!Number.isInteger(pages) || pages < 1) throw new Error('pdfinfo: no page count');
    const fonts = new Map<string, { name: string; type: string; embedded: boolean; pages: number[] }>();
    for (let page = 1; page <= pages; page++) {
      // Columns: name, type (one to three words), encoding, emb, sub, uni, object number, generation.
      for (const row of run(['-f', String(page), '-l', String(page)])
        .split('\n')
        .slice(2)
        .filter(Boolean)) {
        const cols = row.trim().split(/\s+/);
        const [emb, , , obj, gen] = cols.slice(-5);
        const id = `${obj} ${gen}`;
        const font = fonts.get(id) ?? {
          name: cols[0] ?? '',
          type: cols.slice(1, -6).join(' '),
          embedded: emb === 'yes',
          pages: [],
        };
        font.pages.push(page);
        fonts.set(id, font);
      }
    }
    return [...fonts.values()];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
