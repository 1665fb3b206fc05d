/**
 * Cholesky factor A = L·Lᵀ of a small symmetric positive-definite k×k matrix (row-major),
 * by the Cholesky–Banachiewicz order (Golub & Van Loan, Matrix Computations, 4th ed.,
 * Alg. 4.2.1). Returns L (row-major, upper part zero), or null when a pivot is not
 * positive relative to the largest diagonal entry (rank-deficient or not definite).
 *
 * @example choleskyFactor([4, 2, 2, 5], 2) // [2, 0, 1, 2]
 */
export function choleskyFactor(matrix: ArrayLike<number>, k: number, relativeTolerance = 1e-13): Float64Array | null {
  const lower = new Float64Array(k * k);
  let largest = 0;
  for (let i = 0; i < k; i += 1) largest = Math.max(largest, Math.abs(matrix[i * k + i]!));
  if (!(largest > 0) || !Number.isFinite(largest)) return null;
  for (let i = 0; i < k; i += 1) {
    for (let j = 0; j <= i; j += 1) {
      let sum = matrix[i * k + j]!;
      for (let m = 0; m < j; m += 1) sum -= lower[i * k + m]! * lower[j * k + m]!;
      if (i === j) {
        if (!(sum > relativeTolerance * largest)) return null;
        lower[i * k + i] = Math.sqrt(sum);
      } else {
        lower[i * k + j] = sum / lower[j * k + j]!;
      }
    }
  }
  return lower;
}

/** ln det A = 2 Σ ln Lᵢᵢ from a Cholesky factor. */
export function choleskyLogDeterminant(lower: Float64Array, k: number): number {
  let sum = 0;
  for (let i = 0; i < k; i += 1) sum += Math.log(lower[i * k + i]!);
  return 2 * sum;
}

/**
 * A⁻¹ from the Cholesky factor by solving L·Lᵀ·X = I column by column (forward and back
 * substitution; no explicit inverse of L). Used to turn an information matrix JᵀWJ into
 * a covariance, which is the quantity wanted, not a step in solving equations.
 */
export function choleskyInverse(lower: Float64Array, k: number): Float64Array {
  const inverse = new Float64Array(k * k);
  const column = new Float64Array(k);
  for (let c = 0; c < k; c += 1) {
    for (let i = 0; i < k; i += 1) {
      let sum = i === c ? 1 : 0;
      for (let m = 0; m < i; m += 1) sum -= lower[i * k + m]! * column[m]!;
      column[i] = sum / lower[i * k + i]!;
    }
    for (let i = k - 1; i >= 0; i -= 1) {
      let sum = column[i]!;
      for (let m = i + 1; m < k; m += 1) sum -= lower[m * k + i]! * column[m]!;
      column[i] = sum / lower[i * k + i]!;
    }
    for (let i = 0; i < k; i += 1) inverse[i * k + c] = column[i]!;
  }
  return inverse;
}
