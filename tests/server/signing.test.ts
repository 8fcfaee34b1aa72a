import { execFileSync } from 'node:child_process';
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import sharp from 'sharp';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  disclosureText,
  esignDisclosure,
  PROPOSAL_LINK_OPEN_PATH,
  type ProposalSnapshot,
  type SigningState,
} from '@contract';
import { versionIsSigned } from '../../server/src/modules/payments/payments.service';
import { renderProposalPdf } from '../../server/src/modules/proposals/pdf/render-proposal';
import {
  browserAgent,
  csrfOf,
  HTTPS,
  isProblem,
  login,
  makeCompany,
  type Session,
  type TestCompany,
} from '../helpers/fixtures';
import { pdfFonts } from '../helpers/pdf-fonts';
import { pdfPages, pdfText } from '../helpers/pdf-text';
import { sampleSnapshot } from '../helpers/proposal-snapshot';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';
import { newJob } from './jobs-helpers';

/**
 * Issue 14, signing: the ESIGN consent (15 U.S.C. §7001(c)(1)) as its own step, the signature (typed or
 * drawn) on the current version with its 409s, the insert-only signature table, the audit events in
 * order, the job won, and the signed copy made by the queue: signature and signing record in the PDF,
 * sealed with a PDF digital signature that poppler's pdfsig verifies and that breaks when one signed byte
 * changes. Workers are off: the tests drain the queue themselves.
 */
let t: TestApp;
let db: pg.Client;
let a: TestCompany;
let estimator: Session;
let office: Session;
/** One rendered proposal PDF shared by the versions (its bytes stored under each version's key). */
let pdf: Buffer;

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off' });
  a = await makeCompany(t.orm.em.fork(), 'Signing');
  estimator = await login(t.app, a.users.estimator.email);
  office = await login(t.app, a.users.owner.email);
  db = new pg.Client({ connectionString: testDatabaseUrl() });
  await db.connect();
  pdf = await renderProposalPdf({ snapshot: sampleSnapshot('Marisol Quenby'), versionNumber: 1, logo: null });
}, 60_000);
afterAll(async () => {
  await db?.end();
  await t?.close();
});

const sha256 = (b: string | Buffer) => createHash('sha256').update(b).digest('hex');

interface Proposal {
  jobId: string;
  proposalId: string;
  versionId: string;
  snapshot: ProposalSnapshot;
}

/** Adds a version to a proposal (superseding the current one), with its PDF recorded as the renderer would. */
async function addVersion(p: { jobId: string; proposalId: string }, number: number, snapshot: ProposalSnapshot) {
  const versionId = randomUUID();
  await db.query(`update proposal_version set superseded_at = now() where proposal_id = $1 and superseded_at is null`, [
    p.proposalId,
  ]);
  await db.query(
    `insert into proposal_version (id, company_id, proposal_id, number, snapshot, snapshot_sha256, calc_version,
       issued_by_id, issued_by_name, issued_at) values ($1, $2, $3, $4, $5, $6, '0.1.0', $7, 'Test estimator', now())`,
    [
      versionId,
      a.id,
      p.proposalId,
      number,
      JSON.stringify(snapshot),
      sha256(JSON.stringify(snapshot)),
      a.users.estimator.id,
    ],
  );
  const key = `proposal-pdf-${versionId}`;
  await t.services.storage.put(key, pdf, 'application/pdf');
  await db.query(`update proposal_version set pdf_state = 'ready', pdf_sha256 = $2, pdf_key = $3 where id = $1`, [
    versionId,
    sha256(pdf),
    key,
  ]);
  return versionId;
}

/** A job with an issued version 1 whose PDF is ready; `deposit: false` makes every option ask no deposit. */
async function proposal(opts: { deposit?: boolean; customer?: string } = {}): Promise<Proposal> {
  const job = await newJob(estimator);
  const proposalId = randomUUID();
  const snapshot = sampleSnapshot(opts.customer ?? 'Marisol Quenby');
  if (opts.deposit === false)
    for (const o of snapshot.options) {
      o.price.depositCents = 0;
      o.price.balanceCents = o.price.totalCents;
    }
  await db.query(`insert into proposal (id, company_id, job_id, created_at) values ($1, $2, $3, now())`, [
    proposalId,
    a.id,
    job.id,
  ]);
  const versionId = await addVersion({ jobId: job.id, proposalId }, 1, snapshot);
  return { jobId: job.id, proposalId, versionId, snapshot };
}

