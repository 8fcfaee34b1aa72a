import { writeFileSync } from 'node:fs';
import sharp from 'sharp';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { describe, expect, it } from 'vitest';
import { buildCoolingOffNotice, buildUnsignedCoolingOffNotice, NOTICE_BLANK, type ProposalSnapshot } from '@contract';
import { renderProposalPdf } from '../../server/src/modules/proposals/pdf/render-proposal';
import { pdfPages } from '../helpers/pdf-text';
import { sampleSnapshot } from '../helpers/proposal-snapshot';

/**
 * Issue 14, what the company puts on the proposal as the PDF prints it: the cover's logo and contact lines,
 * terms and warranty from the snapshot, the buyer's right-to-cancel statement beside the buyer's signature
 * and the Notice of Cancellation in duplicate (16 CFR 429.1(a), (b)) with the company's extra state wording.
 * Rendered without the database: the PDF is a function of the frozen snapshot. Set PDF_OUT=dir to keep the
 * files for `pdftoppm`.
 */

// pdf.js hands "(" and the kerned letter after it as two runs, which the helper joins with a space.
const flat = (s: string) => s.replace(/\s+/g, ' ').replace(/\( /g, '(').trim();

/** Every text run of each page with its font size in points (pdf.js: the text matrix's scale). */
async function runs(bytes: Uint8Array): Promise<{ str: string; size: number }[][]> {
  const doc = await getDocument({ data: new Uint8Array(bytes), isEvalSupported: false, verbosity: 0 }).promise;
  try {
    const pages = [];
    for (let i = 1; i <= doc.numPages; i++) {
      const content = await (await doc.getPage(i)).getTextContent();
      pages.push(
        content.items.flatMap((item) =>
          'str' in item && item.str.trim() !== ''
            ? [{ str: item.str, size: Math.hypot(item.transform[0] ?? 0, item.transform[1] ?? 0) }]
            : [],
        ),
      );
    }
    return pages;
  } finally {
    await doc.destroy();
  }
}

const company = (): ProposalSnapshot['company'] => ({
  name: 'Quillfeather Air & Heat',
  address: '77 Quillfeather Way\nUnit 3\nMossgrove, OR 97000',
  phone: '(555) 010-7788',
  email: 'office@quillfeather-air.example',
  licence: 'Contractor licence QA-000123 (demo)',
  logoKey: 'logo-key-demo',
  terms: 'Prices hold for 30 days.\n\nThe balance is due on completion.',
  warranty: 'Labor: two years from start-up.',
  cancellationExtra: 'Invented state wording: you may also cancel by e-mail to the address above.',
});

async function render(snapshot: ProposalSnapshot, cancellation: { transactionDate: string } | null, name: string) {
  const logo = {
    data: await sharp({ create: { width: 300, height: 100, channels: 4, background: '#1d6b5f' } })
      .png()
      .toBuffer(),
    format: 'png' as const,
  };
  const pdf = await renderProposalPdf({ snapshot, versionNumber: 2, logo, cancellation });
  if (process.env.PDF_OUT) writeFileSync(`${process.env.PDF_OUT}/${name}.pdf`, pdf);
  return pdf;
}

// The first render in a process merges the typeface (about a second quiet, more while the whole suite runs on
// two cores): a generous limit, not a speed check (speed is `npm run bench`).
describe('the company on the proposal PDF', { timeout: 120_000 }, () => {
  it('the cover carries the contact lines and licence; terms and warranty print from the snapshot', async () => {
    const snapshot = { ...sampleSnapshot('Rowan Ellery'), company: company() };
    const raw = await pdfPages(await render(snapshot, null, 'company-unsigned'));
    const pages = raw.map(flat);
    const cover = pages[0] ?? '';
    // The address's lines print as the owner wrote them, one under the other.
    expect(raw[0]).toMatch(/77\s+Quillfeather Way *\n *Unit 3 *\n *Mossgrove, OR 97000/);
    expect(cover).toContain('Quillfeather Air & Heat');
    // The address's three lines print on the cover, each as written.
    for (const text of ['77 Quillfeather Way', 'Unit 3', 'Mossgrove, OR 97000', '(555) 010-7788'])
      expect(cover).toContain(text);
    expect(cover).toContain('office@quillfeather-air.example');
    expect(cover).toContain('Contractor licence QA-000123 (demo)');
    const terms = pages.find((p) => p.includes('Terms and warranty')) ?? '';
    expect(terms).toContain('Prices hold for 30 days. The balance is due on completion.');
    expect(terms).toContain('Labor: two years from start-up.');
  });

  it('an unsigned version: the 429.1(a) statement beside the buyer’s signature, the 429.1(b) form twice with blank dates', async () => {
    const snapshot = { ...sampleSnapshot('Rowan Ellery'), company: company() };
    const pdf = await render(snapshot, null, 'notice-unsigned');
    const pages = (await pdfPages(pdf)).map(flat);
    const expected = buildUnsignedCoolingOffNotice({
      sellerName: 'Quillfeather Air & Heat',
      sellerAddress: company().address ?? '',
      stateWording: company().cancellationExtra,
    });
    const acceptance = pages.find((p) => p.includes('Acceptance')) ?? '';
    // 16 CFR 429.1(a): the statement, in the buyer's signing part (after "Buyer", before the signature lines).
    const statementAt = acceptance.indexOf(expected.statement);
    expect(statementAt).toBeGreaterThan(acceptance.indexOf('Buyer'));
    expect(statementAt).toBeLessThan(acceptance.indexOf('Name in capitals'));

    const notices = pages.filter((p) => p.includes('NOTICE OF CANCELLATION'));
    expect(notices).toHaveLength(2); // 429.1(b): "in duplicate"
    for (const page of notices) {
      for (const paragraph of expected.form.paragraphs) expect(page).toContain(flat(paragraph));
      expect(page).toContain(
        `at 77 Quillfeather Way, Unit 3, Mossgrove, OR 97000 NOT LATER THAN MIDNIGHT OF ${NOTICE_BLANK}.`,
      );
      expect(page).toContain("I HEREBY CANCEL THIS TRANSACTION. (Date) (Buyer's signature)");
      expect(page).toContain('filled in when you sign');
      expect(page).toContain('Further cancellation terms from Quillfeather Air & Heat');
      expect(page).toContain(company().cancellationExtra);
      expect(page).toContain('16 CFR 429.1(a) and (b)');
    }
    expect(notices[0]).toContain('Copy 1 of 2');
    expect(notices[1]).toContain('Copy 2 of 2');

    // 16 CFR 429.1(a), (b): bold face type of at least 10 points, the statement and every word of the form.
    const all = await runs(pdf);
    const noticeRuns = all.filter((p) => p.some((r) => r.str.includes('NOTICE OF CANCELLATION')));
    expect(noticeRuns).toHaveLength(2);
    // The form itself: from its caption to the buyer's part (not the page's running header and footer).
    const legal = noticeRuns.flatMap((p) => {
      const from = p.findIndex((r) => r.str.includes('NOTICE OF CANCELLATION'));
      const to = p.findIndex((r) => r.str.includes('I HEREBY CANCEL THIS TRANSACTION.'));
      return p.slice(from, to + 1);
    });
    expect(legal.length).toBeGreaterThan(20);
    for (const r of legal) expect(r.size, r.str).toBeGreaterThanOrEqual(10);
  });

  it('a signed version: the transaction date and the last day, counted in 429.0(g) business days, are filled in', async () => {
    const snapshot = { ...sampleSnapshot('Rowan Ellery'), company: company() };
    // Signed Wednesday 25 November 2026: Thanksgiving (26th) does not count, Saturday 28th does, Sunday 29th
    // does not, so the third business day is Monday 30 November (16 CFR 429.0(g), 429.1(a)).
    const pages = (await pdfPages(await render(snapshot, { transactionDate: '2026-11-25' }, 'notice-signed'))).map(
      flat,
    );
    const notices = pages.filter((p) => p.includes('NOTICE OF CANCELLATION'));
    expect(notices).toHaveLength(2);
    const signed = buildCoolingOffNotice({
      sellerName: 'Quillfeather Air & Heat',
      sellerAddress: company().address ?? '',
      transactionDate: '2026-11-25',
    });
    for (const page of notices) {
      expect(page).toContain('November 25, 2026 (Date)');
      expect(page).toContain(flat(signed.form.paragraphs.at(-1) ?? ''));
      expect(page).toContain('NOT LATER THAN MIDNIGHT OF November 30, 2026.');
      expect(page).not.toContain('filled in when you sign');
    }
  });

  it('with nothing in the settings: the form leaves a blank for the address and no state wording', async () => {
    const bare = sampleSnapshot('Rowan Ellery');
    const snapshot = {
      ...bare,
      company: { ...bare.company, address: null, phone: null, email: null, licence: null, cancellationExtra: '' },
    };
    const pages = (await pdfPages(await render(snapshot, null, 'notice-bare'))).map(flat);
    const notices = pages.filter((p) => p.includes('NOTICE OF CANCELLATION'));
    expect(notices).toHaveLength(2);
    for (const page of notices) {
      expect(page).toContain(
        `to Alder Bay Comfort Co., at ${NOTICE_BLANK} NOT LATER THAN MIDNIGHT OF ${NOTICE_BLANK}.`,
      );
      expect(page).not.toContain('Further cancellation terms');
    }
  });
});
