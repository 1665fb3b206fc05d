import { singularValues } from '../linalg/singular-value-decomposition';
import { triangularFactorInPlace } from '../linalg/householder-qr';

/** What {@link leastSquaresCovariance} finds out about the linearised problem. */
export interface CovarianceResult {
  /** Cov(θ̂), row-major k×k in θ's units, or null when J is rank-deficient or s² is undefined. */
  readonly covariance: readonly number[] | null;
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
 * Robinson, 3rd ed., §8.5). No inverse of JᵀWJ is formed: with D the column norms of J,
 * D⁻¹-scaled J = Q·R by Householder QR, and Cov = c·D⁻¹·R⁻¹·R⁻ᵀ·D⁻¹ from the triangular
 * inverse of that factor (Björck, "Numerical Methods for Least Squares Problems", SIAM
 * 1996, ch. 2, the covariance matrix from R, from memory). The covariance is itself the
 * inverse, so R⁻¹ is formed here — of the k×k triangular factor, as LAPACK's xPOTRI forms
 * (AᵀA)⁻¹ from a Cholesky factor — but never used to solve a system.
 *
 * When R is ill-conditioned — κ_F(R) = ‖R‖_F·‖R⁻¹‖_F, an upper bound on σ_max/σ_min,
 * above {@link WELL_CONDITIONED}, or R⁻¹ not finite — a one-sided Jacobi SVD of R decides
 * instead: R = U·Σ·Vᵀ, rank from the σ with a relative tolerance (so units do not
 * matter), the flat directions from V, Cov = c·D⁻¹·V·Σ⁻²·Vᵀ·D⁻¹. Below the limit the
 * rank is full with four orders of magnitude to spare (the SVD's test is σ_min ≤
 * 1e-10·σ_max), there are no flat directions, and the triangular inverse is as accurate
 * as the SVD: both start from the same R, whose backward error ‖δJ‖ ≲ u‖J‖ dominates,
 * and a triangular inverse's relative error is of order u·κ(R) (Higham, "Accuracy and
 * Stability of Numerical Algorithms", 2nd ed., ch. 8; Golub & Van Loan, "Matrix
 * Computations", 4th ed., §5.3, on QR against the normal equations, whose error goes
 * with κ² instead). The two paths agree to about u·κ(R) relative, the last digit or two.
 * `conditionNumber` and `weakestDirection` are worked out from the SVD of R on first
 * read when the triangular path was taken.
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
    for (let i = 0; i < n; i++) sum += jacobian[i * k + j]! * jacobian[i * k + j]!;
    norms[j] = Math.sqrt(sum);
  }
  if (scratch.work.length < n * k) scratch.work = new Float64Array(2 * n * k);
  if (scratch.r.length < k * k) {
    scratch.r = new Float64Array(k * k);
    scratch.inverse = new Float64Array(k * k);
  }
  const { work, r, inverse } = scratch;
  // Column-major, as the QR works on it: the same quotients a row-major copy would hold.
  for (let j = 0; j < k; j++) {
    const norm = norms[j]!;
    for (let i = 0; i < n; i++) work[j * n + i] = norm === 0 ? 0 : jacobian[i * k + j]! / norm;
  }
  triangularFactorInPlace(work, n, k, r);
  const scaleFactor = options.scale === 'stated' ? 1 : n > k ? options.chiSquare / (n - k) : NaN;
  const factor = new Array<number>(k * k);
  for (let i = 0; i < k * k; i++) factor[i] = r[i]!;
  if (k > 0 && n >= k && WELL_CONDITIONED * tolerance < 1 && triangularInverse(r, k, inverse)) {
    let covariance: number[] | null = null;
    if (Number.isFinite(scaleFactor)) {
      // A plain array: a typed array over 64 bytes is allocated off-heap, dearer than the sums.
      covariance = new Array<number>(k * k);
      for (let a = 0; a < k; a++) {
        for (let b = 0; b <= a; b++) {
          // (R⁻¹·R⁻ᵀ)ₐᵦ = Σ_{c ≥ a} Tₐc·Tᵦc with T = R⁻¹ upper triangular, b ≤ a
          let sum = 0;
          for (let c = a; c < k; c++) sum += inverse[a * k + c]! * inverse[b * k + c]!;
          const value = (scaleFactor * sum) / (norms[a]! * norms[b]!);
          covariance[a * k + b] = value;
          covariance[b * k + a] = value;
        }
      }
    }
    return new FullRankCovariance(covariance, scaleFactor, norms, factor, k);
  }
  return fromSingularValues(factor, k, tolerance, scaleFactor, norms);
}

