import { defineConfig, type Plugin } from 'vite';
import { chartLibraryPath, chartLibrarySpecifier } from './src/cli/chart-library.ts';

/**
 * The page's `import('chart.js/dist/chart.umd.js?raw')` (downloads.ts): chart.js does not
 * export its UMD bundle, so the name is resolved here to the installed file, query kept.
 * A plugin rather than an alias: an aliased path into node_modules would be pre-bundled
 * by the dependency optimiser as a module instead of read as text.
 */
function chartLibraryByName(): Plugin {
  return {
    name: 'ringfall-chart-library',
    enforce: 'pre',
    resolveId: (id) => (id.startsWith(`${chartLibrarySpecifier}?`) ? chartLibraryPath() + id.slice(chartLibrarySpecifier.length) : null),
  };
}

export default defineConfig({
  root: '.',
  base: './',
  build: { outDir: 'site', target: 'es2022' },
  worker: { format: 'es' },
  plugins: [chartLibraryByName()],
  server: { host: '127.0.0.1' },
  preview: { host: '127.0.0.1' },
});
