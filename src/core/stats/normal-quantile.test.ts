import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { chiSquareSurvival } from './chi-square-survival';
import { normalQuantile, normalUpperTail } from './normal-quantile';
import { regularizedUpperGamma } from './regularized-incomplete-gamma';
import { studentTQuantile } from './student-t-quantile';

describe('normalQuantile(p) and normalUpperTail(z)', () => {
  it('normalQuantile() reproduces the A&S Table 26.5 percentage points', () => {
    // A&S Table 26.5 (to 9 decimals): z_0.975 = 1.959963985, z_0.995 = 2.575829304, z_0.999 = 3.090232306
    expectClose(normalQuantile(0.975), 1.959963985, { abs: 5e-10 });
    expectClose(normalQuantile(0.995), 2.575829304, { abs: 5e-10 });
    expectClose(normalQuantile(0.999), 3.090232306, { abs: 5e-10 });
    expectClose(normalQuantile(0.025), -1.959963985, { abs: 5e-10 });
  });

  it('normalUpperTail(normalQuantile(p)) returns 1 − p, and studentTQuantile(p, ∞) is the normal quantile', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1 - 1e-12, noNaN: true }), (p) => {
        expectClose(normalUpperTail(normalQuantile(p)), 1 - p, { rel: 1e-12, abs: 1e-16 });
        expect(studentTQuantile(p, Infinity)).toBe(normalQuantile(p));
      }),
      { numRuns: 300, seed: 8 },
    );
    expect(normalQuantile(1.5)).toBeNaN();
    expect(normalQuantile(1)).toBe(Infinity);
  });
});

describe('regularizedUpperGamma(a, x) and chiSquareSurvival(x, ν)', () => {
  it('regularizedUpperGamma(n, x) for integer n equals the Poisson sum e⁻ˣ·Σ_{k<n} xᵏ/k!', () => {
    // A&S 6.5.13, computed independently by summation
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }), fc.double({ min: 0.01, max: 80, noNaN: true }), (n, x) => {
        let term = Math.exp(-x);
        let sum = 0;
        for (let k = 0; k < n; k++) {
          sum += term;
          term *= x / (k + 1);
        }
        expectClose(regularizedUpperGamma(n, x), sum, { rel: 1e-11, abs: 1e-300 });
      }),
      { numRuns: 300, seed: 9 },
    );
  });

  it('chiSquareSurvival(x, 2) is e^(−x/2) and chiSquareSurvival(ν, ν) is near ½ for large ν', () => {
    // closed form: χ² with ν = 2 is the exponential distribution with mean 2, P(χ² > x) = e^(−x/2)
    for (const x of [0.1, 1, 2, 10, 40]) expectClose(chiSquareSurvival(x, 2), Math.exp(-x / 2), { rel: 1e-13 });
    // χ²_ν has mean ν and its median is ≈ ν(1 − 2/(9ν))³ (Wilson–Hilferty), so P(χ² > ν) is a little under ½
    const survival = chiSquareSurvival(1000, 1000);
    expect(survival).toBeLessThan(0.5);
    expect(survival).toBeGreaterThan(0.49);
    // Wilson–Hilferty (1931): (χ²/ν)^(1/3) ≈ N(1 − 2/(9ν), 2/(9ν)), so P(χ² > ν) ≈ 1 − Φ(√(2/(9ν))) = 0.4940531;
    // at ν = 1000 the approximation is good to ~3e-7 (mpmath gammainc(500, 500) = 0.4940528538), 1e-5 leaves room
    expectClose(survival, normalUpperTail(Math.sqrt(2 / 9000)), { abs: 1e-5 });
  });
});
