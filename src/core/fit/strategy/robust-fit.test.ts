import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { fitLeastSquares } from '../engine/least-squares';
import type { LeastSquaresProblem } from '../engine/least-squares-types';
import { fitRobust } from './robust-fit';

/** Root of a decreasing function by bisection (independent of the IRLS iteration). */
function bisect(f: (x: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

describe('fitRobust(problem, options, robust)', () => {
  const sample = Float64Array.of(9.7, 10.4, 10.1, 9.9, 10.2, 9.6, 10.3, 14.5, 10.0, 9.8);
  const location: LeastSquaresProblem = { observed: sample, parameterCount: 1, predict: (t, out) => out.fill(t[0]!) };
  const sigma = new Float64Array(sample.length).fill(0.25);

  it("fitRobust('huber') of a location solves Σψ((y − μ)/σ) = 0 (Huber 1981 M-estimator)", () => {
    const c = 1.345;
    const psi = (u: number): number => Math.max(-c, Math.min(c, u));
    const expected = bisect((mu) => sample.reduce((s, y) => s + psi((y - mu) / 0.25), 0), 0, 20);
    const fit = fitRobust(location, { initial: [5], standardUncertainty: sigma }, { loss: 'huber' });
    expect(fit.settled).toBe(true);
    expectClose(fit.solution.params[0]!, expected, { rel: 1e-6 });
    expect(fit.scale).toBe(1);
    expect(fit.outliers).toEqual(Array.from(sample, (y) => y === 14.5));
  });

  it("fitRobust('soft-l1') of a location solves Σ u/√(1 + u²/c²) = 0", () => {
    const psi = (u: number): number => u / Math.sqrt(1 + u * u);
    const expected = bisect((mu) => sample.reduce((s, y) => s + psi((y - mu) / 0.25), 0), 0, 20);
    const fit = fitRobust(location, { initial: [5], standardUncertainty: sigma }, { loss: 'soft-l1' });
    expectClose(fit.solution.params[0]!, expected, { rel: 1e-6 });
  });

  it('fitRobust() with unknown σ resists one gross outlier in a line and flags only that reading', () => {
    const x = Float64Array.from({ length: 12 }, (_, i) => i);
    const noise = [0.05, -0.08, 0.02, 0.07, -0.03, -0.06, 0.04, 0.01, -0.05, 0.08, -0.02, 0.03];
    const y = Float64Array.from(x, (xi, i) => 1 + 2 * xi + noise[i]!);
    y[9] = y[9]! + 6;
    const line: LeastSquaresProblem = { observed: y, parameterCount: 2, predict: (t, out) => x.forEach((xi, i) => (out[i] = t[0]! + t[1]! * xi)) };
    const plain = fitLeastSquares(line, { initial: [0, 1] });
    const robust = fitRobust(line, { initial: [0, 1] }, { loss: 'huber' });
    // truth (1, 2): ordinary LS is pulled by the outlier, Huber is not
    expect(Math.abs(plain.params[1]! - 2)).toBeGreaterThan(0.1);
    expectClose(robust.solution.params[1]!, 2, { abs: 0.02 });
    expect(robust.outliers.map((flag, i) => (flag ? i : -1)).filter((i) => i >= 0)).toEqual([9]);
    expect(robust.robustWeights[9]!).toBeLessThan(0.1);
  });
});
