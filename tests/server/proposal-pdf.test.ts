import { createHash, randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { pdfStorageKey, queuePdfRender } from '../../server/src/modules/proposals/proposal-pdf.service';
import { isProblem, login, makeCompany, type Session } from '../helpers/fixtures';
import { pdfPages, pdfText } from '../helpers/pdf-text';
import { sampleSnapshot } from '../helpers/proposal-snapshot';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';
import { newJob } from './jobs-helpers';

/**
 * Issue 14, the PDF: a version's PDF is rendered by the queue from the frozen snapshot, stored, its SHA-256
 * recorded on the version with an audit event, and streamed to the office. Workers are off: each test
 * drains the queue itself, so it sees every try.
 */
let t: TestApp;
let db: pg.Client;
let companyId: string;
let estimator: Session;
let salesperson: Session;
let other: Session;
let estimatorId: string;

/** A name a homeowner could type, with markup, template syntax and a line break: it must print as typed. */
const TRICKY = 'Dana <b>Ortiz</b> {{7*7}} ${x}\r\nBcc: all@example.com';

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off' });
  const c = await makeCompany(t.orm.em.fork(), 'Pdf');
  companyId = c.id;
  estimatorId = c.users.estimator.id;
  estimator = await login(t.app, c.users.estimator.email);
  salesperson = await login(t.app, c.users.salesperson.email);
  const o = await makeCompany(t.orm.em.fork(), 'PdfOther');
  other = await login(t.app, o.users.estimator.email);
  db = new pg.Client({ connectionString: testDatabaseUrl() });
  await db.connect();
});
afterAll(async () => {
  await db.end();
  await t.close();
});

/** A job with one issued version of `snapshot` (as issuing stores it), its render queued in the same transaction. */
async function issuedVersion(customerName: string) {
  const job = await newJob(estimator);
  const proposalId = randomUUID();
  const versionId = randomUUID();
  const snapshot = sampleSnapshot(customerName);
  await db.query('begin');
  await db.query(`insert into proposal (id, company_id, job_id, created_at) values ($1, $2, $3, now())`, [
    proposalId,
    companyId,
    job.id,
  ]);
  await db.query(
    `insert into proposal_version (id, company_id, proposal_id, number, snapshot, snapshot_sha256, calc_version,
       issued_by_id, issued_by_name, issued_at) values ($1, $2, $3, 1, $4, $5, '0.1.0', $6, 'Test estimator', now())`,
    [versionId, companyId, proposalId, JSON.stringify(snapshot), 'c'.repeat(64), estimatorId],
  );
  await db.query('commit');
  await queuePdfRender(t.services.queue, versionId);
  return { jobId: job.id, proposalId, versionId, snapshot };
}

const versionRow = async (id: string) =>
  (await db.query(`select pdf_state, pdf_sha256, pdf_key from proposal_version where id = $1`, [id])).rows[0];
const eventsOf = async (proposalId: string) =>
  (await db.query(`select kind, data from proposal_event where proposal_id = $1 order by seq`, [proposalId])).rows;
const getPdf = (s: Session, jobId: string, n: number | string, q = '') =>
  s.agent
    .get(`/api/jobs/${jobId}/proposal/versions/${n}/pdf${q}`)
    .buffer(true)
    .parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
const money = (cents: number) =>
  new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(cents / 100);

