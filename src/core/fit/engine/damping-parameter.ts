import { qrSolve } from './qr-solve';

/** Scratch vectors for {@link dampingParameter}, each of length n. */
export interface DampingScratch {
  readonly sdiag: Float64Array;
  readonly work1: Float64Array;
  readonly work2: Float64Array;
  readonly work3: Float64Array;
}

/**
 * The Levenberg–Marquardt parameter: find damping μ ≥ 0 such that the step x solving
 * (JᵀJ + μ·D²)·x = −Jᵀf satisfies ‖D·x‖ ≈ Δ (within 10 %), or μ = 0 when the
 * Gauss–Newton step already lies inside the trust region — MINPACK `lmpar`
 * (Moré 1978, "The Levenberg–Marquardt algorithm: implementation and theory",
 * Lecture Notes in Mathematics 630, §5), a safeguarded Newton iteration on
 * φ(μ) = ‖D·x(μ)‖ − Δ, at most 10 iterations.
 *
 * Works on the pivoted R from {@link qrFactorize} (column-major, leading dimension
 * `ld`), `qtb` = first n entries of Qᵀf. Writes the (un-negated) solution of the damped
 * system into `x` — the step is −x — and returns the new damping μ.
 */
export function dampingParameter(
  n: number,
  r: Float64Array,
  ld: number,
  pivot: Int32Array,
  diag: Float64Array,
  qtb: Float64Array,
  trustRadius: number,
  previousDamping: number,
  x: Float64Array,
  scratch: DampingScratch,
): number {
  const { sdiag, work1, work2, work3 } = scratch;
  // Gauss–Newton direction; a rank-deficient R gives a least-squares solution.
  let rank = n;
  for (let j = 0; j < n; j++) {
    work1[j] = qtb[j]!;
    if (r[j + j * ld] === 0 && rank === n) rank = j;
    if (rank < n) work1[j] = 0;
  }
  for (let j = rank - 1; j >= 0; j--) {
    work1[j]! /= r[j + j * ld]!;
    const temp = work1[j]!;
    for (let i = 0; i < j; i++) work1[i]! -= r[i + j * ld]! * temp;
  }
  for (let j = 0; j < n; j++) x[pivot[j]!] = work1[j]!;

  for (let j = 0; j < n; j++) work2[j] = diag[j]! * x[j]!;
  let dxnorm = norm(work2, n);
  let fp = dxnorm - trustRadius;
  if (fp <= 0.1 * trustRadius) return 0;

  // Lower bound of μ from the Newton step at μ = 0 (only when R has full rank).
  let lowerBound = 0;
  if (rank >= n) {
    for (let j = 0; j < n; j++) {
      const l = pivot[j]!;
      work1[j] = diag[l]! * (work2[l]! / dxnorm);
    }
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let i = 0; i < j; i++) sum += r[i + j * ld]! * work1[i]!;
      work1[j] = (work1[j]! - sum) / r[j + j * ld]!;
    }
    const temp = norm(work1, n);
    lowerBound = fp / trustRadius / temp / temp;
  }
  // Upper bound from the scaled gradient.
  for (let j = 0; j < n; j++) {
    let sum = 0;
    for (let i = 0; i <= j; i++) sum += r[i + j * ld]! * qtb[i]!;
    work1[j] = sum / diag[pivot[j]!]!;
  }
  const gradientNorm = norm(work1, n);
  let upperBound = gradientNorm / trustRadius;
  if (upperBound === 0) upperBound = DWARF / Math.min(trustRadius, 0.1);

  let damping = Math.min(Math.max(previousDamping, lowerBound), upperBound);
  if (damping === 0) damping = gradientNorm / dxnorm;

  for (let iteration = 1; ; iteration++) {
    if (damping === 0) damping = Math.max(DWARF, 0.001 * upperBound);
    const root = Math.sqrt(damping);
    for (let j = 0; j < n; j++) work1[j] = root * diag[j]!;
    qrSolve(n, r, ld, pivot, work1, qtb, x, sdiag, work3);
    for (let j = 0; j < n; j++) work2[j] = diag[j]! * x[j]!;
    dxnorm = norm(work2, n);
    const previousFp = fp;
    fp = dxnorm - trustRadius;
    if (
      Math.abs(fp) <= 0.1 * trustRadius ||
      (lowerBound === 0 && fp <= previousFp && previousFp < 0) ||
      iteration === 10
    ) {
      return damping;
    }
    // Newton correction, using Sᵀ left in R's strict lower triangle by qrSolve.
    for (let j = 0; j < n; j++) {
      const l = pivot[j]!;
      work1[j] = diag[l]! * (work2[l]! / dxnorm);
    }
    for (let j = 0; j < n; j++) {
      work1[j]! /= sdiag[j]!;
      const temp = work1[j]!;
      for (let i = j + 1; i < n; i++) work1[i]! -= r[i + j * ld]! * temp;
    }
    const temp = norm(work1, n);
    const correction = fp / trustRadius / temp / temp;
    if (fp > 0) lowerBound = Math.max(lowerBound, damping);
    if (fp < 0) upperBound = Math.min(upperBound, damping);
    damping = Math.max(lowerBound, damping + correction);
  }
}

const DWARF = 2.2250738585072014e-308;

function norm(v: Float64Array, n: number): number {
  let sum = 0;
  for (let i = 0; i < n; i++) sum += v[i]! * v[i]!;
  return Math.sqrt(sum);
}
