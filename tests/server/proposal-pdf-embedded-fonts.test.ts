import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { renderProposalPdf } from '../../server/src/modules/proposals/pdf/render-proposal';
import { sealPdf } from '../../server/src/modules/proposals/pdf/seal';
import type { SignedRecord } from '../../server/src/modules/proposals/pdf/signed-record';
import { describeP12, makeSelfSignedP12 } from '../../server/src/services/seal-certificate';
import { pdfFonts } from '../helpers/pdf-fonts';
import { pdfPages } from '../helpers/pdf-text';
import { sampleSnapshot } from '../helpers/proposal-snapshot';

/**
 * Every font the proposal PDF references is the embedded Source Sans 3 (fonts.ts). react-pdf sets any
 * character its font has no glyph for in its fallback, the standard Helvetica, which it names without
 * embedding; a line break inside a text (an option's "Cooling …\nHeating …" cell, a model cell, the terms)
 * did exactly that on every option, scope and terms page. A reader then substitutes a font of its own.
 * Checked with poppler's pdffonts, page by page, on the unsigned proposal (three options, terms with line
 * breaks, tabs and CR/LF), and on the signed copy with its Notice of Cancellation dates, drawn and typed,
 * before and after the seal. Rendered without the database: the PDF is a function of its inputs.
 */
const PASSPHRASE = 'embedded-fonts-test';

function expectOnlyEmbeddedSourceSans(bytes: Uint8Array) {
  const fonts = pdfFonts(bytes);
  expect(fonts.length).toBeGreaterThanOrEqual(2);
  const notEmbedded = fonts
    .filter((f) => !f.embedded)
    .map((f) => `${f.name} (${f.type}) on pages ${f.pages.join(', ')}`);
  expect(notEmbedded, 'fonts referenced but not embedded').toEqual([]);
  for (const f of fonts) expect(f.name, `on pages ${f.pages.join(', ')}`).toMatch(/^[A-Z]{6}\+SourceSans3-/);
}

function snapshotWithBreaks() {
  const snapshot = sampleSnapshot('Rosalind Ashcombe-Vey');
  snapshot.company.terms = 'Payment:\tdue on completion.\r\nChanges in writing.\n\nNo work before the permit.\r\n';
  snapshot.company.warranty = 'Labor:\ttwo years.\nParts:\tas the maker warrants.';
  snapshot.company.cancellationExtra = 'State wording, line one.\nLine two.';
  return snapshot;
}

function signedRecord(over: Partial<SignedRecord>): SignedRecord {
  const at = new Date('2026-12-03T17:42:10Z');
  return {
    signatureId: '0193a8f0-0000-7000-8000-000000000001',
    optionPosition: 2,
    signerName: 'Rosalind Ashcombe-Vey',
    signerEmail: 'rosalind@example.com',
    method: 'typed',
    image: null,
    typedName: 'Rosalind Ashcombe-Vey',
    statement: 'I accept option 2 and agree to the terms above.\nI have read the notice of my right to cancel.',
    statementSha256: 'a'.repeat(64),
    signedAt: at,
    ip: '203.0.113.7',
    userAgent: 'EmbeddedFontsTest/1.0 (phone)',
    documentSha256: 'b'.repeat(64),
    snapshotSha256: 'c'.repeat(64),
    consent: { at: new Date(at.getTime() - 60_000), disclosureVersion: '2026-11', sha256: 'd'.repeat(64) },
    events: [
      { seq: 1, kind: 'issued', at: new Date('2026-12-01T15:00:00Z'), by: 'Office' },
      { seq: 2, kind: 'sent', at: new Date('2026-12-01T15:01:00Z'), by: 'Office' },
      { seq: 3, kind: 'consented', at: new Date(at.getTime() - 60_000), by: 'Customer' },
      { seq: 4, kind: 'signed', at, by: 'Customer' },
    ],
    certificate: { commonName: 'Gaugeline local seal (self-signed, not for production)', sha256: 'e'.repeat(64) },
    ...over,
  };
}

async function drawnMark(): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="600" height="200"><path d="M20 150 C 120 20, 200 190, 300 90 S 480 40, 570 140" stroke="#102030" stroke-width="6" fill="none"/></svg>`;
  return sharp(Buffer.from(svg)).png().toBuffer();
}

// The first render in a process merges the typeface: a generous limit, not a speed check (speed is `npm run bench`).
describe('the proposal PDF embeds every font it uses', { timeout: 120_000 }, () => {
  it('the unsigned three-option proposal: only Source Sans 3, embedded, on every page', async () => {
    const snapshot = snapshotWithBreaks();
    expect(snapshot.options).toHaveLength(3);
    const pdf = await renderProposalPdf({ snapshot, versionNumber: 1, logo: null });
    expectOnlyEmbeddedSourceSans(pdf);
    // The text that carried the line breaks still prints, each part on its own line.
    const text = (await pdfPages(pdf)).join('\n');
    expect(text).toMatch(/Cooling 30,000 Btu\/h\s+Heating 32,000 Btu\/h/);
    expect(text).toMatch(/Changes in writing\./);
  });

  it('the signed copy (typed, then drawn), its Notice of Cancellation dated, before and after the seal', async () => {
    const certificate = describeP12(makeSelfSignedP12(PASSPHRASE), PASSPHRASE);
    for (const signed of [
      signedRecord({}),
      signedRecord({ method: 'drawn', typedName: null, image: await drawnMark() }),
    ]) {
      const pdf = await renderProposalPdf({
        snapshot: snapshotWithBreaks(),
        versionNumber: 2,
        logo: null,
        signed,
        cancellation: { transactionDate: '2026-12-03' },
      });
      const pages = await pdfPages(pdf);
      // The pages this covers are there: the acceptance with the signature, both notice copies, the signing record.
      expect(pages.some((p) => p.includes('This is the signed copy'))).toBe(true);
      expect(pages.filter((p) => /NOTICE OF CANCELLATION/i.test(p)).length).toBeGreaterThanOrEqual(2);
      expect(pages.some((p) => p.includes('Signing record'))).toBe(true);
      expectOnlyEmbeddedSourceSans(pdf);
      const sealed = await sealPdf(pdf, certificate, {
        reason: 'Proposal version 2 signed by Rosalind Ashcombe-Vey',
        name: 'Alder Bay Comfort Co.',
        contactInfo: 'office@example.com',
        location: 'Signed electronically',
        signingTime: new Date('2026-12-03T17:43:00Z'),
      });
      expect(sealed.length).toBeGreaterThan(pdf.length);
      expectOnlyEmbeddedSourceSans(sealed);
    }
  });
});
