/**
 * Types of the least-squares engine ({@link fitLeastSquares}). The engine knows nothing
 * of coils: a problem is a prediction function of a parameter vector, observations and
 * optional standard uncertainties. All arrays are in the caller's units (SI in ringfall).
 */

/** Anything with an `aborted` flag — an AbortSignal works (core has no DOM types). */
export interface AbortFlag {
  readonly aborted: boolean;
}

/** A weighted nonlinear least-squares problem: minimise Σ ((yᵢ − fᵢ(θ))/σᵢ)². */
export interface LeastSquaresProblem {
  /** Observations yᵢ, length m. */
  readonly observed: Float64Array;
  /** Length of θ, fixed parameters included. */
  readonly parameterCount: number;
  /** Write fᵢ(θ) for all i into `out` (length m). Must not keep `params`. */
  predict(params: Float64Array, out: Float64Array): void;
  /**
   * Optional analytic Jacobian ∂fᵢ/∂θⱼ, row-major m×p into `out[i·p + j]` (all
   * parameters, fixed ones included; their columns are ignored). Without it the engine
   * uses central differences with a relative step.
   */
  jacobian?(params: Float64Array, out: Float64Array): void;
  /**
   * Optional fused pass over the readings for small problems (used with `jacobian`, which
   * must be given too, when at most 8 parameters are free): at θ, with wᵢ = weight[i]
   * (1/σᵢ), sⱼ = columnScale[j] and the weighted residuals rᵢ = residuals[i], the entries
   * Jᵢⱼ = ((∂fᵢ/∂θⱼ)·wᵢ)·sⱼ accumulated in reading order i = 0, 1, … into
   * gram[u·p + v] = Σᵢ Jᵢᵤ·Jᵢᵥ (v ≤ u; the upper triangle is not read) and
   * gradient[u] = Σᵢ Jᵢᵤ·rᵢ, for all p parameters (the engine reads the free ones).
   * Written with the same products in the same order as `jacobian` followed by the
   * engine's own accumulation, it gives the same fit to the last bit, without the m×p
   * Jacobian ever being stored.
   */
  normalEquations?(
    params: Float64Array, weight: Float64Array, columnScale: Float64Array, residuals: Float64Array,
    gram: Float64Array, gradient: Float64Array,
  ): void;
}

/** Options of {@link fitLeastSquares}. Tolerances are relative (MINPACK ftol, xtol, gtol). */
export interface LeastSquaresOptions {
  /** Starting θ, length p (fixed parameters are held at these values). */
  readonly initial: ArrayLike<number>;
  /** σᵢ > 0 of each observation (weights 1/σᵢ²); omitted: all 1. */
  readonly standardUncertainty?: ArrayLike<number>;
  /** true = hold θⱼ at its initial value; it is removed from the problem. */
  readonly fixed?: ArrayLike<boolean>;
  /** Hard bounds (±Infinity for none), honoured by a smooth transform (bound-transform.ts). */
  readonly lower?: ArrayLike<number>;
  readonly upper?: ArrayLike<number>;
  /** Typical magnitude of each θⱼ: base of the difference step when θⱼ = 0. Default 1. */
  readonly typicalSize?: ArrayLike<number>;
  /** Stop when both actual and predicted relative cost reductions are ≤ this. Default 1e-10. */
  readonly costTolerance?: number;
  /** Stop when the trust radius is ≤ this × ‖D·θ‖ (relative step). Default 1e-10. */
  readonly stepTolerance?: number;
  /** Stop when the cosine between residuals and every Jacobian column is ≤ this. Default 1e-12. */
  readonly gradientTolerance?: number;
  /** Budget of cost evaluations at trial points (Jacobian evaluations not counted). Default 200·(k + 1). */
  readonly maxEvaluations?: number;
  /** Budget of accepted steps. Default unlimited (the evaluation budget applies). */
  readonly maxIterations?: number;
  /** Relative central-difference step h = step·|θⱼ| (step·typicalSize at 0). Default ε^(1/3). */
  readonly differenceStep?: number;
  /** Initial trust radius = factor·‖D·θ₀‖ (MINPACK `factor`). Default 100. */
  readonly initialStepFactor?: number;
  /** Checked once per iteration; when set the fit stops with stopCode 'aborted'. */
  readonly signal?: AbortFlag;
}

/** Why the iteration stopped. */
export type StopCode =
  | 'cost-tolerance'
  | 'step-tolerance'
  | 'cost-and-step-tolerance'
  | 'gradient-tolerance'
  | 'zero-gradient-plateau'
  | 'exact-fit'
  | 'machine-precision'
  | 'no-free-parameters'
  | 'max-evaluations'
  | 'max-iterations'
  | 'aborted'
  | 'non-finite-start'
  | 'non-finite-jacobian';

/** What {@link fitLeastSquares} returns; it never throws for non-convergence. */
export interface LeastSquaresSolution {
  /** True when a tolerance test stopped the search (or nothing was free). */
  readonly converged: boolean;
  readonly stopCode: StopCode;
  /** One sentence for people: what stopped the search. */
  readonly stopReason: string;
  /** Accepted steps. */
  readonly iterations: number;
  /** Cost evaluations, the starting point and finite-difference evaluations included. */
  readonly evaluations: number;
  /** Best θ found, length p (fixed parameters at their values). */
  readonly params: Float64Array;
  /** Indices into θ of the free parameters, in Jacobian/covariance column order. */
  readonly freeIndices: readonly number[];
  /** χ² = Σ ((yᵢ − fᵢ)/σᵢ)² at `params` (= RSS when no σ was given). */
  readonly chiSquare: number;
  /** Σ (yᵢ − fᵢ)², unweighted. */
  readonly rss: number;
  /** fᵢ(θ̂), length m. (Plain arrays: V8 allocates small typed arrays off-heap, ~10× slower.) */
  readonly predicted: readonly number[];
  /** yᵢ − fᵢ(θ̂), length m. */
  readonly residuals: readonly number[];
  /**
   * Weighted Jacobian (∂fᵢ/∂θⱼ)/σᵢ at θ̂ in the ORIGINAL parameters, free columns only,
   * row-major m×k — the input of the covariance (stats/least-squares-covariance.ts).
   */
  readonly jacobian: readonly number[];
  /** Per parameter (length p): true when a free θⱼ ended on one of its bounds. */
  readonly atBound: readonly boolean[];
  /** Things the caller should pass on (start moved inside its bounds, …). */
  readonly warnings: readonly string[];
}
