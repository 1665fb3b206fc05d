import type { FileOutcome, FileTask } from './batch-types';

/**
 * The outcome of a file that broke the batch machinery rather than failing on its
 * content (a bug, or a worker that died while fitting it): no reports, one unreadable
 * entry saying what happened and how to look closer.
 */
export function failedOutcome(file: FileTask, code: 'BATCH_WORKER_STOPPED' | 'BATCH_INTERNAL_ERROR' | 'BATCH_FILE_TIMEOUT', what: string): FileOutcome {
  return {
    index: file.index,
    source: file.path,
    reports: [],
    unreadable: [{
      source: file.path,
      code,
      // a file past the time limit is not a defect: it says what to do itself
      reason: code === 'BATCH_FILE_TIMEOUT' ? `Batch: ${what}.` : `Batch: ${what}. Fit it on its own with "ringfall fit ${file.path} --debug" and report the problem with the file.`,
    }],
  };
}
