import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { logGamma } from './log-gamma';
import { regularizedIncompleteBeta } from './regularized-incomplete-beta';
import { studentTCdf, studentTDensity } from './student-t-cdf';
import { studentTQuantile } from './student-t-quantile';

describe('studentTQuantile(p, ν)', () => {
  it('studentTQuantile(0.975, ν) for ν = 5, 8, 20 equals DOMAIN.md §9 row 61', () => {
    // DOMAIN.md §9 row 61 [C]: t_0.975 = 2.570582, 2.306004, 2.085963 (6 decimals)
    expectClose(studentTQuantile(0.975, 5), 2.570582, { abs: 5e-7 });
    expectClose(studentTQuantile(0.975, 8), 2.306004, { abs: 5e-7 });
    expectClose(studentTQuantile(0.975, 20), 2.085963, { abs: 5e-7 });
  });

  it('studentTQuantile() matches the NIST/SEMATECH e-Handbook §1.3.6.7.2 critical values (3 decimals)', () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, table 1.3.6.7.2 (upper critical values)
    const table: [number, number, number][] = [
      [1, 0.975, 12.706], [2, 0.975, 4.303], [3, 0.975, 3.182], [10, 0.975, 2.228], [30, 0.975, 2.042],
      [100, 0.975, 1.984], [2, 0.995, 9.925], [10, 0.995, 3.169], [10, 0.999, 4.144], [5, 0.9, 1.476],
    ];
    for (const [nu, p, t] of table) expectClose(studentTQuantile(p, nu), t, { abs: 5e-4 }, `ν = ${nu}, p = ${p}`);
  });

  it('studentTQuantile(p, 4) equals the closed form of Shaw (2006) to 1e-12', () => {
    // W. T. Shaw, "Sampling Student's T distribution — use of the inverse cumulative
    // distribution function", J. Computational Finance 9(4), 2006: ν = 4 in closed form
    for (const p of [0.01, 0.2, 0.6, 0.975, 0.999, 1e-8]) {
      const alpha = 4 * p * (1 - p);
      const q = Math.cos(Math.acos(Math.sqrt(alpha)) / 3) / Math.sqrt(alpha);
      expectClose(studentTQuantile(p, 4), Math.sign(p - 0.5) * 2 * Math.sqrt(q - 1), { rel: 1e-11 }, `p = ${p}`);
    }
  });

  it('studentTQuantile(0.975, ν) tends to the normal quantile 1.959963985 as ν grows', () => {
    // A&S Table 26.5 / common value: z_0.975 = 1.959963984540054; t − z ≈ (z³ + z)/(4ν) (A&S 26.7.5)
    const z = 1.959963984540054;
    expectClose(studentTQuantile(0.975, 1e6), z + (z ** 3 + z) / 4e6, { rel: 1e-9 });
  });

  it('studentTCdf(studentTQuantile(p, ν), ν) returns p, and the quantile is odd about p = ½', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 1 - 1e-9, noNaN: true }), fc.double({ min: 0.5, max: 500, noNaN: true }), (p, nu) => {
        const t = studentTQuantile(p, nu);
        expectClose(studentTCdf(t, nu), p, { rel: 1e-9, abs: 1e-15 });
        // Compare against the exact complement: 1 − u is exact in binary64 for u ≥ ½ (Sterbenz).
        const upper = Math.max(p, 1 - p);
        expectClose(studentTQuantile(upper, nu), -studentTQuantile(1 - upper, nu), { rel: 1e-9, abs: 1e-12 });
      }),
      { numRuns: 300, seed: 4 },
    );
  });

  it('studentTQuantile() gives ±Infinity at p = 1 / 0 and NaN outside the domain', () => {
    expect(studentTQuantile(1, 5)).toBe(Infinity);
    expect(studentTQuantile(0, 5)).toBe(-Infinity);
    expect(studentTQuantile(0.5, 5)).toBe(0);
    for (const [p, nu] of [[-0.1, 5], [1.1, 5], [NaN, 5], [0.9, 0], [0.9, -1], [0.9, NaN]] as const) {
      expect(studentTQuantile(p, nu)).toBeNaN();
    }
  });
});

