import { readdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

// Runs every bench/*.ts in turn. Benchmarks print figures; they never fail the build.
const files = readdirSync('bench')
  .filter((f) => f.endsWith('.ts'))
  .sort();
if (files.length === 0) console.log('no benchmarks yet');
for (const f of files) {
  console.log(`\n=== bench/${f} ===`);
  const r = spawnSync(process.execPath, ['--import', 'tsx', `bench/${f}`], { stdio: 'inherit' });
  if (r.status !== 0) console.log(`(bench/${f} exited ${r.status}; figures above may be incomplete)`);
}