interface Customer {
  get(path: string): request.Test;
  post(path: string, body: object): request.Test;
  /** The option choice through the sending slice's route (an option-chosen event with data.position). */
  choose(position: number): Promise<void>;
  linkId: string;
  agent: ReturnType<typeof browserAgent>;
  csrf: string;
}

/** A browser that opened an e-mailed link for the version (the link made as sending makes it, then opened). */
async function customer(p: { proposalId: string; versionId: string }): Promise<Customer> {
  const token = randomBytes(32).toString('base64url');
  const linkId = randomUUID();
  await db.query(
    `insert into proposal_link (id, company_id, proposal_id, version_id, token_sha256, recipient, created_at, expires_at)
     values ($1, $2, $3, $4, $5, 'marisol@example.com', now(), now() + interval '7 days')`,
    [linkId, a.id, p.proposalId, p.versionId, sha256(token)],
  );
  const agent = browserAgent(t.app);
  const opened = await agent.get(`${PROPOSAL_LINK_OPEN_PATH}?t=${token}`).set(HTTPS);
  expect(opened.status).toBe(303);
  const csrf = await csrfOf(agent);
  const post = (path: string, body: object) =>
    agent
      .post(`/api/proposals/${p.proposalId}${path}`)
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .set('User-Agent', 'SigningTest/1.0 (phone)')
      .send(body);
  return {
    linkId,
    agent,
    csrf,
    get: (path) => agent.get(`/api/proposals/${p.proposalId}${path}`).set(HTTPS),
    post,
    async choose(position) {
      const res = await post('/option', { position });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
    },
  };
}

const stateOf = async (c: Customer): Promise<SigningState> => {
  const res = await c.get('/signing');
  expect(res.status).toBe(200);
  return res.body as SigningState;
};

const consent = async (c: Customer, versionNumber = 1) => {
  const state = await stateOf(c);
  return c.post('/consent', { versionNumber, disclosureSha256: state.consent.sha256 });
};

const typed = (state: SigningState, extra: Record<string, unknown> = {}) => ({
  method: 'typed',
  versionNumber: state.version.number,
  optionPosition: state.option?.position ?? 1,
  statementSha256: state.statement?.sha256 ?? '0'.repeat(64),
  signerName: 'Marisol Quenby',
  signerEmail: 'marisol@example.com',
  typedName: 'Marisol Quenby',
  ...extra,
});

const eventsOf = async (proposalId: string) =>
  (
    await db.query<{ kind: string; data: Record<string, unknown>; ip: string | null; user_agent: string | null }>(
      `select kind, data, ip, user_agent from proposal_event where proposal_id = $1 order by seq`,
      [proposalId],
    )
  ).rows;

const jobStatus = async (jobId: string) =>
  (await db.query<{ status: string }>(`select status from job where id = $1`, [jobId])).rows[0]!.status;

/** A signature drawn as the pad would send it: a dark stroke on a transparent canvas. */
async function drawnPng(width = 600, height = 200): Promise<string> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}"><path d="M20 150 C 120 20, 200 190, 300 90 S 480 40, 570 140" stroke="#102030" stroke-width="6" fill="none"/></svg>`;
  const png = await sharp(Buffer.from(svg)).png().toBuffer();
  return `data:image/png;base64,${png.toString('base64')}`;
}

