import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import {
  browserAgent,
  csrfOf,
  HTTPS,
  isProblem,
  login,
  makeCompany,
  TEST_PASSWORD,
  type TestCompany,
} from '../helpers/fixtures';
import { UserSchema } from '../../server/src/modules/users/user.entity';

let t: TestApp;
let a: TestCompany;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'Auth');
});
afterAll(async () => t.close());

const sidOf = (cookies: string[]) => cookies.find((c) => c.startsWith('__Host-sid='))?.split(';')[0];

describe('POST /api/auth/login', () => {
  it('signs in, returns the user and sets a hardened session cookie', async () => {
    const agent = browserAgent(t.app);
    const csrf = await csrfOf(agent);
    const r = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .send({ email: a.users.owner.email, password: TEST_PASSWORD });
    expect(r.status).toBe(200);
    expect(r.body.user).toMatchObject({ email: a.users.owner.email, role: 'owner', companyId: a.id, active: true });
    expect(r.body.user.passwordHash).toBeUndefined();
    const cookies = ([] as string[]).concat(r.headers['set-cookie'] ?? []);
    const sid = cookies.find((c) => c.startsWith('__Host-sid='));
    expect(sid).toBeDefined();
    expect(sid).toMatch(/HttpOnly/i);
    expect(sid).toMatch(/Secure/i);
    expect(sid).toMatch(/SameSite=Lax/i);
    expect(sid).toMatch(/Path=\//);
    expect(sid).not.toMatch(/Domain=/i);
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const s = await login(t.app, `  ${a.users.estimator.email.toUpperCase()} `);
    const me = await s.agent.get('/api/auth/me').set(HTTPS);
    expect(me.body.user.email).toBe(a.users.estimator.email);
  });

  it('gives the same 401 body for a wrong password and an unknown e-mail', async () => {
    const agent = browserAgent(t.app);
    const csrf = await csrfOf(agent);
    const wrong = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .send({ email: a.users.installer.email, password: 'not-the-password-at-all' });
    const unknown = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .send({ email: 'nobody-here@auth.example.com', password: 'not-the-password-at-all' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(isProblem(wrong)).toBe(true);
    const strip = (b: Record<string, unknown>) => ({ ...b, instance: undefined });
    expect(strip(wrong.body)).toEqual(strip(unknown.body));
    expect(wrong.body.detail).toBe('The e-mail or password is not right.');
  });

  it('checks the password exactly as typed', async () => {
    const agent = browserAgent(t.app);
    const csrf = await csrfOf(agent);
    for (const password of [`${TEST_PASSWORD}x`, TEST_PASSWORD.toUpperCase(), `${TEST_PASSWORD} `]) {
      const r = await agent
        .post('/api/auth/login')
        .set(HTTPS)
        .set('X-CSRF-Token', csrf)
        .send({ email: a.users.salesperson.email, password });
      expect(r.status).toBe(401);
    }
  });

  it('issues a new session id at sign-in (no fixation)', async () => {
    const agent = browserAgent(t.app);
    const pre = await agent.get('/api/auth/csrf').set(HTTPS);
    const before = sidOf(([] as string[]).concat(pre.headers['set-cookie'] ?? []));
    expect(before).toBeDefined();
    const r = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', pre.body.token)
      .send({ email: a.users.owner.email, password: TEST_PASSWORD });
    const after = sidOf(([] as string[]).concat(r.headers['set-cookie'] ?? []));
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
    // the pre-sign-in CSRF token no longer works
    const stale = await agent.post('/api/auth/logout').set(HTTPS).set('X-CSRF-Token', pre.body.token);
    expect(stale.status).toBe(403);
  });

  it('validates the body with field errors', async () => {
    const agent = browserAgent(t.app);
    const csrf = await csrfOf(agent);
    const r = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .send({ email: 'not-an-email', password: '' });
    expect(r.status).toBe(400);
    expect(isProblem(r)).toBe(true);
    expect(r.body.errors).toEqual(
      expect.arrayContaining([
        { path: 'email', message: 'Enter a valid e-mail address.' },
        { path: 'password', message: 'Enter your password.' },
      ]),
    );
  });
});

describe('sessions', () => {
  it('GET /api/auth/me answers 401 when signed out', async () => {
    const r = await request(t.app).get('/api/auth/me').set(HTTPS);
    expect(r.status).toBe(401);
    expect(isProblem(r)).toBe(true);
  });

  it('GET /api/auth/session answers 200 with me: null when signed out, and who is signed in otherwise', async () => {
    const out = await request(t.app).get('/api/auth/session').set(HTTPS);
    expect(out.status).toBe(200);
    expect(out.body).toEqual({ me: null });
    const s = await login(t.app, a.users.salesperson.email);
    const signedIn = await s.agent.get('/api/auth/session').set(HTTPS);
    expect(signedIn.status).toBe(200);
    expect(signedIn.body.me.user.email).toBe(a.users.salesperson.email);
    expect(signedIn.body.me).toEqual((await s.agent.get('/api/auth/me').set(HTTPS)).body);
  });

  it('a cookie replayed after sign-out gets 401', async () => {
    const s = await login(t.app, a.users.salesperson.email);
    const sid = sidOf(s.cookie);
    expect(sid).toBeDefined();
    const out = await s.agent.post('/api/auth/logout').set(HTTPS).set('X-CSRF-Token', s.csrf);
    expect(out.status).toBe(204);
    const replay = await request(t.app).get('/api/auth/me').set(HTTPS).set('Cookie', String(sid));
    expect(replay.status).toBe(401);
  });

  it('a session past its absolute lifetime is refused', async () => {
    const s = await login(t.app, a.users.estimator.email);
    const sid = decodeURIComponent(String(sidOf(s.cookie)).split('=')[1] ?? '')
      .slice(2)
      .split('.')[0];
    await t.orm.em
      .fork()
      .getConnection()
      .execute(
        `update "session" set sess = jsonb_set(sess::jsonb, '{authAt}', to_jsonb((extract(epoch from now()) * 1000 - 13 * 3600 * 1000)::bigint))::json where sid = ?`,
        [sid],
      );
    const r = await s.agent.get('/api/auth/me').set(HTTPS);
    expect(r.status).toBe(401);
  });

  it('a session past its idle expiry is refused', async () => {
    const s = await login(t.app, a.users.estimator.email);
    const sid = decodeURIComponent(String(sidOf(s.cookie)).split('=')[1] ?? '')
      .slice(2)
      .split('.')[0];
    await t.orm.em
      .fork()
      .getConnection()
      .execute(`update "session" set expire = now() - interval '1 minute' where sid = ?`, [sid]);
    const r = await s.agent.get('/api/auth/me').set(HTTPS);
    expect(r.status).toBe(401);
  });
});

describe('CSRF', () => {
  it('refuses a state-changing request without the token, or with a wrong one', async () => {
    const s = await login(t.app, a.users.owner.email);
    const body = {
      name: 'New Person',
      email: 'csrf-new@auth.example.com',
      role: 'installer',
      password: 'long-enough-password',
    };
    const none = await s.agent.post('/api/users').set(HTTPS).send(body);
    const wrong = await s.agent.post('/api/users').set(HTTPS).set('X-CSRF-Token', 'x'.repeat(43)).send(body);
    const other = await login(t.app, a.users.estimator.email);
    const foreign = await s.agent.post('/api/users').set(HTTPS).set('X-CSRF-Token', other.csrf).send(body);
    for (const r of [none, wrong, foreign]) {
      expect(r.status).toBe(403);
      expect(isProblem(r)).toBe(true);
      expect(r.body.type).toBe('/problems/csrf');
    }
    const count = await t.orm.em.fork().count(UserSchema, { email: body.email });
    expect(count).toBe(0);
  });

  it('refuses a cross-site request even with the right token', async () => {
    const s = await login(t.app, a.users.owner.email);
    const r = await s.agent
      .post('/api/auth/logout')
      .set(HTTPS)
      .set('X-CSRF-Token', s.csrf)
      .set('Sec-Fetch-Site', 'cross-site');
    expect(r.status).toBe(403);
  });
});

describe('malformed requests', () => {
  it('malformed JSON → 400, wrong content type → 415, oversize body → 413, all problem+json', async () => {
    const agent = browserAgent(t.app);
    const csrf = await csrfOf(agent);
    const bad = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .set('Content-Type', 'application/json')
      .send('{"email": ');
    expect(bad.status).toBe(400);
    expect(isProblem(bad)).toBe(true);
    const text = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .set('Content-Type', 'text/plain')
      .send('{"email":"a@b.c","password":"x"}');
    expect(text.status).toBe(415);
    expect(isProblem(text)).toBe(true);
    const form = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .type('form')
      .send({ email: 'a@b.c', password: 'x' });
    expect(form.status).toBe(415);
    const big = await agent
      .post('/api/auth/login')
      .set(HTTPS)
      .set('X-CSRF-Token', csrf)
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.c', password: 'x'.repeat(300_000) }));
    expect(big.status).toBe(413);
    expect(isProblem(big)).toBe(true);
    for (const r of [bad, text, big]) expect(JSON.stringify(r.body)).not.toMatch(/node_modules|at .+:\d+:\d+|stack/i);
  });

  it('sends no X-Powered-By and no HTML error pages', async () => {
    const r = await request(t.app).get('/api/does-not-exist').set(HTTPS);
    expect(r.headers['x-powered-by']).toBeUndefined();
    expect(r.headers['content-type']).toMatch(/^application\/problem\+json/);
  });
});
