import { RESET_LINK_INVALID, RESET_REQUESTED_MESSAGE } from '@contract';
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PasswordResetTokenSchema } from '../../server/src/modules/auth/password-reset-token.entity';
import { OutgoingMessageSchema } from '../../server/src/modules/mail/outgoing-message.entity';
import {
  browserAgent,
  csrfOf,
  isProblem,
  login,
  makeCompany,
  TEST_PASSWORD,
  type TestCompany,
} from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';

// The clock the app reads (token expiry), moved forward by the expiry test.
let offsetMs = 0;
const clock = { now: () => new Date(Date.now() + offsetMs) };

let t: TestApp;
let a: TestCompany;
let b: TestCompany;

beforeAll(async () => {
  t = await buildTestApp({}, clock);
  a = await makeCompany(t.orm.em.fork(), 'Accounts');
  b = await makeCompany(t.orm.em.fork(), 'AccountsB');
});
afterAll(async () => t.close());

const signedIn = async (s: { agent: ReturnType<typeof browserAgent> }) => (await s.agent.get('/api/auth/me')).status;

/** A fresh anonymous browser, optionally from a given client address (trusted through the loopback proxy). */
async function anonymous(ip?: string) {
  const agent = browserAgent(t.app);
  if (ip) agent.set('X-Forwarded-For', ip);
  return { agent, csrf: await csrfOf(agent) };
}

async function askReset(email: string, ip?: string) {
  const s = await anonymous(ip);
  return s.agent.post('/api/auth/password-reset').set('X-CSRF-Token', s.csrf).send({ email });
}

async function completeReset(token: string, password: string) {
  const s = await anonymous();
  return s.agent.post('/api/auth/password-reset/complete').set('X-CSRF-Token', s.csrf).send({ token, password });
}

/** The newest mail to `to` whose subject matches, after the queue has sent what is due. */
async function mailTo(to: string, subject: RegExp) {
  await t.services.queue.drain();
  const found = t.smtp.messages.filter((m) => m.to.includes(to) && subject.test(m.subject)).at(-1);
  if (!found) throw new Error(`no mail to ${to} matching ${subject}`);
  return found;
}

const tokenIn = (text: string) => {
  const m = /\/reset-password#token=([A-Za-z0-9_-]{43})\b/.exec(text);
  if (!m?.[1]) throw new Error(`no reset link in: ${text}`);
  return m[1];
};

describe('changing your own password', () => {
  it('needs the current password, ends the other sessions, keeps this one and says so by e-mail', async () => {
    const email = a.users.estimator.email;
    const here = await login(t.app, email);
    const phone = await login(t.app, email);
    const tablet = await login(t.app, email);

    const wrong = await here.agent
      .post('/api/auth/password')
      .set('X-CSRF-Token', here.csrf)
      .send({ currentPassword: 'not-the-password', newPassword: 'a-brand-new-password-1' });
    expect(wrong.status).toBe(400);
    expect(isProblem(wrong)).toBe(true);
    expect(wrong.body.errors).toEqual([{ path: 'currentPassword', message: 'The current password is not right.' }]);

    const short = await here.agent
      .post('/api/auth/password')
      .set('X-CSRF-Token', here.csrf)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.errors).toContainEqual({
      path: 'newPassword',
      message: 'Password must be at least 12 characters.',
    });

    const ok = await here.agent
      .post('/api/auth/password')
      .set('X-CSRF-Token', here.csrf)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a-brand-new-password-1' });
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ endedSessions: 2 });

    expect(await signedIn(here)).toBe(200);
    expect(await signedIn(phone)).toBe(401);
    expect(await signedIn(tablet)).toBe(401);
    await expect(login(t.app, email)).rejects.toThrow(/401/);
    await login(t.app, email, 'a-brand-new-password-1');

    const mail = await mailTo(email, /password was changed/);
    expect(mail.text).toContain('was changed from a signed-in session');
  });

  it('voids a reset link asked for before the change', async () => {
    const c = await makeCompany(t.orm.em.fork(), 'AccountsC');
    const email = c.users.salesperson.email;
    expect((await askReset(email, '198.51.100.7')).status).toBe(202);
    const token = tokenIn((await mailTo(email, /new Gaugeline password/)).text);
    const s = await login(t.app, email);
    const changed = await s.agent
      .post('/api/auth/password')
      .set('X-CSRF-Token', s.csrf)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'changed-before-the-link' });
    expect(changed.status).toBe(200);
    const late = await completeReset(token, 'would-undo-the-change');
    expect(late.status).toBe(400);
    expect(late.body.detail).toBe(RESET_LINK_INVALID);
    await login(t.app, email, 'changed-before-the-link');
  });

  it('is refused when signed out', async () => {
    const s = await anonymous();
    const r = await s.agent
      .post('/api/auth/password')
      .set('X-CSRF-Token', s.csrf)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a-brand-new-password-2' });
    expect(r.status).toBe(401);
  });
});

