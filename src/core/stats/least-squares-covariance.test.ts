import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { correlationMatrix } from './correlation-matrix';
import { deltaMethodVariance } from './delta-method-variance';
import { leastSquaresCovariance, WELL_CONDITIONED } from './least-squares-covariance';
import { parameterIntervals } from './parameter-intervals';
import { singularValues } from '../linalg/singular-value-decomposition';

/** Weighted Jacobian of the line f = a + b·x: rows (1, x)/σ. */
function lineJacobian(x: readonly number[], sigma: readonly number[]): Float64Array {
  return Float64Array.from(x.flatMap((xi, i) => [1 / sigma[i]!, xi / sigma[i]!]));
}

describe('singularValues(a, m, n)', () => {
  it('singularValues() of a 3×2 matrix match the closed form of the 2×2 Gram matrix', () => {
    const a = Float64Array.of(2, 1, 0.5, -3, 4, 0.25);
    const { values, vectors } = singularValues(a, 3, 2);
    // σ² are the eigenvalues of AᵀA = [[p, q], [q, r]]: (p + r ± √((p − r)² + 4q²))/2
    const p = 4 + 0.25 + 16;
    const q = 2 - 1.5 + 1;
    const r = 1 + 9 + 0.0625;
    const root = Math.sqrt((p - r) ** 2 + 4 * q * q);
    expectClose(values[0]! ** 2, (p + r + root) / 2, { rel: 1e-14 });
    expectClose(values[1]! ** 2, (p + r - root) / 2, { rel: 1e-14 });
    // V is orthonormal
    expectClose(vectors[0]! * vectors[1]! + vectors[2]! * vectors[3]!, 0, { abs: 1e-15 });
    expectClose(vectors[0]! ** 2 + vectors[2]! ** 2, 1, { rel: 1e-15 });
  });
});

describe('leastSquaresCovariance(J, n, k, options)', () => {
  const x = [0, 1, 2, 3, 5];
  const sigma = [1, 0.5, 2, 1, 0.25];

  it('leastSquaresCovariance() of a weighted straight line equals the closed form (Bevington & Robinson §6.3)', () => {
    // Δ = Σw·Σwx² − (Σwx)²; Var(a) = Σwx²/Δ, Var(b) = Σw/Δ, Cov(a, b) = −Σwx/Δ
    const w = sigma.map((s) => 1 / (s * s));
    const sw = w.reduce((t, v) => t + v, 0);
    const swx = w.reduce((t, v, i) => t + v * x[i]!, 0);
    const swxx = w.reduce((t, v, i) => t + v * x[i]! ** 2, 0);
    const delta = sw * swxx - swx * swx;
    const result = leastSquaresCovariance(lineJacobian(x, sigma), 5, 2, { scale: 'stated', chiSquare: 7 });
    expect(result.rank).toBe(2);
    const c = result.covariance!;
    expectClose(c[0]!, swxx / delta, { rel: 1e-13 });
    expectClose(c[3]!, sw / delta, { rel: 1e-13 });
    expectClose(c[1]!, -swx / delta, { rel: 1e-13 });
    expectClose(c[2]!, -swx / delta, { rel: 1e-13 });
  });

  it("leastSquaresCovariance() with scale 'estimated' multiplies by s² = χ²/(n − k) (DOMAIN.md §7.4)", () => {
    const stated = leastSquaresCovariance(lineJacobian(x, sigma), 5, 2, { scale: 'stated', chiSquare: 7 });
    const estimated = leastSquaresCovariance(lineJacobian(x, sigma), 5, 2, { scale: 'estimated', chiSquare: 7 });
    expect(estimated.scaleFactor).toBe(7 / 3);
    estimated.covariance!.forEach((v, i) => expectClose(v, (7 / 3) * stated.covariance![i]!, { rel: 1e-14 }));
  });

  it('leastSquaresCovariance() does not depend on parameter units: rescaling a column rescales its variance', () => {
    const j = lineJacobian(x, sigma);
    const inMicro = j.map((v, i) => (i % 2 === 1 ? v * 1e-6 : v));
    const base = leastSquaresCovariance(j, 5, 2, { scale: 'stated', chiSquare: 1 });
    const scaled = leastSquaresCovariance(inMicro, 5, 2, { scale: 'stated', chiSquare: 1 });
    expectClose(scaled.covariance![3]!, base.covariance![3]! * 1e12, { rel: 1e-12 });
    expectClose(scaled.conditionNumber, base.conditionNumber, { rel: 1e-12 });
  });

  it('leastSquaresCovariance() finds the flat direction of two identical columns and returns no covariance', () => {
    // f = a·x + b·x: only a + b is determined; the flat direction is (1, −1)/√2
    const j = Float64Array.from(x.flatMap((xi) => [xi, xi]));
    const result = leastSquaresCovariance(j, 5, 2, { scale: 'stated', chiSquare: 1 });
    expect(result.covariance).toBeNull();
    expect(result.rank).toBe(1);
    expect(result.conditionNumber).toBe(Infinity);
    const [direction] = result.flatDirections;
    expectClose(Math.abs(direction![0]!), Math.SQRT1_2, { rel: 1e-12 });
    expectClose(direction![0]! + direction![1]!, 0, { abs: 1e-12 });
  });

  it('leastSquaresCovariance() returns no covariance when s² is undefined (n = k, estimated scale)', () => {
    const result = leastSquaresCovariance(lineJacobian([0, 1], [1, 1]), 2, 2, { scale: 'estimated', chiSquare: 0 });
    expect(result.covariance).toBeNull();
    expect(result.rank).toBe(2);
  });
});

