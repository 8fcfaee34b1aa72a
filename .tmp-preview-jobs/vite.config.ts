import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vite';
const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));
export default defineConfig({
  root: here('.'),
  plugins: [react(), tailwindcss()],
  resolve: { alias: { '@calc': here('../calc/index.ts') } },
  server: { port: 5391, host: '127.0.0.1', strictPort: true, fs: { allow: [here('..')] } },
});
