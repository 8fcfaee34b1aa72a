import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutgoingMessageSchema } from '../../server/src/modules/mail/outgoing-message.entity';
import { login, makeCompany, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';

// Scaled apart: the API runs with QUEUE_WORKERS=off and a worker process (worker-main.ts, what
// `npm run worker` starts) sends the e-mail.
const namespace = `w-${randomUUID().slice(0, 8)}`;
let t: TestApp;
let a: TestCompany;
let worker: ChildProcess | undefined;

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off', QUEUE_NAMESPACE: namespace });
  a = await makeCompany(t.orm.em.fork(), 'Worker');
});
afterAll(async () => {
  worker?.kill('SIGKILL');
  await t.close();
});

describe('the queue in a worker process of its own', () => {
  it('a job added by a server without workers waits, and the worker process sends it', async () => {
    const owner = await login(t.app, a.users.owner.email);
    const email = `worker-${Date.now()}@mail.example.com`;
    const r = await owner.agent
      .post('/api/users')
      .set('X-CSRF-Token', owner.csrf)
      .send({ name: 'Worker Made', email, role: 'installer', password: 'a-long-enough-password' });
    expect(r.status).toBe(201);
    const waiting = await t.orm.em.fork().findOneOrFail(OutgoingMessageSchema, { toAddress: email });
    expect(waiting.state).toBe('waiting'); // nobody in this process runs jobs

    worker = spawn(process.execPath, ['--import', 'tsx', 'server/src/worker-main.ts'], {
      env: {
        ...process.env,
        NODE_ENV: 'test',
        DATABASE_URL: testDatabaseUrl(),
        SMTP_HOST: '127.0.0.1',
        SMTP_PORT: String(t.smtp.port),
        QUEUE_NAMESPACE: namespace,
        LOG_LEVEL: 'silent',
      },
      stdio: 'ignore',
    });
    const mail = await t.smtp.waitFor(email, 30_000);
    expect(mail.subject).toContain('added you to Gaugeline');
    // The worker marks it sent just after the mail server has it.
    let state = '';
    for (let i = 0; i < 100 && state !== 'sent'; i += 1) {
      state = (await t.orm.em.fork().findOneOrFail(OutgoingMessageSchema, { toAddress: email })).state;
      if (state !== 'sent') await new Promise((resolve) => setTimeout(resolve, 50));
    }
    expect(state).toBe('sent');

    // SIGTERM stops it cleanly (the job in hand finishes, connections close, exit code 0).
    const exited = new Promise<number | null>((resolve) => worker?.once('exit', (code) => resolve(code)));
    worker.kill('SIGTERM');
    expect(await exited).toBe(0);
    worker = undefined;
    expect(t.smtp.messages.filter((m) => m.to.includes(email))).toHaveLength(1);
  }, 60_000);
});
