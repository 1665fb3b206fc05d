import { Worker } from 'node:worker_threads';
import type { ChunkRequest, FileOutcome, FileTask, WorkerMessage } from './batch-types';
import { failedOutcome } from './failed-outcome';

/** How a {@link runWorkerPool} run is set up. */
export interface WorkerPoolOptions {
  /** Worker threads to start (at least 1). */
  readonly workers: number;
  /** Files per message sent to a worker. */
  readonly chunkSize: number;
  /**
   * The worker's entry file (package-files.ts): the built dist/batch-worker.js, or from
   * the sources an .mjs that registers tsx, then loads the worker.
   */
  readonly entry: URL;
  /** Passed to every worker once, as `workerData` (the batch settings). */
  readonly workerData: unknown;
  /** Called with each finished chunk's outcomes, in the order chunks finish. */
  readonly onOutcomes: (outcomes: readonly FileOutcome[]) => void;
  /**
   * Seconds one file may take (a chunk gets this times its files); past it the worker is
   * ended, the chunk's files retried one by one, and a file that runs past it alone gets
   * the outcome BATCH_FILE_TIMEOUT. Default: no limit.
   */
  readonly fileTimeLimit?: number;
  /** Files one worker fits before a fresh one replaces it (default defaultFilesPerWorker). */
  readonly filesPerWorker?: number;
  /**
   * Asked after each chunk's outcomes are handed over: a promise to wait for before the
   * worker is given more files (e.g. until the consumer has written what it holds), or null
   * to go on. Without it a consumer slower than the workers (a slow reader of stdout) would
   * hold finished outcomes in memory without bound.
   */
  readonly holdBack?: () => Promise<unknown> | null;
}

/** A running pool: `done` settles when every file has an outcome or the pool was stopped. */
export interface WorkerPoolRun {
  readonly done: Promise<void>;
  /** Terminate every worker now; files not finished get no outcome. */
  stop(): Promise<void>;
}

/**
 * Old-generation heap of a worker, MB: V8 otherwise lets a long-lived worker's heap grow
 * far past what it holds (measured: a third of batch's RSS growth over 10,000 files); a
 * survey of 10^5 readings fitted with every model stays well inside it.
 */
const workerHeapMb = 256;

/**
 * Files one worker fits before it is replaced by a fresh one, a safety net against a heap
 * that grows however little it keeps. Rarely: a fresh worker loads the code again and runs
 * it slowly until V8 has optimised it (measured, 30-reading surveys: 1.8 ms CPU a file over
 * the first 1,000, 1.0 over the next, 0.7 from the third thousand on), and a worker that
 * sends only places (survey-digest.ts) keeps its heap flat (measured: 69 MB in all from
 * 4,000 to 8,000 files).
 */
const defaultFilesPerWorker = 20_000;

/** Chunks kept in flight per worker, so a worker never waits for the next message. */
const inFlightPerWorker = 2;

/**
 * Fit files on worker threads: the files are cut into chunks of `chunkSize` (one message
 * per chunk, the worker reads each file itself), each worker keeps two chunks in flight.
 * When a worker dies (a crash, not a RingfallError, which the worker reports as an
 * outcome), its unfinished chunks are retried one file per chunk on a fresh worker; a
 * file that kills a worker on its own gets an outcome saying so, as does one that runs past
 * `fileTimeLimit` on its own (the worker is ended and replaced). The order outcomes
 * arrive in depends on timing; callers order them by `index`.
 *
 * @throws (through `done`) when a worker dies before it has loaded: nothing could run.
 */
