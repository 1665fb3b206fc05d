import type { FileOutcome, FileTask } from './batch-types';

/**
 * The outcome of a file that broke the batch machinery rather than failing on its
 * content (a bug, or a worker that died while fitting it): no reports, one unreadable
 * entry saying what happened and how to look closer.
 */
export function failedOutcome(file: FileTask, code: 'BATCH_WORKER_STOPPED' | 'BATCH_INTERNAL_ERROR', what: string): FileOutcome {
  return {
    index: file.index,
    source: file.path,
    reports: [],
    unreadable: [{
      source: file.path,
      code,
      reason: `Batch: ${what}. Fit it on its own with "ringfall fit ${file.path} --debug" and report the problem with the file.`,
    }],
  };
}
