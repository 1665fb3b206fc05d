/**
 * Householder QR factorisation with column pivoting, in place, of an m×n matrix
 * stored column-major with leading dimension m (a[i + j·m]). Transcribed from MINPACK
 * `qrfac` (Moré, Garbow & Hillstrom, Argonne ANL-80-74, 1980): on return the upper
 * triangle of the first n rows holds R except its diagonal (in `rdiag`), the lower
 * trapezoid holds the Householder vectors, and column j of R belongs to original
 * column `pivot[j]`, so that A·P = Q·R with |R₀₀| ≥ |R₁₁| ≥ ….
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
    for (let k = j; k < n; k++) if (rdiag[k]! > rdiag[kmax]!) kmax = k;
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
        if (rdiag[k] !== 0) {
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

/**
 * The k×k upper-triangular R of A = Q·R for a row-major n×k matrix A (n ≥ k), by
 * Householder reflections without pivoting (Golub & Van Loan, "Matrix Computations", 4th
 * ed., Alg. 5.2.1: v = x − α·e₁, H = I − 2·v·vᵀ/vᵀv). A and R have the same singular values
 * and right singular vectors, so a Jacobi SVD of the small R replaces one of the tall A
 * (Demmel & Veselić 1992 recommend this preconditioning); Q is not formed.
 *
 * The same reflections as {@link qrFactorize}, in Golub & Van Loan's rounding rather than
 * MINPACK's (x/‖x‖ + e₁): the covariance, its rank decision and its flat directions are
 * computed from this R, and on ill-conditioned fits (a far-field moment, a power law with
 * a free offset) the small singular values follow the rounding, so swapping the two
 * changes reported intervals. Kept apart on purpose; the engine keeps MINPACK's.
 *
 * @param a row-major n×k (not modified).
 * @returns R row-major k×k (zeros below the diagonal), as a plain array.
 * @example
 * triangularFactor([3, 4], 2, 1); // [-5] (|R₀₀| = ‖column‖ = 5)
 */
export function triangularFactor(a: ArrayLike<number>, n: number, k: number): number[] {
  // Column-major working copy: reflections run down columns.
  const w = new Float64Array(n * k);
  for (let i = 0; i < n; i++) for (let j = 0; j < k; j++) w[j * n + i] = a[i * k + j]!;
  const r = new Float64Array(k * k);
  triangularFactorInPlace(w, n, k, r);
  return Array.from(r);
}

/**
 * {@link triangularFactor} of a column-major n×k matrix given as `w` (w[j·n + i] = Aᵢⱼ),
 * which it overwrites with the reflection vectors, R written into `r` (row-major k×k,
 * zeros below the diagonal): the same arithmetic without the copies, for a caller that
 * builds A column-major in scratch space anyway.
 */
export function triangularFactorInPlace(w: Float64Array, n: number, k: number, r: Float64Array): void {
  // x·x, not x ** 2: the same bits (fdlibm's pow returns x·x for y = 2), without a call.
  r.fill(0, 0, k * k);
  for (let j = 0; j < k; j++) {
    const offset = j * n;
    let norm = 0;
    for (let i = j; i < n; i++) norm += w[offset + i]! * w[offset + i]!;
    norm = Math.sqrt(norm);
    if (norm !== 0) {
      const alpha = w[offset + j]! > 0 ? -norm : norm;
      // v = x − α·e₁ stored in place; β = 1/(vᵀv/2).
      w[offset + j] = w[offset + j]! - alpha;
      let vv = 0;
      for (let i = j; i < n; i++) vv += w[offset + i]! * w[offset + i]!;
      for (let c = j + 1; c < k; c++) {
        const other = c * n;
        let dot = 0;
        for (let i = j; i < n; i++) dot += w[offset + i]! * w[other + i]!;
        const factor = (2 * dot) / vv;
        for (let i = j; i < n; i++) w[other + i] = w[other + i]! - factor * w[offset + i]!;
      }
      r[j * k + j] = alpha;
    }
    // A column already zero from row j down needs no reflection, but row j of R is still
    // what the earlier reflections left in it.
    for (let c = j + 1; c < k; c++) r[j * k + c] = w[c * n + j]!;
  }
}

const EPSILON = 2.220446049250313e-16;

function columnNorm(a: Float64Array, from: number, to: number): number {
  let sum = 0;
  for (let i = from; i < to; i++) sum += a[i]! * a[i]!;
  return Math.sqrt(sum);
}
