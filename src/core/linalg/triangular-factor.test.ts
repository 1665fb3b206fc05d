import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { triangularFactor } from './householder-qr';

describe('triangularFactor(a, n, k)', () => {
  it('triangularFactor(): RᵀR equals AᵀA for a row-major 7×3 matrix', () => {
    const [n, k] = [7, 3];
    const a = Array.from({ length: n * k }, (_, index) => Math.sin(1.3 * index + 0.1) * (1 + 40 * (index % k)));
    const r = triangularFactor(a, n, k);
    for (let p = 0; p < k; p++) {
      for (let q = 0; q < k; q++) {
        let rtr = 0;
        for (let i = 0; i <= Math.min(p, q); i++) rtr += r[i * k + p]! * r[i * k + q]!;
        // independent: the Gram matrix summed directly
        let ata = 0;
        for (let i = 0; i < n; i++) ata += a[i * k + p]! * a[i * k + q]!;
        expectClose(rtr, ata, { rel: 1e-12, abs: 1e-12 });
      }
    }
    expect(r[1 * k + 0]).toBe(0);
    expect(triangularFactor([3, 4], 2, 1)).toEqual([-5]);
  });

  it('triangularFactor(): a column already zero from the diagonal down keeps its row of R', () => {
    // A = [[0, 1], [0, 0]] is already upper triangular: R = A up to signs, RᵀR = AᵀA = [[0, 0], [0, 1]] (hand calculation)
    const r = triangularFactor([0, 1, 0, 0], 2, 2);
    expect(r[0]).toBe(0);
    expect(Math.abs(r[1]!)).toBe(1);
    expect(r[2]).toBe(0);
    expect(r[3]).toBe(0);
  });
});
