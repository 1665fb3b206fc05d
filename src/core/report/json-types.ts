import type { ModelId, ParameterUnit } from '../models/field-model';
import type { ReadingType } from '../survey/survey';
import type { RunRecord } from './run-record';
import type { FleetSummary, SkippedFiles, SpecUse, ThresholdResult, Verdict } from './report';

/**
 * The JSON the CLI prints and the library's `toJsonReport` returns (docs/CONTRACT.md), as
 * types. The JSON Schemas in schema/ (draft 2020-12, shipped in the package) say the same
 * thing for programs in other languages; test/e2e/json-schema.cli.test.ts validates every
 * JSON the CLI prints against them. All values SI. The contract lets fields be added, so
 * objects may hold more than is listed here; a non-finite number is null.
 */

/** `[lower, upper]` of a 95 % interval; a bound that is not finite is null. */
export type JsonInterval = readonly [number | null, number | null];

/** One fitted parameter (`fits[].params.NAME`). */
export interface JsonParameter {
  readonly value: number | null;
  readonly unit: ParameterUnit;
  /** Standard error, or null when fixed or not determined by the data. */
  readonly stderr: number | null;
  readonly ci95: JsonInterval | null;
  readonly fixed: boolean;
  /** False when the readings cannot determine this parameter. */
  readonly determined: boolean;
}

/** Goodness of fit and information criteria of one fit (`fits[].stats`). */
export interface JsonFitStats {
  readonly n: number;
  readonly k: number;
  readonly rss: number | null;
  readonly rmse: number | null;
  readonly chiSquare: number | null;
  readonly reducedChiSquare: number | null;
  readonly aicc: number | null;
  readonly bic: number | null;
  readonly akaikeWeight: number | null;
}

/** One model fitted to one survey (`surveys[].fits[]`). */
export interface JsonFit {
  readonly model: ModelId;
  readonly converged: boolean;
  readonly stopReason: string;
  readonly iterations: number;
  readonly params: Readonly<Record<string, JsonParameter>>;
  readonly stats: JsonFitStats;
  /** Stated σ, or s² estimated from the residuals. */
  readonly uncertaintyScale: 'stated' | 'estimated';
  /** Names of the free parameters, in the order of `correlation`. */
  readonly freeParameters: readonly string[];
  /** Correlation matrix of the free parameters, row-major, or null. */
  readonly correlation: readonly (number | null)[] | null;
  /** Covariance of the free parameters (SI), row-major in the order of `freeParameters`, or null when singular. */
  readonly covariance: readonly (number | null)[] | null;
  /** The readings the fit used, as columns (one array per quantity, SI), so a saved report can be drawn again. */
  readonly points: JsonPoints;
  /** Far-field magnetic moment of a physical model; absent for power laws. */
  readonly moment?: { readonly value: number | null; readonly unit: 'A·m²'; readonly stderr: number | null; readonly ci95: JsonInterval | null };
  readonly warnings: readonly string[];
}

/** Per-reading columns of a fit (`surveys[].fits[].points`); every array has one entry per reading used. */
export interface JsonPoints {
  readonly line: readonly number[];
  readonly distance: readonly (number | null)[];
  readonly radial: readonly (number | null)[];
  readonly field: readonly (number | null)[];
  readonly predicted: readonly (number | null)[];
  readonly residual: readonly (number | null)[];
  readonly standardUncertainty: readonly (number | null)[];
  /** Present when a robust fit flagged readings. */
  readonly outlier?: readonly boolean[];
}

/** A data row the import did not use (`surveys[].readings.rejected[]`). */
export interface JsonRejectedRow {
  readonly line: number;
  readonly column: string | null;
  readonly value: string | null;
  readonly code: string | null;
  readonly reason: string;
}

