import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { browserAgent, csrfOf, isProblem, login, makeCompany, type TestCompany } from '../helpers/fixtures';

let t: TestApp;
let a: TestCompany;
beforeAll(async () => {
  t = await buildTestApp({ LOGIN_MAX_PER_ACCOUNT: 1_000_000, LOGIN_MAX_PER_IP: 1_000_000 });
  a = await makeCompany(t.orm.em.fork(), 'Fuzz');
});
afterAll(async () => t.close());

/** A fingerprint of every row a rejected request could have touched. */
async function snapshot(): Promise<string> {
  const rows = await t.orm.em
    .fork()
    .getConnection()
    .execute(
      `select (select count(*) from company) as c, (select md5(coalesce(string_agg(id::text || name || email || role || active::text || password_hash, ',' order by id), '')) from app_user) as u`,
    );
  return JSON.stringify(rows);
}

// Random JSON (fast-check's jsonValue) half the time, mutations of a valid body the other half.
const hostile = (valid: Record<string, unknown>) =>
  fc.oneof(
    fc.jsonValue(),
    fc
      .record({
        key: fc.constantFrom(...Object.keys(valid), '__proto__', 'constructor', 'companyId', 'id'),
        value: fc.jsonValue(),
      })
      .map(({ key, value }) => ({ ...valid, [key]: value })),
    fc
      .constantFrom(...Object.keys(valid))
      .map((drop) => Object.fromEntries(Object.entries(valid).filter(([k]) => k !== drop))),
    fc.string({ maxLength: 3000 }).map((s) => ({ ...valid, name: s, email: s })),
  );

// 1,000 requests per test: allow for a busy 2-core machine running other suites beside it.
describe('1,000 hostile bodies per route', { timeout: 180_000 }, () => {
  it('POST /api/auth/login: no 5xx, problem+json for every 4xx, no row changed', async () => {
    const agent = browserAgent(t.app);
    const csrf = await csrfOf(agent);
    const before = await snapshot();
    await fc.assert(
      fc.asyncProperty(hostile({ email: a.users.owner.email, password: 'wrong-password-xyz' }), async (body) => {
        const r = await agent
          .post('/api/auth/login')
          .set('X-CSRF-Token', csrf)
          .set('Content-Type', 'application/json')
          .send(JSON.stringify(body));
        expect(r.status).toBeLessThan(500);
        expect(r.status).not.toBe(200);
        expect(isProblem(r)).toBe(true);
      }),
      { numRuns: 1000, seed: 42 },
    );
    expect(await snapshot()).toBe(before);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('POST /api/users and PATCH /api/users/:id as the owner: no 5xx, and rejected bodies change nothing', async () => {
    const s = await login(t.app, a.users.owner.email);
    const before = await snapshot();
    let created = 0;
    await fc.assert(
      fc.asyncProperty(
        hostile({ name: 'Fuzzy Person', email: 'fuzz@fuzz.example.com', role: 'installer', password: 'short' }),
        async (body) => {
          const post = await s.agent
            .post('/api/users')
            .set('X-CSRF-Token', s.csrf)
            .set('Content-Type', 'application/json')
            .send(JSON.stringify(body));
          expect(post.status).toBeLessThan(500);
          if (post.status === 201) created += 1;
          else expect(isProblem(post)).toBe(true);
          const patch = await s.agent
            .patch(`/api/users/${a.users.installer.id}`)
            .set('X-CSRF-Token', s.csrf)
            .set('Content-Type', 'application/json')
            .send(
              JSON.stringify(
                typeof body === 'object' && body !== null && !Array.isArray(body) ? { ...body, active: 'no' } : body,
              ),
            );
          expect(patch.status).toBeLessThan(500);
          expect(isProblem(patch)).toBe(true);
        },
      ),
      { numRuns: 1000, seed: 7 },
    );
    // "short" is not a valid password, so a valid creation needs fast-check to replace it: count those.
    if (created === 0) expect(await snapshot()).toBe(before);
  });
});
