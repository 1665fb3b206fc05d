/**
 * Data that crosses between the batch's main thread and its worker threads. Everything
 * here is plain data (structured-clonable): no functions, no class instances.
 */
import type { SurveyReport } from '../../core/report/report';
import type { SurveyDigest } from './survey-digest';
import type { ProblemCode } from '../../core/error-codes';
import type { FitFileTexts } from '../fit-file';
import type { RunInput } from '../../core/report/run-record';

/** One survey file to fit: its place in the sorted file list and its path as found. */
export interface FileTask {
  readonly index: number;
  readonly path: string;
}

/** A file, or a part of one, that gave no fitted survey, and why (CONTRACT.md fleet.unreadable). */
export interface UnreadableEntry {
  readonly source: string;
  readonly reason: string;
  /** Stable code for programs (error-codes.ts): the RingfallError code (IMPORT_…, FIT_…), a ROW_… code, or a BATCH_… / SURVEY_… code of the batch. */
  readonly code: ProblemCode;
}

/** What became of one file: its survey reports in file order, and everything that could not be used. */
export interface FileOutcome {
  readonly index: number;
  readonly source: string;
  readonly reports: readonly SurveyReport[];
  /** With BatchSettings.digest: the surveys as digests instead of `reports` (which is then empty). */
  readonly digests?: readonly SurveyDigest[];
  /** The file itself when it could not be read at all, or its coil/date groups that could not be fitted. */
  readonly unreadable: readonly UnreadableEntry[];
  /** With BatchSettings.fitTexts: the file as `fit --json` reports it (`reports` and `unreadable` are then empty). */
  readonly fit?: FitFileTexts;
  /** With BatchSettings.digest: the file's run-record entry (SHA-256 and size of the bytes fitted), when it could be read. */
  readonly input?: RunInput;
}

/** Main thread → worker: fit these files and answer with one `ChunkDone`. */
export interface ChunkRequest {
  readonly kind: 'chunk';
  readonly chunk: number;
  readonly files: readonly FileTask[];
}

/** Worker → main thread. `ready` once the worker has loaded its modules. */
export type WorkerMessage =
  | { readonly kind: 'ready' }
  | { readonly kind: 'done'; readonly chunk: number; readonly outcomes: readonly FileOutcome[] };
