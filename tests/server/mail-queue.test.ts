import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startSmtpFake, type SmtpFake } from '../../server/src/fakes/smtp-fake';
import { OutgoingMessageSchema } from '../../server/src/modules/mail/outgoing-message.entity';
import { login, makeCompany, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let a: TestCompany;
const restarted: SmtpFake[] = [];

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'Mail');
});
afterAll(async () => {
  for (const s of restarted) await s.close();
  await t.close();
});

const newUser = (tag: string) => ({
  name: `Queued ${tag}`,
  email: `queued-${tag}-${Date.now()}@mail.example.com`,
  role: 'installer',
  password: 'a-long-enough-password',
});

const messageTo = (to: string) => t.orm.em.fork().findOneOrFail(OutgoingMessageSchema, { toAddress: to });

describe('e-mail on the job queue', () => {
  it('retries while the mail server is down and delivers exactly once when it is back', async () => {
    const port = t.smtp.port;
    await t.smtp.close(); // the mail server goes away
    const owner = await login(t.app, a.users.owner.email);
    const body = newUser('retry');
    // The account is made at once: the request does not wait for the mail server.
    const r = await owner.agent.post('/api/users').set('X-CSRF-Token', owner.csrf).send(body);
    expect(r.status).toBe(201);

    await t.services.queue.drain(); // the first try runs and fails
    let message = await messageTo(body.email);
    expect(message.state).toBe('retrying');
    expect(message.attempts).toBeGreaterThanOrEqual(1);
    expect(message.lastError).toContain('could not be reached');
    expect(message.nextAttemptAt).not.toBeNull();
    expect(message.bodyText).toContain('created a Gaugeline account for you');

    // The owner sees it on the E-mail page, without its body.
    const list = await owner.agent.get('/api/mail');
    expect(list.status).toBe(200);
    const shown = list.body.messages.find((m: { to: string }) => m.to === body.email);
    expect(shown).toMatchObject({ state: 'retrying', kind: 'new-user', subject: expect.stringContaining('added you') });
    expect(shown.lastError).toContain('could not be reached');
    expect(JSON.stringify(shown)).not.toContain('created a Gaugeline account');

    await t.services.queue.drain({ retriesNow: true }); // still down: another failed try
    message = await messageTo(body.email);
    expect(message.state).toBe('retrying');
    expect(message.attempts).toBeGreaterThanOrEqual(2);

    const back = await startSmtpFake({ port }); // the mail server is back on the same address
    restarted.push(back);
    await t.services.queue.drain({ retriesNow: true });
    const mail = await back.waitFor(body.email);
    expect(mail.subject).toContain('added you to Gaugeline');
    message = await messageTo(body.email);
    expect(message.state).toBe('sent');
    expect(message.sentAt).not.toBeNull();
    expect(message.lastError).toBeNull();

    // Once: nothing is left to retry, and draining again sends nothing more.
    await t.services.queue.drain({ retriesNow: true });
    expect(back.messages.filter((m) => m.to.includes(body.email))).toHaveLength(1);
  });

  it('"Try again" sends a failing message now; a sent one cannot be sent twice', async () => {
    const live = restarted[0];
    if (!live) throw new Error('the first test restarts the fake');
    const port = live.port;
    await live.close();
    restarted.length = 0;
    const owner = await login(t.app, a.users.owner.email);
    const body = newUser('again');
    expect((await owner.agent.post('/api/users').set('X-CSRF-Token', owner.csrf).send(body)).status).toBe(201);
    await t.services.queue.drain();
    const failing = await messageTo(body.email);
    expect(failing.state).toBe('retrying');

    const back = await startSmtpFake({ port });
    restarted.push(back);
    const retry = await owner.agent.post(`/api/mail/${failing.id}/retry`).set('X-CSRF-Token', owner.csrf);
    expect(retry.status).toBe(200);
    expect(retry.body.message).toMatchObject({ id: failing.id, attempts: 0 });
    await t.services.queue.drain();
    await back.waitFor(body.email);
    expect((await messageTo(body.email)).state).toBe('sent');

    const again = await owner.agent.post(`/api/mail/${failing.id}/retry`).set('X-CSRF-Token', owner.csrf);
    expect(again.status).toBe(409);
    expect(back.messages.filter((m) => m.to.includes(body.email))).toHaveLength(1);
  });

  it("another company's message is not found, and only the owner may see or retry mail", async () => {
    const b = await makeCompany(t.orm.em.fork(), 'MailB');
    const ownerB = await login(t.app, b.users.owner.email);
    const [mine] = await t.orm.em.fork().find(OutgoingMessageSchema, { company: a.id }, { limit: 1 });
    if (!mine) throw new Error('the tests above made messages');
    const r = await ownerB.agent.post(`/api/mail/${mine.id}/retry`).set('X-CSRF-Token', ownerB.csrf);
    expect(r.status).toBe(404);
    const listB = await ownerB.agent.get('/api/mail');
    expect(listB.body.messages.map((m: { id: string }) => m.id)).not.toContain(mine.id);
    const estimator = await login(t.app, a.users.estimator.email);
    expect((await estimator.agent.get('/api/mail')).status).toBe(403);
  });
});
