import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { HTTPS, isProblem, login, makeCompany, TEST_PASSWORD, type TestCompany } from '../helpers/fixtures';
import { UserSchema } from '../../server/src/modules/users/user.entity';
import { browserAgent } from '../helpers/fixtures';

let t: TestApp;
let a: TestCompany;
let b: TestCompany;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'UsersA');
  b = await makeCompany(t.orm.em.fork(), 'UsersB');
});
afterAll(async () => t.close());

const newUser = (tag: string) => ({
  name: `New ${tag}`,
  email: `new-${tag}-${Date.now()}@users.example.com`,
  role: 'installer',
  password: 'a-long-new-password',
});

describe('user administration', () => {
  it('is refused when signed out (401)', async () => {
    const r = await browserAgent(t.app).get('/api/users').set(HTTPS);
    expect(r.status).toBe(401);
    expect(isProblem(r)).toBe(true);
  });

  it('is open to the owner only: other roles get 403', async () => {
    for (const role of ['estimator', 'salesperson', 'installer'] as const) {
      const s = await login(t.app, a.users[role].email);
      const list = await s.agent.get('/api/users');
      expect(list.status).toBe(403);
      expect(isProblem(list)).toBe(true);
      const create = await s.agent.post('/api/users').set('X-CSRF-Token', s.csrf).send(newUser(role));
      expect(create.status).toBe(403);
    }
  });

  it('lists only the owner’s own company', async () => {
    const s = await login(t.app, a.users.owner.email);
    const r = await s.agent.get('/api/users');
    expect(r.status).toBe(200);
    const ids = r.body.users.map((u: { id: string }) => u.id).sort();
    expect(ids).toEqual(
      Object.values(a.users)
        .map((u) => u.id)
        .sort(),
    );
    expect(JSON.stringify(r.body)).not.toMatch(/passwordHash|argon2/);
  });

  it('answers 404 for another company’s user, for read and write, and changes nothing', async () => {
    const s = await login(t.app, b.users.owner.email);
    const read = await s.agent.get(`/api/users/${a.users.estimator.id}`);
    expect(read.status).toBe(404);
    expect(isProblem(read)).toBe(true);
    expect(JSON.stringify(read.body)).not.toContain(a.users.estimator.email);
    const write = await s.agent
      .patch(`/api/users/${a.users.estimator.id}`)
      .set('X-CSRF-Token', s.csrf)
      .send({ role: 'owner' });
    expect(write.status).toBe(404);
    const fresh = await t.orm.em.fork().findOneOrFail(UserSchema, { id: a.users.estimator.id });
    expect(fresh.role).toBe('estimator');
  });

  it('ignores a tenant id smuggled into the body (strict schema → 400)', async () => {
    const s = await login(t.app, a.users.owner.email);
    const r = await s.agent
      .post('/api/users')
      .set('X-CSRF-Token', s.csrf)
      .send({ ...newUser('smuggle'), companyId: b.id });
    expect(r.status).toBe(400);
    expect(r.body.errors[0].message).toMatch(/Unrecognized key/i);
  });

  it('validates each field with a message next to it', async () => {
    const s = await login(t.app, a.users.owner.email);
    const cases: Array<[Record<string, unknown>, string, string]> = [
      [{ ...newUser('v1'), name: '' }, 'name', 'Enter a name.'],
      [{ ...newUser('v2'), email: 'nope' }, 'email', 'Enter a valid e-mail address.'],
      [{ ...newUser('v3'), role: 'admin' }, 'role', 'Role must be one of: owner, estimator, salesperson, installer.'],
      [{ ...newUser('v4'), password: 'short' }, 'password', 'Password must be at least 12 characters.'],
      [{ ...newUser('v5'), password: 'x'.repeat(129) }, 'password', 'Password must be at most 128 characters.'],
    ];
    for (const [body, path, message] of cases) {
      const r = await s.agent.post('/api/users').set('X-CSRF-Token', s.csrf).send(body);
      expect(r.status).toBe(400);
      expect(r.body.errors).toContainEqual({ path, message });
    }
  });

  it('creates a user who can sign in, and e-mails them through the SMTP fake', async () => {
    const s = await login(t.app, a.users.owner.email);
    const body = { ...newUser('ok'), password: 'emoji-🔧-long-password' };
    const r = await s.agent.post('/api/users').set('X-CSRF-Token', s.csrf).send(body);
    expect(r.status).toBe(201);
    expect(r.body.user).toMatchObject({ email: body.email, role: 'installer', companyId: a.id });
    const stored = await t.orm.em
      .fork()
      .findOneOrFail(UserSchema, { email: body.email }, { populate: ['passwordHash'] });
    // OWASP Password Storage Cheat Sheet: argon2id m=19456 (19 MiB), t=2, p=1
    expect(stored.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    const mail = await t.smtp.waitFor(body.email);
    expect(mail.subject).toContain('added you to Gaugeline');
    await login(t.app, body.email, body.password);
    const dup = await s.agent.post('/api/users').set('X-CSRF-Token', s.csrf).send(body);
    expect(dup.status).toBe(409);
  });

  it('changes a role, and refuses to remove the last owner', async () => {
    const s = await login(t.app, a.users.owner.email);
    const r = await s.agent
      .patch(`/api/users/${a.users.installer.id}`)
      .set('X-CSRF-Token', s.csrf)
      .send({ role: 'estimator' });
    expect(r.status).toBe(200);
    expect(r.body.user.role).toBe('estimator');
    const self = await s.agent
      .patch(`/api/users/${a.users.owner.id}`)
      .set('X-CSRF-Token', s.csrf)
      .send({ active: false });
    expect(self.status).toBe(422);
    await s.agent.patch(`/api/users/${a.users.installer.id}`).set('X-CSRF-Token', s.csrf).send({ role: 'installer' });
  });

  it('deactivating a user ends every session they have', async () => {
    const c = await makeCompany(t.orm.em.fork(), 'Deact');
    const sessions = await Promise.all([1, 2, 3].map(() => login(t.app, c.users.salesperson.email)));
    for (const x of sessions) expect((await x.agent.get('/api/auth/me')).status).toBe(200);
    const owner = await login(t.app, c.users.owner.email);
    const r = await owner.agent
      .patch(`/api/users/${c.users.salesperson.id}`)
      .set('X-CSRF-Token', owner.csrf)
      .send({ active: false });
    expect(r.status).toBe(200);
    for (const x of sessions) expect((await x.agent.get('/api/auth/me')).status).toBe(401);
    const again = await browserAgent(t.app).get('/api/auth/csrf');
    const relogin = await browserAgent(t.app)
      .post('/api/auth/login')
      .set('X-CSRF-Token', again.body.token)
      .send({ email: c.users.salesperson.email, password: TEST_PASSWORD });
    expect(relogin.status).toBe(403); // different agent: no session for that token, so CSRF refuses first
  });
});
