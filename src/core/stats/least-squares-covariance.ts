import { singularValues } from '../linalg/singular-value-decomposition';
import { triangularFactor } from '../linalg/householder-qr';

/** What {@link leastSquaresCovariance} finds out about the linearised problem. */
export interface CovarianceResult {
  /** Cov(θ̂), row-major k×k in θ's units, or null when J is rank-deficient or s² is undefined. */
  readonly covariance: Float64Array | null;
  /** Factor applied to (JᵀWJ)⁻¹: 1 for stated σ, s² = χ²/(n − k) when estimated. */
  readonly scaleFactor: number;
  /** Numerical rank of the column-equilibrated J. */
  readonly rank: number;
  /** σ_max/σ_min of the column-equilibrated J (Infinity when singular). */
  readonly conditionNumber: number;
  /**
   * Directions in θ along which the data constrain nothing (one per missing rank), each a
   * unit vector in the equilibrated coordinates θⱼ·‖Jⱼ‖; empty at full rank. With full
   * rank, `weakestDirection` is the least constrained direction in the same coordinates.
   */
  readonly flatDirections: readonly (readonly number[])[];
  readonly weakestDirection: readonly number[];
  /** Euclidean norms ‖Jⱼ‖ of the weighted Jacobian's columns (the equilibration D). */
  readonly columnNorms: Float64Array;
}

/**
 * Covariance of least-squares estimates, Cov(θ̂) = c·(JᵀWJ)⁻¹ with J the weighted
 * Jacobian (rows (∂f/∂θ)/σᵢ): c = 1 when the σᵢ are stated standard uncertainties,
 * c = s² = χ²/(n − k) when they are only relative weights (DOMAIN.md §7.4; Bevington &
 * Robinson, 3rd ed., §8.5). No inverse of JᵀWJ is formed: with D the column norms of J
 * and D⁻¹-scaled J = Q·R, R = U·Σ·Vᵀ (Householder QR, then one-sided Jacobi SVD of R),
 * Cov = c·D⁻¹·V·Σ⁻²·Vᵀ·D⁻¹. Rank is
 * decided on the equilibrated J with a relative tolerance, so units do not matter.
 *
 * @param jacobian weighted Jacobian, row-major n×k (LeastSquaresSolution.jacobian).
 * @param options.scale 'stated' or 'estimated'; chiSquare χ² at the optimum;
 *   rankTolerance singular values below rankTolerance·σ_max count as zero (default 1e-10).
 * @example
 * // straight line through x = 0, 1, 2 with σ = 1: Var(slope) = 1/Σ(x − x̄)² = 0.5
 */
export function leastSquaresCovariance(
  jacobian: ArrayLike<number>,
  n: number,
  k: number,
  options: { readonly scale: 'stated' | 'estimated'; readonly chiSquare: number; readonly rankTolerance?: number },
): CovarianceResult {
  const tolerance = options.rankTolerance ?? 1e-10;
  const norms = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    let sum = 0;
    for (let i = 0; i < n; i++) sum += jacobian[i * k + j]! ** 2;
    norms[j] = Math.sqrt(sum);
  }
  const equilibrated = new Array<number>(n * k);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < k; j++) equilibrated[i * k + j] = norms[j] === 0 ? 0 : jacobian[i * k + j]! / norms[j]!;
  }
  // Same singular values and V as the tall matrix, at a fraction of the Jacobi cost.
  const { values, vectors } = singularValues(triangularFactor(equilibrated, n, k), k, k);
  const largest = values[0] ?? 0;
  let rank = 0;
  while (rank < k && values[rank]! > tolerance * largest) rank += 1;
  const column = (c: number): number[] => {
    const out = new Array<number>(k);
    for (let r = 0; r < k; r++) out[r] = vectors[r * k + c]!;
    return out;
  };
  const flatDirections: number[][] = [];
  for (let c = rank; c < k; c++) flatDirections.push(column(c));
  const weakestDirection = k > 0 ? column(k - 1) : [];
  const conditionNumber = rank < k || k === 0 ? Infinity : largest / values[k - 1]!;
  const scaleFactor = options.scale === 'stated' ? 1 : n > k ? options.chiSquare / (n - k) : NaN;
  if (rank < k || !Number.isFinite(scaleFactor)) {
    return { covariance: null, scaleFactor, rank, conditionNumber, flatDirections, weakestDirection, columnNorms: norms };
  }
  const covariance = new Float64Array(k * k);
  for (let a = 0; a < k; a++) {
    for (let b = 0; b <= a; b++) {
      let sum = 0;
      for (let c = 0; c < k; c++) sum += (vectors[a * k + c]! * vectors[b * k + c]!) / values[c]! ** 2;
      const value = (scaleFactor * sum) / (norms[a]! * norms[b]!);
      covariance[a * k + b] = value;
      covariance[b * k + a] = value;
    }
  }
  return { covariance, scaleFactor, rank, conditionNumber, flatDirections, weakestDirection, columnNorms: norms };
}