/**
 * κ_F(R) up to which the covariance comes from R⁻¹ without an SVD. 1e6: σ_min/σ_max ≥
 * 1e-6, four orders above the rank tolerance, and R⁻¹ still good to about 1e-10 relative.
 */
export const WELL_CONDITIONED = 1e6;

/** Scratch space reused from call to call (a covariance is worked out synchronously). */
const scratch = { work: new Float64Array(256), r: new Float64Array(64), inverse: new Float64Array(64) };

/**
 * T = R⁻¹ of an upper-triangular row-major k×k R into `t` (back substitution, column by
 * column); false when κ_F(R) = ‖R‖_F·‖R⁻¹‖_F exceeds {@link WELL_CONDITIONED} or is not
 * finite (then `t` holds nothing useful).
 */
function triangularInverse(r: Float64Array, k: number, t: Float64Array): boolean {
  t.fill(0, 0, k * k);
  let rSquares = 0;
  let tSquares = 0;
  for (let c = 0; c < k; c++) {
    t[c * k + c] = 1 / r[c * k + c]!;
    for (let row = c - 1; row >= 0; row--) {
      let sum = 0;
      for (let m = row + 1; m <= c; m++) sum += r[row * k + m]! * t[m * k + c]!;
      t[row * k + c] = -sum / r[row * k + row]!;
    }
    for (let row = 0; row <= c; row++) {
      rSquares += r[row * k + c]! * r[row * k + c]!;
      tSquares += t[row * k + c]! * t[row * k + c]!;
    }
  }
  return Math.sqrt(rSquares * tSquares) <= WELL_CONDITIONED;
}

/** A well-conditioned result: full rank, no flat directions; the SVD of R only if asked for. */
class FullRankCovariance implements CovarianceResult {
  readonly rank: number;
  readonly flatDirections: readonly (readonly number[])[] = [];
  #condition = NaN;
  #weakest: number[] | null = null;

  constructor(
    readonly covariance: readonly number[] | null,
    readonly scaleFactor: number,
    readonly columnNorms: Float64Array,
    private readonly factor: readonly number[],
    k: number,
  ) {
    this.rank = k;
  }

  get conditionNumber(): number {
    if (this.#weakest === null) this.decompose();
    return this.#condition;
  }

  get weakestDirection(): readonly number[] {
    if (this.#weakest === null) this.decompose();
    return this.#weakest!;
  }

  private decompose(): void {
    const k = this.rank;
    const { values, vectors } = singularValues(this.factor, k, k);
    const weakest = new Array<number>(k);
    for (let row = 0; row < k; row++) weakest[row] = vectors[row * k + k - 1]!;
    this.#condition = values[0]! / values[k - 1]!;
    this.#weakest = weakest;
  }
}

/** The covariance, rank and flat directions from the one-sided Jacobi SVD of R. */
function fromSingularValues(r: readonly number[], k: number, tolerance: number, scaleFactor: number, norms: Float64Array): CovarianceResult {
  // Same singular values and V as the tall matrix, at a fraction of the Jacobi cost.
  const { values, vectors } = singularValues(r, k, k);
  const largest = values[0] ?? 0;
  let rank = 0;
  while (rank < k && values[rank]! > tolerance * largest) rank += 1;
  const column = (c: number): number[] => {
    const out = new Array<number>(k);
    for (let row = 0; row < k; row++) out[row] = vectors[row * k + c]!;
    return out;
  };
  const flatDirections: number[][] = [];
  for (let c = rank; c < k; c++) flatDirections.push(column(c));
  const weakestDirection = k > 0 ? column(k - 1) : [];
  const conditionNumber = rank < k || k === 0 ? Infinity : largest / values[k - 1]!;
  if (rank < k || !Number.isFinite(scaleFactor)) {
    return { covariance: null, scaleFactor, rank, conditionNumber, flatDirections, weakestDirection, columnNorms: norms };
  }
  const covariance = new Array<number>(k * k);
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
