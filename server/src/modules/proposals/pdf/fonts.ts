import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { Font } from '@react-pdf/renderer';
import { woffToSfnt } from './woff-to-sfnt';

/**
 * The proposal's typeface: Source Sans 3 as shipped by @fontsource/source-sans-3 (SIL Open Font License),
 * read from node_modules, never fetched. Fontsource ships it cut into script subsets (WOFF, which
 * react-pdf's fontkit reads); each subset is its own family here and a text run lists them all, so
 * react-pdf takes each character from the first subset that has it: "Łukasz" and "Nguyễn" print in the
 * same face as the rest. Regular 400, semibold 600 and bold 700. Each file is unwrapped from WOFF once
 * (`woffToSfnt`, which is why a render takes a fraction of a second rather than seconds).
 */

const SUBSETS = ['latin', 'latin-ext', 'vietnamese', 'greek', 'cyrillic', 'greek-ext', 'cyrillic-ext'] as const;
export const FONT_WEIGHTS = { regular: 400, semibold: 600, bold: 700 } as const;

const familyOf = (subset: string) => `Source Sans 3 ${subset}`;
/** The `fontFamily` every text of the proposal uses (the subsets in order). */
export const PROPOSAL_FONT = SUBSETS.map(familyOf);

const filesDir = (): string => {
  const require = createRequire(import.meta.url);
  return join(dirname(require.resolve('@fontsource/source-sans-3/package.json')), 'files');
};
const fileOf = (dir: string, subset: string, weight: number) =>
  join(dir, `source-sans-3-${subset}-${weight}-normal.woff`);

let registered = false;
let printable: Set<number> | null = null;

/** Registers the faces with react-pdf once per process (registration only notes the files; they load on first use). */
export function registerProposalFonts(): void {
  if (registered) return;
  const dir = filesDir();
  for (const subset of SUBSETS)
    for (const weight of Object.values(FONT_WEIGHTS))
      Font.register({
        family: familyOf(subset),
        src: `data:font/ttf;base64,${woffToSfnt(readFileSync(fileOf(dir, subset, weight))).toString('base64')}`,
        fontWeight: weight,
      });
  // Names, model numbers and e-mail addresses must print as typed: never split a word with a hyphen.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}

/**
 * Registers the faces and works out every code point one of the subsets can draw (from the regular
 * faces, which react-pdf loads here once per process). A character none has (a Chinese name, an emoji)
 * would print as an empty box and extract as garbage, so `printableText` puts a '?' in its place.
 */
export async function loadProposalFonts(): Promise<void> {
  registerProposalFonts();
  if (printable) return;
  const all = new Set<number>();
  for (const family of PROPOSAL_FONT) {
    const source = Font.getFont({ fontFamily: family, fontWeight: FONT_WEIGHTS.regular });
    await source.load();
    const set: unknown = source.data && 'characterSet' in source.data ? source.data.characterSet : null;
    if (!Array.isArray(set)) throw new Error(`The font ${family} has no character set`);
    for (const cp of set) if (typeof cp === 'number') all.add(cp);
  }
  printable = all;
}

// U+FFFD is in the latin subset's map but prints as a stray glyph over its neighbours, so a plain '?'.
const REPLACEMENT = '?';
/** Signs calc's worked formulas use that Source Sans 3's subsets lack, written the way a keyboard would. */
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
