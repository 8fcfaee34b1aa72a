import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { browserAgent, csrfOf, makeCompany, TEST_PASSWORD, type TestCompany } from '../helpers/fixtures';

let t: TestApp;
let a: TestCompany;
beforeAll(async () => {
  t = await buildTestApp({ LOGIN_MAX_PER_ACCOUNT: 3, LOGIN_MAX_PER_IP: 8 });
  a = await makeCompany(t.orm.em.fork(), 'Limit');
});
afterAll(async () => t.close());

describe('sign-in rate limit', () => {
  it('answers 429 with Retry-After after too many failures for one account, even with the right password', async () => {
    const agent = browserAgent(t.app).set('X-Forwarded-For', '203.0.113.10');
    const csrf = await csrfOf(agent);
    const attempt = (password: string) =>
      agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email: a.users.owner.email, password });
    for (let i = 0; i < 3; i++) expect((await attempt('wrong-password-guess')).status).toBe(401);
    const blocked = await attempt(TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect(blocked.headers['content-type']).toMatch(/^application\/problem\+json/);
  });

  it('limits one client address across accounts', async () => {
    // A documentation address (RFC 5737) of its own, so other test files' failures do not count here.
    const agent = browserAgent(t.app).set('X-Forwarded-For', '203.0.113.20');
    const csrf = await csrfOf(agent);
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      const r = await agent
        .post('/api/auth/login')
        .set('X-CSRF-Token', csrf)
        .send({ email: `spray-${i}@limit.example.com`, password: 'wrong-password-guess' });
      statuses.push(r.status);
    }
    expect(statuses).toContain(429);
    expect(statuses.slice(0, 3).every((s) => s === 401)).toBe(true);
  });
});
