import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderProposalPdf } from '../../server/src/modules/proposals/pdf/render-proposal';
import { sampleSnapshot } from '../helpers/proposal-snapshot';

/**
 * The proposal PDF read by a reader other than the one that made it: poppler's pdfinfo, pdffonts, pdftotext
 * and pdftoppm (poppler-utils, installed on the machine), on a three-option proposal rendered from the
 * sample snapshot without the database. A reader that finds the file damaged says so on stderr ("Syntax
 * Error …"); these tests ask for none.
 */
const dir = mkdtempSync(join(tmpdir(), 'gaugeline-pdf-reader-'));
const file = join(dir, 'proposal.pdf');
const snapshot = sampleSnapshot('Pat Quinlan');
let bytes: Buffer;

beforeAll(async () => {
  bytes = await renderProposalPdf({ snapshot, versionNumber: 1, logo: null });
  writeFileSync(file, bytes);
}, 60_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A poppler tool's stdout; its stderr must be empty (a complaint about the file fails the test). */
function poppler(tool: string, args: string[]): string {
  const r = spawnSync(tool, args, { encoding: 'utf8' });
  expect(r.error, `${tool} runs`).toBeUndefined();
  expect(r.stderr, `${tool} has nothing to say about the file`).toBe('');
  expect(r.status).toBe(0);
  return r.stdout;
}

const info = () =>
  Object.fromEntries(
    poppler('pdfinfo', [file])
      .split('\n')
      .filter((l) => l.includes(':'))
      .map((l) => [l.slice(0, l.indexOf(':')).trim(), l.slice(l.indexOf(':') + 1).trim()]),
  );

const pageText = (n: number) =>
  poppler('pdftotext', ['-f', String(n), '-l', String(n), file, '-'])
    .split('\n')
    .map((l) => l.trim())
    .filter(Boolean);

describe('the proposal PDF in another reader', () => {
  it('parses: US Letter pages, not encrypted, titled for the customer and version, its size on record', () => {
    const i = info();
    expect(i.Title).toBe('Proposal for Pat Quinlan, version 1');
    expect(i.Encrypted).toBe('no');
    expect(i['Page size']).toBe('612 x 792 pts (letter)');
    expect(Number(i['File size']?.split(' ')[0])).toBe(bytes.length);
    // Every page is drawn by poppler without a complaint (each to a small PNG).
    const pages = Number(i.Pages);
    poppler('pdftoppm', ['-r', '12', '-png', file, join(dir, 'page')]);
    expect(readdirSync(dir).filter((f) => f.startsWith('page-') && f.endsWith('.png'))).toHaveLength(pages);
  });

  it('has the expected pages: the cover first, then each section from the top of a new page, in order', () => {
    const pages = Number(info().Pages);
    // The section headings (proposal-document.tsx: one <Page> per section; a long section runs onto more).
    const sections = [
      'Your home’s heating and cooling loads',
      ...snapshot.options.map((o) => `Option ${o.position}: ${o.name}`),
      'Terms and warranty',
      'Acceptance',
    ];
    const starts: number[] = [];
    const found = new Map<string, number>();
    for (let n = 1; n <= pages; n++) {
      // Below the running frame (company, then "Proposal for … · version 1"), a section's first page opens with its heading.
      const lines = pageText(n);
      expect(lines[1], `page ${n}'s frame`).toBe('Proposal for Pat Quinlan · version 1');
      const heading = lines[2] ?? '';
      if (sections.includes(heading)) {
        found.set(heading, n);
        starts.push(n);
      }
    }
    expect(pageText(1)).toContain('Pat Quinlan'); // the cover names the customer
    expect([...found.keys()]).toEqual(sections);
    expect(starts).toEqual([...starts].sort((x, y) => x - y));
    expect(starts[0]).toBe(2); // the cover is page 1 alone
    expect(pages).toBeGreaterThanOrEqual(sections.length + 1);
  });

  it('carries its typeface inside: every Source Sans 3 weight is embedded and subset', () => {
    const rows = poppler('pdffonts', [file]).split('\n').slice(2).filter(Boolean);
    const sourceSans = rows.filter((r) => /\+SourceSans3-/.test(r));
    expect(sourceSans.length).toBeGreaterThanOrEqual(2);
    // Columns: name, type (two words), encoding, emb, sub, uni, object id.
    for (const r of sourceSans) expect(r.split(/\s+/).slice(-5, -2), r).toEqual(['yes', 'yes', 'yes']);
    expect(execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' })).toContain('Option 3: Best');
  });
});