describe('leastSquaresCovariance(): R⁻¹ when well-conditioned, the SVD otherwise', () => {
  /** Covariance V·Σ⁻²·Vᵀ from a Jacobi SVD of the whole tall J (no QR, no triangular inverse). */
  function bySvdOfJ(j: Float64Array, n: number, k: number): { covariance: number[]; condition: number; weakest: number[] } {
    const norms = Array.from({ length: k }, (_, c) => Math.hypot(...Array.from({ length: n }, (_, i) => j[i * k + c]!)));
    const { values, vectors } = singularValues(Array.from(j, (v, i) => v / norms[i % k]!), n, k);
    const covariance = Array.from({ length: k * k }, (_, e) => {
      const [a, b] = [Math.floor(e / k), e % k];
      return values.reduce((t, s, c) => t + (vectors[a * k + c]! * vectors[b * k + c]!) / (s * s), 0) / (norms[a]! * norms[b]!);
    });
    return { covariance, condition: values[0]! / values[k - 1]!, weakest: Array.from({ length: k }, (_, r) => vectors[r * k + k - 1]!) };
  }
  /** Cubic polynomial a + b·x + c·x² + d·x³ on x = x0 … x0 + 1: columns nearly dependent as x0 grows. */
  function cubic(x0: number): Float64Array {
    return Float64Array.from(Array.from({ length: 12 }, (_, i) => x0 + i / 11).flatMap((x) => [1, x, x * x, x * x * x]));
  }

  it('leastSquaresCovariance(): a well-conditioned fit gives the covariance, condition number and weakest direction of the SVD of J', () => {
    // x in [0, 1]: σ_max/σ_min of the equilibrated J is a few hundred, far below the switch
    const j = cubic(0);
    const result = leastSquaresCovariance(j, 12, 4, { scale: 'stated', chiSquare: 1 });
    const reference = bySvdOfJ(j, 12, 4);
    expect(reference.condition).toBeLessThan(WELL_CONDITIONED / 100);
    expect(result.rank).toBe(4);
    expect(result.flatDirections).toEqual([]);
    // a triangular inverse is good to about u·κ relative (Higham, Accuracy and Stability, 2nd ed., ch. 8)
    result.covariance!.forEach((v, e) => expectClose(v, reference.covariance[e]!, { rel: 1e-11, abs: 1e-11 * Math.abs(reference.covariance[0]!) }));
    expectClose(result.conditionNumber, reference.condition, { rel: 1e-10 });
    const sign = Math.sign(result.weakestDirection[0]! * reference.weakest[0]!);
    result.weakestDirection.forEach((v, r) => expectClose(sign * v, reference.weakest[r]!, { abs: 1e-9 }));
  });

  it('leastSquaresCovariance(): past the switch the SVD decides, and the covariance still matches the SVD of J', () => {
    // x in [30, 31]: σ_max/σ_min of the equilibrated J is about 1e7, above WELL_CONDITIONED, below the rank tolerance
    const j = cubic(30);
    const reference = bySvdOfJ(j, 12, 4);
    expect(reference.condition).toBeGreaterThan(WELL_CONDITIONED);
    expect(reference.condition).toBeLessThan(1e10);
    const result = leastSquaresCovariance(j, 12, 4, { scale: 'stated', chiSquare: 1 });
    expect(result.rank).toBe(4);
    expectClose(result.conditionNumber, reference.condition, { rel: 1e-6 });
    // error grows with κ (Golub & Van Loan, 4th ed., §5.3): compare the well-determined diagonal
    for (let a = 0; a < 4; a++) expectClose(result.covariance![a * 4 + a]!, reference.covariance[a * 4 + a]!, { rel: 1e-6 });
  });
});

describe('parameterIntervals(), correlationMatrix(), deltaMethodVariance()', () => {
  it('parameterIntervals() is θ̂ ± t_{0.975, ν}·√C with t from DOMAIN.md §9 row 61', () => {
    const { intervals, standardErrors, coverageFactor } = parameterIntervals([10, -1], Float64Array.of(4, 0, 0, 0.25), 8);
    // DOMAIN.md §9 row 61: t_0.975(8) = 2.306004
    expectClose(coverageFactor, 2.306004, { abs: 5e-7 });
    expect(Array.from(standardErrors)).toEqual([2, 0.5]);
    expectClose(intervals[0]![0], 10 - 2 * coverageFactor, { rel: 1e-15 });
    expectClose(intervals[1]![1], -1 + 0.5 * coverageFactor, { rel: 1e-15 });
  });

  it('correlationMatrix() divides by the standard deviations (DOMAIN.md §7.4)', () => {
    expect(Array.from(correlationMatrix(Float64Array.of(4, -3, -3, 9), 2))).toEqual([1, -0.5, -0.5, 1]);
  });

  it('deltaMethodVariance() is ∇gᵀC∇g: Var(θ₁ + θ₂) = Var₁ + Var₂ + 2Cov', () => {
    // JCGM 100:2008 eq. (13)
    expect(deltaMethodVariance([1, 1], Float64Array.of(1, -1, -1, 4))).toBe(3);
  });
});
