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
});