describe('forgot password', () => {
  it('answers the same whether or not the address has an account, and e-mails only the account', async () => {
    const known = await askReset(a.users.installer.email);
    const unknown = await askReset(`nobody-${Date.now()}@accounts.example.com`);
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    expect(known.body).toEqual({ message: RESET_REQUESTED_MESSAGE });
    expect(unknown.headers['content-type']).toBe(known.headers['content-type']);
    const mail = await mailTo(a.users.installer.email, /new Gaugeline password/);
    expect(mail.text).toMatch(/https:\/\/gaugeline\.test\/reset-password#token=/);
    expect(t.smtp.messages.some((m) => m.to.some((to) => to.startsWith('nobody-')))).toBe(false);
  });

  it('keeps only the SHA-256 of a 256-bit token; the link works once and ends every session', async () => {
    const email = a.users.salesperson.email;
    const before = await login(t.app, email);
    expect((await askReset(email)).status).toBe(202);
    const token = tokenIn((await mailTo(email, /new Gaugeline password/)).text);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);

    const em = t.orm.em.fork();
    const stored = await em.find(PasswordResetTokenSchema, { user: a.users.salesperson.id });
    expect(stored.map((r) => r.tokenHash)).toContain(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(stored)).not.toContain(token);
    const message = await em.findOneOrFail(
      OutgoingMessageSchema,
      { toAddress: email, kind: 'password-reset' },
      { orderBy: { createdAt: 'desc' } },
    );
    expect(message.bodyText).toBeNull(); // the raw link never reaches the database
    expect(message.state).toBe('sent');

    const weak = await completeReset(token, 'short');
    expect(weak.status).toBe(400);
    expect(weak.body.errors).toContainEqual({ path: 'password', message: 'Password must be at least 12 characters.' });

    const done = await completeReset(token, 'reset-by-link-password');
    expect(done.status).toBe(200);
    expect(await signedIn(before)).toBe(401);
    await login(t.app, email, 'reset-by-link-password');
    await expect(login(t.app, email)).rejects.toThrow(/401/);
    expect(await em.count(PasswordResetTokenSchema, { user: a.users.salesperson.id })).toBe(0);

    const again = await completeReset(token, 'another-new-password');
    expect(again.status).toBe(400);
    expect(again.body.detail).toBe(RESET_LINK_INVALID);
    await login(t.app, email, 'reset-by-link-password');
    expect((await mailTo(email, /password was changed/)).text).toContain('with an e-mailed reset link');
  });

  it('a link stops working after 30 minutes', async () => {
    const email = b.users.installer.email;
    expect((await askReset(email)).status).toBe(202);
    const token = tokenIn((await mailTo(email, /new Gaugeline password/)).text);
    offsetMs = 31 * 60_000;
    try {
      const late = await completeReset(token, 'too-late-for-this-one');
      expect(late.status).toBe(400);
      expect(late.body.detail).toBe(RESET_LINK_INVALID);
    } finally {
      offsetMs = 0;
    }
    await login(t.app, email); // the password did not change

    // A fresh link, used at 29 minutes, still works.
    expect((await askReset(email)).status).toBe(202);
    await t.services.queue.drain();
    const mails = t.smtp.messages.filter((m) => m.to.includes(email) && /new Gaugeline password/.test(m.subject));
    const fresh = tokenIn(mails.at(-1)?.text ?? '');
    expect(fresh).not.toBe(token);
    offsetMs = 29 * 60_000;
    try {
      expect((await completeReset(fresh, 'just-in-time-password')).status).toBe(200);
    } finally {
      offsetMs = 0;
    }
    await login(t.app, email, 'just-in-time-password');
  });

  it('refuses a malformed or made-up token with the same message', async () => {
    const bad = await completeReset('x'.repeat(43), 'whatever-long-password');
    expect(bad.status).toBe(400);
    expect(bad.body.detail).toBe(RESET_LINK_INVALID);
    const short = await completeReset('abc', 'whatever-long-password');
    expect(short.status).toBe(400);
    expect(short.body.errors[0].path).toBe('token');
  });

  it('is rate limited per address (known or not, the same) and per client address', async () => {
    const known = b.users.estimator.email;
    const unknown = `nobody-limit-${Date.now()}@accounts.example.com`;
    for (let i = 0; i < 3; i += 1) {
      expect((await askReset(known, '198.51.100.1')).status).toBe(202);
      expect((await askReset(unknown, '198.51.100.1')).status).toBe(202);
    }
    const k = await askReset(known, '198.51.100.2');
    const u = await askReset(unknown, '198.51.100.2');
    expect(k.status).toBe(429);
    expect(u.status).toBe(429);
    expect(u.body.type).toBe(k.body.type);
    expect(Number(k.headers['retry-after'])).toBeGreaterThan(0);
    // Only three reset e-mails for the known address, however often it was asked for.
    await t.services.queue.drain();
    expect(t.smtp.messages.filter((m) => m.to.includes(known))).toHaveLength(3);

    // One client address asking for many addresses is stopped too (20 an hour by default).
    const statuses: number[] = [];
    for (let i = 0; i < 21; i += 1)
      statuses.push((await askReset(`spray-${i}-${Date.now()}@example.com`, '198.51.100.3')).status);
    expect(statuses.slice(0, 20).every((s) => s === 202)).toBe(true);
    expect(statuses[20]).toBe(429);
  });
});

