import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { choleskyFactorize } from './cholesky';
import { applyQTransposeAndFinishR, qrFactorize } from './householder-qr';

const m = 7;
const k = 3;
/** A column-major 7×3 test matrix with unequal column scales. */
function matrix(collinear = 0): Float64Array {
  const a = new Float64Array(m * k);
  for (let i = 0; i < m; i++) {
    a[i] = 1 + 0.3 * i;
    a[m + i] = 100 * Math.sin(1.7 * i + 0.2);
    a[2 * m + i] = collinear > 0 ? a[i]! + collinear * Math.cos(3 * i) : 0.01 * (i - 3) ** 2;
  }
  return a;
}
const f = Float64Array.from({ length: m }, (_, i) => Math.cos(i) - 0.2 * i);

/** (AᵀA)[p][q] computed directly from the column-major matrix. */
function gram(a: Float64Array, p: number, q: number): number {
  let sum = 0;
  for (let i = 0; i < m; i++) sum += a[p * m + i]! * a[q * m + i]!;
  return sum;
}

/** (RᵀR)[p][q] from R stored in the leading upper triangle (leading dimension m). */
function rtr(r: Float64Array, p: number, q: number): number {
  let sum = 0;
  for (let i = 0; i <= Math.min(p, q); i++) sum += r[i + p * m]! * r[i + q * m]!;
  return sum;
}

/** qrFactorize then applyQTransposeAndFinishR on a copy of a: R in the copy's leading triangle, Qᵀf in qtf. */
function factorQr(a: Float64Array) {
  const r = Float64Array.from(a);
  const pivot = new Int32Array(k);
  const rdiag = new Float64Array(k);
  const norms = new Float64Array(k);
  const qtf = new Float64Array(k);
  qrFactorize(m, k, r, pivot, rdiag, norms, new Float64Array(k));
  applyQTransposeAndFinishR(m, k, r, rdiag, Float64Array.from(f), qtf);
  return { r, pivot, rdiag, norms, qtf };
}

describe('qrFactorize() and choleskyFactorize()', () => {
  it('qrFactorize(): RᵀR equals PᵀAᵀAP and the pivots order |R_jj| decreasingly', () => {
    const a = matrix();
    const { r, pivot, rdiag, norms } = factorQr(a);
    for (let p = 0; p < k; p++) {
      // independent: the Gram matrix of the original columns
      expectClose(norms[p]!, Math.sqrt(gram(a, p, p)), { rel: 1e-14 });
      for (let q = 0; q < k; q++) expectClose(rtr(r, p, q), gram(a, pivot[p]!, pivot[q]!), { rel: 1e-12, abs: 1e-12 });
    }
    for (let j = 1; j < k; j++) expect(Math.abs(rdiag[j - 1]!)).toBeGreaterThanOrEqual(Math.abs(rdiag[j]!));
  });

  it('choleskyFactorize() gives the QR factor up to signs, and Rᵀ·qtf = Pᵀ·Aᵀf', () => {
    const a = matrix();
    const { r: viaQr, pivot: pivotQr, qtf: qtfQr } = factorQr(a);
    const viaCholesky = Float64Array.from(a);
    const pivot = new Int32Array(k);
    const qtf = new Float64Array(k);
    const accepted = choleskyFactorize(m, k, viaCholesky, f, pivot, new Float64Array(k), qtf, new Float64Array(k * k), new Float64Array(k));
    expect(accepted).toBe(true);
    expect(Array.from(pivot)).toEqual(Array.from(pivotQr));
    for (let j = 0; j < k; j++) {
      const sign = Math.sign(viaQr[j + j * m]!);
      for (let i = 0; i <= j; i++) expectClose(viaCholesky[i + j * m]!, sign * viaQr[i + j * m]!, { rel: 1e-10, abs: 1e-10 });
      expectClose(qtf[j]!, sign * qtfQr[j]!, { rel: 1e-10, abs: 1e-12 });
      let atf = 0;
      for (let i = 0; i < m; i++) atf += a[pivot[j]! * m + i]! * f[i]!;
      let rq = 0;
      for (let i = 0; i <= j; i++) rq += viaCholesky[i + j * m]! * qtf[i]!;
      expectClose(rq, atf, { rel: 1e-12, abs: 1e-12 });
    }
  });

  it('choleskyFactorize() declines nearly collinear columns and leaves J untouched for QR', () => {
    const a = matrix(1e-6);
    const copy = Float64Array.from(a);
    const accepted = choleskyFactorize(m, k, copy, f, new Int32Array(k), new Float64Array(k), new Float64Array(k), new Float64Array(k * k), new Float64Array(k));
    expect(accepted).toBe(false);
    expect(Array.from(copy)).toEqual(Array.from(a));
  });
});
