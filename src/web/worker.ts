/// <reference lib="webworker" />
/**
 * The Web Worker: parses and fits off the page's thread so the page stays responsive.
 * Receives a RunRequest, posts progress (throttled to one message per 50 ms) and the
 * outcome, or `failed` with the message of an unexpected error.
 */
import { packReport } from './packed-report';
import { runPipeline } from './pipeline';
import type { RunRequest, WorkerMessage } from './worker-protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (message: WorkerMessage) => scope.postMessage(message);

scope.addEventListener('message', (event: MessageEvent<RunRequest>) => {
  const request = event.data;
  if (request.type !== 'run') return;
  const started = performance.now();
  let lastProgress = 0;
  try {
    const outcome = runPipeline(request.files, request.settings, (progress) => {
      const now = performance.now();
      if (now - lastProgress < 50 && progress.done !== 0) return;
      lastProgress = now;
      post({ type: 'progress', job: request.job, progress });
    });
    const { message, transfer } = packReport(outcome.report);
    const result: WorkerMessage = { type: 'result', job: request.job, files: outcome.files, report: message, settingErrors: outcome.settingErrors, elapsedMs: performance.now() - started };
    scope.postMessage(result, transfer);
  } catch (error) {
    post({ type: 'failed', job: request.job, message: error instanceof Error ? `${error.name}: ${error.message}` : String(error) });
  }
});
