import type { Server } from 'node:http';
import { createApp } from './app';
import { loadConfig, type Config } from './config';
import { logger } from './lib/logger';
import { buildServices, closeServices } from './services/build';
import type { Services } from './services/services';

export interface Running {
  server: Server;
  services: Services;
  url: string;
  close(): Promise<void>;
}

/**
 * Builds the services from configuration and listens. The only place that opens a port for the API.
 * The job queue's workers run in this process unless QUEUE_WORKERS=off (then `npm run worker` runs them).
 */
export async function startServer(config: Config = loadConfig(), extra: Partial<Services> = {}): Promise<Running> {
  logger.level = config.LOG_LEVEL;
  const services = await buildServices(config, extra);
  if (config.QUEUE_WORKERS === 'on') await services.queue.start();
  const app = createApp(services);
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  const url = `http://${config.HOST}:${port}`;
  logger.info({ url, queueWorkers: config.QUEUE_WORKERS }, 'Gaugeline is listening');
  return {
    server,
    services,
    url,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await closeServices(services);
    },
  };
}