describe('render-proposal-pdf', () => {
  it('renders the frozen snapshot, stores it, records its SHA-256 and an audit event, and the office downloads it', async () => {
    const v = await issuedVersion('Pat Quinlan');
    expect(await versionRow(v.versionId)).toMatchObject({ pdf_state: 'waiting', pdf_sha256: null });
    await t.services.queue.drain();

    const row = await versionRow(v.versionId);
    expect(row.pdf_state).toBe('ready');
    expect(row.pdf_key).toBe(pdfStorageKey(v.versionId));
    const stored = await t.services.storage.get(row.pdf_key);
    expect(stored).not.toBeNull();
    expect(createHash('sha256').update(stored!).digest('hex')).toBe(row.pdf_sha256);
    expect(await eventsOf(v.proposalId)).toEqual([
      { kind: 'pdf-ready', data: { sha256: row.pdf_sha256, bytes: stored!.length, attempt: 1 } },
    ]);

    const r = await getPdf(estimator, v.jobId, 1);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toBe('application/pdf');
    expect(r.headers['content-disposition']).toBe('inline; filename="proposal-pat-quinlan-v1.pdf"');
    expect(r.headers.etag).toBe(`"${row.pdf_sha256}"`);
    expect(Buffer.compare(r.body as Buffer, stored!)).toBe(0);
    const download = await getPdf(estimator, v.jobId, 1, '?download=1');
    expect(download.headers['content-disposition']).toBe('attachment; filename="proposal-pat-quinlan-v1.pdf"');

    // Real text a reader can search: the customer, each option's total, the method statement, the cautions.
    const text = await pdfText(r.body as Buffer);
    expect(text).toContain('Pat Quinlan');
    for (const o of v.snapshot.options) {
      expect(text).toContain(`Option ${o.position}: ${o.name}`);
      expect(text).toContain(money(o.price.totalCents));
    }
    expect(text).toContain('These loads are an estimate.');
    expect(text).toContain(v.snapshot.design.method.replace(/\s+/g, ' '));
    expect(text).toContain('A licensed electrician confirms them');
    const pages = await pdfPages(r.body as Buffer);
    // The acceptance page, then the Notice of Cancellation in duplicate (16 CFR 429.1(b)).
    expect(pages.at(-3)).toContain('Acceptance');
    expect(pages.slice(-2).every((p) => p.includes('NOTICE OF CANCELLATION'))).toBe(true);

    // Rendered once: another job for the same version leaves the recorded PDF alone.
    await queuePdfRender(t.services.queue, v.versionId);
    await t.services.queue.drain();
    expect(await versionRow(v.versionId)).toEqual(row);
    expect(await eventsOf(v.proposalId)).toHaveLength(1);
  });

  it('prints a name with markup, template syntax and CR/LF literally, on one line', async () => {
    const v = await issuedVersion(TRICKY);
    await t.services.queue.drain();
    const r = await getPdf(estimator, v.jobId, 1);
    expect(r.status).toBe(200);
    const text = await pdfText(r.body as Buffer);
    expect(text).toContain('Dana <b>Ortiz</b> {{7*7}} ${x} Bcc: all@example.com');
    expect(text).not.toContain('Ortiz</b> 49');
    // The file name keeps only plain letters, digits and hyphens: nothing can end the header's quoted string.
    expect(r.headers['content-disposition']).toMatch(/^inline; filename="proposal-dana-b-ortiz-b-[a-z0-9-]+-v1\.pdf"$/);
  });

  it('a failed try leaves the version waiting, the next try finishes it; the last failed try marks it failed', async () => {
    const v = await issuedVersion('Robin Vale');
    const put = vi.spyOn(t.services.storage, 'put').mockRejectedValueOnce(new Error('disk full'));
    await t.services.queue.drain();
    expect(put).toHaveBeenCalledTimes(1);
    expect(await versionRow(v.versionId)).toEqual({ pdf_state: 'waiting', pdf_sha256: null, pdf_key: null });
    const waiting = await getPdf(estimator, v.jobId, 1);
    expect(waiting.status).toBe(409);
    expect(JSON.parse(String(waiting.body)).detail).toBe('The PDF of this version is still being prepared.');

    await t.services.queue.drain({ retriesNow: true });
    expect((await versionRow(v.versionId)).pdf_state).toBe('ready');
    expect((await eventsOf(v.proposalId)).map((e) => e.kind)).toEqual(['pdf-ready']);
    put.mockRestore();

    const w = await issuedVersion('Sam Ferris');
    const always = vi.spyOn(t.services.storage, 'put').mockRejectedValue(new Error('disk full'));
    await t.services.queue.drain();
    for (let i = 0; i < 5; i++) await t.services.queue.drain({ retriesNow: true });
    always.mockRestore();
    expect(await versionRow(w.versionId)).toEqual({ pdf_state: 'failed', pdf_sha256: null, pdf_key: null });
    expect(await eventsOf(w.proposalId)).toEqual([{ kind: 'pdf-failed', data: { reason: 'disk full', attempts: 5 } }]);
    const failed = await getPdf(estimator, w.jobId, 1);
    expect(failed.status).toBe(409);
    expect(JSON.parse(String(failed.body)).detail).toMatch(/could not be made/);
  });
});

describe('GET /api/jobs/:jobId/proposal/versions/:n/pdf', () => {
  it('is for the office of the job’s company: 403 for a salesperson, 404 for another company or version', async () => {
    const v = await issuedVersion('Lee Marsh');
    await t.services.queue.drain();
    expect((await getPdf(salesperson, v.jobId, 1)).status).toBe(403);
    const elsewhere = await getPdf(other, v.jobId, 1);
    expect(elsewhere.status).toBe(404);
    expect((await getPdf(estimator, v.jobId, 2)).status).toBe(404);
    expect((await getPdf(estimator, randomUUID(), 1)).status).toBe(404);
  });

  it('refuses a malformed version number or query with 400', async () => {
    const v = await issuedVersion('Kim Ashby');
    for (const [n, q] of [
      ['0', ''],
      ['x', ''],
      ['1.5', ''],
      ['1', '?download=yes'],
    ] as const) {
      const r = await getPdf(estimator, v.jobId, n, q);
      expect(r.status, `${n}${q}`).toBe(400);
      const body = JSON.parse(String(r.body));
      expect(body.type).toBe('/problems/validation');
    }
    expect(isProblem(await estimator.agent.get(`/api/jobs/not-a-job/proposal/versions/1/pdf`))).toBe(true);
  });
});
