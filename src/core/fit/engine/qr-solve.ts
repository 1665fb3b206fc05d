/**
 * Solve the damped least-squares system  [A; D]·x ≈ [b; 0]  given the pivoted QR
 * factorisation A·P = Q·R, the diagonal D and Qᵀb — MINPACK `qrsolv` (Moré, Garbow &
 * Hillstrom 1980). Givens rotations eliminate D from [R; Pᵀ·D·P], giving the upper
 * triangular S with PᵀAᵀAP + PᵀD²P = SᵀS; a singular S yields a least-squares solution.
 *
 * `r` is column-major with leading dimension `ld`; its full upper triangle is left
 * unchanged and its strict lower triangle receives Sᵀ (off the diagonal). S's
 * diagonal goes to `sdiag`. All vectors have length n; `work` is scratch.
 */
export function qrSolve(
  n: number,
  r: Float64Array,
  ld: number,
  pivot: Int32Array,
  diag: Float64Array,
  qtb: Float64Array,
  x: Float64Array,
  sdiag: Float64Array,
  work: Float64Array,
): void {
  // Copy R and Qᵀb so that the input survives; keep R's diagonal in x.
  for (let j = 0; j < n; j++) {
    for (let i = j; i < n; i++) r[i + j * ld] = r[j + i * ld]!;
    x[j] = r[j + j * ld]!;
    work[j] = qtb[j]!;
  }
  for (let j = 0; j < n; j++) {
    const d = diag[pivot[j]!]!;
    if (d !== 0) {
      for (let k = j; k < n; k++) sdiag[k] = 0;
      sdiag[j] = d;
      // The rotations only touch Qᵀb components beyond the first n, which start at 0.
      let qtbpj = 0;
      for (let k = j; k < n; k++) {
        const skk = sdiag[k]!;
        if (skk === 0) continue;
        const rkk = r[k + k * ld]!;
        let cos: number;
        let sin: number;
        if (Math.abs(rkk) < Math.abs(skk)) {
          const cotan = rkk / skk;
          sin = 0.5 / Math.sqrt(0.25 + 0.25 * cotan * cotan);
          cos = sin * cotan;
        } else {
          const tan = skk / rkk;
          cos = 0.5 / Math.sqrt(0.25 + 0.25 * tan * tan);
          sin = cos * tan;
        }
        r[k + k * ld] = cos * rkk + sin * skk;
        const temp = cos * work[k]! + sin * qtbpj;
        qtbpj = -sin * work[k]! + cos * qtbpj;
        work[k] = temp;
        for (let i = k + 1; i < n; i++) {
          const rik = r[i + k * ld]!;
          const si = sdiag[i]!;
          r[i + k * ld] = cos * rik + sin * si;
          sdiag[i] = -sin * rik + cos * si;
        }
      }
    }
    sdiag[j] = r[j + j * ld]!;
    r[j + j * ld] = x[j]!;
  }
  // Back substitution; a singular S gives the least-squares solution with zeros.
  let rank = n;
  for (let j = 0; j < n; j++) {
    if (sdiag[j] === 0 && rank === n) rank = j;
    if (rank < n) work[j] = 0;
  }
  for (let j = rank - 1; j >= 0; j--) {
    let sum = 0;
    for (let i = j + 1; i < rank; i++) sum += r[i + j * ld]! * work[i]!;
    work[j] = (work[j]! - sum) / sdiag[j]!;
  }
  for (let j = 0; j < n; j++) x[pivot[j]!] = work[j]!;
}
