import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { log } from './system';

function newest(path: string): number {
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  let max = st.mtimeMs;
  for (const name of readdirSync(path)) {
    if (name === 'node_modules') continue;
    max = Math.max(max, newest(join(path, name)));
  }
  return max;
}

/** Builds the client with Vite when dist is missing or older than any source it is made from. */
export async function buildClientIfStale(): Promise<void> {
  const out = 'dist/client/index.html';
  const sources = ['client', 'calc', 'server/src/contract', 'vite.config.ts', 'package-lock.json'].filter((p) =>
    existsSync(p),
  );
  const srcTime = Math.max(...sources.map(newest));
  if (existsSync(out) && statSync(out).mtimeMs >= srcTime) return;
  log('building the client…');
  const t0 = Date.now();
  const { build } = await import('vite');
  await build({ configFile: 'vite.config.ts', logLevel: 'warn' });
  log(`client built in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
}
