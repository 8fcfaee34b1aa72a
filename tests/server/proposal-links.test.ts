import { createHash, randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { customerProposalView, LINK_ENDED, PROPOSAL_LINK_OPEN_PATH } from '@contract';
import { depositDue } from '../../server/src/modules/payments/payments.service';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { deskJob, multiZone, newOption, seedData, singleZone } from './desk-helpers';
import { expectProblem, post } from './jobs-helpers';

/**
 * Issue 14, sending: the e-mailed link (≥128-bit token, only its hash stored), the exchange for a customer
 * session scoped to one proposal with a clean 303, the same page for every link that does not work, the
 * customer's view and option choice, the audit trail in order, and names that add no e-mail header.
 */
let t: TestApp;
let a: TestCompany;
let estimator: Session;
let sales: Session;
let otherEstimator: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'Sending');
  await seedData(t.orm.em.fork(), a.id);
  const b = await makeCompany(t.orm.em.fork(), 'SendingB');
  await seedData(t.orm.em.fork(), b.id);
  estimator = await login(t.app, a.users.estimator.email);
  sales = await login(t.app, a.users.salesperson.email);
  otherEstimator = await login(t.app, b.users.estimator.email);
});
afterAll(async () => t.close());

const sql = <T>(q: string, params: unknown[] = []) => t.orm.em.fork().execute<T[]>(q, params);
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
const REASON = 'The owner keeps this room cool for a home studio; the larger unit is wanted.';

/** A job of `s` with two priced options, marked ready and issued as version 1. */
async function issuedJob(s: Session = estimator) {
  const { job, rooms } = await deskJob(s);
  await newOption(s, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '', 30) });
  await newOption(s, job.id, { name: 'Whole home', design: multiZone(rooms) });
  const ready = await post(s, `/api/jobs/${job.id}/ready`).send({ sizingOverride: { reason: REASON } });
  expect(ready.status, JSON.stringify(ready.body)).toBe(200);
  const issued = await post(s, `/api/jobs/${job.id}/proposal/versions`).send();
  expect(issued.status, JSON.stringify(issued.body)).toBe(201);
  return { jobId: job.id, proposalId: String(issued.body.proposal.id) };
}

let mailCount = 0;
const recipient = () => `homeowner-${Date.now()}-${++mailCount}@example.com`;

/** Sends the current version to a new address and returns the token read from the e-mail the fake received. */
async function send(jobId: string, s: Session = estimator) {
  const to = recipient();
  const r = await post(s, `/api/jobs/${jobId}/proposal/links`).send({ to });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  const mail = await t.smtp.waitFor(to, 20_000);
  // The token's hash is committed just after the mail server took the message: wait for that.
  for (let i = 0; i < 200; i++) {
    const [m] = await sql<{ state: string }>(`select "state" from "outgoing_message" where "to_address" = ?`, [to]);
    if (m?.state === 'sent') break;
    await new Promise((r) => setTimeout(r, 50));
  }
  const url = new URL(/https:\/\/\S+/.exec(mail.text)?.[0] ?? 'https://none.invalid');
  return { to, mail, url, token: url.searchParams.get('t') ?? '' };
}

/** A browser that opens a link: its own cookie jar, a pre-session (so the id can be seen to change). */
async function open(token: string) {
  const agent = browserAgent(t.app);
  const pre = await agent.get('/api/auth/csrf').set(HTTPS);
  const before = String(pre.headers['set-cookie'] ?? '');
  const res = await agent.get(`${PROPOSAL_LINK_OPEN_PATH}?t=${encodeURIComponent(token)}`).set(HTTPS);
  return { agent, res, before };
}

const sidOf = (cookie: string) => /sid=([^;]+)/.exec(cookie)?.[1] ?? '';
const events = async (proposalId: string) =>
  (
    await sql<{ kind: string; by_customer: boolean; data: Record<string, unknown> }>(
      `select "kind", "by_customer", "data" from "proposal_event" where "proposal_id" = ? order by "seq"`,
      [proposalId],
    )
  ).filter((e) => !e.kind.startsWith('pdf-'));

