/** Thin SVD A = U·diag(σ)·Vᵀ of an m×n matrix (m ≥ n), V only. */
export interface SingularValues {
  /** σ₁ ≥ σ₂ ≥ … ≥ σₙ ≥ 0. */
  readonly values: readonly number[];
  /** Right singular vectors, row-major n×n: column c (v[r·n + c]) belongs to values[c]. */
  readonly vectors: readonly number[];
}

/**
 * Singular values and right singular vectors by one-sided Jacobi rotations (Hestenes
 * 1958; J. Demmel & K. Veselić, "Jacobi's method is more accurate than QR", SIAM J.
 * Matrix Anal. Appl. 13 (1992) 1204–1245): rotate column pairs of A until all are
 * mutually orthogonal; the column norms are then the σ and the accumulated rotations V.
 * Small singular values come out with high relative accuracy, which is what a rank or
 * flat-direction test needs. For the small matrices of a fit (n ≤ ~10).
 *
 * Plain arrays throughout: V8 allocates typed arrays over 64 bytes off-heap, which costs
 * more than the arithmetic at these sizes.
 *
 * @param a row-major m×n (not modified).
 * @example
 * singularValues([3, 0, 0, 4], 2, 2).values; // [4, 3]
 */
export function singularValues(a: ArrayLike<number>, m: number, n: number): SingularValues {
  const u = new Array<number>(m * n);
  for (let i = 0; i < m * n; i++) u[i] = a[i]!;
  const v = new Array<number>(n * n);
  for (let i = 0; i < n * n; i++) v[i] = i % (n + 1) === 0 ? 1 : 0;
  for (let sweep = 0; sweep < 60; sweep++) {
    let rotated = false;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        let alpha = 0;
        let beta = 0;
        let gamma = 0;
        for (let i = 0; i < m; i++) {
          const up = u[i * n + p]!;
          const uq = u[i * n + q]!;
          alpha += up * up;
          beta += uq * uq;
          gamma += up * uq;
        }
        if (gamma === 0 || Math.abs(gamma) <= 1e-15 * Math.sqrt(alpha * beta)) continue;
        rotated = true;
        const zeta = (beta - alpha) / (2 * gamma);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = c * t;
        rotate(u, m, n, p, q, c, s);
        rotate(v, n, n, p, q, c, s);
      }
    }
    if (!rotated) break;
  }
  const norms = new Array<number>(n);
  const order = new Array<number>(n);
  for (let c = 0; c < n; c++) {
    let sum = 0;
    for (let i = 0; i < m; i++) sum += u[i * n + c]! * u[i * n + c]!;
    norms[c] = Math.sqrt(sum);
    order[c] = c;
  }
  // Insertion sort by decreasing σ (n is small).
  for (let c = 1; c < n; c++) {
    const item = order[c]!;
    let at = c;
    while (at > 0 && norms[order[at - 1]!]! < norms[item]!) {
      order[at] = order[at - 1]!;
      at -= 1;
    }
    order[at] = item;
  }
  const values = new Array<number>(n);
  const vectors = new Array<number>(n * n);
  for (let to = 0; to < n; to++) {
    const from = order[to]!;
    values[to] = norms[from]!;
    for (let r = 0; r < n; r++) vectors[r * n + to] = v[r * n + from]!;
  }
  return { values, vectors };
}

function rotate(x: number[], rows: number, n: number, p: number, q: number, c: number, s: number): void {
  for (let i = 0; i < rows; i++) {
    const xp = x[i * n + p]!;
    const xq = x[i * n + q]!;
    x[i * n + p] = c * xp - s * xq;
    x[i * n + q] = s * xp + c * xq;
  }
}
