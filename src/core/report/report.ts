import type { FitResult } from '../fit/fit-result';
import type { ModelId } from '../models/field-model';
import type { ReadingType, RejectedRow, SurveyUnits } from '../survey/survey';
import type { SetAsideRow } from './set-aside-rows';
import type { RunRecord } from './run-record';

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

export type CheckStatus = 'pass' | 'fail' | 'inconclusive';

/** The spec a survey was checked against (CONTRACT.md "Spec file"). */
export interface SpecUse {
  /** False when specs were given but none applies to this survey's coil. */
  readonly applied: boolean;
  /** The spec that applied ("specs.json" or "specs.json, spec 2"), or the file(s) given when none applied. */
  readonly source: string;
  /** Coil ids the applied spec names (null: it names none, so it applies to every coil); when none applied, every id the file names. */
  readonly coils: readonly string[] | null;
  /** The applied spec's model, or null. */
  readonly model: ModelId | null;
  /** Why no spec applied, in one sentence with what to do; null when one applied. */
  readonly reason: string | null;
}

export interface SpecCheck {
  /** What was checked: "ampereTurns", "radius", "field at 0 mm". */
  readonly what: string;
  readonly status: CheckStatus;
  readonly expected: { readonly value: number; readonly unit: string };
  readonly measured: { readonly value: number; readonly unit: string; readonly ci95: readonly [number, number] | null };
  readonly tolerance: { readonly relative: number; readonly absolute: number };
  /** One sentence of evidence, with numbers and units. */
  readonly evidence: string;
  /** What was compared: a label parameter, a field claim, or the far-field moment derived from the label. */
  readonly kind?: 'parameter' | 'claim' | 'moment';
  /** Claims only: where the claimed distance is measured from (the device surface, or the winding). */
  readonly datum?: 'surface' | 'winding';
  /**
   * For an inconclusive check: the measurement that would decide it, in one sentence
   * (added points and where, or the uncertainty to reach). Absent when decided.
   */
  readonly toDecide?: string;
  /** Claims only: the same point under other curves, side by side (T). */
  readonly alternatives?: readonly { readonly model: ModelId; readonly value: number; readonly unit: 'T' }[];
}

export interface Verdict {
  readonly status: CheckStatus;
  /** The decision rule in words (decide-conformity.ts decisionRule), naming ISO 14253-1 and JCGM 106. */
  readonly rule?: string;
  /** The model the checks were made with: the spec's. */
  readonly model?: ModelId;
  readonly findings: readonly string[];
  readonly checks: readonly SpecCheck[];
  /** Sentences explaining findings (degraded vs mislabeled), and what would decide an inconclusive check. */
  readonly explanations: readonly string[];
}

export interface ThresholdResult {
  readonly level: { readonly value: number; readonly unit: 'T'; readonly label?: string; readonly flag?: string };
  readonly model: ModelId;
  readonly distance: { readonly value: number; readonly unit: 'm'; readonly ci95: readonly [number, number] | null } | null;
  readonly extrapolated: boolean;
  readonly naive: {
    readonly model: ModelId;
    readonly distance: { readonly value: number; readonly unit: 'm' } | null;
    /** naive distance / physical-model distance. */
    readonly ratio?: number | null;
    readonly extrapolated?: boolean;
  } | null;
  readonly notes: readonly string[];
  /** The fitted power law's distance (descriptive baseline) and its ratio to the physical model's. */
  readonly powerLaw?: {
    readonly model: ModelId;
    readonly exponent: number;
    readonly distance: { readonly value: number; readonly unit: 'm' } | null;
    readonly ratio: number | null;
    readonly extrapolated: boolean;
  } | null;
  /** How the 95 % interval was obtained: delta method, or Monte Carlo when the curve is strongly nonlinear. */
  readonly intervalMethod?: 'delta' | 'monte-carlo' | null;
  /** Surveyed distances as field-point distances from the datum, m. */
  readonly surveyedRange?: readonly [number, number] | null;
  /** DOMAIN.md §4.5 cautions that go with every threshold distance. */
  readonly cautions?: readonly string[];
}

/** One survey's place in a coil's history (fleet section). */
export interface FleetEntry {
  readonly source: string;
  readonly date: string | null;
  /** Fitted ampere-turns with 95 % interval (A), null when not fitted or not determined. */
  readonly ampereTurns: { readonly value: number; readonly unit: 'A'; readonly ci95: readonly [number, number] | null } | null;
  /** Fitted geometry parameters (m) with 95 % intervals. */
  readonly geometry: Readonly<Record<string, { readonly value: number; readonly unit: 'm'; readonly ci95: readonly [number, number] | null }>>;
  /** ampereTurns / reference, with interval, or null. */
  readonly ratioToReference: { readonly value: number; readonly ci95: readonly [number, number] | null } | null;
  readonly verdict: CheckStatus | null;
}

/** One coil across its surveys (CONTRACT.md fleet section; extra fields are additions). */
export interface FleetCoil {
  readonly coil: string;
  readonly surveys: number;
  /** Date of the latest dated survey, or null. */
  readonly latest: string | null;
  /** 'degrading', 'geometry-changed', 'failed-spec', … */
  readonly flags: readonly string[];
  readonly trend: {
    readonly ampereTurnsPerYear: { readonly value: number; readonly unit: 'A/yr'; readonly ci95: readonly [number, number] } | null;
    /** What the trend says (trend-reading.ts): declining, rising, steady (inside ±steadyBand), or undetermined. */
    readonly status: 'declining' | 'rising' | 'steady' | 'undetermined';
    /** The reference's tolerance per year: a trend inside ±this is steady; null without a trend. */
    readonly steadyBand: { readonly value: number; readonly unit: 'A/yr' } | null;
    /** For an undetermined trend, how many more surveys at the same interval and precision would decide; else null. */
    readonly moreSurveys: number | null;
  };
  /** The model whose parameters are trended. */
  readonly model: ModelId | null;
  /** What the history is compared with: the spec's label or the first survey. */
  readonly reference: { readonly kind: 'spec' | 'first-survey'; readonly ampereTurns: number; readonly unit: 'A' } | null;
  /** Surveys in date order (undated last). */
  readonly history: readonly FleetEntry[];
  /** One sentence per flag with the numbers, and what was left out and why. */
  readonly explanations: readonly string[];
}

/** The fleet section of a batch report (CONTRACT.md). */
export interface FleetSummary {
  readonly coils: readonly FleetCoil[];
  readonly unreadable: readonly { readonly source: string; readonly reason: string }[];
  /** Surveys without a coil id, which cannot join a history. */
  readonly ungrouped?: readonly { readonly source: string; readonly reason: string }[];
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