describe('sending a proposal', () => {
  it('e-mails a 256-bit token through the queue, stores only its SHA-256, and moves the job to proposed', async () => {
    const { jobId, proposalId } = await issuedJob();
    const list = await estimator.agent.get(`/api/jobs/${jobId}/proposal/links`);
    expect(list.status).toBe(200);
    expect(list.body.canSend).toEqual({ ok: true, versionNumber: 1 });
    expect(list.body.customerEmail).toMatch(/@example\.com$/);

    const { to, mail, url, token } = await send(jobId);
    expect(url.origin + url.pathname).toBe(`https://gaugeline.test${PROPOSAL_LINK_OPEN_PATH}`);
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32); // 256 bits, ≥ 128 (ASVS 5.0 7.2.3)
    expect(mail.to).toEqual([to]);
    expect(mail.subject).toBe(`Your proposal from ${a.name}`);

    const rows = await sql<Record<string, unknown>>(`select * from "proposal_link" where "proposal_id" = ?`, [
      proposalId,
    ]);
    expect(rows).toHaveLength(1);
    expect(rows[0]?.token_sha256).toBe(sha256(token));
    const messages = await sql<Record<string, unknown>>(`select * from "outgoing_message" where "to_address" = ?`, [
      to,
    ]);
    expect(messages[0]?.body_text).toBeNull();
    // The raw token is in no row of either table.
    expect(JSON.stringify([rows, messages])).not.toContain(token);

    const after = await estimator.agent.get(`/api/jobs/${jobId}/proposal/links`);
    expect(after.body.links).toMatchObject([{ state: 'sent', to, versionNumber: 1, mailProblem: null }]);
    const job = await estimator.agent.get(`/api/jobs/${jobId}`);
    expect(job.body.job.status).toBe('proposed');
    expect((await events(proposalId)).map((e) => e.kind)).toEqual(['issued', 'sent']);
  });

  it('refuses with 409 before a version is issued and after the job changed; salesperson 403; another company 404; bad address 400', async () => {
    const { job, rooms } = await deskJob(estimator);
    await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '', 30) });
    const none = await post(estimator, `/api/jobs/${job.id}/proposal/links`).send({ to: recipient() });
    expectProblem(none, 409);
    expect(none.body.detail).toBe('Issue a version of the proposal before sending it.');

    const { jobId } = await issuedJob();
    await sql(`update "job" set "ready_at" = null, "ready_by_id" = null where "id" = ?`, [jobId]);
    const changed = await post(estimator, `/api/jobs/${jobId}/proposal/links`).send({ to: recipient() });
    expectProblem(changed, 409);
    expect(changed.body.detail).toMatch(/changed since version 1 was issued/);
    const listed = await estimator.agent.get(`/api/jobs/${jobId}/proposal/links`);
    expect(listed.body.canSend).toEqual({ ok: false, reason: changed.body.detail });

    expectProblem(await post(sales, `/api/jobs/${jobId}/proposal/links`).send({ to: recipient() }), 403);
    expectProblem(await post(otherEstimator, `/api/jobs/${jobId}/proposal/links`).send({ to: recipient() }), 404);
    const bad = await post(estimator, `/api/jobs/${jobId}/proposal/links`).send({ to: 'someone\r\nBcc: x@y.example' });
    expectProblem(bad, 400);
    expect(bad.body.errors).toEqual([{ path: 'to', message: 'Enter a valid e-mail address.' }]);
    expect(
      await sql(`select 1 from "proposal_link" where "proposal_id" in (select id from proposal where job_id = ?)`, [
        jobId,
      ]),
    ).toEqual([]);
  });
});

