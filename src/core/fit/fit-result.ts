import type { ModelId, ParameterUnit } from '../models/field-model';

/**
 * What a fit of one model to one survey returns. Never thrown away on
 * non-convergence: `converged: false` with the `stopReason` instead.
 * All values SI. Fields may be added; the listed ones are relied upon by analyses,
 * reports and the JSON contract (CONTRACT.md).
 */
export interface ParameterEstimate {
  readonly name: string;
  readonly unit: ParameterUnit;
  readonly value: number;
  /** Standard error, or null when fixed or not determined by the data. */
  readonly stderr: number | null;
  /**
   * 95 % interval: θ̂ ± t_{0.975, n−k}·stderr when the scale was estimated from the residuals,
   * θ̂ ± 1.96·stderr when σ were stated (parameter-uncertainty.ts); null when fixed / undetermined.
   */
  readonly ci95: readonly [number, number] | null;
  readonly fixed: boolean;
  /** False when the data cannot determine this parameter (identifiability, DOMAIN §7.6). */
  readonly determined: boolean;
}

export interface FitStats {
  /** Readings used. */
  readonly n: number;
  /**
   * Fitted parameters: the free ones, plus any the search held on a bound after the
   * multi-start (search-model-fit.ts `pinned`; counted here, absent from the covariance).
   */
  readonly k: number;
  /** Σ (y − f)² in T², unweighted. */
  readonly rss: number;
  /** √(rss / n), T. */
  readonly rmse: number;
  /** Σ ((y − f)/σ)²; equals rss when no uncertainties are stated (σ = 1). */
  readonly chiSquare: number;
  /** χ²/(n − k) when uncertainties were stated, else null. */
  readonly reducedChiSquare: number | null;
  readonly aicc: number;
  readonly bic: number;
  /** Among the models fitted to the same survey; null until compared. */
  readonly akaikeWeight: number | null;
}

export interface FitResult {
  readonly model: ModelId;
  readonly converged: boolean;
  readonly stopReason: string;
  readonly iterations: number;
  /** By parameter name, in the model's parameter order. */
  readonly params: Readonly<Record<string, ParameterEstimate>>;
  /** Names of the free parameters, in covariance order. */
  readonly freeParameters: readonly string[];
  /** Covariance of the free parameters (SI), row-major, freeParameters.length square, or null when singular. */
  readonly covariance: readonly number[] | null;
  /** Correlation matrix of the free parameters, row-major like the covariance, or null. */
  readonly correlation: readonly number[] | null;
  /** How the covariance was scaled (DOMAIN §7.4): stated σ, or s² estimated from residuals. */
  readonly uncertaintyScale: 'stated' | 'estimated';
  readonly stats: FitStats;
  /** Per reading, in survey order: prediction (T), residual y − f (T), σ used (T, null if none). */
  readonly points: readonly {
    readonly line: number;
    readonly distance: number;
    readonly radial: number;
    readonly field: number;
    readonly predicted: number;
    readonly residual: number;
    readonly standardUncertainty: number | null;
    /** Set when a robust loss flagged this reading as an outlier. */
    readonly outlier?: boolean;
    /** A 3-D map's reading: its position in the map's frame (m). */
    readonly position?: { readonly x: number; readonly y: number; readonly z: number };
    /** A vector map's reading is three points, one per component of the map's frame; `field` is that component. */
    readonly component?: 'x' | 'y' | 'z';
  }[];
  /**
   * Far-field magnetic moment of a physical model (A·m², DOMAIN.md §7.6), with its
   * delta-method uncertainty: what far-field readings determine even when ampere-turns
   * and size are not. Absent for power laws.
   */
  readonly moment?: {
    readonly value: number;
    readonly stderr: number | null;
    readonly ci95: readonly [number, number] | null;
  };
  /** Plain-language warnings (identifiability, χ² too large, bound hit, non-convergence). */
  readonly warnings: readonly string[];
}
