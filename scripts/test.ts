import { spawn } from 'node:child_process';
import { buildClientIfStale } from './lib/client-build';
import { migrate } from './lib/db';
import { TEST, startCluster } from './lib/stack';
import { chromiumPath, ensureChromium, log } from './lib/system';

// The test cluster is separate from the demo one and its database is made anew on every run.
const t0 = Date.now();
ensureChromium();
const { cluster, url } = await startCluster(TEST, { fast: true, recreate: true });
await migrate(url);
if (!process.env.GAUGELINE_SKIP_BUILD) await buildClientIfStale();
log(`test set-up ready in ${((Date.now() - t0) / 1000).toFixed(1)} s; running the suite…`);

const child = spawn(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', ...process.argv.slice(2)], {
  stdio: 'inherit',
  env: { ...process.env, DATABASE_URL: url, NODE_ENV: 'test', CHROMIUM_PATH: chromiumPath, LOG_LEVEL: 'silent' },
});
const code: number = await new Promise((resolve) => child.on('exit', (c, sig) => resolve(c ?? (sig ? 1 : 0))));
cluster.stop();
log(`tests finished in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
process.exit(code);
