import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import type { FileOutcome } from './batch-types';
import { runWorkerPool } from './worker-pool';

// A stand-in worker in plain JavaScript: answers each chunk with one outcome per file
// (source = path), and ends its thread on a file whose path contains "crash", the way a
// native crash or an out-of-memory would.
const folder = mkdtempSync(join(tmpdir(), 'ringfall-pool-test-'));
const entry = pathToFileURL(join(folder, 'worker.mjs'));
writeFileSync(entry, `
import { parentPort, workerData } from 'node:worker_threads';
if (workerData === 'fail-to-start') throw new Error('cannot load');
parentPort.on('message', (request) => {
  if (request.files.some((file) => file.path.includes('crash'))) process.exit(3);
  parentPort.postMessage({ kind: 'done', chunk: request.chunk, outcomes: request.files.map((file) => ({ index: file.index, source: file.path, reports: [], unreadable: [] })) });
});
parentPort.postMessage({ kind: 'ready' });
// each worker thread says where it started, so a test can count the threads
if (workerData === 'count') writeFileSync(new URL('./started-' + threadId, import.meta.url), '');
`.replace("import { parentPort, workerData } from 'node:worker_threads';", "import { parentPort, workerData, threadId } from 'node:worker_threads';\nimport { writeFileSync } from 'node:fs';"));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

async function run(paths: readonly string[], workers: number, workerData: unknown = null): Promise<FileOutcome[]> {
  const outcomes: FileOutcome[] = [];
  const pool = runWorkerPool(paths.map((path, index) => ({ index, path })), {
    workers, chunkSize: 3, entry, workerData, onOutcomes: (finished) => outcomes.push(...finished),
  });
  await pool.done;
  return outcomes.sort((a, b) => a.index - b.index);
}

describe('runWorkerPool()', () => {
  it('runWorkerPool() gives every file exactly one outcome whatever the number of workers', async () => {
    const paths = Array.from({ length: 20 }, (_, i) => `f${i}.csv`);
    for (const workers of [1, 3]) {
      expect((await run(paths, workers)).map((o) => o.source)).toEqual(paths);
    }
  });

  it('runWorkerPool() retries the chunk of a worker that died one file at a time, so only the file that kills a worker is lost, with BATCH_WORKER_STOPPED', async () => {
    const paths = ['a.csv', 'b.csv', 'crash.csv', 'd.csv', 'e.csv', 'f.csv', 'g.csv'];
    const outcomes = await run(paths, 2);
    expect(outcomes.map((o) => o.source)).toEqual(paths);
    const lost = outcomes.filter((o) => o.unreadable.length > 0);
    expect(lost.map((o) => o.source)).toEqual(['crash.csv']);
    expect(lost[0]!.unreadable[0]).toMatchObject({ code: 'BATCH_WORKER_STOPPED' });
    expect(lost[0]!.unreadable[0]!.reason).toContain('exited with status 3');
  });

  it('runWorkerPool() gives a worker no more files while holdBack keeps it waiting, and finishes every file once it is released', async () => {
    const outcomes: FileOutcome[] = [];
    let release: () => void = () => undefined;
    let held = true;
    const gate = new Promise<void>((resolve) => { release = resolve; });
    const pool = runWorkerPool(Array.from({ length: 60 }, (_, index) => ({ index, path: `f${index}.csv` })), {
      workers: 2, chunkSize: 3, entry, workerData: null,
      onOutcomes: (finished) => outcomes.push(...finished),
      holdBack: () => (held ? gate : null),
    });
    // long enough for unpaused workers to answer all 20 chunks many times over
    await new Promise((resolve) => setTimeout(resolve, 300));
    const whileHeld = outcomes.length;
    // each worker finishes only the chunks it was given before its first answer: at most 2 workers x 2 in flight x 3 files
    expect(whileHeld).toBeGreaterThan(0);
    expect(whileHeld).toBeLessThanOrEqual(12);
    held = false;
    release();
    await pool.done;
    expect(outcomes.map((o) => o.index).sort((a, b) => a - b)).toEqual(Array.from({ length: 60 }, (_, i) => i));
  });

  it('runWorkerPool() rejects when a worker dies before it is ready, rather than starting workers without end', async () => {
    await expect(run(['a.csv'], 2, 'fail-to-start')).rejects.toThrow('A batch worker could not start: cannot load');
  });

  it('runWorkerPool() stop() settles at once and gives no outcome for unfinished files', async () => {
    const outcomes: FileOutcome[] = [];
    const pool = runWorkerPool(Array.from({ length: 50 }, (_, index) => ({ index, path: `f${index}.csv` })), {
      workers: 1, chunkSize: 1, entry, workerData: null, onOutcomes: (finished) => outcomes.push(...finished),
    });
    await pool.stop();
    await expect(pool.done).resolves.toBeUndefined();
    expect(outcomes.length).toBeLessThan(50);
  });

  it('runWorkerPool() replaces a worker that has fitted its share of files with a fresh one, and still gives every file one outcome', async () => {
    const paths = Array.from({ length: 20 }, (_, i) => `r${i}.csv`);
    const outcomes: FileOutcome[] = [];
    const pool = runWorkerPool(paths.map((path, index) => ({ index, path })), {
      workers: 1, chunkSize: 3, entry, workerData: 'count', filesPerWorker: 6, onOutcomes: (finished) => outcomes.push(...finished),
    });
    await pool.done;
    expect(outcomes.map((o) => o.source).sort()).toEqual([...paths].sort());
    expect(outcomes.every((o) => o.unreadable.length === 0)).toBe(true);
    // 20 files, 6 per worker: four threads one after another
    expect(readdirSync(folder).filter((name) => name.startsWith('started-'))).toHaveLength(4);
  });
});
