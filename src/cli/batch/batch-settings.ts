import type { SurveyAnalysisSettings } from '../../core/report/analyse-survey';
import type { DigestParts } from './survey-digest';

/**
 * Everything a batch worker needs to turn a survey file into reports, parsed and checked
 * once on the main thread and sent to each worker as `workerData` (plain data only): the
 * per-survey analysis settings shared with `ringfall fit` (fit options without an abort
 * signal — a stopped batch terminates its workers —, specs, threshold levels), the import
 * options, and whether to keep the per-reading points.
 */
export interface BatchSettings extends SurveyAnalysisSettings {
  /** For importSurveys: units of headers that state none. */
  readonly import: { readonly fieldUnit?: string; readonly distanceUnit?: string };
  /**
   * Keep each fit's per-reading points (needed for HTML charts only). Without `--out` they
   * are dropped in the worker: the text and JSON reports do not show them, and they are
   * most of what would be copied between threads.
   */
  readonly keepPoints: boolean;
  /**
   * Send each survey back as a digest (survey-digest.ts: a summary row, the history's part,
   * and the texts named here: a spool line for the pages, the JSON text) instead of the
   * report object, so the main thread of a large batch only appends text to the spool.
   */
  readonly digest?: DigestParts;
  /**
   * `ringfall fit --json` on many files: each file as `fit` reports it (fitFileTexts in
   * fit-file.ts: its surveys' JSON texts, rejected rows, input record or problem) in
   * FileOutcome.fit, instead of batch's reports or digests.
   */
  readonly fitTexts?: boolean;
}
