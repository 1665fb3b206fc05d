import { describe, it, expect } from 'vitest';
import { choleskyFactor, choleskyInverse, choleskyLogDeterminant } from './cholesky';
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

  it('choleskyFactor() returns null for a singular or indefinite matrix', () => {
    expect(choleskyFactor([1, 1, 1, 1], 2)).toBeNull();
    expect(choleskyFactor([1, 2, 2, 1], 2)).toBeNull();
    expect(choleskyFactor([0, 0, 0, 0], 2)).toBeNull();
  });
});