describe('consent, then signature (the customer, through a proposal link)', () => {
  it('the consent text names the paper copy, withdrawal and what is needed; it is stored with its hash', async () => {
    const p = await proposal();
    const c = await customer(p);
    const before = await stateOf(c);
    const text = before.consent.paragraphs.map((x) => x.text).join(' ');
    // 15 U.S.C. §7001(c)(1)(B)(i), (iii), (iv) and (C)(i): paper copy, withdrawal, how, hardware and software.
    expect(text).toMatch(/right to have any of these records on paper/);
    expect(text).toMatch(/withdraw this agreement/);
    expect(text).toMatch(/call \(555\) 010-4410, e-mail office@alderbay-comfort\.example/);
    expect(text).toMatch(/web browser/);
    expect(before.consent.givenAt).toBeNull();
    expect(before.consent.sha256).toBe(sha256(disclosureText(esignDisclosure(p.snapshot.company))));

    const stale = await c.post('/consent', { versionNumber: 1, disclosureSha256: 'a'.repeat(64) });
    expect(stale.status).toBe(409);
    expect(isProblem(stale)).toBe(true);

    const given = await consent(c);
    expect(given.status).toBe(200);
    expect(given.body.consent.givenAt).not.toBeNull();
    await consent(c); // twice: recorded once
    const events = (await eventsOf(p.proposalId)).filter((e) => e.kind === 'consented');
    expect(events).toHaveLength(1);
    expect(events[0]!.data).toMatchObject({
      disclosureSha256: before.consent.sha256,
      disclosure: disclosureText(before.consent.paragraphs),
    });
    expect(events[0]!.user_agent).toBe('SigningTest/1.0 (phone)');
  });

  it('sign before consent → 409; before an option → 409; another option than chosen → 409; nothing is written', async () => {
    const p = await proposal();
    const c = await customer(p);
    const noConsent = await c.post('/signature', typed(await stateOf(c)));
    expect(noConsent.status).toBe(409);
    expect(noConsent.body.detail).toMatch(/Agree to sign electronically first/);
    await consent(c);
    const noOption = await c.post('/signature', typed(await stateOf(c)));
    expect(noOption.status).toBe(409);
    expect(noOption.body.detail).toMatch(/Choose one of the options/);
    await c.choose(2);
    const state = await stateOf(c);
    expect(state.statement?.text).toMatch(/I accept option 2, .* of proposal version 1 from Alder Bay Comfort Co\./);
    const other = await c.post('/signature', typed(state, { optionPosition: 1 }));
    expect(other.status).toBe(409);
    const wrongStatement = await c.post('/signature', typed(state, { statementSha256: 'b'.repeat(64) }));
    expect(wrongStatement.status).toBe(409);
    expect((await db.query(`select 1 from proposal_signature where proposal_id = $1`, [p.proposalId])).rowCount).toBe(
      0,
    );
    expect(await versionIsSigned(t.orm.em.fork(), a.id, p.versionId)).toBe(false);
  });

  it('a typed signature: 201, one row, consented → signed in order in the trail, versionIsSigned, the job won (no deposit)', async () => {
    const p = await proposal({ deposit: false });
    const c = await customer(p);
    await consent(c);
    await c.choose(1);
    const state = await stateOf(c);
    const res = await c.post('/signature', typed(state));
    expect(res.status).toBe(201);
    expect(res.body.signature).toMatchObject({ signerName: 'Marisol Quenby', method: 'typed', optionPosition: 1 });
    expect(res.body.signedPdf).toBe('waiting');

    const rows = (await db.query(`select * from proposal_signature where proposal_id = $1`, [p.proposalId])).rows;
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      version_id: p.versionId,
      option_position: 1,
      method: 'typed',
      typed_name: 'Marisol Quenby',
      signer_email: 'marisol@example.com',
      document_sha256: sha256(pdf),
      statement: state.statement!.text,
      statement_sha256: sha256(state.statement!.text),
      user_agent: 'SigningTest/1.0 (phone)',
      image_key: null,
    });
    const kinds = (await eventsOf(p.proposalId)).map((e) => e.kind);
    expect(kinds).toEqual(['opened', 'consented', 'option-chosen', 'signed']);
    const signed = (await eventsOf(p.proposalId)).find((e) => e.kind === 'signed')!;
    expect(signed.data).toMatchObject({ signatureId: rows[0].id, signerName: 'Marisol Quenby' });
    expect(await versionIsSigned(t.orm.em.fork(), a.id, p.versionId)).toBe(true);
    expect(await jobStatus(p.jobId)).toBe('won');

    const again = await c.post('/signature', typed(await stateOf(c)));
    expect(again.status).toBe(409);
    expect(again.body.detail).toMatch(/already signed/);
    const consentAgain = await consent(c);
    expect(consentAgain.status).toBe(409);
  });

  it('where a deposit is due the job is not won at signing (the deposit step moves it)', async () => {
    const p = await proposal();
    const c = await customer(p);
    await consent(c);
    await c.choose(3);
    const before = await jobStatus(p.jobId);
    expect((await c.post('/signature', typed(await stateOf(c)))).status).toBe(201);
    expect(await jobStatus(p.jobId)).toBe(before);
  });

  it('a superseded version cannot be signed: its link ends (410, why and whom to contact); a page left open on it is 409', async () => {
    const p = await proposal();
    const c = await customer(p);
    await consent(c);
    await c.choose(1);
    const seen = await stateOf(c);
    const v2 = await addVersion(p, 2, p.snapshot);
    const ended = await c.post('/signature', typed(seen));
    expect(ended.status).toBe(410);
    expect(isProblem(ended)).toBe(true);
    expect(ended.body).toMatchObject({ reason: 'superseded', contact: { name: 'Alder Bay Comfort Co.' } });
    // A link to version 2, with the page still showing version 1.
    const c2 = await customer({ proposalId: p.proposalId, versionId: v2 });
    expect((await stateOf(c2)).consent.givenAt).toBeNull(); // version 2 needs its own consent
    await consent(c2, 2);
    await c2.choose(1);
    const stale = await c2.post('/signature', typed(seen));
    expect(stale.status).toBe(409);
    expect(stale.body.detail).toMatch(/replaced by version 2/);
    expect(stale.body.reason).toBe('superseded');
    expect(await versionIsSigned(t.orm.em.fork(), a.id, p.versionId)).toBe(false);
    expect(await versionIsSigned(t.orm.em.fork(), a.id, v2)).toBe(false);
  });

  it('a revoked link can neither consent nor sign (410), and nothing is written', async () => {
    const p = await proposal();
    const c = await customer(p);
    await c.choose(1);
    const state = await stateOf(c);
    await db.query(`update proposal_link set revoked_at = now() where id = $1`, [c.linkId]);
    const consentRes = await c.post('/consent', { versionNumber: 1, disclosureSha256: state.consent.sha256 });
    expect(consentRes.status).toBe(410);
    expect(consentRes.body.reason).toBe('revoked');
    expect((await c.post('/signature', typed(state))).status).toBe(410);
    expect((await c.get('/signing')).status).toBe(410);
    const kinds = (await eventsOf(p.proposalId)).map((e) => e.kind);
    expect(kinds).not.toContain('consented');
    expect(kinds).not.toContain('signed');
  });

  it('two signatures sent at once: exactly one is taken', async () => {
    const p = await proposal();
    const c = await customer(p);
    await consent(c);
    await c.choose(1);
    const state = await stateOf(c);
    const answers = await Promise.all([c.post('/signature', typed(state)), c.post('/signature', typed(state))]);
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
    expect((await db.query(`select 1 from proposal_signature where proposal_id = $1`, [p.proposalId])).rowCount).toBe(
      1,
    );
  });

  it('bad signature input is a 400 problem and writes nothing', async () => {
    const p = await proposal();
    const c = await customer(p);
    await consent(c);
    await c.choose(1);
    const state = await stateOf(c);
    const drawn = (image: string) => ({ ...typed(state), typedName: undefined, method: 'drawn', image });
    const notPng = `data:image/png;base64,${Buffer.from('GIF89a not a png at all').toString('base64')}`;
    const jpeg = await sharp({ create: { width: 200, height: 80, channels: 3, background: '#ffffff' } })
      .jpeg()
      .toBuffer();
    const blank = await sharp({
      create: { width: 600, height: 200, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } },
    })
      .png()
      .toBuffer();
    const cases: Array<[string, object]> = [
      ['not a data URL', drawn('https://example.com/sig.png')],
      ['not PNG bytes', drawn(notPng)],
      ['a JPEG labelled PNG', drawn(`data:image/png;base64,${jpeg.toString('base64')}`)],
      ['blank', drawn(`data:image/png;base64,${blank.toString('base64')}`)],
      ['too large', drawn(`data:image/png;base64,${'A'.repeat(260_000)}`)],
      ['no name', typed(state, { signerName: '  ' })],
      ['a name with a line break', typed(state, { signerName: 'Marisol\r\nBcc: x@example.com' })],
      ['a bad e-mail', typed(state, { signerEmail: 'marisol' })],
      ['an unknown method', typed(state, { method: 'stamped' })],
      ['a smuggled company', typed(state, { companyId: randomUUID() })],
    ];
    for (const [what, body] of cases) {
      const res = await c.post('/signature', body);
      expect([400, 413], what).toContain(res.status);
      expect(isProblem(res), what).toBe(true);
    }
    expect((await db.query(`select 1 from proposal_signature where proposal_id = $1`, [p.proposalId])).rowCount).toBe(
      0,
    );
  });

  it("another proposal's session cannot sign this one (404), and a staff session is 401", async () => {
    const p = await proposal();
    const q = await proposal();
    const cq = await customer(q);
    const cross = await cq.agent
      .post(`/api/proposals/${p.proposalId}/consent`)
      .set(HTTPS)
      .set('X-CSRF-Token', cq.csrf)
      .send({ versionNumber: 1, disclosureSha256: 'a'.repeat(64) });
    expect(cross.status).toBe(404);
    const staff = await estimator.agent.get(`/api/proposals/${p.proposalId}/signing`).set(HTTPS);
    expect(staff.status).toBe(401);
  });
});

