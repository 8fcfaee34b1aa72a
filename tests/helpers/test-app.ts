import { MikroORM } from '@mikro-orm/postgresql';
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import request from 'supertest';
import { ormConfig } from '../../mikro-orm.config';
import { createApp, type AppExtras } from '../../server/src/app';
import { loadConfig, type Config } from '../../server/src/config';
import { startPaymentsFake, type PaymentsFake } from '../../server/src/fakes/payments-fake';
import { startSmtpFake, type SmtpFake } from '../../server/src/fakes/smtp-fake';
import { createStripePayments } from '../../server/src/services/payments';
import { createSmtpMailer } from '../../server/src/services/mailer';
import { createQueue } from '../../server/src/services/queue';
import { systemClock, type Clock, type Services } from '../../server/src/services/services';
import { createLocalDiskStorage } from '../../server/src/services/storage';
import { ensureLocalSealCertificate, LOCAL_SEAL_PASSPHRASE } from '../../server/src/services/seal-certificate';
import { abandonedHandlers, taskHandlers } from '../../server/src/tasks/handlers';

export interface TestApp {
  app: Express;
  orm: MikroORM;
  services: Services;
  smtp: SmtpFake;
  /** The payments fake the app's `stripe` SDK talks to; its webhooks reach this app's /api/hooks/payments. */
  payments: PaymentsFake;
  close(): Promise<void>;
}

export function testDatabaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url || !url.includes('_test'))
    throw new Error('DATABASE_URL must point at the test database: run the suite with `npm test`.');
  return url;
}

/** The real app on the real test database, with production error semantics and its own SMTP fake. */
export async function buildTestApp(
  overrides: Partial<Config> = {},
  clock: Clock = systemClock,
  extras: AppExtras = {},
): Promise<TestApp> {
  const url = testDatabaseUrl();
  const config = loadConfig(
    {
      NODE_ENV: 'production',
      DATABASE_URL: url,
      SESSION_SECRET: 'test-secret-test-secret-test-secret-0123',
      // The self-signed sealing certificate the tests share (made once under .data/seal).
      SEAL_P12_FILE: await ensureLocalSealCertificate(),
      SEAL_P12_PASSPHRASE: LOCAL_SEAL_PASSPHRASE,
      APP_ORIGIN: 'https://gaugeline.test',
      LOG_LEVEL: 'silent',
    },
    { DEV_OUTBOX: 'on', LOGIN_MAX_PER_IP: 1000, RESPONSE_VALIDATION: 'on', ...overrides },
  );
  const orm = await MikroORM.init(ormConfig(url, 5));
  const sessionPool = new pg.Pool({ connectionString: url, max: 3 });
  const smtp = await startSmtpFake({ port: 0 });
  const mailer = createSmtpMailer({ host: '127.0.0.1', port: smtp.port, from: config.MAIL_FROM });
  const paymentsFake = await startPaymentsFake({ port: 0, webhookSecret: config.PAYMENTS_WEBHOOK_SECRET });
  const paymentsConfig = { ...config, PAYMENTS_SECRET_KEY: undefined, PAYMENTS_API_URL: paymentsFake.url };
  // Each test app stores uploads in its own temporary folder, never in the developer's .data/uploads.
  const storage = createLocalDiskStorage(mkdtempSync(join(tmpdir(), 'gaugeline-uploads-')));
  const base: Omit<Services, 'queue'> & { queue?: Services['queue'] } = {
    orm,
    sessionPool,
    config: { ...config, PAYMENTS_API_URL: paymentsFake.url, devOutbox: true },
    mailer,
    payments: createStripePayments(paymentsConfig),
    storage,
    clock,
    outbox: smtp,
  };
  // Workers run in the test app as in the server; the namespace keeps each test file's jobs (and so
  // its e-mail) to its own app while the files share one database.
  const queue = createQueue({
    databaseUrl: url,
    handlers: taskHandlers(base),
    abandoned: abandonedHandlers(base),
    namespace: config.QUEUE_NAMESPACE ?? `t-${randomUUID().slice(0, 8)}`,
    concurrency: 1,
    pollIntervalMs: 200,
  });
  base.queue = queue; // the handlers read it when a task queues more work
  // QUEUE_WORKERS: 'off' in the overrides: the app only adds jobs (a worker process runs them).
  if (config.QUEUE_WORKERS === 'on') await queue.start();
  const services: Services = { ...base, queue };
  const app = createApp(services, extras);
  // The fake's webhooks go to this app as the service would send them (over HTTPS behind the proxy).
  paymentsFake.setWebhookTarget(async (body, signature) => {
    const res = await request(app)
      .post('/api/hooks/payments')
      .set('X-Forwarded-Proto', 'https')
      .set('Content-Type', 'application/json; charset=utf-8')
      .set('Stripe-Signature', signature)
      .send(body);
    return res.status;
  });
  return {
    app,
    orm,
    services,
    smtp,
    payments: paymentsFake,
    async close() {
      await paymentsFake.close();
      await services.queue.stop().catch(() => undefined);
      mailer.close();
      await smtp.close();
      await sessionPool.end().catch(() => undefined);
      await orm.close().catch(() => undefined);
    },
  };
}