describe('opening the link', () => {
  it('303 to the clean page with no-referrer and no-store, a new session id, and a session that reaches only its proposal', async () => {
    const { jobId, proposalId } = await issuedJob();
    const other = await issuedJob();
    const { token } = await send(jobId);
    const { agent, res, before } = await open(token);
    expect(res.status).toBe(303);
    expect(res.headers.location).toBe(`/p/${proposalId}`);
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['cache-control']).toBe('no-store');
    const after = String(res.headers['set-cookie'] ?? '');
    expect(sidOf(after)).not.toBe('');
    expect(sidOf(after)).not.toBe(sidOf(before)); // rotated at the exchange

    const read = await agent.get(`/api/proposals/${proposalId}`).set(HTTPS);
    expect(read.status, JSON.stringify(read.body)).toBe(200);
    const view = customerProposalView.parse(read.body);
    expect(view.options.map((o) => o.name)).toEqual(['Essential', 'Whole home']);
    expect(view.changes).toBeNull();
    expect(view.chosen).toBeNull();

    // Another proposal is unknown to this session; staff routes do not know it at all.
    expectProblem(await agent.get(`/api/proposals/${other.proposalId}`).set(HTTPS), 404);
    expectProblem(await agent.get(`/api/jobs`).set(HTTPS), 401);
    expectProblem(await agent.get(`/api/jobs/${jobId}/proposal`).set(HTTPS), 401);
    const me = await agent.get('/api/auth/session').set(HTTPS);
    expect(me.body).toEqual({ me: null });

    // Read again in the same session: one 'viewed'; every customer event carries the link.
    await agent.get(`/api/proposals/${proposalId}`).set(HTTPS);
    const trail = await events(proposalId);
    expect(trail.map((e) => e.kind)).toEqual(['issued', 'sent', 'opened', 'viewed']);
    expect(trail.filter((e) => e.by_customer).map((e) => e.kind)).toEqual(['opened', 'viewed']);
  });

  it('the same page for an unknown, altered or malformed token; a real but ended one also says why and whom to contact', async () => {
    const { jobId, proposalId } = await issuedJob();
    const { token } = await send(jobId);
    const unknown = await open(randomBytes(32).toString('base64url'));
    const altered = await open(`${token.slice(0, -1)}${token.endsWith('A') ? 'B' : 'A'}`);
    const malformed = await open('not-a-token');
    const missing = await browserAgent(t.app).get(PROPOSAL_LINK_OPEN_PATH).set(HTTPS);
    // No session is made or changed: a browser that had one keeps the same id (the cookie only rolls).
    for (const o of [unknown, altered, malformed])
      expect(sidOf(String(o.res.headers['set-cookie'] ?? o.before))).toBe(sidOf(o.before));
    expect(missing.headers['set-cookie']).toBeUndefined();
    for (const r of [unknown.res, altered.res, malformed.res, missing]) {
      expect(r.status).toBe(410);
      expect(r.headers['content-type']).toContain('text/html');
      expect(r.headers['referrer-policy']).toBe('no-referrer');
      expect(r.headers['cache-control']).toBe('no-store');
      expect(r.text).toBe(unknown.res.text);
    }
    expect(unknown.res.text).toContain(LINK_ENDED.title);
    expect(unknown.res.text).toContain(LINK_ENDED.unknown);
    expect(unknown.res.text).not.toContain(a.name);

    // A session opened before the link is revoked ends with it.
    const live = await open(token);
    expect(live.res.status).toBe(303);
    const links = await estimator.agent.get(`/api/jobs/${jobId}/proposal/links`);
    const linkId = String(links.body.links[0].id);
    const revoked = await post(estimator, `/api/jobs/${jobId}/proposal/links/${linkId}/revoke`).send();
    expect(revoked.status, JSON.stringify(revoked.body)).toBe(200);
    expect(revoked.body.links[0].state).toBe('revoked');
    expectProblem(await post(estimator, `/api/jobs/${jobId}/proposal/links/${linkId}/revoke`).send(), 409);
    const gone = await live.agent.get(`/api/proposals/${proposalId}`).set(HTTPS);
    expectProblem(gone, 410);
    expect(gone.body).toMatchObject({
      type: '/problems/link-ended',
      detail: LINK_ENDED.revoked,
      reason: 'revoked',
      contact: { name: a.name },
    });
    const again = await open(token);
    expect(again.res.status).toBe(410);
    expect(again.res.text).toContain(LINK_ENDED.revoked);
    expect(again.res.text).toContain(a.name);
    expect(again.res.text.replace(LINK_ENDED.revoked, '').length).toBeGreaterThan(0);
  });

  it('an expired link and a superseded one: 410 with why; the office sees each link’s state', async () => {
    const { jobId } = await issuedJob();
    const first = await send(jobId);
    const links = await estimator.agent.get(`/api/jobs/${jobId}/proposal/links`);
    expect(
      (await post(estimator, `/api/jobs/${jobId}/proposal/links/${String(links.body.links[0].id)}/revoke`).send())
        .status,
    ).toBe(200);
    expect((await open(first.token)).res.status).toBe(410);
    // Expired.
    const second = await send(jobId);
    await sql(
      `update "proposal_link" set "created_at" = "created_at" - interval '31 days', "expires_at" = "expires_at" - interval '31 days' where "recipient" = ?`,
      [second.to],
    );
    const [moved] = await sql<{ past: boolean }>(
      `select "expires_at" < now() as "past" from "proposal_link" where "recipient" = ?`,
      [second.to],
    );
    expect(moved?.past).toBe(true);
    const expired = await open(second.token);
    expect(expired.res.status).toBe(410);
    expect(expired.res.text).toContain(LINK_ENDED.expired);

    // Superseded: a newer version replaces the one the link sent.
    const third = await send(jobId);
    expect((await open(third.token)).res.status).toBe(303);
    expect((await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send()).status).toBe(201);
    const superseded = await open(third.token);
    expect(superseded.res.status).toBe(410);
    expect(superseded.res.text).toContain(LINK_ENDED.superseded);
    // Newest first (the expired one was moved 31 days back); a replaced version ends its links, expired or not,
    // and a withdrawn link stays "withdrawn".
    const after = await estimator.agent.get(`/api/jobs/${jobId}/proposal/links`);
    expect(after.body.links.map((l: { state: string }) => l.state)).toEqual(['superseded', 'revoked', 'superseded']);
  });

  it('a newer version sent to the customer says what changed since the one before', async () => {
    const { jobId, proposalId } = await issuedJob();
    await send(jobId);
    const desk = await estimator.agent.get(`/api/jobs/${jobId}/desk`);
    const first = desk.body.options[0] as { id: string; version: number };
    const changed = await estimator.agent
      .patch(`/api/jobs/${jobId}/options/${first.id}`)
      .set('X-CSRF-Token', estimator.csrf)
      .set('If-Match', `"${first.version}"`)
      .send({ name: 'Essential plus' });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    // Sent, the job is proposed; the estimator marks it ready again and issues version 2 without a detour.
    expect((await estimator.agent.get(`/api/jobs/${jobId}`)).body.job.status).toBe('proposed');
    const ready = await post(estimator, `/api/jobs/${jobId}/ready`).send({ sizingOverride: { reason: REASON } });
    expect(ready.status, JSON.stringify(ready.body)).toBe(200);
    const issued = await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send();
    expect(issued.status, JSON.stringify(issued.body)).toBe(201);
    const { token } = await send(jobId);
    const { agent } = await open(token);
    const view = customerProposalView.parse((await agent.get(`/api/proposals/${proposalId}`).set(HTTPS)).body);
    expect(view.version.number).toBe(2);
    expect(view.changes?.sinceNumber).toBe(1);
    expect(view.changes?.sentences).toContain('Option “Essential plus”: name “Essential” → “Essential plus”.');
    // Sending the new version keeps the job proposed.
    expect((await estimator.agent.get(`/api/jobs/${jobId}`)).body.job.status).toBe('proposed');
  });
});

