import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LINK_ENDED, PROPOSAL_LINK_OPEN_PATH, type SigningState } from '@contract';
import { browserAgent, csrfOf, HTTPS, isProblem, login, makeCompany, type Session } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { multiZone, newOption, seedData, singleZone } from './desk-helpers';
import { newJob, newRoom, post, sampleRoom } from './jobs-helpers';

/**
 * Issue 14, revising a proposal: once a job is proposed the estimator changes the desk, marks it ready
 * again and issues version N+1 with the job staying proposed (no detour through design); the earlier
 * version's link then ends with the clear page. While a version is signed and not cancelled, a new
 * version is refused (409, who signed and when) and the desk will not mark the job ready; after the
 * buyer cancels, the estimator revises and issues again, and the next send moves the job lost → proposed.
 * Everything goes through the real routes and the queue (PDF and mail), as the office and the customer use them.
 */
let t: TestApp;
let estimator: Session;
let companyId: string;

beforeAll(async () => {
  t = await buildTestApp();
  const a = await makeCompany(t.orm.em.fork(), 'Revising');
  companyId = a.id;
  await seedData(t.orm.em.fork(), a.id);
  estimator = await login(t.app, a.users.estimator.email);
});
afterAll(async () => t.close());

const sql = <T>(q: string, params: unknown[] = []) => t.orm.em.fork().execute<T[]>(q, params);
const REASON = 'The owner keeps this room cool for a home studio; the larger unit is wanted.';
const BUYER = 'Odalys Brennick';

const jobOf = async (jobId: string) => (await estimator.agent.get(`/api/jobs/${jobId}`)).body.job as JobBody;
interface JobBody {
  status: string;
  lostReason: string | null;
  version: number;
}
const markReady = (jobId: string) =>
  post(estimator, `/api/jobs/${jobId}/ready`).send({ sizingOverride: { reason: REASON } });
const issue = (jobId: string) => post(estimator, `/api/jobs/${jobId}/proposal/versions`).send();
const proposalOf = async (jobId: string) => (await estimator.agent.get(`/api/jobs/${jobId}/proposal`)).body;

/** A job in Illinois (America/Chicago) with two priced options, marked ready and issued as version 1. */
async function issuedJob() {
  const job = await newJob(estimator, { house: { bedrooms: 2 }, region: 'Illinois' });
  const rooms: string[] = [];
  for (const name of ['Living room', 'Main bedroom', 'Office'])
    rooms.push((await newRoom(estimator, job.id, sampleRoom(name))).id);
  await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '', 30) });
  await newOption(estimator, job.id, { name: 'Whole home', design: multiZone(rooms) });
  expect((await markReady(job.id)).status).toBe(200);
  const issued = await issue(job.id);
  expect(issued.status, JSON.stringify(issued.body)).toBe(201);
  return { jobId: job.id, proposalId: String(issued.body.proposal.id) };
}

/** Renames the job's first option on the desk (a change: the ready mark goes). */
async function changeDesk(jobId: string, name: string) {
  const desk = await estimator.agent.get(`/api/jobs/${jobId}/desk`);
  const first = desk.body.options[0] as { id: string; version: number };
  const changed = await estimator.agent
    .patch(`/api/jobs/${jobId}/options/${first.id}`)
    .set('X-CSRF-Token', estimator.csrf)
    .set('If-Match', `"${first.version}"`)
    .send({ name });
  expect(changed.status, JSON.stringify(changed.body)).toBe(200);
}

let mailCount = 0;

/** Sends the current version and returns the link's token as the e-mail in the fake outbox carries it. */
async function send(jobId: string) {
  const to = `revise-${Date.now()}-${++mailCount}@example.com`;
  const r = await post(estimator, `/api/jobs/${jobId}/proposal/links`).send({ to });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  const mail = await t.smtp.waitFor(to, 20_000);
  // The token's hash is committed just after the mail server took the message: wait for that.
  for (let i = 0; i < 200; i++) {
    const [m] = await sql<{ state: string }>(`select "state" from "outgoing_message" where "to_address" = ?`, [to]);
    if (m?.state === 'sent') break;
    await new Promise((r) => setTimeout(r, 50));
  }
  return new URL(/https:\/\/\S+/.exec(mail.text)?.[0] ?? 'https://none.invalid').searchParams.get('t') ?? '';
}

