import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';
import { VitePWA } from 'vite-plugin-pwa';
import type { Plugin } from 'vite';
import { defineConfig } from 'vitest/config';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));
const alias = { '@calc': here('./calc/index.ts'), '@contract': here('./server/src/contract/index.ts') };
const apiTarget = `http://127.0.0.1:${process.env.PORT ?? '4780'}`;

/**
 * The installable app (client/src/lib/offline/app-update.tsx registers it): a service worker made
 * by workbox at build time precaches the shell and every built asset, so the app opens with no
 * signal; API answers are never cached by it (the query cache is persisted per person instead).
 * The workbox runtime is bundled beside sw.js: nothing is fetched from another host.
 */
const pwa = VitePWA({
  registerType: 'prompt',
  injectRegister: false,
  strategies: 'generateSW',
  includeAssets: ['icons/icon.svg', 'icons/apple-touch-icon-180.png'],
  manifest: {
    name: 'Gaugeline',
    short_name: 'Gaugeline',
    description: 'Walk-throughs, loads and proposals for heating and cooling contractors, with or without signal.',
    lang: 'en',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    theme_color: '#12343b',
    background_color: '#f7f4ee',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
      { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    ],
  },
  workbox: {
    globPatterns: ['**/*.{js,css,html,woff2,woff,svg,png,webmanifest}'],
    navigateFallback: '/index.html',
    navigateFallbackDenylist: [/^\/api(\/|$)/],
    cleanupOutdatedCaches: true,
    // The PDF and chart chunks are large; the walk-through must still open offline with them.
    maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
    inlineWorkboxRuntime: false,
    sourcemap: false,
  },
  devOptions: { enabled: false },
});

/**
 * The app itself (boot.tsx, which the entry imports dynamically, and its static imports: React, the router,
 * TanStack Query, its CSS) named in index.html, so the browser asks for it while the entry downloads
 * instead of after the entry has run: one round trip less before anything can show (issue 11).
 */
function preloadApp(): Plugin {
  return {
    name: 'gaugeline-preload-app',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(html, ctx) {
        const chunks = Object.values(ctx.bundle ?? {}).filter((c) => c.type === 'chunk');
        const boot = chunks.find((c) => c.facadeModuleId?.endsWith('/src/boot.tsx'));
        if (!boot) return [];
        const entries = new Set(chunks.filter((c) => c.isEntry).map((c) => c.fileName));
        // What the page already names (the entry and its own imports) is not named twice.
        const files = [boot.fileName, ...boot.imports].filter((f) => !entries.has(f) && !html.includes(`/${f}"`));
        const css = [...(boot.viteMetadata?.importedCss ?? [])];
        return [
          ...files.map((f) => ({
            tag: 'link',
            attrs: { rel: 'modulepreload', crossorigin: '', href: `/${f}` },
            injectTo: 'head' as const,
          })),
          ...css.map((f) => ({
            tag: 'link',
            attrs: { rel: 'preload', as: 'style', crossorigin: '', href: `/${f}` },
            injectTo: 'head' as const,
          })),
        ];
      },
    },
  };
}

/**
 * The app's own fonts (woff2) named in index.html, so they arrive with the code instead of after the first
 * paint: with `font-display: swap` a late font re-wraps every line and the whole page jumps (the desk measured
 * a 0.26 layout shift on a slow phone, header and all, when the text face swapped in).
 */
function preloadFonts(): Plugin {
  return {
    name: 'gaugeline-preload-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(_html, ctx) {
        return Object.values(ctx.bundle ?? {})
          .filter((a) => a.type === 'asset' && a.fileName.endsWith('.woff2'))
          .map((a) => ({
            tag: 'link',
            attrs: { rel: 'preload', as: 'font', type: 'font/woff2', crossorigin: '', href: `/${a.fileName}` },
            injectTo: 'head' as const,
          }));
      },
    },
  };
}

