import { describe, expect, it } from 'vitest';
import { renderProposalPdf } from '../../server/src/modules/proposals/pdf/render-proposal';
import { pdfPages, pdfText } from '../helpers/pdf-text';
import { sampleSnapshot } from '../helpers/proposal-snapshot';

/**
 * The proposal's typeface draws Latin-extended, Vietnamese, Greek and Cyrillic letters in one font per
 * weight (fonts.ts merges Source Sans 3's subsets), so a reader extracts a name whole, as typed. Rendered
 * without the database: the PDF is a function of the snapshot.
 */
// The first render in a process merges the typeface (about a second quiet, more while the whole suite runs on
// two cores): a generous limit, not a speed check (speed is `npm run bench`).
describe('proposal PDF typeface', { timeout: 120_000 }, () => {
  it('prints Latin-extended names whole in the regular and the bold weights', async () => {
    const names = 'Łódź Óscar Şen';
    const snapshot = sampleSnapshot(names);
    snapshot.company.name = 'Ștefan Ősz Heating';
    snapshot.company.terms = 'Žofie Đurić, Nguyễn Thị Ánh, Ελένη, Дмитрий';
    const pdf = await renderProposalPdf({ snapshot, versionNumber: 1, logo: null });
    const text = await pdfText(pdf);
    // The cover's customer name is bold (700), the page frame regular (400), the company heading bold.
    expect(text).toContain(`HEATING AND COOLING PROPOSAL ${names}`);
    expect(text).toContain(`Proposal for ${names} · version 1`);
    expect(text).toContain('Ștefan Ősz Heating');
    expect(text).toContain('Žofie Đurić, Nguyễn Thị Ánh, Ελένη, Дмитрий');
    // No '?' stood in for a letter the typeface lacked.
    expect((await pdfPages(pdf)).join('')).not.toMatch(/Ł\?|\?ód|Ş\?/);
  });

  it('still puts a plain ? in place of a character Source Sans 3 cannot draw', async () => {
    const pdf = await renderProposalPdf({ snapshot: sampleSnapshot('Wei 王 Chen'), versionNumber: 1, logo: null });
    expect(await pdfText(pdf)).toContain('Wei ? Chen');
  });
});
