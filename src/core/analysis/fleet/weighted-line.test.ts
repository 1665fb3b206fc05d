import { describe, it, expect } from 'vitest';
import { weightedLine } from './weighted-line';
import { expectClose } from '../../../../test/support/expect-close';

// NIST StRD linear regression dataset Norris (36 observations, y then x), as distributed
// at itl.nist.gov/div898/strd/lls/data/Norris.shtml
const norrisY = [0.1, 338.8, 118.1, 888.0, 9.2, 228.1, 668.5, 998.5, 449.1, 778.9, 559.2, 0.3, 0.1, 778.1, 668.8, 339.3, 448.9, 10.8, 557.7, 228.3,
  998.0, 888.8, 119.6, 0.3, 0.6, 557.6, 339.3, 888.0, 998.5, 778.9, 10.2, 117.6, 228.9, 668.4, 449.2, 0.2];
const norrisX = [0.2, 337.4, 118.2, 884.6, 10.1, 226.5, 666.3, 996.3, 448.6, 777.0, 558.2, 0.4, 0.6, 775.5, 666.9, 338.0, 447.5, 11.6, 556.0, 228.1,
  995.8, 887.6, 120.2, 0.3, 0.3, 556.8, 339.1, 887.2, 999.0, 779.0, 11.1, 118.3, 229.2, 669.1, 448.9, 0.5];

describe('weightedLine()', () => {
  it('weightedLine() with equal small σ reproduces the NIST StRD Norris certified values', () => {
    // With σ far below the scatter, the Birge ratio turns the weighted errors into the OLS
    // errors with s² = RSS/(n − 2), which is what NIST certifies.
    const line = weightedLine(norrisX, norrisY, norrisX.map(() => 1e-3));
    // NIST StRD certified values (Norris)
    expectClose(line.slope, 1.00211681802045, { rel: 1e-12 });
    expectClose(line.intercept, -0.262323073774029, { rel: 1e-10 });
    expectClose(line.slopeStandardError, 0.429796848199937e-3, { rel: 1e-9 });
    expectClose(line.interceptStandardError, 0.232818234301152, { rel: 1e-9 });
    // NIST StRD certified residual sum of squares 26.6173985294224 (χ² = RSS/σ²)
    expectClose(line.chiSquare * 1e-6, 26.6173985294224, { rel: 1e-9 });
    expect(line.degreesOfFreedom).toBe(34);
  });

  it('weightedLine() keeps stated σ when the scatter is smaller (σ_b² = 1/Σw(x − x̄)²)', () => {
    // exact line: χ² = 0, so the Birge ratio is 1 and σ_b follows from the weights alone
    const line = weightedLine([0, 1, 2, 3], [10, 9, 8, 7], [0.5, 0.5, 0.5, 0.5]);
    expectClose(line.slope, -1, { rel: 1e-14 });
    expect(line.scatterScale).toBe(1);
    // Σw(x − x̄)² = 4·(2.25 + 0.25 + 0.25 + 2.25) = 20 → σ_b = 1/√20 (hand calculation)
    expectClose(line.slopeStandardError, 1 / Math.sqrt(20), { rel: 1e-14 });
  });

  it('weightedLine() gives a precise point more pull than an imprecise one', () => {
    // two points with σ = 0.01 on y = x, a third far off with σ = 100: the line follows the precise ones
    const line = weightedLine([0, 1, 2], [0, 1, 50], [0.01, 0.01, 100]);
    expectClose(line.slope, 1, { rel: 1e-3 });
  });

  it('weightedLine() rejects fewer than two points, bad σ and equal x', () => {
    expect(() => weightedLine([1], [1], [1])).toThrow(RangeError);
    expect(() => weightedLine([1, 2], [1, 2], [1, 0])).toThrow(/σ\[1\]/);
    expect(() => weightedLine([1, 1], [1, 2], [1, 1])).toThrow(/all x are equal/);
  });
});
