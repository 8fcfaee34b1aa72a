import { spawn } from 'node:child_process';
import { loadConfig } from '../server/src/config';
import { localSeal } from './lib/seal';
import { startLocalPaymentsFake } from '../server/src/fakes/payments-fake';
import { startSmtpFake } from '../server/src/fakes/smtp-fake';
import { startServer } from '../server/src/server';
import { isEmpty, seedDemo } from '../fixtures/seed';
import { migrate, withOrm } from './lib/db';
import { DEMO, startCluster } from './lib/stack';
import { log } from './lib/system';

// Express on its port, Vite's dev server with HMR on 5173 proxying /api to it.
const { cluster, url } = await startCluster(DEMO);
await migrate(url);
await withOrm(url, async (orm) => {
  if (await isEmpty(orm.em.fork())) await seedDemo(orm, { outboxDir: '.data/outbox' });
});
const config = loadConfig({
  ...process.env,
  ...(await localSeal(process.env)),
  DATABASE_URL: url,
  CLIENT_DIST: '.data/no-client',
});
const smtp = await startSmtpFake({ port: config.SMTP_PORT, dir: '.data/outbox' });
const paymentsFake = await startLocalPaymentsFake(config);
const running = await startServer(config);
paymentsFake?.setWebhookTarget(`${running.url}/api/hooks/payments`);
const vite = spawn(process.execPath, ['node_modules/vite/bin/vite.js'], {
  stdio: 'inherit',
  env: { ...process.env, PORT: String(config.PORT) },
});
log(`API on ${running.url}; open http://127.0.0.1:5173 for the client with hot reload.`);
const stop = async () => {
  vite.kill('SIGTERM');
  await running.close().catch(() => undefined);
  await smtp.close().catch(() => undefined);
  await paymentsFake?.close().catch(() => undefined);
  cluster.stop();
  process.exit(0);
};
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());
