import { fitLeastSquares } from '../engine/least-squares';
import type { LeastSquaresOptions, LeastSquaresProblem, LeastSquaresSolution } from '../engine/least-squares-types';
import type { LeastSquaresWorkspace } from '../engine/least-squares-workspace';
import { medianOf } from '../../numeric/order-statistics';

/** Robust loss of a standardised residual u: 'huber' or 'soft-l1' (the losses of scipy's least_squares). */
export type RobustLoss = 'huber' | 'soft-l1';

/** Options of {@link fitRobust}. */
export interface RobustOptions {
  readonly loss: RobustLoss;
  /** Tuning constant c in units of σ. Default 1.345 for Huber (95 % efficiency at the normal), 1 for soft-L1. */
  readonly tuning?: number;
  /** |u| above this flags a reading as an outlier. Default 3. */
  readonly outlierCut?: number;
  /** Re-weighting rounds at most. Default 30. */
  readonly rounds?: number;
}

/** A robust fit: the final weighted solution, the robust weights and the outlier flags. */
export interface RobustFit {
  readonly solution: LeastSquaresSolution;
  /** IRLS weight of each reading in (0, 1]: 1 = full weight. */
  readonly robustWeights: Float64Array;
  /** uᵢ = (yᵢ − fᵢ)/(σᵢ·s) at the solution. */
  readonly standardizedResiduals: Float64Array;
  readonly outliers: readonly boolean[];
  /** s: 1 when σ were stated, else the robust scale 1.4826·median|r/σ| (MAD). */
  readonly scale: number;
  readonly rounds: number;
  readonly settled: boolean;
}

/**
 * Robust nonlinear least squares by iteratively reweighted least squares (IRLS;
 * P. J. Huber, "Robust Statistics", 1981, §7.8; Holland & Welsch, Commun. Statist. A6
 * (1977) 813–827): each round refits with σᵢ/√wᵢ, where wᵢ = ψ(uᵢ)/uᵢ is the loss's
 * weight at the standardised residual uᵢ:
 * Huber wᵢ = min(1, c/|uᵢ|); soft-L1 (ρ = 2(√(1 + u²/c²) − 1)) wᵢ = 1/√(1 + uᵢ²/c²).
 * The scale s is 1 when `options.standardUncertainty` is given (stated σ), else the
 * normalised median absolute deviation of r/σ, re-estimated each round. Stops when no
 * weight changes by more than 1e-6. Readings with |u| > outlierCut are flagged.
 * The solution's Jacobian carries the final weights, so its covariance is the usual
 * IRLS approximation (the sandwich correction is not applied).
 */
export function fitRobust(
  problem: LeastSquaresProblem,
  options: LeastSquaresOptions,
  robust: RobustOptions,
  workspace?: LeastSquaresWorkspace,
): RobustFit {
  const n = problem.observed.length;
  const tuning = robust.tuning ?? (robust.loss === 'huber' ? 1.345 : 1);
  const cut = robust.outlierCut ?? 3;
  const maxRounds = robust.rounds ?? 30;
  const stated = options.standardUncertainty;
  const base = Float64Array.from({ length: n }, (_, i) => (stated === undefined ? 1 : stated[i]!));
  const weights = new Float64Array(n).fill(1);
  const sigma = Float64Array.from(base);
  const u = new Float64Array(n);
  let solution = fitLeastSquares(problem, { ...options, standardUncertainty: sigma }, workspace);
  let scale = 1;
  let rounds = 1;
  let settled = false;
  for (;;) {
    scale = standardize(solution.residuals, base, stated !== undefined, u);
    let change = 0;
    for (let i = 0; i < n; i++) {
      const a = Math.abs(u[i]!);
      const w = robust.loss === 'huber' ? (a <= tuning ? 1 : tuning / a) : 1 / Math.sqrt(1 + (a / tuning) ** 2);
      change = Math.max(change, Math.abs(w - weights[i]!));
      weights[i] = w;
      sigma[i] = base[i]! / Math.sqrt(w);
    }
    if (change <= 1e-6) {
      settled = true;
      break;
    }
    if (rounds >= maxRounds) break;
    solution = fitLeastSquares(problem, { ...options, initial: solution.params, standardUncertainty: sigma }, workspace);
    rounds += 1;
  }
  const outliers = Array.from(u, (value) => Math.abs(value) > cut);
  return { solution, robustWeights: weights, standardizedResiduals: u, outliers, scale, rounds, settled };
}

/** Write uᵢ = rᵢ/(σᵢ·s) and return s (1 when stated, else 1.4826·median|r/σ|). */
function standardize(residuals: ArrayLike<number>, sigma: Float64Array, stated: boolean, out: Float64Array): number {
  for (let i = 0; i < out.length; i++) out[i] = residuals[i]! / sigma[i]!;
  let scale = 1;
  if (!stated) {
    const median = medianOf(Array.from(out, Math.abs));
    // 1.4826 = 1/Φ⁻¹(3/4) makes the MAD consistent for σ at the normal (common practice).
    scale = 1.4826 * median;
    if (!(scale > 0)) scale = Number.MIN_VALUE;
  }
  for (let i = 0; i < out.length; i++) out[i]! /= scale;
  return scale;
}
