import type { Spec } from '../../core/analysis/spec/spec';
import type { ThresholdLevel } from '../../core/analysis/thresholds/threshold-level';
import type { FitSurveyOptions } from '../../core/fit/fit-survey-options';
import type { ModelId } from '../../core/models';

/**
 * Everything a batch worker needs to turn a survey file into reports, parsed and checked
 * once on the main thread and sent to each worker as `workerData` (plain data only).
 */
export interface BatchSettings {
  /** For fitSurvey (no abort signal: a stopped batch terminates its workers). */
  readonly fit: Omit<FitSurveyOptions, 'signal'> & { readonly models: readonly ModelId[] };
  /** For importSurveys: units of headers that state none. */
  readonly import: { readonly fieldUnit?: string; readonly distanceUnit?: string };
  /** Parsed `--spec` file; empty when none. */
  readonly specs: readonly Spec[];
  /** `--threshold` levels; empty when none. */
  readonly thresholds: readonly ThresholdLevel[];
  /**
   * Keep each fit's per-reading points (needed for HTML charts only). Without `--out` they
   * are dropped in the worker: the text and JSON reports do not show them, and they are
   * most of what would be copied between threads.
   */
  readonly keepPoints: boolean;
}
