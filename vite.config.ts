import { defineConfig } from 'vite';

export default defineConfig({
  root: '.',
  base: './',
  build: { outDir: 'site', target: 'es2022' },
  worker: { format: 'es' },
  server: { host: '127.0.0.1' },
  preview: { host: '127.0.0.1' },
});