describe('the owner ends all of a user’s sessions', () => {
  it('signs the person out everywhere; the owner keeps their own current session', async () => {
    const owner = await login(t.app, b.users.owner.email);
    const ownerElsewhere = await login(t.app, b.users.owner.email);
    const s1 = await login(t.app, b.users.salesperson.email);
    const s2 = await login(t.app, b.users.salesperson.email);
    const r = await owner.agent
      .post(`/api/users/${b.users.salesperson.id}/end-sessions`)
      .set('X-CSRF-Token', owner.csrf);
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ ended: 2 });
    expect(await signedIn(s1)).toBe(401);
    expect(await signedIn(s2)).toBe(401);
    await login(t.app, b.users.salesperson.email); // the account itself is untouched

    const self = await owner.agent.post(`/api/users/${b.users.owner.id}/end-sessions`).set('X-CSRF-Token', owner.csrf);
    expect(self.body).toEqual({ ended: 1 });
    expect(await signedIn(owner)).toBe(200);
    expect(await signedIn(ownerElsewhere)).toBe(401);
  });

  it("another company's user is not found, and only the owner may do it", async () => {
    const owner = await login(t.app, b.users.owner.email);
    const victim = await login(t.app, a.users.owner.email);
    const r = await owner.agent.post(`/api/users/${a.users.owner.id}/end-sessions`).set('X-CSRF-Token', owner.csrf);
    expect(r.status).toBe(404);
    expect(await signedIn(victim)).toBe(200);
    const estimator = await login(t.app, b.users.estimator.email);
    const e = await estimator.agent
      .post(`/api/users/${b.users.salesperson.id}/end-sessions`)
      .set('X-CSRF-Token', estimator.csrf);
    expect(e.status).toBe(403);
  });
});
