import { loadConfig } from './config';
import { logger } from './lib/logger';
import { startWorker } from './worker';

// Production entry of a worker process: configuration from the environment, like main.ts.
const running = await startWorker(loadConfig());
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    logger.info({ signal }, 'worker shutting down');
    void running.close().then(() => process.exit(0));
  });
}
