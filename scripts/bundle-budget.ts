/**
 * Prints the JavaScript each first-load route pulls, gzipped, against its budget (issue 11):
 * sign-in ≤ 120 KB, walk-through ≤ 200 KB. Reads Vite's manifest (dist/client/.vite/manifest.json):
 * a route loads the entry and its static imports, then its lazy route modules and their static
 * imports; dynamic imports inside them (charts, the PDF) load only when used and are not counted.
 * Sizes are the build's own .gz files (gzip -9) where present. Prints; never fails the build.
 * Run after `vite build` (npm run build does): node --import tsx scripts/bundle-budget.ts
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

interface Chunk {
  file: string;
  imports?: string[];
  dynamicImports?: string[];
  isEntry?: boolean;
  css?: string[];
}

export interface RouteBudget {
  readonly route: string;
  readonly modules: readonly string[];
  readonly budgetKb: number;
}

/**
 * The routes a phone opens first, by the modules loaded for them: the app (boot.tsx, which the
 * entry imports at once) and what client/src/app/route-preload.ts asks for on that page.
 */
const BOOT = 'src/boot.tsx';
export const ROUTE_BUDGETS: readonly RouteBudget[] = [
  { route: 'sign-in', modules: [BOOT, 'src/app/routes/sign-in.tsx'], budgetKb: 120 },
  {
    route: 'walk-through',
    modules: [
      BOOT,
      'src/app/routes/app-root.tsx',
      'src/app/job-route-loaders.ts',
      'src/app/routes/job-walkthrough.tsx',
    ],
    budgetKb: 200,
  },
  {
    route: 'loads',
    modules: [BOOT, 'src/app/routes/app-root.tsx', 'src/app/job-route-loaders.ts', 'src/app/routes/job-loads.tsx'],
    budgetKb: Number.NaN,
  },
];

export interface RouteSize {
  readonly route: string;
  readonly files: number;
  readonly rawKb: number;
  readonly gzipKb: number;
  readonly budgetKb: number;
  readonly largest: readonly { file: string; gzipKb: number }[];
}

export function routeSizes(dist = 'dist/client'): RouteSize[] | null {
  const manifestPath = join(dist, '.vite', 'manifest.json');
  if (!existsSync(manifestPath)) return null;
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Record<string, Chunk>;
  const entry = Object.keys(manifest).find((k) => manifest[k]?.isEntry);
  const gz = (file: string) => {
    const p = join(dist, file);
    return existsSync(`${p}.gz`) ? statSync(`${p}.gz`).size : gzipSync(readFileSync(p), { level: 9 }).length;
  };
  const closure = (keys: readonly string[]) => {
    const seen = new Set<string>();
    const walk = (k: string) => {
      if (seen.has(k) || !manifest[k]) return;
      seen.add(k);
      for (const i of manifest[k]?.imports ?? []) walk(i);
    };
    keys.forEach(walk);
    return seen;
  };
  return ROUTE_BUDGETS.map(({ route, modules, budgetKb }) => {
    const keys = closure([...(entry ? [entry] : []), ...modules]);
    const files = [...keys].map((k) => manifest[k]?.file ?? '').filter((f) => f.endsWith('.js'));
    const sizes = files.map((file) => ({ file, raw: statSync(join(dist, file)).size, gz: gz(file) }));
    return {
      route,
      files: files.length,
      rawKb: sizes.reduce((s, x) => s + x.raw, 0) / 1024,
      gzipKb: sizes.reduce((s, x) => s + x.gz, 0) / 1024,
      budgetKb,
      largest: sizes
        .sort((a, b) => b.gz - a.gz)
        .slice(0, 3)
        .map((x) => ({ file: x.file.replace(/^assets\//, ''), gzipKb: x.gz / 1024 })),
    };
  });
}

export function printBudgets(dist = 'dist/client'): void {
  const sizes = routeSizes(dist);
  if (!sizes) {
    console.log('bundle budgets: no build manifest (run npm run build)');
    return;
  }
  console.log('first-load JavaScript per route (gzipped, as sent to a browser that accepts gzip; brotli is smaller):');
  for (const s of sizes) {
    const verdict = Number.isFinite(s.budgetKb)
      ? `budget ≤ ${s.budgetKb} KB: ${s.gzipKb <= s.budgetKb ? 'MET' : 'NOT MET'}`
      : 'no budget';
    console.log(
      `  ${s.route.padEnd(13)} ${s.gzipKb.toFixed(1).padStart(6)} KB gzip (${s.rawKb.toFixed(0)} KB raw, ${s.files} files) — ${verdict}; largest: ${s.largest
        .map((l) => `${l.file} ${l.gzipKb.toFixed(1)}`)
        .join(', ')}`,
    );
  }
}

if (import.meta.url === `file://${process.argv[1]}`) printBudgets();
