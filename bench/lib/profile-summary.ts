/**
 * A `node --cpu-prof` profile in a few lines: busy time by area of the code (calc, the server's desk
 * module, the rest of the server, zod, the ORM, the pg driver, other packages, Node itself, natives such
 * as JSON, the garbage collector) and the functions with the most self time, idle time left out.
 */
import { readFileSync } from 'node:fs';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}
interface Profile {
  nodes: ProfileNode[];
  startTime: number;
  samples: number[];
  timeDeltas: number[];
}

const AREAS: [string, (url: string, fn: string) => boolean][] = [
  ['garbage collector', (_u, fn) => fn === '(garbage collector)'],
  ['calc', (u) => u.includes('/calc/')],
  ['server: desk module', (u) => u.includes('/server/src/modules/desk/')],
  ['server: the rest', (u) => u.includes('/server/src/')],
  ['zod', (u) => u.includes('/node_modules/zod/')],
  ['MikroORM', (u) => u.includes('/node_modules/@mikro-orm/') || u.includes('/node_modules/knex/')],
  ['pg driver', (u) => /\/node_modules\/pg[-/]/.test(u)],
  ['other packages', (u) => u.includes('/node_modules/')],
  ['Node (node:*)', (u) => u.startsWith('node:')],
  ['natives (JSON, regexps, builtins)', () => true],
];

/** Now on the clock a profile's timestamps use (the monotonic clock, µs), to mark a window of it. */
export const profileClockUs = (): number => Number(process.hrtime.bigint() / 1000n);

/**
 * Prints the summary of the samples taken within `window` (profileClockUs() readings taken around the
 * requests of interest, so the server's start and the bench's setup stay out), or of the whole profile.
 */
export function summariseProfile(
  file: string,
  top: number,
  label: string,
  window?: { fromUs: number; toUs: number },
): void {
  const p = JSON.parse(readFileSync(file, 'utf8')) as Profile;
  const byId = new Map(p.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of p.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const selfUs = new Map<number, number>();
  let at = p.startTime;
  p.samples.forEach((id, i) => {
    const dt = p.timeDeltas[i] ?? 0;
    at += dt;
    if (window && (at < window.fromUs || at > window.toUs)) return;
    selfUs.set(id, (selfUs.get(id) ?? 0) + dt);
  });
  const areas = new Map<string, number>();
  const fns = new Map<string, number>();
  // The server's own functions with the time spent in them and below (each counted once per sample).
  const ours = new Map<string, number>();
  const nameOf = (n: ProfileNode) => {
    const { functionName, url, lineNumber } = n.callFrame;
    const where = url ? `${url.replace(/^.*\/(node_modules\/|calc\/|server\/src\/)/, '$1')}:${lineNumber + 1}` : '';
    return `${functionName || '(anonymous)'} ${where}`.trim();
  };
  let busy = 0;
  for (const [id, us] of selfUs) {
    const n = byId.get(id);
    if (!n) continue;
    const { functionName, url } = n.callFrame;
    if (functionName === '(idle)' || functionName === '(program)' || functionName === '(root)') continue;
    busy += us;
    const area = AREAS.find(([, is]) => is(url, functionName))?.[0] ?? 'other';
    areas.set(area, (areas.get(area) ?? 0) + us);
    const key = nameOf(n);
    fns.set(key, (fns.get(key) ?? 0) + us);
    const seen = new Set<string>();
    for (let up: number | undefined = id; up !== undefined; up = parent.get(up)) {
      const u = byId.get(up);
      if (!u || !u.callFrame.url.includes('/server/src/modules/') || !u.callFrame.functionName) continue;
      const k = nameOf(u);
      if (!seen.has(k)) ours.set(k, (ours.get(k) ?? 0) + us);
      seen.add(k);
    }
  }
  const pct = (us: number) => `${((100 * us) / Math.max(1, busy)).toFixed(1).padStart(5)} %`;
  console.log(`  --cpu-prof of the server, ${label}: ${(busy / 1000).toFixed(0)} ms busy`);
  console.log('    by area:');
  for (const [a, us] of [...areas].sort((x, y) => y[1] - x[1])) console.log(`      ${pct(us)}  ${a}`);
  console.log(`    top ${top} functions by self time:`);
  for (const [f, us] of [...fns].sort((x, y) => y[1] - x[1]).slice(0, top)) console.log(`      ${pct(us)}  ${f}`);
  console.log(`    the server's modules: top ${top} functions with what they call (inclusive):`);
  for (const [f, us] of [...ours].sort((x, y) => y[1] - x[1]).slice(0, top)) console.log(`      ${pct(us)}  ${f}`);
}
