/**
 * The pivoted triangular factor R of a weighted Jacobian J (m×k, column-major, leading
 * dimension m) through the normal equations: JᵀJ = P·RᵀR·Pᵀ by outer-product Cholesky
 * with diagonal pivoting (Golub & Van Loan, "Matrix Computations", 4th ed., Alg. 4.2.2
 * with the pivoting of §4.2.8), and Qᵀf = R⁻ᵀ·Pᵀ·Jᵀf. In exact arithmetic this is the R
 * and pivot order that Householder QR with column pivoting gives (householder-qr.ts), so
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
    }
  }
  return choleskyFromNormalEquations(m, k, J, pivot, columnNorms, qtf, gram, gradient, minimumRatio);
}

/**
 * The second half of {@link choleskyFactorize}, for callers that formed the normal
 * equations themselves (a fused pass over the readings): from `gram` = JᵀJ (k×k,
 * row-major, lower triangle; only that is read, and it is destroyed) and `gradient` = Jᵀf (k), the column norms
 * √(JᵀJ)ⱼⱼ, the pivoted R into the leading upper triangle of `J` (leading dimension m;
 * nothing else of J is read or written) and Qᵀf into `qtf`. Same acceptance test and
 * return value as choleskyFactorize.
 */
export function choleskyFromNormalEquations(
  m: number,
  k: number,
  J: Float64Array,
  pivot: Int32Array,
  columnNorms: Float64Array,
  qtf: Float64Array,
  gram: Float64Array,
  gradient: Float64Array,
  minimumRatio = 1e-4,
): boolean {
  for (let a = 0; a < k; a++) columnNorms[a] = Math.sqrt(gram[a * k + a]!);
  // The pivot floors ratio²·‖J_col‖² go in qtf until it is computed below.
  for (let a = 0; a < k; a++) qtf[a] = minimumRatio * minimumRatio * columnNorms[a]! * columnNorms[a]!;
  if (!choleskyInPlace(gram, k, pivot, qtf)) return false;
  // R = Lᵀ into J's leading upper triangle; Qᵀf by forward substitution with Rᵀ.
  for (let j = 0; j < k; j++) {
    for (let i = 0; i <= j; i++) J[i + j * m] = gram[j * k + i]!;
    let sum = gradient[pivot[j]!]!;
    for (let i = 0; i < j; i++) sum -= gram[j * k + i]! * qtf[i]!;
    qtf[j] = sum / gram[j * k + j]!;
  }
  return true;
}

/**
 * The one Cholesky factorisation of the project: A = L·Lᵀ in place for a symmetric k×k
 * matrix (row-major; only the lower triangle is read or written, the strict upper triangle
 * is left as it was), by the outer-product form (Golub & Van Loan, "Matrix Computations",
 * 4th ed., Alg. 4.2.2) with optional diagonal pivoting (§4.2.8). Each entry is reduced by
 * the products L_im·L_jm in the order m = 0, 1, …, so the rounding is that of the
 * Cholesky–Banachiewicz order (Alg. 4.2.1).
 *
 * With `pivot` (length k) the largest remaining diagonal is brought forward at each step and
 * `pivot[j]` names the original row and column in position j; with null, no pivoting. A
 * pivot is accepted only when the remaining diagonal exceeds `floor[original index]`;
 * otherwise false is returned with `a` part-way through. On success the lower triangle of
 * `a` holds L.
 */
export function choleskyInPlace(a: Float64Array, k: number, pivot: Int32Array | null, floor: ArrayLike<number>): boolean {
  if (pivot !== null) for (let j = 0; j < k; j++) pivot[j] = j;
  for (let j = 0; j < k; j++) {
    if (pivot !== null) {
      // The first largest remaining diagonal (strictly greater replaces).
      let q = j;
      let largest = a[j * k + j]!;
      for (let i = j + 1; i < k; i++) {
        const d = a[i * k + i]!;
        if (d > largest) {
          largest = d;
          q = i;
        }
      }
      if (q !== j) {
        swapSymmetricLower(a, k, j, q);
        const t = pivot[j]!;
        pivot[j] = pivot[q]!;
        pivot[q] = t;
      }
    }
    const remaining = a[j * k + j]!;
    if (!(remaining > floor[pivot === null ? j : pivot[j]!]!)) return false;
    const diagonal = Math.sqrt(remaining);
    a[j * k + j] = diagonal;
    // Row by row: L_ij, then row i of the trailing update, which needs L_lj only for l ≤ i
    // (already divided): the same values as dividing the whole column first.
    for (let i = j + 1; i < k; i++) {
      const rowI = i * k;
      const lij = a[rowI + j]! / diagonal;
      a[rowI + j] = lij;
      for (let l = j + 1; l <= i; l++) a[rowI + l] = a[rowI + l]! - lij * a[l * k + j]!;
    }
  }
  return true;
}

/**
 * Cholesky factor A = L·Lᵀ of a small symmetric positive-definite k×k matrix (row-major)
 * by {@link choleskyInPlace} without pivoting. Returns L (row-major, upper part zero), or
 * null when a pivot is not positive relative to the largest diagonal entry
 * (rank-deficient or not definite).
 *
 * @example choleskyFactor([4, 2, 2, 5], 2) // [2, 0, 1, 2]
 */
export function choleskyFactor(matrix: ArrayLike<number>, k: number, relativeTolerance = 1e-13): Float64Array | null {
  let largest = 0;
  for (let i = 0; i < k; i += 1) largest = Math.max(largest, Math.abs(matrix[i * k + i]!));
  if (!(largest > 0) || !Number.isFinite(largest)) return null;
  const lower = Float64Array.from(matrix as ArrayLike<number>);
  const floor = new Float64Array(k).fill(relativeTolerance * largest);
  if (!choleskyInPlace(lower, k, null, floor)) return null;
  for (let i = 0; i < k; i += 1) for (let j = i + 1; j < k; j += 1) lower[i * k + j] = 0;
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

/**
 * Symmetric interchange of rows and columns p < q of a matrix held in its lower triangle
 * (row-major), as LAPACK's dsyswapr does for uplo = 'L': the rows of the columns before p
 * (the factor so far), the diagonal entries, the segment between p and q (row of one, column
 * of the other) and the columns below q. The entry (q, p) stays where it is.
 */
function swapSymmetricLower(a: Float64Array, k: number, p: number, q: number): void {
  const rowP = p * k;
  const rowQ = q * k;
  for (let c = 0; c < p; c++) {
    const t = a[rowP + c]!;
    a[rowP + c] = a[rowQ + c]!;
    a[rowQ + c] = t;
  }
  const t = a[rowP + p]!;
  a[rowP + p] = a[rowQ + q]!;
  a[rowQ + q] = t;
  for (let c = p + 1; c < q; c++) {
    const u = a[c * k + p]!;
    a[c * k + p] = a[rowQ + c]!;
    a[rowQ + c] = u;
  }
  for (let r = q + 1; r < k; r++) {
    const u = a[r * k + p]!;
    a[r * k + p] = a[r * k + q]!;
    a[r * k + q] = u;
  }
}
