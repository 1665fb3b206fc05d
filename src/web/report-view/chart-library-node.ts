import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

/**
 * The Chart.js UMD bundle's source text, read from the installed chart.js package, for
 * `renderReportDocument` in Node (CLI `--html`). chart.js does not export the UMD file
 * in its package map, so it is found next to the package's main entry.
 */
export function chartLibrarySource(): string {
  const main = createRequire(import.meta.url).resolve('chart.js');
  return readFileSync(join(dirname(main), 'chart.umd.js'), 'utf8');
}
