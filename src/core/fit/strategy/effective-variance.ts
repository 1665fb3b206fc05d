import { fitLeastSquares } from '../engine/least-squares';
import type { LeastSquaresOptions, LeastSquaresProblem, LeastSquaresSolution } from '../engine/least-squares-types';
import type { LeastSquaresWorkspace } from '../engine/least-squares-workspace';

/**
 * σ_eff,i = √(σ_B,i² + (∂f/∂d|ᵢ·σ_d,i)²): the reading's own uncertainty and the position
 * uncertainty carried through the local slope of the model (effective variance; Orear,
 * Am. J. Phys. 50 (1982) 912; DOMAIN.md §3.7–3.8).
 *
 * @param readingUncertainty σ_B (reading unit); slope ∂f/∂d (reading unit per metre);
 *   positionUncertainty σ_d (m); out receives σ_eff (reading unit). All length n.
 * @example
 * // loop NI = 400 A, R = 50 mm at z = 50 mm: dB/dz = −0.0533146 T/m, σ_z = 1 mm
 * // → position term 5.33146e-5 T (DOMAIN.md §9 row 51)
 */
export function effectiveUncertainty(
  readingUncertainty: ArrayLike<number>,
  slope: ArrayLike<number>,
  positionUncertainty: ArrayLike<number>,
  out: Float64Array,
): void {
  for (let i = 0; i < out.length; i++) out[i] = Math.hypot(readingUncertainty[i]!, slope[i]! * positionUncertainty[i]!);
}

/** Inputs of {@link fitEffectiveVariance}. */
export interface EffectiveVarianceOptions {
  /** σ_B,i > 0 of each reading (reading unit). */
  readonly readingUncertainty: ArrayLike<number>;
  /** σ_d,i ≥ 0 of each distance (m). */
  readonly positionUncertainty: ArrayLike<number>;
  /** Writes ∂fᵢ/∂dᵢ at θ — the slope of each prediction with respect to its own distance. */
  readonly slope: (params: Float64Array, out: Float64Array) => void;
  /** Re-weighting rounds at most. Default 5. */
  readonly rounds?: number;
  /** Stop when no σ_eff changes by more than this fraction. Default 1e-3. */
  readonly tolerance?: number;
}

/** A fit with effective-variance weights, and the weights it settled on. */
export interface EffectiveVarianceFit {
  readonly solution: LeastSquaresSolution;
  /** σ_eff used in the final fit. */
  readonly effectiveUncertainty: Float64Array;
  readonly rounds: number;
  /** True when σ_eff changed by less than the tolerance in the last round. */
  readonly settled: boolean;
}

/**
 * Least squares with errors in both variables by iterated effective variance
 * (DOMAIN.md §3.8): σ_eff from the slope at the start, fit, recompute σ_eff from the
 * slope at the fitted θ, refit from there, until σ_eff settles (usually 2–3 rounds).
 * `options.standardUncertainty` is ignored: the σ come from `effective`. A reading whose
 * slope is not finite keeps σ_B, and the fit then reports the weights as not settled.
 *
 * @throws RangeError when a σ_B is not > 0 or lengths differ (as fitLeastSquares).
 */
export function fitEffectiveVariance(
  problem: LeastSquaresProblem,
  options: LeastSquaresOptions,
  effective: EffectiveVarianceOptions,
  workspace?: LeastSquaresWorkspace,
): EffectiveVarianceFit {
  const n = problem.observed.length;
  for (const [name, array] of [['readingUncertainty', effective.readingUncertainty], ['positionUncertainty', effective.positionUncertainty]] as const) {
    if (array.length !== n) throw new RangeError(`effective variance: ${name} has length ${array.length}, expected ${n}`);
  }
  const maxRounds = effective.rounds ?? 5;
  const tolerance = effective.tolerance ?? 1e-3;
  const slope = new Float64Array(n);
  const sigma = new Float64Array(n);
  const next = new Float64Array(n);
  let params: Float64Array = Float64Array.from(options.initial);
  effective.slope(params, slope);
  effectiveUncertainty(effective.readingUncertainty, slope, effective.positionUncertainty, sigma);
  // A slope the model cannot give (not finite) leaves that reading at σ_B, and the weights unsettled.
  let defined = keepDefined(sigma, effective.readingUncertainty);
  let solution = fitLeastSquares(problem, { ...options, initial: params, standardUncertainty: sigma }, workspace);
  let rounds = 1;
  let settled = false;
  while (rounds < maxRounds) {
    params = solution.params;
    effective.slope(params, slope);
    effectiveUncertainty(effective.readingUncertainty, slope, effective.positionUncertainty, next);
    defined = keepDefined(next, effective.readingUncertainty) && defined;
    let change = 0;
    for (let i = 0; i < n; i++) change = Math.max(change, Math.abs(next[i]! - sigma[i]!) / sigma[i]!);
    if (change <= tolerance) {
      settled = defined;
      break;
    }
    sigma.set(next);
    solution = fitLeastSquares(problem, { ...options, initial: params, standardUncertainty: sigma }, workspace);
    rounds += 1;
  }
  return { solution, effectiveUncertainty: sigma, rounds, settled };
}

/** Replace σ_eff entries that are not finite and > 0 by σ_B; true when none had to be. */
function keepDefined(sigma: Float64Array, reading: ArrayLike<number>): boolean {
  let all = true;
  for (let i = 0; i < sigma.length; i++) {
    if (!(sigma[i]! > 0 && sigma[i]! < Infinity)) {
      sigma[i] = reading[i]!;
      all = false;
    }
  }
  return all;
}
