import { parentPort, workerData } from 'node:worker_threads';
import type { BatchSettings } from './batch-settings';
import type { ChunkRequest, FileOutcome, FileTask, WorkerMessage } from './batch-types';
import { failedOutcome } from './failed-outcome';
import { fitSurveyFile } from './fit-survey-file';
import { fitFileTexts } from '../fit-file';
import { flushThreadSpools } from './worker-spool';

/**
 * Fit one chunk of files in a worker: each file's outcome, in the order given. A bug
 * thrown while fitting one file (not a RingfallError, which fitSurveyFile reports itself)
 * becomes that file's unreadable entry, so one file cannot stop the batch.
 */
export function fitChunk(files: readonly FileTask[], settings: BatchSettings): FileOutcome[] {
  return files.map((file) => {
    try {
      if (settings.fitTexts === true) return { index: file.index, source: file.path, reports: [], unreadable: [], fit: fitFileTexts(file.path, settings.import, settings) };
      return fitSurveyFile(file, settings);
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      return failedOutcome(file, 'BATCH_INTERNAL_ERROR', `internal error while fitting this file (${message})`);
    }
  });
}

if (parentPort !== null) {
  const port = parentPort;
  const settings = workerData as BatchSettings;
  port.on('message', (request: ChunkRequest) => {
    const message: WorkerMessage = { kind: 'done', chunk: request.chunk, outcomes: fitChunk(request.files, settings) };
    // the places sent are readable once the spool is written
    flushThreadSpools();
    port.postMessage(message);
  });
  port.postMessage({ kind: 'ready' } satisfies WorkerMessage);
}