// One file for the client build, the dev server and the test projects.
export default defineConfig({
  root: here('./client'),
  plugins: [
    react(),
    tailwindcss(),
    preloadApp(),
    preloadFonts(),
    pwa,
    // Every text file of the build also as .br and .gz: the server picks one by Accept-Encoding (server/src/app.ts).
    compression({
      include: /\.(js|mjs|css|html|svg|json|webmanifest|txt)$/,
      threshold: 512,
      algorithms: [defineAlgorithm('brotliCompress'), defineAlgorithm('gzip', { level: 9 })],
    }),
  ],
  // convert-units (used by calc) reads Node's `global`; the browser has globalThis.
  define: { global: 'globalThis' },
  resolve: { alias },
  build: {
    outDir: here('./dist/client'),
    emptyOutDir: true,
    sourcemap: true,
    manifest: true,
    rolldownOptions: {
      // calc and the contract are pure (no module-level effects), so a page that uses one schema or
      // constant does not pull the whole engine into its chunk: the engine loads with the walk-through.
      treeshake: { moduleSideEffects: [{ test: /[\\/](calc|server[\\/]src[\\/]contract)[\\/]/, sideEffects: false }] },
      output: {
        // What every page runs (React, the router, TanStack Query) in one file rather than a dozen small
        // ones: the entry asks for the app and the page's modules at once (client/src/app/route-preload.ts),
        // and many tiny shared chunks would cost a phone more requests and more gzip overhead.
        codeSplitting: {
          groups: [
            {
              // Small app modules every page, sign-in included, loads: one file rather than a dozen.
              name: 'core',
              // The sign-in page's own small modules are here too: each file costs a phone a request.
              test: /[\\/](client[\\/]src[\\/](lib[\\/](api-error|api-client|api-version|early-fetch|offline[\\/](last-person|online))|config[\\/]paths|entities[\\/]job[\\/]paths|components[\\/](ui[\\/](button|spinner|alert|field-shell)|layout[\\/](wordmark|public-page))|features[\\/]auth[\\/](query-keys|components[\\/]use-countdown))|server[\\/]src[\\/]contract[\\/](api-version|links))\.tsx?$/,
            },
            {
              name: 'framework',
              test: /[\\/]node_modules[\\/](react|react-dom|scheduler|react-router|react-router-dom|@tanstack[\\/](query-core|react-query))[\\/]/,
            },
            {
              // The signed-in shell (app-root: guards, the session, the offline queue, the contract and zod) and
              // the job screens' loaders, with everything they import: every signed-in page loads all of it first,
              // and as one file rather than twenty it costs a phone one request instead of a queue of them
              // (six connections at a time over HTTP/1.1, 150 ms each on weak 4G).
              name: 'shell',
              test: /[\\/]client[\\/]src[\\/]app[\\/](routes[\\/]app-root|job-route-loaders)\.tsx?$/,
            },
            {
              // Small pieces the job screens share (units, labels, figures, empty states, widget boundaries): one file.
              // (The customer's proposal page shares the figures' grouping too; alone it was a tenth walk-through file.)
              name: 'job-kit',
              test: /[\\/](client[\\/]src[\\/](lib[\\/](unit-display|months|use-after-idle|grouped-number)|entities[\\/]job[\\/](labels|design-fields)|components[\\/](ui[\\/]empty-state|errors[\\/](query-)?widget-boundary))|calc[\\/]src[\\/](units|construction-defaults))\.tsx?$/,
            },
          ],
        },
      },
    },
  },
  server: { port: 5173, host: '127.0.0.1', proxy: { '/api': apiTarget } },
  test: {
    root: here('.'),
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'calc',
          root: here('.'),
          include: ['tests/calc/**/*.test.ts'],
          environment: 'node',
          // Property runs share two cores with the other projects under `npm test`: 5 s is too tight.
          testTimeout: 30_000,
        },
      },
      {
        plugins: [react()],
        resolve: { alias },
        test: {
          name: 'client',
          root: here('.'),
          include: ['tests/client/**/*.test.{ts,tsx}'],
          environment: 'happy-dom',
          setupFiles: ['tests/client/setup.ts'],
          // The walk-through's saves wait out a debounce and the queue; under `npm test` the client files share two
          // cores with the server and e2e projects, so a 5 s test budget and 2 s waits were too tight (3 of them
          // timed out at load 18). Waits now allow 5 s; a test may take 15 s.
          testTimeout: 15_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'server',
          root: here('.'),
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          execArgv: ['--import', 'tsx'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          root: here('.'),
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          execArgv: ['--import', 'tsx'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
