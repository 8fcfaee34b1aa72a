import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { browserAgent, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { routeRegistry } from '../../server/src/lib/route';
import { ROLES, type Role } from '../../server/src/contract';

let t: TestApp;
let a: TestCompany;
const sessions = {} as Record<Role, Session>;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'Policy');
  for (const role of ROLES) sessions[role] = await login(t.app, a.users[role].email);
});
afterAll(async () => t.close());

const sample = (path: string) => path.replace(/:(\w+)/g, '00000000-0000-4000-8000-000000000000');

describe('deny by default', () => {
  it('every API route states a policy', () => {
    expect(routeRegistry.length).toBeGreaterThan(5);
    for (const r of routeRegistry) {
      expect(r.policy, `${r.method} ${r.path}`).toBeDefined();
      expect(['public', 'roles']).toContain(r.policy.kind);
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
});
