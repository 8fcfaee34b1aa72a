import { loadConfig } from './config';
import { logger } from './lib/logger';
import { startServer } from './server';

// Production entry: configuration from the environment, no fakes, no cluster management.
const running = await startServer(loadConfig());
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    logger.info({ signal }, 'shutting down');
    void running.close().then(() => process.exit(0));
  });
}