describe('the customer’s page', () => {
  it('holds no cost, margin, approval, note or takeoff field: checked on the schema’s keys and the answer', async () => {
    const keys = new Set<string>();
    const walk = (node: unknown) => {
      if (Array.isArray(node)) node.forEach(walk);
      else if (node && typeof node === 'object') {
        for (const [k, v] of Object.entries(node)) {
          if (k === 'properties' && v && typeof v === 'object') for (const p of Object.keys(v)) keys.add(p);
          walk(v);
        }
      }
    };
    walk(z.toJSONSchema(customerProposalView));
    expect(keys.size).toBeGreaterThan(40);
    const forbidden = [...keys].filter((k) =>
      /cost|margin|approv|note|takeoff|sell|labor|markup|internal|discount.*(by|reason)|customers/i.test(k),
    );
    expect(forbidden).toEqual([]);

    const { jobId, proposalId } = await issuedJob();
    const { token } = await send(jobId);
    const { agent } = await open(token);
    const r = await agent.get(`/api/proposals/${proposalId}`).set(HTTPS);
    const seen = new Set<string>();
    const collect = (v: unknown) => {
      if (Array.isArray(v)) v.forEach(collect);
      else if (v && typeof v === 'object')
        for (const [k, x] of Object.entries(v)) {
          seen.add(k);
          collect(x);
        }
    };
    collect(r.body);
    for (const k of seen) expect(keys.has(k), k).toBe(true);
    // The office's snapshot has takeoff lines with per-line sell prices; none reach the customer.
    const office = await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/1`);
    expect(office.body.snapshot.options[0].takeoff.length).toBeGreaterThan(0);
    for (const k of ['takeoff', 'sellCents', 'itemKey', 'category', 'lineSets', 'electrical'])
      expect(seen.has(k), k).toBe(false);
  });

  it('choosing an option: validated, on the trail with data.position (what the deposit reads), CSRF required; the PDF downloads', async () => {
    const { jobId, proposalId } = await issuedJob();
    const { token } = await send(jobId);
    const { agent } = await open(token);
    const csrf = String((await agent.get('/api/auth/csrf').set(HTTPS)).body.token);
    const choose = (body: unknown, withCsrf = true) => {
      const req = agent.post(`/api/proposals/${proposalId}/option`).set(HTTPS);
      return (withCsrf ? req.set('X-CSRF-Token', csrf) : req).send(body as object);
    };
    for (const body of [{}, { position: 3 }, { position: 0 }, { position: '1' }, { position: 1.5 }]) {
      const r = await choose(body);
      expectProblem(r, 400);
      expect(r.body.errors[0].path).toBe('position');
    }
    expect((await choose({ position: 3 })).body.errors[0].message).toBe('Choose one of the options offered (1, 2).');
    expectProblem(await choose({ position: 1, amountCents: 1 }), 400);
    expectProblem(await choose({ position: 1 }, false), 403);
    expect((await events(proposalId)).some((e) => e.kind === 'option-chosen')).toBe(false);

    const first = await choose({ position: 1 });
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body.chosen.position).toBe(1);
    const second = await choose({ position: 2 });
    expect(second.body.chosen.position).toBe(2);
    const due = await depositDue(t.orm.em.fork(), a.id, proposalId);
    expect(due.depositCents).toBe(customerProposalView.parse(second.body).options[1]?.price.depositCents);

    // The PDF, once the queue has made it.
    await t.services.queue.drain();
    const pdf = await agent.get(`/api/proposals/${proposalId}/pdf`).set(HTTPS).buffer(true);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.headers['content-disposition']).toMatch(/^attachment; filename="[a-z0-9-]+\.pdf"$/);
    const trail = await events(proposalId);
    expect(trail.map((e) => e.kind)).toEqual([
      'issued',
      'sent',
      'opened',
      'option-chosen',
      'option-chosen',
      'downloaded',
    ]);
    expect(trail.filter((e) => e.kind === 'option-chosen').map((e) => e.data.position)).toEqual([1, 2]);
    expect(trail.every((e) => e.kind === 'issued' || e.kind === 'sent' || e.by_customer)).toBe(true);
  });
});

describe('names in the e-mail', () => {
  it('markup, template syntax and CR/LF in names stay literal text and add no header', async () => {
    const c = await makeCompany(t.orm.em.fork(), 'Header');
    await seedData(t.orm.em.fork(), c.id);
    const est = await login(t.app, c.users.estimator.email);
    const evilCompany = 'Cold & Co\r\nBcc: thief@evil.example';
    await sql(`update "company" set "name" = ? where "id" = ?`, [evilCompany, c.id]);
    const { jobId } = await issuedJob(est);
    const evilCustomer = '<b>{{7*7}}</b> ${1+1}\r\nX-Injected: yes';
    await sql(`update "customer" set "name" = ? where "id" = (select "customer_id" from "job" where "id" = ?)`, [
      evilCustomer,
      jobId,
    ]);
    // The snapshot is frozen at issue: issue again so it carries the customer's new name.
    expect((await post(est, `/api/jobs/${jobId}/proposal/versions`).send()).status).toBe(201);
    const { mail, to } = await send(jobId, est);
    expect(mail.to).toEqual([to]);
    expect(mail.subject).toBe('Your proposal from Cold & Co Bcc: thief@evil.example');
    expect(mail.text).toContain('Hello <b>{{7*7}}</b> ${1+1}');
    expect(t.smtp.messages.some((m) => m.to.includes('thief@evil.example'))).toBe(false);
  });
});

describe('guessing at links', () => {
  it('an address whose openings keep failing gets 429 for every token, a real one too; another address is not held up', async () => {
    const { jobId, proposalId } = await issuedJob();
    const { token } = await send(jobId);
    const guesser = `203.0.113.${Math.floor(Math.random() * 200) + 20}`;
    const from = (ip: string, tok: string) =>
      browserAgent(t.app).get(`${PROPOSAL_LINK_OPEN_PATH}?t=${tok}`).set(HTTPS).set('X-Forwarded-For', ip);
    const limit = t.services.config.LINK_OPEN_MAX_FAILURES_PER_IP;
    for (let i = 0; i < limit; i++)
      expect((await from(guesser, randomBytes(32).toString('base64url'))).status).toBe(410);
    const held = await from(guesser, token);
    expect(held.status).toBe(429);
    expect(Number(held.headers['retry-after'])).toBeGreaterThan(0);
    expect(held.text).toContain(LINK_ENDED.tooMany);
    expect(held.text).not.toContain(a.name);
    const other = await from('198.51.100.9', token);
    expect(other.status).toBe(303);
    expect(other.headers.location).toBe(`/p/${proposalId}`);
  });
});

describe('a mail server that stays down', () => {
  // Last in the file: it stops this app's SMTP fake.
  it('shows "waiting to send" with the reason while retrying, then "not sent" and a send-failed event after the last try', async () => {
    const { jobId, proposalId } = await issuedJob();
    await t.smtp.close();
    const to = recipient();
    const r = await post(estimator, `/api/jobs/${jobId}/proposal/links`).send({ to });
    expect(r.status).toBe(201);
    await t.services.queue.drain({ retriesNow: true });
    const waiting = await estimator.agent.get(`/api/jobs/${jobId}/proposal/links`);
    expect(waiting.body.links[0]).toMatchObject({ state: 'waiting-to-send', to, sentAt: null });
    expect(waiting.body.links[0].mailProblem).toContain('could not be reached');
    // The job moved to proposed with the send, whatever the mail server does.
    expect((await estimator.agent.get(`/api/jobs/${jobId}`)).body.job.status).toBe('proposed');
    for (let i = 0; i < 12; i++) await t.services.queue.drain({ retriesNow: true });
    const failed = await estimator.agent.get(`/api/jobs/${jobId}/proposal/links`);
    expect(failed.body.links[0]).toMatchObject({ state: 'not-sent', to });
    const [row] = await sql<{ token_sha256: string | null }>(
      `select "token_sha256" from "proposal_link" where "recipient" = ?`,
      [to],
    );
    expect(row?.token_sha256).toBeNull(); // no token was ever made for a mail that never went
    const trail = await events(proposalId);
    expect(trail.map((e) => e.kind)).toEqual(['issued', 'send-failed']);
    expect(String(trail[1]?.data.reason)).toContain('could not be reached');
  });
});
