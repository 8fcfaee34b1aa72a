import type { Server } from 'node:http';
import { MikroORM } from '@mikro-orm/postgresql';
import pg from 'pg';
import { ormConfig } from '../../mikro-orm.config';
import { createApp } from './app';
import { loadConfig, type Config } from './config';
import { directoryOutbox } from './fakes/smtp-fake';
import { logger } from './lib/logger';
import { createSmtpMailer } from './services/mailer';
import { systemClock, type Services } from './services/services';
import { createLocalDiskStorage } from './services/storage';

export interface Running {
  server: Server;
  services: Services;
  url: string;
  close(): Promise<void>;
}

/** Builds the services from configuration and listens. The only place that opens a port for the API. */
export async function startServer(config: Config = loadConfig(), extra: Partial<Services> = {}): Promise<Running> {
  logger.level = config.LOG_LEVEL;
  const orm = await MikroORM.init(ormConfig(config.DATABASE_URL, config.DB_POOL_MAX));
  const sessionPool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 4, connectionTimeoutMillis: 2000 });
  const mailer = createSmtpMailer({ host: config.SMTP_HOST, port: config.SMTP_PORT, from: config.MAIL_FROM });
  const services: Services = {
    orm,
    sessionPool,
    config,
    mailer,
    storage: createLocalDiskStorage(config.STORAGE_DIR),
    clock: systemClock,
    outbox: config.devOutbox ? directoryOutbox('.data/outbox') : undefined,
    ...extra,
  };
  const app = createApp(services);
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  const url = `http://${config.HOST}:${port}`;
  logger.info({ url }, 'Gaugeline is listening');
  return {
    server,
    services,
    url,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      mailer.close();
      await sessionPool.end();
      await orm.close();
    },
  };
}
