import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));
const alias = { '@calc': here('./calc/index.ts'), '@contract': here('./server/src/contract/index.ts') };
const apiTarget = `http://127.0.0.1:${process.env.PORT ?? '4780'}`;

// One file for the client build, the dev server and the test projects.
export default defineConfig({
  root: here('./client'),
  plugins: [react(), tailwindcss()],
  // convert-units (used by calc) reads Node's `global`; the browser has globalThis.
  define: { global: 'globalThis' },
  resolve: { alias },
  build: { outDir: here('./dist/client'), emptyOutDir: true, sourcemap: true },
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
