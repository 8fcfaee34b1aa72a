import { loadConfig } from '../server/src/config';
import { localSeal } from './lib/seal';
import { startLocalPaymentsFake } from '../server/src/fakes/payments-fake';
import { startSmtpFake } from '../server/src/fakes/smtp-fake';
import { startServer } from '../server/src/server';
import { demoAccounts, isEmpty, seedDemo } from '../fixtures/seed';
import { buildClientIfStale } from './lib/client-build';
import { migrate, withOrm } from './lib/db';
import { DEMO, startCluster } from './lib/stack';
import { log } from './lib/system';

const t0 = Date.now();
// Vite's build sets process.env.NODE_ENV to production in this process: read the environment first.
const env = { ...process.env };
const { cluster, url: databaseUrl } = await startCluster(DEMO);
await migrate(databaseUrl);
const config = loadConfig({ ...env, ...(await localSeal(env)), DATABASE_URL: env.DATABASE_URL ?? databaseUrl });
await withOrm(databaseUrl, async (orm) => {
  if (await isEmpty(orm.em.fork())) {
    log('loading the demo data…');
    const seedStart = Date.now();
    // The demo's e-mails (proposal links among them) land where the /dev/outbox page reads.
    await seedDemo(orm, { config, outboxDir: '.data/outbox' });
    log(`demo data loaded in ${((Date.now() - seedStart) / 1000).toFixed(1)} s`);
  }
});
await buildClientIfStale();

const smtp = await startSmtpFake({ port: config.SMTP_PORT, dir: '.data/outbox' });
const paymentsFake = await startLocalPaymentsFake(config);
const running = await startServer(config);
paymentsFake?.setWebhookTarget(`${running.url}/api/hooks/payments`);

console.log(`
  Gaugeline is running at ${running.url}   (ready in ${((Date.now() - t0) / 1000).toFixed(1)} s)
  Outgoing e-mail is caught by the local SMTP fake on 127.0.0.1:${smtp.port}; owners read it at ${running.url}/dev/outbox
  ${paymentsFake ? `Deposits go to the local payments fake on 127.0.0.1:${paymentsFake.port} (test card pm_card_visa pays, pm_card_chargeDeclined is declined)` : 'Deposits go to the payment service configured by PAYMENTS_SECRET_KEY'}

  Demo sign-ins:
${demoAccounts.map((a) => `    ${a.role.padEnd(12)} ${a.email.padEnd(40)} ${a.password.padEnd(28)} ${a.company}`).join('\n')}

  Press Ctrl-C to stop.
`);

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  log(`${signal}: stopping the server, the fakes and the database…`);
  await running.close().catch(() => undefined);
  await smtp.close().catch(() => undefined);
  await paymentsFake?.close().catch(() => undefined);
  cluster.stop();
  log('stopped.');
  process.exit(0);
}
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
