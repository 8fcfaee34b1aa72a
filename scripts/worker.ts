import { loadConfig } from '../server/src/config';
import { localSeal } from './lib/seal';
import { startWorker } from '../server/src/worker';
import { DEMO, startCluster } from './lib/stack';
import { log } from './lib/system';

// `npm run worker`: the job queue's workers in a process of their own, against DATABASE_URL or the
// local demo cluster. Run the server with QUEUE_WORKERS=off beside it (README, "Past one machine").
const env = { ...process.env };
const started = env.DATABASE_URL ? undefined : await startCluster(DEMO);
const config = loadConfig({ ...env, ...(await localSeal(env)), DATABASE_URL: env.DATABASE_URL ?? started?.url });
const running = await startWorker(config);
log(`worker running (${config.QUEUE_CONCURRENCY} at a time); Ctrl-C stops it.`);

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  log(`${signal}: stopping the worker…`);
  await running.close().catch(() => undefined);
  if (started?.startedHere) started.cluster.stop();
  process.exit(0);
}
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
