/**
 * The k×k upper-triangular R of A = Q·R for a row-major n×k matrix A (n ≥ k), by
 * Householder reflections (Golub & Van Loan, "Matrix Computations", 4th ed., Alg. 5.2.1).
 * A and R have the same singular values and right singular vectors, so a Jacobi SVD of
 * the small R replaces one of the tall A (Demmel & Veselić 1992 recommend this
 * preconditioning); Q is not formed.
 *
 * @param a row-major n×k (not modified).
 * @returns R row-major k×k (zeros below the diagonal), as a plain array.
 * @example
 * triangularFactor([3, 4], 2, 1); // [-5] (|R₀₀| = ‖column‖ = 5)
 */
export function triangularFactor(a: ArrayLike<number>, n: number, k: number): number[] {
  // Column-major working copy: reflections run down columns.
  const w = new Array<number>(n * k);
  for (let i = 0; i < n; i++) for (let j = 0; j < k; j++) w[j * n + i] = a[i * k + j]!;
  const r = new Array<number>(k * k).fill(0);
  for (let j = 0; j < k; j++) {
    const offset = j * n;
    let norm = 0;
    for (let i = j; i < n; i++) norm += w[offset + i]! ** 2;
    norm = Math.sqrt(norm);
    if (norm === 0) continue;
    const alpha = w[offset + j]! > 0 ? -norm : norm;
    // v = x − α·e₁ stored in place; β = 1/(vᵀv/2).
    w[offset + j] = w[offset + j]! - alpha;
    let vv = 0;
    for (let i = j; i < n; i++) vv += w[offset + i]! ** 2;
    for (let c = j + 1; c < k; c++) {
      const other = c * n;
      let dot = 0;
      for (let i = j; i < n; i++) dot += w[offset + i]! * w[other + i]!;
      const factor = (2 * dot) / vv;
      for (let i = j; i < n; i++) w[other + i] = w[other + i]! - factor * w[offset + i]!;
    }
    r[j * k + j] = alpha;
    for (let c = j + 1; c < k; c++) r[j * k + c] = w[c * n + j]!;
  }
  return r;
}
