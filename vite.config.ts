import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';
import { defineConfig } from 'vitest/config';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));
const alias = { '@calc': here('./calc/index.ts'), '@contract': here('./server/src/contract/index.ts') };
const apiTarget = `http://127.0.0.1:${process.env.PORT ?? '4780'}`;

// One file for the client build, the dev server and the test projects.
export default defineConfig({
  root: here('./client'),
  plugins: [
    react(),
    tailwindcss(),
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
    },
  },
  server: { port: 5173, host: '127.0.0.1', proxy: { '/api': apiTarget } },
  test: {
    root: here('.'),
    projects: [
      {
        resolve: { alias },
        test: { name: 'calc', root: here('.'), include: ['tests/calc/**/*.test.ts'], environment: 'node' },
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
