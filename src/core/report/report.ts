import type { FitResult } from '../fit/fit-result';
import type { ModelId } from '../models/field-model';
import type { ReadingType, RejectedRow } from '../survey/survey';

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
  readonly readings: { readonly total: number; readonly used: number; readonly rejected: readonly RejectedRow[] };
  readonly fits: readonly FitResult[];
  /** Best model by AICc among converged fits, or null if none converged. */
  readonly best: ModelId | null;
  /** One sentence per power law on what it gets wrong (issue: model comparison). */
  readonly comparison: readonly string[];
  /** Spec verdict (analyses), or null when no spec applies. */
  readonly verdict: Verdict | null;
  readonly thresholds: readonly ThresholdResult[];
  readonly warnings: readonly string[];
  /** Cautions to show with thresholds and exposure (DOMAIN §4.5). */
  readonly cautions: readonly string[];
  /** Importer notes (units read, sign flipped, …). */
  readonly notes: readonly string[];
}

export type CheckStatus = 'pass' | 'fail' | 'inconclusive';

export interface SpecCheck {
  /** What was checked: "ampereTurns", "radius", "field at 0 mm". */
  readonly what: string;
  readonly status: CheckStatus;
  readonly expected: { readonly value: number; readonly unit: string };
  readonly measured: { readonly value: number; readonly unit: string; readonly ci95: readonly [number, number] | null };
  readonly tolerance: { readonly relative: number; readonly absolute: number };
  /** One sentence of evidence, with numbers and units. */
  readonly evidence: string;
}

export interface Verdict {
  readonly status: CheckStatus;
  readonly findings: readonly string[];
  readonly checks: readonly SpecCheck[];
  /** Sentences explaining findings (degraded vs mislabeled), and what would decide an inconclusive check. */
  readonly explanations: readonly string[];
}

export interface ThresholdResult {
  readonly level: { readonly value: number; readonly unit: 'T'; readonly label?: string };
  readonly model: ModelId;
  readonly distance: { readonly value: number; readonly unit: 'm'; readonly ci95: readonly [number, number] | null } | null;
  readonly extrapolated: boolean;
  readonly naive: {
    readonly model: ModelId;
    readonly distance: { readonly value: number; readonly unit: 'm' } | null;
  } | null;
  readonly notes: readonly string[];
}

export interface Report {
  readonly surveys: readonly SurveyReport[];
  readonly fleet?: unknown;
}
