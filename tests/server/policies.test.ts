import { z } from 'zod';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { link, NO_CONTENT, PUBLIC, signed, routeRegistry, type ApiRouter } from '../../server/src/lib/route';
import { ROLES, type Role } from '../../server/src/contract';

/**
 * No proposal-link or webhook route exists yet (the proposal and payment issues add them), so this file
 * mounts one of each through the route declaration itself; the checks below run over every route of
 * the registry of its kind, so the real ones join them when they land.
 */
const OTHER_PROPOSAL = '7c2e9a14-5b63-4d08-8e1f-2a9b7c6d5e40';
function linkTestRoutes(api: ApiRouter): void {
  // Stands in for the route a proposal link opens: a grant for `proposalId`, expired when asked.
  api.route({
    method: 'post',
    path: '/open-link/:proposalId',
    policy: PUBLIC,
    params: z.strictObject({ proposalId: z.uuid() }),
    query: z.strictObject({ expired: z.literal('1').optional() }),
    response: NO_CONTENT,
    handler: async ({ req, params, query }) => {
      const expiresAt = query.expired ? Date.now() - 1_000 : Date.now() + 60_000;
      req.session.link = { proposalId: params.proposalId, companyId: 'c', expiresAt };
    },
  });
  api.route({
    method: 'get',
    path: '/proposals/:proposalId',
    policy: link('proposalId'),
    params: z.strictObject({ proposalId: z.uuid() }),
    response: z.object({ proposalId: z.string() }),
    handler: async ({ link: grant }) => ({ proposalId: grant?.proposalId ?? '' }),
  });
  api.route({
    method: 'post',
    path: '/proposals/:proposalId/accept',
    policy: link('proposalId'),
    params: z.strictObject({ proposalId: z.uuid() }),
    response: NO_CONTENT,
    handler: async () => undefined,
  });
}
function signedTestHook(api: ApiRouter): void {
  api.route({
    method: 'post',
    path: '/',
    policy: signed((_raw, req) => req.get('X-Test-Signature') === 'right'),
    response: NO_CONTENT,
    handler: async () => undefined,
  });
}

let t: TestApp;
let a: TestCompany;
const sessions = {} as Record<Role, Session>;

beforeAll(async () => {
  t = await buildTestApp({}, undefined, {
    hooks: [['/policy-test', signedTestHook]],
    modules: [['/policy-test', linkTestRoutes]],
  });
  a = await makeCompany(t.orm.em.fork(), 'Policy');
  for (const role of ROLES) sessions[role] = await login(t.app, a.users[role].email);
});
afterAll(async () => t.close());

const SAMPLE_ID = '00000000-0000-4000-8000-000000000000';
const sample = (path: string) => path.replace(/:(\w+)/g, SAMPLE_ID);

