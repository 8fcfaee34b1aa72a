import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { UserSchema } from '../../server/src/modules/users/user.entity';
import { login, makeCompany, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { expectProblem } from './jobs-helpers';

let t: TestApp;
let a: TestCompany;
let b: TestCompany;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'StaffA');
  b = await makeCompany(t.orm.em.fork(), 'StaffB');
});
afterAll(async () => t.close());

describe('GET /api/staff — who a job can be handed to', () => {
  it('gives the owner and the estimator the active people of their company only, by name, with no e-mail', async () => {
    const em = t.orm.em.fork();
    await em.nativeUpdate(UserSchema, { id: a.users.installer.id }, { active: false });
    for (const who of [a.users.owner.email, a.users.estimator.email]) {
      const s = await login(t.app, who);
      const r = await s.agent.get('/api/staff');
      expect(r.status).toBe(200);
      const staff = r.body.staff as Array<{ id: string; name: string; role: string }>;
      const ids = staff.map((p) => p.id);
      expect(ids).toContain(a.users.salesperson.id);
      expect(ids).not.toContain(a.users.installer.id);
      for (const u of Object.values(b.users)) expect(ids).not.toContain(u.id);
      expect(Object.keys(staff[0] ?? {}).sort()).toEqual(['id', 'name', 'role']);
    }
    await em.nativeUpdate(UserSchema, { id: a.users.installer.id }, { active: true });
  });

  it('is refused to a salesperson and an installer', async () => {
    expectProblem(await (await login(t.app, a.users.salesperson.email)).agent.get('/api/staff'), 403);
    expectProblem(await (await login(t.app, a.users.installer.email)).agent.get('/api/staff'), 403);
  });
});