describe('the signature table is insert-only in PostgreSQL', () => {
  it('UPDATE and DELETE are refused by the trigger and the row stays', async () => {
    const p = await proposal();
    const c = await customer(p);
    await consent(c);
    await c.choose(1);
    expect((await c.post('/signature', typed(await stateOf(c)))).status).toBe(201);
    const before = (await db.query(`select * from proposal_signature where proposal_id = $1`, [p.proposalId])).rows[0];
    await expect(
      db.query(`update proposal_signature set signer_name = 'Someone Else' where id = $1`, [before.id]),
    ).rejects.toThrow(/insert-only/);
    await expect(
      db.query(`update proposal_signature set option_position = 2 where id = $1`, [before.id]),
    ).rejects.toThrow(/insert-only/);
    await expect(db.query(`delete from proposal_signature where id = $1`, [before.id])).rejects.toThrow(/insert-only/);
    const after = (await db.query(`select * from proposal_signature where id = $1`, [before.id])).rows[0];
    expect(after).toEqual(before);
  });
});

describe('the signed copy', () => {
  let p: Proposal;
  let c: Customer;
  let signatureId: string;
  let sealed: Buffer;

  const getBytes = (req: request.Test) =>
    req.buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });

  beforeAll(async () => {
    p = await proposal({ customer: 'Ezekiel Thornbury' });
    c = await customer(p);
    await consent(c);
    await c.choose(2);
    const state = await stateOf(c);
    const res = await c.post('/signature', {
      method: 'drawn',
      versionNumber: 1,
      optionPosition: 2,
      statementSha256: state.statement!.sha256,
      signerName: 'Ezekiel Thornbury',
      signerEmail: 'ezekiel@example.com',
      image: await drawnPng(),
    });
    expect(res.status).toBe(201);
    signatureId = (await db.query(`select id from proposal_signature where proposal_id = $1`, [p.proposalId])).rows[0]
      .id;
  }, 60_000);

  it('is 409 until the queue has made it, then served to the customer and the office as the same sealed bytes', async () => {
    const waiting = await c.get('/signed-pdf');
    expect(waiting.status).toBe(409);
    // The office's proposal screen reads the signature on the version, the copy not made yet.
    const officeView = async () =>
      (await office.agent.get(`/api/jobs/${p.jobId}/proposal`).set(HTTPS)).body.proposal.versions[0].signed;
    expect(await officeView()).toMatchObject({ signerName: 'Ezekiel Thornbury', copySha256: null });
    await t.services.queue.drain({ timeoutMs: 60_000 });
    const row = (await db.query(`select * from proposal_signed_pdf where signature_id = $1`, [signatureId])).rows[0];
    expect(row).toBeDefined();
    // Every signature of the file so far (typed ones too) has its sealed copy.
    const unsealed = await db.query(
      `select s.id, s.method from proposal_signature s left join proposal_signed_pdf d on d.signature_id = s.id
        where s.company_id = $1 and d.id is null`,
      [a.id],
    );
    expect(unsealed.rows).toEqual([]);
    const methods = await db.query(`select distinct method from proposal_signature where company_id = $1`, [a.id]);
    expect(methods.rows.map((r) => r.method).sort()).toEqual(['drawn', 'typed']);
    const mine = await getBytes(c.get('/signed-pdf'));
    expect(mine.status).toBe(200);
    expect(mine.headers['content-type']).toBe('application/pdf');
    expect(mine.headers['content-disposition']).toMatch(
      /^attachment; filename="proposal-ezekiel-thornbury-v1-signed\.pdf"$/,
    );
    sealed = mine.body as Buffer;
    expect(sha256(sealed)).toBe(row.sha256);
    const theirs = await getBytes(office.agent.get(`/api/jobs/${p.jobId}/proposal/versions/1/signed-pdf`).set(HTTPS));
    expect(theirs.status).toBe(200);
    expect(sha256(theirs.body as Buffer)).toBe(row.sha256);
    expect((await stateOf(c)).signedPdf).toBe('ready');
    expect((await officeView()).copySha256).toBe(row.sha256);
    // The sealed row is insert-only too.
    await expect(
      db.query(`update proposal_signed_pdf set sha256 = $2 where id = $1`, [row.id, 'f'.repeat(64)]),
    ).rejects.toThrow(/insert-only/);
  }, 90_000);

  it('holds the signer on the acceptance page and, on the signing record, the hash of the document signed and the trail', async () => {
    const pages = (await pdfPages(sealed)).map((x) => x.replace(/\s+/g, ' '));
    const first = pages.findIndex((x) => x.includes('Signing record'));
    expect(first).toBeGreaterThan(0);
    const acceptance = pages.find((x) => x.includes('This is the signed copy')) ?? '';
    // The right-to-cancel statement stays beside the buyer's signature, now with its dates (16 CFR 429.1(a)).
    expect(acceptance).toMatch(/cancel this transaction/i);
    expect(pages.slice(0, first).some((x) => /NOTICE OF CANCELLATION/i.test(x))).toBe(true);
    const record = pages.slice(first).join(' ');
    expect(acceptance).toMatch(/This is the signed copy of proposal version 1/);
    expect(acceptance).toMatch(/Ezekiel Thornbury/);
    expect(acceptance).toMatch(/I accept option 2/);
    expect(record).toMatch(/Signing record/);
    expect(record).toMatch(/ezekiel@example\.com/);
    expect(record.replace(/\s/g, '')).toContain(sha256(pdf)); // the PDF that was signed
    expect(record).toMatch(/SigningTest\/1\.0 \(phone\)/);
    expect(record).toMatch(/Agreed to sign electronically/);
    expect(record).toMatch(/Option chosen/);
    expect(record).toMatch(/\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC/);
    expect(await pdfText(sealed)).toMatch(/Drawn on screen/);
  });

  it('embeds every font it uses: only Source Sans 3, no fallback Helvetica (pdffonts, page by page)', () => {
    const fonts = pdfFonts(sealed);
    expect(fonts.filter((f) => !f.embedded).map((f) => `${f.name} on pages ${f.pages.join(', ')}`)).toEqual([]);
    for (const f of fonts) expect(f.name).toMatch(/^[A-Z]{6}\+SourceSans3-/);
  });

  it("the seal verifies with poppler's pdfsig, and fails after one byte of the signed range is changed", () => {
    const dir = mkdtempSync(join(tmpdir(), 'gaugeline-seal-'));
    const good = join(dir, 'good.pdf');
    writeFileSync(good, sealed);
    const ok = execFileSync('pdfsig', [good], { encoding: 'utf8' });
    expect(ok).toMatch(/Signature Validation: Signature is Valid\./);
    expect(ok).toMatch(/Total document signed/);
    // One byte inside the first signed range (the body of the document), not the signature itself.
    const range = /\/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]/.exec(sealed.toString('latin1'));
    expect(range).not.toBeNull();
    const at = Math.floor(Number(range![2]) / 2);
    const tampered = Buffer.from(sealed);
    tampered[at] = tampered[at] === 0x20 ? 0x21 : 0x20;
    const bad = join(dir, 'bad.pdf');
    writeFileSync(bad, tampered);
    let out = '';
    try {
      out = execFileSync('pdfsig', [bad], { encoding: 'utf8' });
    } catch (err) {
      out = String((err as { stdout?: string }).stdout ?? '');
    }
    expect(out).not.toMatch(/Signature is Valid/);
    expect(out).toMatch(/Digest Mismatch|Signature is Invalid/);
  });

  it('is e-mailed to the signer with the sealed PDF attached', async () => {
    await t.services.queue.drain({ timeoutMs: 30_000 });
    const mail = await t.smtp.waitFor('ezekiel@example.com', 10_000);
    expect(mail.subject).toBe('Your signed proposal from Alder Bay Comfort Co.');
    expect(mail.text).toContain(sha256(sealed));
    expect(mail.attachments).toEqual([
      expect.objectContaining({
        filename: 'proposal-ezekiel-thornbury-v1-signed.pdf',
        contentType: 'application/pdf',
        sha256: sha256(sealed),
      }),
    ]);
  });

  it("the office's download: another company's job is 404, an unsigned version is 409", async () => {
    const o = await makeCompany(t.orm.em.fork(), 'SigningOther');
    const stranger = await login(t.app, o.users.owner.email);
    expect((await stranger.agent.get(`/api/jobs/${p.jobId}/proposal/versions/1/signed-pdf`).set(HTTPS)).status).toBe(
      404,
    );
    const q = await proposal();
    const unsigned = await office.agent.get(`/api/jobs/${q.jobId}/proposal/versions/1/signed-pdf`).set(HTTPS);
    expect(unsigned.status).toBe(409);
    expect((await office.agent.get(`/api/jobs/${q.jobId}/proposal/versions/9/signed-pdf`).set(HTTPS)).status).toBe(404);
  });
});
