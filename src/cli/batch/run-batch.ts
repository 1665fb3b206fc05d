import type { StopSignals } from '../stop-signals';
import { fleetHistory } from '../../core/analysis/fleet/fleet-history';
import type { Report } from '../../core/report/report';
import { createBatchProgress, type ProgressStream } from './batch-progress';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome } from './batch-types';
import { batchWorkerEntry } from '../package-files';
import { runWorkerPool } from './worker-pool';

/** How a batch runs (not what it computes: that is BatchSettings). */
export interface BatchRunOptions {
  readonly workers: number;
  /** Where progress goes (stderr). */
  readonly progress: ProgressStream;
  /** Seconds between plain progress lines when `progress` is not a terminal. */
  readonly progressInterval?: number;
  /** Stop requests (SIGINT, SIGTERM; stop-signals.ts): the first terminates the workers and the result covers the files done. */
  readonly stop?: Pick<StopSignals, 'onStop'>;
  /** Seconds one file may take before it is left out with BATCH_FILE_TIMEOUT (worker-pool.ts). */
  readonly fileTimeLimit?: number;
  /** Backpressure from the consumer of the outcomes (WorkerPoolOptions.holdBack). */
  readonly holdBack?: () => Promise<unknown> | null;
}

/** A finished (or stopped) batch: the Report with its fleet section, and how far it got. */
export interface BatchResult {
  readonly report: Report;
  readonly filesDone: number;
  readonly filesTotal: number;
  /** True when Ctrl-C stopped the run; the report then covers the files done only. */
  readonly interrupted: boolean;
}

/** Chunks per worker aimed at: enough to balance uneven files, few enough to keep messages rare. */
const chunksPerWorker = 8;
/** Largest chunk: keeps progress moving and a crashed worker's retry small. */
const largestChunk = 32;

/**
 * Fit every file on `workers` worker threads (worker-pool.ts) with progress on stderr,
 * then assemble the Report: surveys ordered by file (the sorted list) then by their order
 * in the file — never by which worker finished first — and the fleet section
 * (fleetHistory: coils by first appearance in that order, trends and flags, unreadable
 * files). So the report is the same byte for byte whatever the number of workers. Ctrl-C
 * or SIGTERM (options.stop) terminates the workers and returns what was finished, marked
 * interrupted; a second signal ends the process at once.
 */
export async function runBatch(files: readonly string[], settings: BatchSettings, options: BatchRunOptions): Promise<BatchResult> {
  const outcomes: (FileOutcome | undefined)[] = new Array(files.length);
  const result = await runBatchInOrder(files, settings, options, (outcome) => { outcomes[outcome.index] = outcome; });
  return { ...result, report: assembleReport(outcomes, settings) };
}

/**
 * runBatch without keeping the outcomes: each file's outcome is handed to `onOutcome` in
 * file order (the sorted list) as soon as every file before it is done, whatever worker
 * finished first, so what a consumer writes is the same byte for byte with any number of
 * workers. A stopped run hands over the files it finished, still in file order.
 */
export async function runBatchInOrder(
  files: readonly string[], settings: BatchSettings, options: BatchRunOptions, onOutcome: (outcome: FileOutcome) => void,
): Promise<Omit<BatchResult, 'report'>> {
  const waiting = new Map<number, FileOutcome>();
  let next = 0;
  const deliver = (outcome: FileOutcome) => {
    waiting.set(outcome.index, outcome);
    for (let ready = waiting.get(next); ready !== undefined; ready = waiting.get(next)) {
      waiting.delete(next);
      next += 1;
      onOutcome(ready);
    }
  };
  const workers = Math.max(1, Math.min(options.workers, files.length));
  const chunkSize = Math.max(1, Math.min(largestChunk, Math.ceil(files.length / (workers * chunksPerWorker))));
  const progress = createBatchProgress(options.progress, files.length, workers, options.progressInterval === undefined ? {} : { intervalSeconds: options.progressInterval });
  let done = 0;
  const run = runWorkerPool(files.map((path, index) => ({ index, path })), {
    workers,
    chunkSize,
    ...(options.fileTimeLimit === undefined ? {} : { fileTimeLimit: options.fileTimeLimit }),
    ...(options.holdBack === undefined ? {} : { holdBack: options.holdBack }),
    entry: batchWorkerEntry(),
    workerData: settings,
    onOutcomes: (finished) => {
      for (const outcome of finished) deliver(outcome);
      done += finished.length;
      progress.update(done);
    },
  });
  let interrupted = false;
  options.stop?.onStop(() => {
    interrupted = true;
    void run.stop();
  });
  await run.done;
  // a stopped run leaves gaps: what was finished after a gap follows, still in file order
  for (const index of [...waiting.keys()].sort((a, b) => a - b)) onOutcome(waiting.get(index)!);
  progress.finish(done, interrupted);
  return { filesDone: done, filesTotal: files.length, interrupted };
}

/** The Report from outcomes indexed by file: surveys in file order, then the fleet section. */
export function assembleReport(outcomes: readonly (FileOutcome | undefined)[], settings: BatchSettings): Report {
  const finished = outcomes.filter((outcome): outcome is FileOutcome => outcome !== undefined);
  const surveys = finished.flatMap((outcome) => outcome.reports);
  const unreadable = finished.flatMap((outcome) => outcome.unreadable);
  const fleet = fleetHistory(
    surveys.map((s) => ({ source: s.source, coil: s.coil, date: s.date, fits: s.fits, verdict: s.verdict, ...(s.units ? { units: s.units } : {}) })),
    { specs: settings.specs, unreadable },
  );
  return { surveys, fleet };
}
