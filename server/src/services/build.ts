import { MikroORM } from '@mikro-orm/postgresql';
import pg from 'pg';
import { ormConfig } from '../../../mikro-orm.config';
import type { Config } from '../config';
import { directoryOutbox } from '../fakes/smtp-fake';
import { abandonedHandlers, taskHandlers } from '../tasks/handlers';
import { createSmtpMailer } from './mailer';
import { createStripePayments } from './payments';
import { createQueue } from './queue';
import { systemClock, type Services } from './services';
import { createLocalDiskStorage } from './storage';

/**
 * Every outside dependency, built from configuration: the server and the worker process use the
 * same set. `extra` replaces pieces (tests, the e2e harness); the queue's handlers see the result.
 */
export async function buildServices(config: Config, extra: Partial<Services> = {}): Promise<Services> {
  const orm = extra.orm ?? (await MikroORM.init(ormConfig(config.DATABASE_URL, config.DB_POOL_MAX)));
  const services = {
    orm,
    sessionPool:
      extra.sessionPool ??
      new pg.Pool({ connectionString: config.DATABASE_URL, max: 4, connectionTimeoutMillis: 2000 }),
    config,
    mailer: createSmtpMailer({ host: config.SMTP_HOST, port: config.SMTP_PORT, from: config.MAIL_FROM }),
    payments: createStripePayments(config),
    storage: createLocalDiskStorage(config.STORAGE_DIR),
    clock: systemClock,
    outbox: config.devOutbox ? directoryOutbox('.data/outbox') : undefined,
    ...extra,
  } as Services;
  services.queue ??= createQueue({
    databaseUrl: config.DATABASE_URL,
    handlers: taskHandlers(services),
    abandoned: abandonedHandlers(services),
    namespace: config.QUEUE_NAMESPACE,
    concurrency: config.QUEUE_CONCURRENCY,
  });
  return services;
}

/** Stops the workers and closes every connection the services hold. */
export async function closeServices(services: Services): Promise<void> {
  await services.queue.stop().catch(() => undefined);
  services.mailer.close();
  await services.sessionPool.end().catch(() => undefined);
  await services.orm.close().catch(() => undefined);
}