describe('studentTCdf(t, ν) and studentTDensity(t, ν)', () => {
  it('studentTCdf() equals the closed forms for ν = 1 (Cauchy) and ν = 2', () => {
    // A&S 26.7.3–26.7.4 special cases: ν = 1: ½ + atan(t)/π; ν = 2: ½ + t/(2√(2 + t²))
    for (const t of [-30, -2, -0.3, 0, 0.7, 4, 100]) {
      expectClose(studentTCdf(t, 1), 0.5 + Math.atan(t) / Math.PI, { rel: 1e-13, abs: 1e-16 }, `ν = 1, t = ${t}`);
      expectClose(studentTCdf(t, 2), 0.5 + t / (2 * Math.sqrt(2 + t * t)), { rel: 1e-13, abs: 1e-16 }, `ν = 2, t = ${t}`);
    }
  });

  it('studentTDensity() integrates (Simpson) to the CDF difference', () => {
    // independent numerical method: composite Simpson rule, 2000 panels
    const nu = 6.5;
    const [a, b] = [-1.2, 2.9];
    const panels = 2000;
    const h = (b - a) / panels;
    let sum = studentTDensity(a, nu) + studentTDensity(b, nu);
    for (let i = 1; i < panels; i++) sum += (i % 2 === 1 ? 4 : 2) * studentTDensity(a + i * h, nu);
    expectClose((sum * h) / 3, studentTCdf(b, nu) - studentTCdf(a, nu), { rel: 1e-12 });
  });
});

describe('regularizedIncompleteBeta(x, a, b) and logGamma(x)', () => {
  it('regularizedIncompleteBeta() with integer a, b equals the binomial tail P(Bin(a+b−1, x) ≥ a)', () => {
    // identity A&S 26.5.24 (binomial distribution), computed independently by summation
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 30 }), fc.double({ min: 0.001, max: 0.999, noNaN: true }), (a, b, x) => {
        const n = a + b - 1;
        let tail = 0;
        let coefficient = 1;
        for (let j = 0; j <= n; j++) {
          if (j >= a) tail += coefficient * x ** j * (1 - x) ** (n - j);
          coefficient = (coefficient * (n - j)) / (j + 1);
        }
        expectClose(regularizedIncompleteBeta(x, a, b), tail, { rel: 1e-11, abs: 1e-15 });
      }),
      { numRuns: 300, seed: 11 },
    );
  });

  it('regularizedIncompleteBeta(0.5, 2, 3) is 11/16, I_x(a, 1) = xᵃ and the ends are 0 and 1', () => {
    // (6 + 4 + 1)/16 from the binomial identity
    expectClose(regularizedIncompleteBeta(0.5, 2, 3), 11 / 16, { rel: 1e-14 });
    // closed form by direct integration: I_x(a, 1) = a·∫₀ˣ t^(a−1) dt = xᵃ
    expectClose(regularizedIncompleteBeta(0.3, 2.7, 1), 0.3 ** 2.7, { rel: 1e-13 });
    expect(regularizedIncompleteBeta(0, 2, 3)).toBe(0);
    expect(regularizedIncompleteBeta(1, 2, 3)).toBe(1);
    expect(regularizedIncompleteBeta(1.5, 2, 3)).toBeNaN();
  });

  it('logGamma() equals ln((n−1)!) for integers, ln √π at ½, and obeys the reflection formula', () => {
    let logFactorial = 0;
    for (let n = 1; n <= 171; n++) {
      // independent: ln((n−1)!) summed directly
      expectClose(logGamma(n), logFactorial, { rel: 1e-13, abs: 1e-14 }, `n = ${n}`);
      logFactorial += Math.log(n);
    }
    // Γ(½) = √π (A&S 6.1.8)
    expectClose(logGamma(0.5), 0.5 * Math.log(Math.PI), { rel: 1e-14 });
    // Γ(x)Γ(1 − x) = π/sin(πx) (A&S 6.1.17)
    expectClose(logGamma(0.1) + logGamma(0.9), Math.log(Math.PI / Math.sin(0.1 * Math.PI)), { rel: 1e-14 });
    expect(logGamma(0)).toBeNaN();
  });
});