/** Waits (a bounded number of polls) until the queue has rendered the current version's PDF. */
async function pdfReady(jobId: string) {
  for (let i = 0; i < 400; i++) {
    const current = (await proposalOf(jobId)).proposal.versions.find((v: { current: boolean }) => v.current);
    if (current?.pdf.state === 'ready') return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('The PDF was not made.');
}

/** The customer opens the link, chooses option 1, consents and signs by typing the name. */
async function signAsCustomer(proposalId: string, token: string) {
  const agent = browserAgent(t.app);
  expect((await agent.get(`${PROPOSAL_LINK_OPEN_PATH}?t=${encodeURIComponent(token)}`).set(HTTPS)).status).toBe(303);
  const csrf = await csrfOf(agent);
  const postAs = (path: string, body: object) =>
    agent.post(`/api/proposals/${proposalId}${path}`).set(HTTPS).set('X-CSRF-Token', csrf).send(body);
  expect((await postAs('/option', { position: 1 })).status).toBe(200);
  let state = (await agent.get(`/api/proposals/${proposalId}/signing`).set(HTTPS)).body as SigningState;
  const consented = await postAs('/consent', {
    versionNumber: state.version.number,
    disclosureSha256: state.consent.sha256,
  });
  expect(consented.status, JSON.stringify(consented.body)).toBeLessThan(300);
  state = (await agent.get(`/api/proposals/${proposalId}/signing`).set(HTTPS)).body as SigningState;
  const signed = await postAs('/signature', {
    method: 'typed',
    versionNumber: state.version.number,
    optionPosition: state.option?.position ?? 1,
    statementSha256: state.statement?.sha256 ?? '',
    signerName: BUYER,
    signerEmail: 'odalys@example.com',
    typedName: BUYER,
  });
  expect(signed.status, JSON.stringify(signed.body)).toBeLessThan(300);
  return { cancel: () => postAs('/cancellation', { reason: 'We will wait until spring.' }) };
}

const eventKinds = async (proposalId: string) =>
  (
    await sql<{ kind: string; number: number | null }>(
      `select e."kind", v."number" from "proposal_event" e left join "proposal_version" v on v."id" = e."version_id"
        where e."proposal_id" = ? order by e."seq"`,
      [proposalId],
    )
  )
    .filter((e) => !e.kind.startsWith('pdf-') && e.kind !== 'opened' && e.kind !== 'viewed')
    .map((e) => `${e.kind} ${e.number ?? ''}`.trim());

describe('revising while proposed', () => {
  it('change the desk → mark ready → issue version 2 → send: the job stays proposed, version 1’s link ends with the clear page', async () => {
    const { jobId, proposalId } = await issuedJob();
    const first = await send(jobId);
    expect((await jobOf(jobId)).status).toBe('proposed');

    await changeDesk(jobId, 'Essential plus');
    // The change took the ready mark off: neither issuing nor sending version 1 again goes through.
    const notReady = await issue(jobId);
    expect(notReady.status).toBe(409);
    expect(isProblem(notReady)).toBe(true);
    expect(notReady.body.detail).toMatch(/Mark the job ready to propose/);
    const staleSend = await post(estimator, `/api/jobs/${jobId}/proposal/links`).send({ to: 'x@example.com' });
    expect(staleSend.status).toBe(409);
    expect(staleSend.body.detail).toMatch(/changed since version 1/);

    // Marked ready while proposed: no move back to design.
    const ready = await markReady(jobId);
    expect(ready.status, JSON.stringify(ready.body)).toBe(200);
    expect((await jobOf(jobId)).status).toBe('proposed');
    expect((await proposalOf(jobId)).canIssue).toEqual({ ok: true });
    const second = await issue(jobId);
    expect(second.status, JSON.stringify(second.body)).toBe(201);
    const versions = (await proposalOf(jobId)).proposal.versions as Array<{ number: number; current: boolean }>;
    expect(versions.map((v) => [v.number, v.current])).toEqual([
      [2, true],
      [1, false],
    ]);
    expect((await jobOf(jobId)).status).toBe('proposed');

    await send(jobId);
    expect((await jobOf(jobId)).status).toBe('proposed');
    // Version 1's link: the clear page that says it was replaced, no proposal data.
    const old = await browserAgent(t.app)
      .get(`${PROPOSAL_LINK_OPEN_PATH}?t=${encodeURIComponent(first)}`)
      .set(HTTPS);
    expect(old.status).toBe(410);
    expect(old.text).toContain(LINK_ENDED.superseded);
    expect(old.text).not.toContain('Essential plus');

    expect(await eventKinds(proposalId)).toEqual(['issued 1', 'sent 1', 'superseded 1', 'issued 2', 'sent 2']);
  });
});

describe('a signed version', () => {
  it('refuses version 2 with 409 naming the signer and the day, the desk will not mark it ready, nothing changes; after the buyer cancels, version 2 is issued and sent (lost → proposed)', async () => {
    const { jobId, proposalId } = await issuedJob();
    await pdfReady(jobId);
    const token = await send(jobId);
    const buyer = await signAsCustomer(proposalId, token);
    const [sig] = await sql<{ signed_at: Date }>(
      `select "signed_at" from "proposal_signature" where "company_id" = ? and "proposal_id" = ?`,
      [companyId, proposalId],
    );
    // The signing day on the site's calendar (Illinois: America/Chicago), worked out here with Intl directly.
    const day = new Intl.DateTimeFormat('en-US', { timeZone: 'America/Chicago', dateStyle: 'long' }).format(
      new Date(sig!.signed_at),
    );
    const detail = `Version 1 was signed on ${day} by ${BUYER}, and a signed contract is not changed here`;

    // The office screen's answer: no "Issue version 2", and why.
    const before = await proposalOf(jobId);
    expect(before.canIssue.ok).toBe(false);
    expect(before.canIssue.reason).toContain(detail);
    expect(before.canIssue.signed).toMatchObject({ versionNumber: 1, signerName: BUYER });

    // Issuing straight away (the ready mark from version 1 is still on): 409, problem+json, nothing written.
    const refused = await issue(jobId);
    expect(refused.status).toBe(409);
    expect(isProblem(refused)).toBe(true);
    expect(refused.body.detail).toContain(detail);
    expect(refused.body.detail).toMatch(/agreed with the customer outside this proposal/);
    // A change on the desk, then "mark ready": refused with the same reason.
    await changeDesk(jobId, 'Essential revised');
    const notReady = await markReady(jobId);
    expect(notReady.status).toBe(422);
    expect(notReady.body.detail).toContain(detail);
    const versions = await sql<{ n: number }>(
      `select count(*)::int as n from "proposal_version" where "proposal_id" = ?`,
      [proposalId],
    );
    expect(versions[0]?.n).toBe(1);
    expect(await eventKinds(proposalId)).toEqual(['issued 1', 'sent 1', 'option-chosen 1', 'consented 1', 'signed 1']);

    // The buyer cancels within the window: the job is lost "Cancelled by buyer" and the estimator may revise.
    const cancelled = await buyer.cancel();
    expect(cancelled.status, JSON.stringify(cancelled.body)).toBe(201);
    expect(await jobOf(jobId)).toMatchObject({ status: 'lost', lostReason: 'Cancelled by buyer' });
    expect((await markReady(jobId)).status).toBe(200);
    expect((await proposalOf(jobId)).canIssue).toEqual({ ok: true });
    const second = await issue(jobId);
    expect(second.status, JSON.stringify(second.body)).toBe(201);
    expect((await jobOf(jobId)).status).toBe('lost');
    await send(jobId);
    expect(await jobOf(jobId)).toMatchObject({ status: 'proposed', lostReason: null });
    // The signed, cancelled version 1 stays as it was (superseded, its signature kept).
    const after = (await proposalOf(jobId)).proposal.versions as Array<{
      number: number;
      current: boolean;
      signed: { signerName: string } | null;
    }>;
    expect(after.map((v) => [v.number, v.current, v.signed?.signerName ?? null])).toEqual([
      [2, true, null],
      [1, false, BUYER],
    ]);
  });
});
