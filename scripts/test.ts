import { spawn, spawnSync } from 'node:child_process';
import { buildClientIfStale } from './lib/client-build';
import { rmSync } from 'node:fs';
import { isEmpty, seedDemo } from '../fixtures/seed';
import { createLocalDiskStorage } from '../server/src/services/storage';
import { migrate, withOrm } from './lib/db';
import { TEST, startCluster } from './lib/stack';
import { chromiumPath, ensureChromium, log } from './lib/system';

// The test cluster is separate from the demo one and its database is made anew on every run.
const t0 = Date.now();
const vitestArgs = process.argv.slice(2);
// The whole suite (what CI runs) starts with the typecheck and the lint, so CI catches what they catch.
// A run narrowed by vitest arguments skips them, as does GAUGELINE_SKIP_CHECKS=1.
if (vitestArgs.length === 0 && !process.env.GAUGELINE_SKIP_CHECKS) {
  for (const script of ['typecheck', 'lint']) {
    log(`npm run ${script}…`);
    const r = spawnSync('npm', ['run', '-s', script], { stdio: 'inherit' });
    if (r.status !== 0) {
      log(`npm run ${script} failed; fix it before the suite runs.`);
      process.exit(r.status ?? 1);
    }
  }
}
ensureChromium();
const { cluster, url, startedHere } = await startCluster(TEST, { fast: true, recreate: true });
await migrate(url);
// The end-to-end tests sign in as the demo accounts; other tests make companies of their own.
// Test uploads (demo photos included) live apart from the demo instance's, and start empty.
const storageDir = `.data/uploads-${TEST.database}`;
rmSync(storageDir, { recursive: true, force: true });
// The demo's e-mails (its proposal links), for the e2e that opens the sent one as the customer would.
const outboxDir = `.data/outbox-${TEST.database}`;
rmSync(outboxDir, { recursive: true, force: true });
await withOrm(url, async (orm) => {
  if (await isEmpty(orm.em.fork())) await seedDemo(orm, { storage: createLocalDiskStorage(storageDir), outboxDir });
});
if (!process.env.GAUGELINE_SKIP_BUILD) await buildClientIfStale();
log(`test set-up ready in ${((Date.now() - t0) / 1000).toFixed(1)} s; running the suite…`);

const child = spawn(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', ...vitestArgs], {
  stdio: 'inherit',
  env: {
    ...process.env,
    DATABASE_URL: url,
    STORAGE_DIR: storageDir,
    DEMO_OUTBOX_DIR: outboxDir,
    NODE_ENV: 'test',
    CHROMIUM_PATH: chromiumPath,
    LOG_LEVEL: 'silent',
  },
});
const code: number = await new Promise((resolve) => child.on('exit', (c, sig) => resolve(c ?? (sig ? 1 : 0))));
// Leave a cluster that another run started (e.g. a second terminal) to that run.
if (startedHere) cluster.stop();
log(`tests finished in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
process.exit(code);
