import type { FitSettings } from './fit-settings';
import type { PipelineFile, PipelineOutcome, PipelineProgress } from './pipeline';
import { unpackReport } from './packed-report';
import type { RunRequest, WorkerMessage } from './worker-protocol';

declare global {
  /**
   * The fitting worker as one classic script, set only in the single-file page
   * (scripts/build-single-file.ts): opened from file://, Chromium refuses module workers
   * and worker files, so that page starts the worker from a blob: URL of this text.
   */
  var ringfallFitWorkerSource: string | undefined;
}

let inlinedWorkerUrl: string | null = null;

/** A new fitting worker: the module worker Vite bundles, or the inlined one in the single-file page. */
function startFitWorker(): Worker {
  const source = globalThis.ringfallFitWorkerSource;
  if (source === undefined) return new Worker(new URL('./worker.ts', import.meta.url), { type: 'module', name: 'ringfall-fit' });
  inlinedWorkerUrl ??= URL.createObjectURL(new Blob([source], { type: 'text/javascript' }));
  return new Worker(inlinedWorkerUrl, { name: 'ringfall-fit' });
}

/**
 * Runs the pipeline in a Web Worker. A new run supersedes the one in flight: the busy
 * worker is terminated (the only way to stop a synchronous fit) and a fresh one started,
 * so the page never waits for work nobody wants any more.
 */
export class PipelineWorker {
  private worker: Worker | null = null;
  private job = 0;
  private busy = false;
  private pending: { reject: (error: Error) => void } | null = null;

  /** Run and resolve with the outcome; rejects with `superseded` when a newer run starts. */
  run(files: readonly PipelineFile[], settings: FitSettings, onProgress: (progress: PipelineProgress) => void): Promise<{ outcome: PipelineOutcome; elapsedMs: number }> {
    if (this.busy && this.worker) {
      this.worker.terminate();
      this.worker = null;
      this.pending?.reject(new Error('superseded'));
    }
    const worker = this.worker ?? startFitWorker();
    this.worker = worker;
    const job = ++this.job;
    this.busy = true;
    return new Promise((resolve, reject) => {
      this.pending = { reject };
      const finish = () => {
        worker.removeEventListener('message', listener);
        worker.removeEventListener('error', onError);
        if (this.job === job) { this.busy = false; this.pending = null; }
      };
      const listener = (event: MessageEvent<WorkerMessage>) => {
        const message = event.data;
        if (message.job !== job) return;
        if (message.type === 'progress') onProgress(message.progress);
        else if (message.type === 'result') {
          finish();
          const outcome: PipelineOutcome = { files: message.files, report: unpackReport(message.report), settingErrors: message.settingErrors };
          resolve({ outcome, elapsedMs: message.elapsedMs });
        }
        else { finish(); reject(new Error(message.message)); }
      };
      const onError = (event: ErrorEvent) => { finish(); reject(new Error(`The worker failed: ${event.message}`)); };
      worker.addEventListener('message', listener);
      worker.addEventListener('error', onError);
      const request: RunRequest = { type: 'run', job, files, settings };
      worker.postMessage(request);
    });
  }
}