/** One survey's report (`surveys[]`). */
export interface JsonSurvey {
  readonly source: string;
  readonly coil: string | null;
  readonly date: string | null;
  readonly readingType: ReadingType | null;
  /**
   * The units the survey's file was written in (header, option or hand mapping), as the
   * text and HTML reports show its values; the values in this report stay SI. Absent when
   * not known.
   */
  readonly units?: { readonly field: string; readonly distance: string };
  readonly readings: { readonly total: number; readonly used: number; readonly rejected: readonly JsonRejectedRow[] };
  readonly fits: readonly JsonFit[];
  /** Best model by AICc among converged fits, or null. */
  readonly best: ModelId | null;
  readonly comparison: readonly string[];
  /** The model summaries read the coil from and why (summaryFit), or null when no coil model converged. */
  readonly summaryModel: { readonly model: ModelId; readonly basis: 'spec' | 'coil-history' | 'best-physical' } | null;
  /**
   * 'position' when the survey is a scan along the axis (signed positions from a ruler's
   * zero, every fit has `centre` in place of `probeOffset`, fit points' `distance` is the
   * signed position); absent for distances from the datum.
   */
  readonly axis?: 'position';
  /** The spec checked, or why none applied; null when no spec file was given. */
  readonly spec: SpecUse | null;
  readonly verdict: Verdict | null;
  readonly thresholds: readonly ThresholdResult[];
  readonly warnings: readonly string[];
  readonly notes: readonly string[];
  readonly cautions: readonly string[];
}

/** The fleet section of `batch --json` and `demo --json`. */
export type JsonFleet = FleetSummary;

/** The report of `fit --json`, `batch --json` and `demo --json` (schema/report.schema.json). */
export interface JsonReport {
  readonly schema: 'ringfall-report/1';
  readonly surveys: readonly JsonSurvey[];
  /** Rows outside any survey, with their file. */
  rejected?: readonly (JsonRejectedRow & { readonly source: string })[];
  /** batch and demo only. */
  fleet?: JsonFleet;
  /** When a signal (Ctrl-C: SIGINT; SIGTERM) stopped the run: the report covers the files done. */
  partial?: { readonly filesDone: number; readonly filesTotal: number; readonly signal?: 'SIGINT' | 'SIGTERM' };
  /** Files a folder's skip list left out of the search (present when any was). */
  skipped?: readonly SkippedFiles[];
  /** How the report was made (version, command, time, inputs with SHA-256, settings); first in the file when present. */
  readonly run?: RunRecord;
}

/** A quantity: SI value and unit. */
export interface JsonQuantity<Unit extends string = string> {
  readonly value: number;
  readonly unit: Unit;
}

/** `predict --json` (schema/predict.schema.json). */
export interface JsonPrediction {
  readonly field: JsonQuantity<'T'>;
  readonly components: { readonly axial: JsonQuantity<'T'>; readonly radial: JsonQuantity<'T'> };
  readonly model: ModelId;
  readonly point: { readonly distance: JsonQuantity<'m'>; readonly radial: JsonQuantity<'m'> };
  readonly params: Readonly<Record<string, JsonQuantity>>;
}

/** One plan's positions and expected 95 % half-widths (`plan --json`, `plans.*`). */
export interface JsonPlanIntervals {
  readonly points: readonly { readonly distance: JsonQuantity<'m'>; readonly radial: JsonQuantity<'m'> }[];
  readonly expected: Readonly<Record<string, { readonly halfWidth95: number | null; readonly unit: ParameterUnit; readonly relative: number | null }>>;
  readonly moment: { readonly value: number; readonly unit: 'A·m²'; readonly halfWidth95: number | null; readonly relative: number | null } | null;
  readonly correlation: number | null;
  readonly determined: boolean;
  readonly warnings: readonly string[];
}

/** `plan --json` (schema/plan.schema.json). */
export interface JsonPlan {
  readonly schema: 'ringfall-plan/1';
  readonly model: ModelId;
  readonly parameters: Readonly<Record<string, { readonly value: number; readonly unit: ParameterUnit; readonly free: boolean }>>;
  readonly interest: readonly string[];
  readonly noise: { readonly relative: number; readonly absolute: JsonQuantity<'T'>; readonly position: JsonQuantity<'m'> };
  /** Present for a scan through the coil (`plan --scan`): points' `distance` is a signed position on the ruler. */
  readonly axis?: 'position';
  readonly plans: {
    readonly recommended: JsonPlanIntervals;
    readonly evenlySpaced: JsonPlanIntervals;
    readonly compared: JsonPlanIntervals | null;
    /** Scans only: the same count on one side, from the datum with the probe offset free. */
    readonly oneSided?: JsonPlanIntervals | null;
  };
  readonly notes: readonly string[];
}
