import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { Font } from '@react-pdf/renderer';
import { Font as FontFile, type FontEditor } from 'fonteditor-core';

/**
 * The proposal's typeface: Source Sans 3 as shipped by @fontsource/source-sans-3 (SIL Open Font License),
 * read from node_modules, never fetched. Fontsource ships it cut into script subsets (WOFF), and react-pdf
 * takes one file per weight, so at first use each weight's subsets are merged into one TrueType font with
 * fonteditor-core: the latin file as it is (its kerning kept: new glyphs are appended, so its glyph ids
 * do not move), then every glyph of latin-ext, vietnamese, greek and cyrillic for a code point the font
 * does not draw yet. One font per weight means a name like "Łódź Óscar Şen" is one run of text: it prints
 * with the same spacing as the rest and a reader extracts and searches it whole (with one family per
 * subset, react-pdf cut it into runs and a reader read "Ł ód ź"). Composite glyphs are made simple on
 * reading (their parts refer to glyph ids of their own subset file); hinting is dropped (a PDF reader
 * does its own). Regular 400, semibold 600 and bold 700; about a second for the three, once per process.
 */

const SUBSETS = ['latin', 'latin-ext', 'vietnamese', 'greek', 'cyrillic', 'greek-ext', 'cyrillic-ext'] as const;
/** Tab, line feed and carriage return: given an empty glyph so react-pdf never falls back to Helvetica for them. */
const CONTROL_CODE_POINTS = [0x09, 0x0a, 0x0d] as const;
export const FONT_WEIGHTS = { regular: 400, semibold: 600, bold: 700 } as const;

/** The `fontFamily` every text of the proposal uses. */
export const PROPOSAL_FONT = 'Source Sans 3';

const filesDir = (): string => {
  const require = createRequire(import.meta.url);
  return join(dirname(require.resolve('@fontsource/source-sans-3/package.json')), 'files');
};

function readSubset(dir: string, subset: string, weight: number, kerning: boolean): FontEditor.Font {
  const woff = readFileSync(join(dir, `source-sans-3-${subset}-${weight}-normal.woff`));
  return FontFile.create(woff, {
    type: 'woff',
    // fonteditor-core reads WOFF's zlib tables through the inflate it is given (node's own here).
    inflate: (data) => Array.from(inflateSync(Buffer.from(data))),
    compound2simple: true,
    hinting: false,
    kerning,
  });
}

/** One weight's subsets merged into one TrueType font (the latin subset first, its kerning kept). */
export function mergedFace(weight: number, dir = filesDir()): Buffer {
  const base = readSubset(dir, SUBSETS[0], weight, true);
  const ttf = base.get();
  const drawn = new Set(ttf.glyf.flatMap((g) => g.unicode ?? []));
  for (const subset of SUBSETS.slice(1)) {
    for (const glyph of readSubset(dir, subset, weight, false).get().glyf) {
      const fresh = (glyph.unicode ?? []).filter((cp) => !drawn.has(cp));
      if (fresh.length === 0) continue;
      for (const cp of fresh) drawn.add(cp);
      ttf.glyf.push({ ...glyph, unicode: fresh });
    }
  }
  // A line break (or tab) inside a text is a character too: react-pdf looks it up in the font like any other and,
  // where the font has no glyph for it, sets that character in its fallback, the standard Helvetica, which is
  // then referenced without being embedded. An empty glyph with no width for the control characters keeps every
  // character of the proposal in this one embedded face (react-pdf breaks the line there; nothing is drawn).
  ttf.glyf.push({
    contours: [],
    xMin: 0,
    yMin: 0,
    xMax: 0,
    yMax: 0,
    unicode: [...CONTROL_CODE_POINTS],
    advanceWidth: 0,
    leftSideBearing: 0,
    name: 'controls',
  });
  base.set(ttf);
  return base.write({ type: 'ttf', toBuffer: true, kerning: true, hinting: false });
}

let registered = false;
let printable: Set<number> | null = null;

/** Merges and registers the three weights with react-pdf once per process. */
export function registerProposalFonts(): void {
  if (registered) return;
  const dir = filesDir();
  for (const weight of Object.values(FONT_WEIGHTS))
    Font.register({
      family: PROPOSAL_FONT,
      src: `data:font/ttf;base64,${mergedFace(weight, dir).toString('base64')}`,
      fontWeight: weight,
    });
  // Names, model numbers and e-mail addresses must print as typed: never split a word with a hyphen.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}

/**
 * Registers the faces and works out every code point the typeface can draw (from the regular face, which
 * react-pdf loads here once per process). A character it lacks (a Chinese name, an emoji) would print as
 * an empty box and extract as garbage, so `printableText` puts a '?' in its place.
 */
export async function loadProposalFonts(): Promise<void> {
  registerProposalFonts();
  if (printable) return;
  const source = Font.getFont({ fontFamily: PROPOSAL_FONT, fontWeight: FONT_WEIGHTS.regular });
  await source.load();
  const set: unknown = source.data && 'characterSet' in source.data ? source.data.characterSet : null;
  if (!Array.isArray(set)) throw new Error(`The font ${PROPOSAL_FONT} has no character set`);
  printable = new Set(set.filter((cp): cp is number => typeof cp === 'number'));
}

// U+FFFD is in the latin subset's map but prints as a stray glyph over its neighbours, so a plain '?'.
const REPLACEMENT = '?';
/** Signs calc's worked formulas use that Source Sans 3 lacks, written the way a keyboard would. */
const SPELLED: Readonly<Record<string, string>> = { '≤': '<=', '≥': '>=', '≈': '~', '→': '->' };

/** `text` with every character the typeface cannot draw replaced by '?'; line breaks and tabs stay. */
export function printableText(text: string): string {
  const ok = printable;
  if (!ok) throw new Error('loadProposalFonts() first');
  let out = '';
  for (const ch of text) {
    const cp = ch.codePointAt(0) ?? 0;
    out += cp === 0x0a || cp === 0x09 || ok.has(cp) ? ch : (SPELLED[ch] ?? REPLACEMENT);
  }
  return out;
}
