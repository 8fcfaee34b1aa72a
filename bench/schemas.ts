/**
 * The zod schemas the signed-in shell builds when it loads (issue 11): every calc and contract module the
 * built `shell` chunk holds (read from its source map, so the list follows the build), bundled for Node with
 * zod and evaluated in fresh processes. It prints the CPU time of building them (zod's own start-up apart) —
 * the fastest of the runs, which other work on the machine hardly moves — and how many schema objects they
 * make. A phone at 4× slowdown takes several times this machine's figure. Never fails.
 *
 * BENCH_SCHEMA_RUNS (default 15); BENCH_SERVER_DIR=<checkout> measures another checkout's built shell.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { join, resolve } from 'node:path';
import { rolldown } from 'rolldown';

const ROOT = resolve(process.env.BENCH_SERVER_DIR ?? '.');
const RUNS = Number(process.env.BENCH_SCHEMA_RUNS ?? 15);
const assets = join(ROOT, 'dist/client/assets');

const mapFile = readdirSync(assets).find((f) => /^shell-.*\.js\.map$/.test(f));
if (!mapFile) {
  console.log('schema build: no built shell chunk (run npm run build first)');
  process.exit(0);
}
const sources = (JSON.parse(readFileSync(join(assets, mapFile), 'utf8')) as { sources: string[] }).sources
  .map((s) => s.replace(/^(\.\.\/)+/, ''))
  .filter((s) => /^(calc\/src|server\/src\/contract)\//.test(s));

// Inside the checkout, so the entry finds zod in its node_modules.
mkdirSync(join(ROOT, 'node_modules/.cache'), { recursive: true });
const dir = mkdtempSync(join(ROOT, 'node_modules/.cache/bench-schemas-'));
try {
  // zod first, then the clock, then the modules: what is timed is the building, not zod's own start.
  writeFileSync(join(dir, 'start.mjs'), 'globalThis.__t0 = process.cpuUsage(); globalThis.__marks = [];\n');
  // After each module (and what it brings that came before it in none of the others): the CPU so far.
  sources.forEach((_, i) =>
    writeFileSync(
      join(dir, `mark${i}.mjs`),
      'const u = process.cpuUsage(globalThis.__t0); globalThis.__marks.push(u.user + u.system);\n',
    ),
  );
  writeFileSync(
    join(dir, 'entry.mjs'),
    [
      "import * as zod from 'zod';",
      "import './start.mjs';",
      ...sources.flatMap((s, i) => [
        `import * as m${i} from ${JSON.stringify(join(ROOT, s))};`,
        `import './mark${i}.mjs';`,
      ]),
      'const t = process.cpuUsage(globalThis.__t0);',
      'const each = globalThis.__marks.map((m, i, all) => (m - (i ? all[i - 1] : 0)) / 1000);',
      // Keep every module's exports alive, so the bundler drops nothing the chunk built.
      `globalThis.__kept = [zod, ${sources.map((_, i) => `m${i}`).join(', ')}];`,
      'const kept = globalThis.__kept.length;',
      'console.log(JSON.stringify({ ms: (t.user + t.system) / 1000, each, kept }));',
    ].join('\n'),
  );
  const bundle = await rolldown({
    input: join(dir, 'entry.mjs'),
    cwd: ROOT,
    resolve: {
      alias: { '@calc': join(ROOT, 'calc/index.ts'), '@contract': join(ROOT, 'server/src/contract/index.ts') },
    },
    platform: 'node',
    // As the client build has it (vite.config.ts): calc and the contract are pure, so `@calc` brings only what is used.
    treeshake: { moduleSideEffects: [{ test: /[\\/](calc|server[\\/]src[\\/]contract)[\\/]/, sideEffects: false }] },
    logLevel: 'silent',
  });
  await bundle.write({ file: join(dir, 'out.mjs'), format: 'esm' });
  const runs = Array.from(
    { length: RUNS },
    () =>
      JSON.parse(execFileSync(process.execPath, [join(dir, 'out.mjs')], { encoding: 'utf8' })) as {
        ms: number;
        each: number[];
      },
  );
  const times = runs.map((r) => r.ms).sort((a, b) => a - b);
  const fastest = runs.find((r) => r.ms === times[0]);
  console.log(
    `schemas the shell chunk builds at load (${sources.length} calc/contract modules from ${mapFile}): ` +
      `${times[0]?.toFixed(1)} ms CPU on this machine, fastest of ${RUNS} fresh processes ` +
      `(median ${times[Math.floor(times.length / 2)]?.toFixed(1)}; load average ${loadavg()[0]?.toFixed(2)})`,
  );
  // By module, in the order loaded (each with what it imports that no module before it did), in the fastest run.
  const byModule = sources
    .map((s, i) => ({ s, ms: fastest?.each[i] ?? 0 }))
    .filter((m) => m.ms >= 0.5)
    .sort((a, b) => b.ms - a.ms);
  console.log(`  by module: ${byModule.map((m) => `${m.s} ${m.ms.toFixed(1)}`).join(', ')}`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