export function runWorkerPool(tasks: readonly FileTask[], options: WorkerPoolOptions): WorkerPoolRun {
  const queue: { files: FileTask[]; retry: boolean }[] = [];
  for (let start = 0; start < tasks.length; start += options.chunkSize) {
    queue.push({ files: tasks.slice(start, start + options.chunkSize), retry: false });
  }
  const workers = new Set<Worker>();
  let nextChunk = 0;
  let pending = tasks.length;
  let stopped = false;
  let settle: { resolve: () => void; reject: (error: Error) => void } | null = null;
  const done = new Promise<void>((resolve, reject) => {
    settle = { resolve, reject };
  });
  const finish = (error?: Error) => {
    if (settle === null) return;
    const { resolve, reject } = settle;
    settle = null;
    void Promise.all([...workers].map((w) => w.terminate())).then(() => (error ? reject(error) : resolve()));
  };

  const limitMs = options.fileTimeLimit === undefined ? null : options.fileTimeLimit * 1000;
  const filesPerWorker = options.filesPerWorker ?? defaultFilesPerWorker;
  const start = () => {
    const worker = new Worker(options.entry, { workerData: options.workerData, resourceLimits: { maxOldGenerationSizeMb: workerHeapMb } });
    const inFlight = new Map<number, { files: FileTask[]; retry: boolean }>();
    let ready = false;
    // the chunk the worker is on (the oldest in flight) and since when, once the worker has loaded
    let since = performance.now();
    let timedOut = false;
    // files given to this worker; past filesPerWorker it takes no more and is replaced once idle
    let given = 0;
    let retiring = false;
    workers.add(worker);
    // set when the worker has exited: a feed delayed by holdBack must give it nothing
    let exited = false;
    const feed = () => {
      while (!stopped && !exited && inFlight.size < inFlightPerWorker && queue.length > 0 && given < filesPerWorker) {
        const chunk = queue.shift()!;
        given += chunk.files.length;
        const id = nextChunk++;
        if (inFlight.size === 0) since = performance.now();
        inFlight.set(id, chunk);
        const request: ChunkRequest = { kind: 'chunk', chunk: id, files: chunk.files };
        worker.postMessage(request);
      }
    };
    const watch = limitMs === null ? null : setInterval(() => {
      const current = inFlight.values().next().value;
      if (!ready || current === undefined || timedOut) return;
      if (performance.now() - since > limitMs * current.files.length) {
        timedOut = true;
        void worker.terminate();
      }
    }, Math.max(20, Math.min(1000, limitMs / 4)));
    watch?.unref();
    worker.on('message', (message: WorkerMessage) => {
      if (message.kind === 'ready') {
        ready = true;
        since = performance.now();
        return;
      }
      inFlight.delete(message.chunk);
      since = performance.now();
      pending -= message.outcomes.length;
      options.onOutcomes(message.outcomes);
      if (pending === 0) finish();
      else if (given >= filesPerWorker && inFlight.size === 0) {
        // a fresh worker starts with a small heap; this one has done its share
        retiring = true;
        void worker.terminate();
      } else {
        const wait = options.holdBack?.() ?? null;
        if (wait === null) feed();
        else void wait.then(feed, feed);
      }
    });
    let failure: Error | null = null;
    worker.on('error', (error) => {
      failure = error;
    });
    worker.on('exit', (code) => {
      exited = true;
      if (watch !== null) clearInterval(watch);
      workers.delete(worker);
      if (stopped || settle === null) return;
      if (retiring && inFlight.size === 0) {
        // a fresh worker only while there is work left for it; a later crash starts its own
        if (queue.length > 0) start();
        return;
      }
      const reason = failure?.message ?? `it exited with status ${code}`;
      if (!ready) {
        finish(new Error(`A batch worker could not start: ${reason}`));
        return;
      }
      const lost: FileOutcome[] = [];
      // the chunk the worker was on is the one that stopped it; the others never started
      let first = true;
      for (const chunk of inFlight.values()) {
        if (!first) {
          queue.unshift(chunk);
        } else if (chunk.retry) {
          lost.push(...chunk.files.map((file) => (timedOut
            ? failedOutcome(file, 'BATCH_FILE_TIMEOUT', `fitting this file took longer than ${options.fileTimeLimit} s, so it was stopped and the batch went on. Fit it alone with a longer limit (--file-time-limit) or fewer models to see why`)
            : failedOutcome(file, 'BATCH_WORKER_STOPPED', `the worker fitting this file stopped (${reason})`))));
        } else {
          queue.unshift(...chunk.files.map((file) => ({ files: [file], retry: true })));
        }
        first = false;
      }
      if (lost.length > 0) {
        pending -= lost.length;
        options.onOutcomes(lost);
      }
      if (pending === 0) finish();
      else start();
    });
    feed();
  };

  const count = Math.max(1, Math.min(options.workers, queue.length));
  if (tasks.length === 0) finish();
  else for (let i = 0; i < count; i++) start();
  return {
    done,
    stop: async () => {
      stopped = true;
      finish();
      await done.catch(() => undefined);
    },
  };
}
