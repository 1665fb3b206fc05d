/**
 * Householder QR factorisation with column pivoting, in place, of an m×n matrix
 * stored column-major with leading dimension m (a[i + j·m]). Transcribed from MINPACK
 * `qrfac` (Moré, Garbow & Hillstrom, Argonne ANL-80-74, 1980): on return the upper
 * triangle of the first n rows holds R except its diagonal (in `rdiag`), the lower
 * trapezoid holds the Householder vectors, and column j of R belongs to original
 * column `pivot[j]`, so that A·P = Q·R with |R₀₀| ≥ |R₁₁| ≥ …. With `pivoting` false (qrfac's
 * `pivot = .false.`) the columns keep their order and `pivot` is the identity.
 *
 * The one Householder QR of the project: the least-squares engine uses it pivoted, and
 * {@link triangularFactor} unpivoted for the covariance.
 *
 * @param rdiag output, length n: diagonal of R.
 * @param columnNorms output, length n: Euclidean norms of the columns of A before
 *   factorisation (in original column order).
 * @param work scratch, length n.
 */
export function qrFactorize(
  m: number,
  n: number,
  a: Float64Array,
  pivot: Int32Array,
  rdiag: Float64Array,
  columnNorms: Float64Array,
  work: Float64Array,
  pivoting = true,
): void {
  for (let j = 0; j < n; j++) {
    const norm = columnNorm(a, j * m, j * m + m);
    columnNorms[j] = norm;
    rdiag[j] = norm;
    work[j] = norm;
    pivot[j] = j;
  }
  const steps = Math.min(m, n);
  for (let j = 0; j < steps; j++) {
    // Bring the column of largest remaining norm into the pivot position.
    let kmax = j;
    if (pivoting) for (let k = j; k < n; k++) if (rdiag[k]! > rdiag[kmax]!) kmax = k;
    if (kmax !== j) {
      for (let i = 0; i < m; i++) {
        const t = a[i + j * m]!;
        a[i + j * m] = a[i + kmax * m]!;
        a[i + kmax * m] = t;
      }
      rdiag[kmax] = rdiag[j]!;
      work[kmax] = work[j]!;
      const t = pivot[j]!;
      pivot[j] = pivot[kmax]!;
      pivot[kmax] = t;
    }
    const jj = j + j * m;
    let ajnorm = columnNorm(a, jj, j * m + m);
    if (ajnorm !== 0) {
      if (a[jj]! < 0) ajnorm = -ajnorm;
      for (let i = j; i < m; i++) a[i + j * m]! /= ajnorm;
      a[jj]! += 1;
      // Apply the reflector to the remaining columns and downdate their norms.
      for (let k = j + 1; k < n; k++) {
        let sum = 0;
        for (let i = j; i < m; i++) sum += a[i + j * m]! * a[i + k * m]!;
        const temp = sum / a[jj]!;
        for (let i = j; i < m; i++) a[i + k * m]! -= temp * a[i + j * m]!;
        if (pivoting && rdiag[k] !== 0) {
          const ratio = a[j + k * m]! / rdiag[k]!;
          rdiag[k]! *= Math.sqrt(Math.max(0, 1 - ratio * ratio));
          const relative = rdiag[k]! / work[k]!;
          if (0.05 * relative * relative <= EPSILON) {
            rdiag[k] = columnNorm(a, j + 1 + k * m, k * m + m);
            work[k] = rdiag[k]!;
          }
        }
      }
    }
    rdiag[j] = -ajnorm;
  }
}

/**
 * After {@link qrFactorize}: overwrite `vector` (length m) with Qᵀ·vector, copy its first
 * n entries into `qtv`, and move R's diagonal from `rdiag` into the matrix so that the
 * leading n×n upper triangle of `a` is R (as MINPACK `lmder` does after `qrfac`).
 */
export function applyQTransposeAndFinishR(
  m: number,
  n: number,
  a: Float64Array,
  rdiag: Float64Array,
  vector: Float64Array,
  qtv: Float64Array,
): void {
  for (let j = 0; j < n; j++) {
    const jj = j + j * m;
    if (a[jj] !== 0) {
      let sum = 0;
      for (let i = j; i < m; i++) sum += a[i + j * m]! * vector[i]!;
      const temp = -sum / a[jj]!;
      for (let i = j; i < m; i++) vector[i]! += a[i + j * m]! * temp;
    }
    a[jj] = rdiag[j]!;
    qtv[j] = vector[j]!;
  }
}

/** Reused working arrays of {@link triangularFactor}, grown as needed. */
let scratch = { w: new Float64Array(0), pivot: new Int32Array(0), rdiag: new Float64Array(0), norms: new Float64Array(0), work: new Float64Array(0) };

/**
 * The k×k upper-triangular R of A = Q·R for a row-major n×k matrix A (n ≥ k), by
 * {@link qrFactorize} without pivoting. A and R have the same singular values and right
 * singular vectors, so a Jacobi SVD of the small R replaces one of the tall A (Demmel &
 * Veselić 1992 recommend this preconditioning); Q is not formed. R's diagonal has the
 * sign opposite to the column's leading entry (Golub & Van Loan, "Matrix Computations",
 * 4th ed., Alg. 5.2.1, uses the same convention).
 *
 * @param a row-major n×k (not modified).
 * @returns R row-major k×k (zeros below the diagonal), as a plain array.
 * @example
 * triangularFactor([3, 4], 2, 1); // [-5] (|R₀₀| = ‖column‖ = 5)
 */
export function triangularFactor(a: ArrayLike<number>, n: number, k: number): number[] {
  // Column-major working copy: reflections run down columns. Scratch is reused between
  // calls (one per fit): allocating typed arrays costs more than this small factorisation.
  if (scratch.w.length < n * k) scratch.w = new Float64Array(n * k);
  if (scratch.rdiag.length < k) scratch = { w: scratch.w, pivot: new Int32Array(k), rdiag: new Float64Array(k), norms: new Float64Array(k), work: new Float64Array(k) };
  const { w, pivot, rdiag, norms, work } = scratch;
  for (let i = 0; i < n; i++) for (let j = 0; j < k; j++) w[j * n + i] = a[i * k + j]!;
  qrFactorize(n, k, w, pivot, rdiag, norms, work, false);
  const r = new Array<number>(k * k).fill(0);
  for (let j = 0; j < k; j++) {
    r[j * k + j] = rdiag[j]!;
    for (let c = j + 1; c < k; c++) r[j * k + c] = w[c * n + j]!;
  }
  return r;
}

const EPSILON = 2.220446049250313e-16;

function columnNorm(a: Float64Array, from: number, to: number): number {
  let sum = 0;
  for (let i = from; i < to; i++) sum += a[i]! * a[i]!;
  return Math.sqrt(sum);
}
