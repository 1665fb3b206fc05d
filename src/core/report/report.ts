import type { FitResult } from '../fit/fit-result';
import type { ModelId } from '../models/field-model';
import type { ReadingType, RejectedRow, SurveyUnits } from '../survey/survey';
import type { CheckStatus } from '../analysis/decide-conformity';
import type { FleetCoil, FleetEntry } from '../analysis/fleet/coil-history';
import type { FleetSummary } from '../analysis/fleet/fleet-history';
import type { SpecCheck } from '../analysis/spec/spec-check';
import type { SpecUse } from '../analysis/spec/spec-use';
import type { Verdict } from '../analysis/spec/verify-spec';
import type { ThresholdResult } from '../analysis/thresholds/threshold-distances';
import type { SetAsideRow } from './set-aside-rows';
import type { RunRecord } from './run-record';

// The analyses' results live with the modules that compute them; the report assembles them.
export type { CheckStatus, FleetCoil, FleetEntry, FleetSummary, SpecCheck, SpecUse, Verdict, ThresholdResult };

/**
 * The Report: everything a view shows, computed once in core. Views (CLI text, JSON,
 * HTML, web page) render it and never recompute physics. All values SI.
 * `toJsonReport` (core/report) maps it onto the CONTRACT.md JSON schema.
 */
export interface SurveyReport {
  readonly source: string;
  readonly coil: string | null;
  readonly date: string | null;
  readonly readingType: ReadingType | null;
  /**
   * The units the survey's file was written in; human-facing views show its fields and
   * lengths in them (surveyUnits). Absent when not known: views choose units from the values.
   */
  readonly units?: SurveyUnits;
  readonly readings: { readonly total: number; readonly used: number; readonly rejected: readonly RejectedRow[] };
  readonly fits: readonly FitResult[];
  /** Best model by AICc among converged fits, or null if none converged. */
  readonly best: ModelId | null;
  /** One sentence per power law on what it gets wrong (issue: model comparison). */
  readonly comparison: readonly string[];
  /** Spec verdict (analyses), or null when no spec applies. */
  readonly verdict: Verdict | null;
  /**
   * Which spec was checked, when spec files were given: the one that applied, or why none
   * did (a spec for another coil is never ignored silently). Null or absent: no spec given.
   */
  readonly spec?: SpecUse | null;
  readonly thresholds: readonly ThresholdResult[];
  readonly warnings: readonly string[];
  /** Cautions to show with thresholds and exposure (DOMAIN §4.5). */
  readonly cautions: readonly string[];
  /** Importer notes (units read, sign flipped, …). */
  readonly notes: readonly string[];
  /** 'position' for a scan (Survey.axis): readings at signed ruler positions, the coil's `centre` fitted. Absent otherwise. */
  readonly axis?: 'position';
}

export interface Report {
  readonly surveys: readonly SurveyReport[];
  readonly fleet?: FleetSummary;
  /**
   * Rows of the files read that belong to no survey (bad date or reading type, commented
   * out, unclosed quote, …), each with its file, line, code and reason (CONTRACT.md
   * `rejected`). Rows of a survey are in its `readings.rejected` instead.
   */
  readonly rejected?: readonly SetAsideRow[];
  /** How the report was made (version, time, input files and their SHA-256, settings); CONTRACT.md `run`. */
  readonly run?: RunRecord;
  /** Files a folder's skip list left out of the search, one entry per list (CONTRACT.md `skipped`). */
  readonly skipped?: readonly SkippedFiles[];
}

/** What one folder's skip list (`.ringfall-skip`) left out of a search. */
export interface SkippedFiles {
  /** The list file, as the search reached it. */
  readonly list: string;
  readonly patterns: readonly string[];
  /** The survey files left out. */
  readonly files: readonly string[];
}
