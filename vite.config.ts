import { defineConfig } from 'vite';

export default defineConfig({
  root: '.',
  base: './',
  build: { outDir: 'dist', target: 'es2022' },
  worker: { format: 'es' },
  server: { host: '127.0.0.1' },
  preview: { host: '127.0.0.1' },
});
