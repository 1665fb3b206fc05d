import { describe, it, expect } from 'vitest';
import { choleskyFactor, choleskyInPlace, choleskyInverse, choleskyLogDeterminant } from './cholesky';
import { expectClose } from '../../../test/support/expect-close';

describe('choleskyFactor()', () => {
  it('choleskyFactor() of [[4,2],[2,5]] is [[2,0],[1,2]] (hand calculation)', () => {
    expect(Array.from(choleskyFactor([4, 2, 2, 5], 2)!)).toEqual([2, 0, 1, 2]);
  });

  it('choleskyInverse() of the 4×4 Hilbert matrix equals its known integer inverse', () => {
    // Hilbert matrix H_ij = 1/(i + j − 1); inverse of H4 (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed. §28.1, from memory; also exact rational arithmetic)
    const hilbert = Array.from({ length: 16 }, (_, index) => 1 / (Math.floor(index / 4) + (index % 4) + 1));
    const known = [16, -120, 240, -140, -120, 1200, -2700, 1680, 240, -2700, 6480, -4200, -140, 1680, -4200, 2800];
    const lower = choleskyFactor(hilbert, 4)!;
    const inverse = choleskyInverse(lower, 4);
    known.forEach((value, i) => expectClose(inverse[i]!, value, { rel: 1e-9 }));
    // det H4 = 1/6048000 (exact rational arithmetic)
    expectClose(choleskyLogDeterminant(lower, 4), Math.log(1 / 6048000), { rel: 1e-10 });
  });

  it('choleskyInPlace() with pivoting gives L·Lᵀ = PᵀAP from the lower triangle alone, swapping rows and columns far apart', () => {
    // A = BᵀB for a 7×5 B whose column norms grow, so the first pivot swaps positions 0 and 4
    // (every part of the symmetric interchange: the segment between them too)
    const k = 5;
    const rows = 7;
    const b = Array.from({ length: rows * k }, (_, index) => (1 + (index % k)) ** 2 * Math.sin(0.37 * index * index + 1));
    const a = new Float64Array(k * k);
    for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) for (let r = 0; r < rows; r++) a[i * k + j]! += b[r * k + i]! * b[r * k + j]!;
    const work = Float64Array.from(a);
    // the strict upper triangle must not be read: poison it
    for (let i = 0; i < k; i++) for (let j = i + 1; j < k; j++) work[i * k + j] = NaN;
    const pivot = new Int32Array(k);
    expect(choleskyInPlace(work, k, pivot, new Float64Array(k))).toBe(true);
    expect(pivot[0]).toBe(4);
    // the definition of pivoted Cholesky, PᵀAP = L·Lᵀ (Golub & Van Loan, Matrix Computations, 4th ed., §4.2.8), against the product formed directly
    for (let i = 0; i < k; i++) {
      for (let j = 0; j <= i; j++) {
        let sum = 0;
        for (let l = 0; l <= j; l++) sum += work[i * k + l]! * work[j * k + l]!;
        expectClose(sum, a[pivot[i]! * k + pivot[j]!]!, { rel: 1e-12, abs: 1e-12 });
      }
    }
    // the largest remaining diagonal comes first: L's diagonal does not grow (§4.2.8)
    for (let j = 1; j < k; j++) expect(work[j * k + j]!).toBeLessThanOrEqual(work[(j - 1) * k + (j - 1)]! * (1 + 1e-12));
  });

  it('choleskyFactor() returns null for a singular or indefinite matrix', () => {
    expect(choleskyFactor([1, 1, 1, 1], 2)).toBeNull();
    expect(choleskyFactor([1, 2, 2, 1], 2)).toBeNull();
    expect(choleskyFactor([0, 0, 0, 0], 2)).toBeNull();
  });
});
