// The one file that runs before dependencies exist, so it is plain JavaScript with
// no imports outside Node itself. It makes sure node_modules matches package-lock.json
// (npm ci when missing or stale), then hands over to the TypeScript script named (or, for `deps`,
// stops there).
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { spawnSync, spawn } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const [task, ...rest] = process.argv.slice(2);
if (!task) {
  console.error('usage: node scripts/bootstrap.mjs <deps|start|test|…> [args]');
  process.exit(2);
}

const lock = join(root, 'package-lock.json');
const stamp = join(root, 'node_modules', '.gaugeline-lock.sha256');
const want = createHash('sha256').update(readFileSync(lock)).digest('hex');
const have = existsSync(stamp) ? readFileSync(stamp, 'utf8').trim() : '';
if (want !== have) {
  console.log('[gaugeline] installing dependencies (npm ci)…');
  const t0 = Date.now();
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) {
    console.error('[gaugeline] npm ci failed; see the output above.');
    process.exit(r.status ?? 1);
  }
  writeFileSync(stamp, want + '\n');
  console.log(`[gaugeline] dependencies ready in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
}

// `deps` only brings node_modules up to date: the package scripts that call a tool directly
// (typecheck, lint, build, format) start with it, so a checkout whose lockfile moved never runs
// them against old packages.
if (task === 'deps') process.exit(0);

const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'scripts', `${task}.ts`), ...rest], {
  cwd: root,
  stdio: 'inherit',
});
// The child handles SIGINT/SIGTERM itself (it owns the server, fakes and cluster);
// the terminal delivers Ctrl-C to the whole process group, so we only wait for it.
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
