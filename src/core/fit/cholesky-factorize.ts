/**
 * The pivoted triangular factor R of a weighted Jacobian J (m×k, column-major, leading
 * dimension m) through the normal equations: JᵀJ = P·RᵀR·Pᵀ by outer-product Cholesky
 * with diagonal pivoting (Golub & Van Loan, "Matrix Computations", 4th ed., Alg. 4.2.2
 * with the pivoting of §4.2.8), and Qᵀf = R⁻ᵀ·Pᵀ·Jᵀf. In exact arithmetic this is the R
 * and pivot order that Householder QR with column pivoting gives (qr-factorize.ts), so
 * the MINPACK step logic is unchanged; it costs fewer dependent operations for small k.
 *
 * Forming JᵀJ squares the condition number, so the factor is accepted only when every
 * pivot keeps at least `minimumRatio` of its column's norm (R_jj ≥ ratio·‖J_col‖, an
 * equilibrated conditioning test); otherwise it returns false, leaves J untouched, and the
 * caller falls back to QR. With the default 1e-4 the normal-equation error, ≈ ε·κ², stays
 * below ~1e-8 of the step.
 *
 * On success the upper triangle of J's first k rows holds R (positive diagonal),
 * `columnNorms` the column norms of J, `pivot` the column order and `qtf` the first k
 * entries of Qᵀf. `gram` (k·k) and `gradient` (k) are scratch.
 */
export function choleskyFactorize(
  m: number,
  k: number,
  J: Float64Array,
  residuals: Float64Array,
  pivot: Int32Array,
  columnNorms: Float64Array,
  qtf: Float64Array,
  gram: Float64Array,
  gradient: Float64Array,
  minimumRatio = 1e-4,
): boolean {
  // Each sum over the rows in a register (columns are contiguous); same order of additions
  // as a row-by-row pass, so the same rounding.
  for (let a = 0; a < k; a++) {
    const ca = a * m;
    let g = 0;
    for (let i = 0; i < m; i++) g += J[ca + i]! * residuals[i]!;
    gradient[a] = g;
    for (let b = 0; b <= a; b++) {
      const cb = b * m;
      let sum = 0;
      for (let i = 0; i < m; i++) sum += J[ca + i]! * J[cb + i]!;
      gram[a * k + b] = sum;
      gram[b * k + a] = sum;
    }
    columnNorms[a] = Math.sqrt(gram[a * k + a]!);
    pivot[a] = a;
  }
  for (let j = 0; j < k; j++) {
    let q = j;
    for (let i = j + 1; i < k; i++) if (gram[i * k + i]! > gram[q * k + q]!) q = i;
    if (q !== j) {
      swapRowsAndColumns(gram, k, j, q);
      const t = pivot[j]!;
      pivot[j] = pivot[q]!;
      pivot[q] = t;
    }
    const remaining = gram[j * k + j]!;
    const norm = columnNorms[pivot[j]!]!;
    if (!(norm > 0) || !(remaining > minimumRatio * minimumRatio * norm * norm)) return false;
    const diagonal = Math.sqrt(remaining);
    gram[j * k + j] = diagonal;
    for (let i = j + 1; i < k; i++) gram[i * k + j]! /= diagonal;
    for (let i = j + 1; i < k; i++) {
      for (let l = j + 1; l <= i; l++) {
        const value = gram[i * k + l]! - gram[i * k + j]! * gram[l * k + j]!;
        gram[i * k + l] = value;
        gram[l * k + i] = value;
      }
    }
  }
  // R = Lᵀ into J's leading upper triangle; Qᵀf by forward substitution with Rᵀ.
  for (let j = 0; j < k; j++) {
    for (let i = 0; i <= j; i++) J[i + j * m] = gram[j * k + i]!;
    let sum = gradient[pivot[j]!]!;
    for (let i = 0; i < j; i++) sum -= gram[j * k + i]! * qtf[i]!;
    qtf[j] = sum / gram[j * k + j]!;
  }
  return true;
}

function swapRowsAndColumns(a: Float64Array, k: number, p: number, q: number): void {
  for (let c = 0; c < k; c++) {
    const t = a[p * k + c]!;
    a[p * k + c] = a[q * k + c]!;
    a[q * k + c] = t;
  }
  for (let r = 0; r < k; r++) {
    const t = a[r * k + p]!;
    a[r * k + p] = a[r * k + q]!;
    a[r * k + q] = t;
  }
}
