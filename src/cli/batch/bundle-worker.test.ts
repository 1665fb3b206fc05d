import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome } from './batch-types';
import { bundledWorkerSource } from './bundle-worker';
import { runWorkerPool } from './worker-pool';

const settings: BatchSettings = {
  fit: { models: ['loop', 'dipole', 'power-law'], fixed: {}, instrumentUncertainty: null, positionUncertainty: null, robust: null, seed: 1 },
  import: {}, specs: [], thresholds: [], keepPoints: false,
};
const files = readdirSync('sample-data').filter((f) => f.endsWith('.csv')).sort().map((f) => `sample-data/${f}`);

async function outcomes(entry: URL | { source: string }): Promise<FileOutcome[]> {
  const found: FileOutcome[] = [];
  const pool = runWorkerPool(files.map((path, index) => ({ index, path })), {
    workers: 2, chunkSize: 2, entry, workerData: settings, onOutcomes: (finished) => found.push(...finished),
  });
  await pool.done;
  return found.sort((a, b) => a.index - b.index);
}

describe('bundledWorkerSource()', () => {
  it('bundles the batch worker into one script whose reports equal the tsx-loaded worker\'s', async () => {
    // the same code two ways (common practice: a bundler must not change behaviour)
    const source = await bundledWorkerSource();
    expect(source).not.toBeNull();
    expect(source!).toContain('fitChunk');
    const bundled = await outcomes({ source: source! });
    const loaded = await outcomes(new URL('./batch-worker-entry.mjs', import.meta.url));
    expect(bundled.map((o) => o.reports.length)).toEqual(loaded.map((o) => o.reports.length));
    expect(bundled.reduce((n, o) => n + o.reports.length, 0)).toBeGreaterThan(files.length);
    expect(JSON.stringify(bundled)).toBe(JSON.stringify(loaded));
  }, 60_000);
});
