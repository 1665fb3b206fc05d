import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

/**
 * The import specifier of the Chart.js UMD bundle (chart.umd.js, which defines the global
 * `Chart`). chart.js does not export that file in its package map, so Node and Vite refuse
 * the subpath; `chartLibraryPath` finds it, and vite.config.ts and
 * scripts/build-single-file.ts map this specifier to that path for the page's `?raw` import.
 */
export const chartLibrarySpecifier = 'chart.js/dist/chart.umd.js';

/** Where the installed chart.js package keeps its UMD bundle: next to the package's main entry. */
export function chartLibraryPath(): string {
  return join(dirname(createRequire(import.meta.url).resolve('chart.js')), 'chart.umd.js');
}

/**
 * The Chart.js UMD bundle's source text, read from the installed chart.js package, for
 * `renderReportDocument` (src/render) in the CLI (`fit --html`, `batch --out`).
 */
export function chartLibrarySource(): string {
  return readFileSync(chartLibraryPath(), 'utf8');
}
