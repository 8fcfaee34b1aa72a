import type { Config } from './config';
import { logger } from './lib/logger';
import { buildServices, closeServices } from './services/build';
import type { Services } from './services/services';

export interface RunningWorker {
  services: Services;
  close(): Promise<void>;
}

/**
 * The job queue's workers without the HTTP server: for when the queue is scaled apart from the API
 * (the servers run with QUEUE_WORKERS=off). Any number of these may run against one database.
 */
export async function startWorker(config: Config, extra: Partial<Services> = {}): Promise<RunningWorker> {
  logger.level = config.LOG_LEVEL;
  const services = await buildServices(config, extra);
  await services.queue.start();
  logger.info({ concurrency: config.QUEUE_CONCURRENCY }, 'Gaugeline worker is running');
  return { services, close: () => closeServices(services) };
}
