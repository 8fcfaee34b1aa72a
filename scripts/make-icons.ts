import { mkdirSync, writeFileSync } from 'node:fs';
import sharp from 'sharp';

/**
 * The installable app's icons, drawn from Gaugeline's own mark (the gauge arc and needle of the
 * favicon in client/index.html) on the brand's dark teal. Run `npx tsx scripts/make-icons.ts`
 * after changing the mark; the PNGs are committed under client/public/icons/.
 */
const INK = '#12343b';
const AMBER = '#e39b2d';
const PAPER = '#f7f4ee';

/** `safe` shrinks the mark into the middle 80 % so a maskable icon survives any mask shape. */
function mark(safe: boolean): string {
  const s = safe ? 0.62 : 0.8;
  const o = (1 - s) / 2;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 32 32">
  <rect width="32" height="32" rx="${safe ? 0 : 7}" fill="${INK}"/>
  <g transform="translate(${o * 32} ${o * 32 + 2}) scale(${s})">
    <path d="M5 22a11 11 0 0 1 22 0" fill="none" stroke="${PAPER}" stroke-width="3.5" stroke-linecap="round"/>
    <path d="M16 22 22 11" stroke="${AMBER}" stroke-width="3" stroke-linecap="round"/>
    <circle cx="16" cy="22" r="3" fill="${PAPER}"/>
  </g>
</svg>`;
}

const out = 'client/public/icons';
mkdirSync(out, { recursive: true });
const icons: [string, number, boolean][] = [
  ['icon-192.png', 192, false],
  ['icon-512.png', 512, false],
  ['icon-maskable-512.png', 512, true],
  ['apple-touch-icon-180.png', 180, true],
];
for (const [name, size, safe] of icons) {
  const png = await sharp(Buffer.from(mark(safe)), { density: (72 * size) / 32 })
    .resize(size, size)
    .png({ compressionLevel: 9 })
    .toBuffer();
  writeFileSync(`${out}/${name}`, png);
}
writeFileSync(`${out}/icon.svg`, mark(false));
console.log(`icons written to ${out}`);