describe('deny by default', () => {
  it('every API route states a policy', () => {
    expect(routeRegistry.length).toBeGreaterThan(5);
    for (const r of routeRegistry) {
      expect(r.policy, `${r.method} ${r.path}`).toBeDefined();
      expect(['public', 'roles', 'link', 'signed']).toContain(r.policy.kind);
      // A signed route has no session or CSRF: the app mounts its raw router before both.
      if (r.policy.kind === 'signed') expect(r.raw, `${r.method} ${r.path}`).toBe(true);
      else expect(r.raw, `${r.method} ${r.path}`).toBe(false);
      if (r.policy.kind === 'roles') expect(r.policy.roles.length).toBeGreaterThan(0);
    }
  });

  it('the Express router holds no API route outside the registry', () => {
    interface Layer {
      route?: { path: string; methods: Record<string, boolean> };
      handle?: { stack?: Layer[] };
    }
    const root = (t.app as unknown as { router: { stack: Layer[] } }).router.stack;
    const registered = new Set(routeRegistry.map((r) => `${r.method} ${r.path.replace(/^\/api\/[^/]+/, '')}`));
    const inner = root.flatMap((l) => l.handle?.stack ?? []).filter((l) => l.route);
    expect(inner.length).toBeGreaterThan(0);
    for (const l of inner) {
      for (const m of Object.keys(l.route?.methods ?? {})) {
        const key = `${m} ${l.route?.path}`;
        expect(
          [...registered].some((r) => r === key),
          key,
        ).toBe(true);
      }
    }
  });

  it('each role reaches exactly the routes its policy allows (403 otherwise, 401 signed out)', async () => {
    for (const r of routeRegistry.filter((x) => x.policy.kind === 'roles')) {
      const path = sample(r.path);
      const anon = browserAgent(t.app)[r.method](path).set('X-CSRF-Token', 'none');
      const anonRes = await anon;
      // signed out: CSRF refuses writes (403) before the policy; reads get 401
      expect(anonRes.status, `${r.method} ${path} signed out`).toBe(r.method === 'get' ? 401 : 403);
      for (const role of ROLES) {
        const s = sessions[role];
        const res = await s.agent[r.method](path).set('X-CSRF-Token', s.csrf).send({});
        const allowed = r.policy.kind === 'roles' && r.policy.roles.includes(role);
        if (allowed) expect(res.status, `${role} ${r.method} ${path}`).not.toBe(403);
        else expect(res.status, `${role} ${r.method} ${path}`).toBe(403);
        expect(res.status).toBeLessThan(500);
      }
    }
  });

  it('a proposal-link route: 401 to every staff role and to no grant or an expired one, 404 for another proposal', async () => {
    const linkRoutes = routeRegistry.filter((x) => x.policy.kind === 'link');
    expect(linkRoutes.length).toBeGreaterThan(0);
    const customer = async (grantFor?: string, expired = false) => {
      const agent = browserAgent(t.app);
      const { body } = await agent.get('/api/auth/csrf').set(HTTPS);
      const csrf = String(body.token);
      if (grantFor) {
        const opened = await agent
          .post(`/api/policy-test/open-link/${grantFor}${expired ? '?expired=1' : ''}`)
          .set(HTTPS)
          .set('X-CSRF-Token', csrf);
        expect(opened.status).toBe(204);
      }
      return { agent, csrf };
    };
    const none = await customer();
    const stale = await customer(SAMPLE_ID, true);
    const other = await customer(OTHER_PROPOSAL);
    for (const r of linkRoutes) {
      const path = sample(r.path);
      const send = (c: { agent: ReturnType<typeof browserAgent>; csrf: string }) =>
        c.agent[r.method](path).set(HTTPS).set('X-CSRF-Token', c.csrf).send({});
      for (const role of ROLES) {
        const s = sessions[role];
        const res = await s.agent[r.method](path).set('X-CSRF-Token', s.csrf).send({});
        expect(res.status, `${role} ${r.method} ${path}`).toBe(401);
      }
      expect((await send(none)).status, `no grant ${r.method} ${path}`).toBe(401);
      expect((await send(stale)).status, `expired grant ${r.method} ${path}`).toBe(401);
      expect((await send(other)).status, `another proposal's grant ${r.method} ${path}`).toBe(404);
    }
    // The grant's own proposal gets through (the test routes answer; a real one may then 404 a missing proposal).
    const own = await customer(SAMPLE_ID);
    const read = await own.agent.get(`/api/policy-test/proposals/${SAMPLE_ID}`).set(HTTPS);
    expect(read.status, JSON.stringify(read.body)).toBe(200);
    expect(read.body).toEqual({ proposalId: SAMPLE_ID });
    const write = await own.agent
      .post(`/api/policy-test/proposals/${SAMPLE_ID}/accept`)
      .set(HTTPS)
      .set('X-CSRF-Token', own.csrf);
    expect(write.status).toBe(204);
  });

  it('a signed webhook route: 401 without the signature, even from a signed-in owner', async () => {
    const hooks = routeRegistry.filter((x) => x.policy.kind === 'signed');
    expect(hooks.length).toBeGreaterThan(0);
    for (const r of hooks) {
      const path = sample(r.path);
      const stranger = browserAgent(t.app);
      const anon = await stranger[r.method](path).set(HTTPS).set('Content-Type', 'application/json').send('{}');
      expect(anon.status, `${r.method} ${path}`).toBe(401);
      const owner = sessions.owner;
      const res = await owner.agent[r.method](path).set('X-CSRF-Token', owner.csrf).send({});
      expect(res.status, `owner ${r.method} ${path}`).toBe(401);
    }
    const ok = await browserAgent(t.app)
      .post('/api/hooks/policy-test')
      .set(HTTPS)
      .set('X-Test-Signature', 'right')
      .set('Content-Type', 'application/json')
      .send('{}');
    expect(ok.status).toBe(204);
  });
});
