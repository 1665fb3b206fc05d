import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { mulberry32 } from '../random/mulberry32';
import { chiSquareSurvival } from './chi-square-survival';
import { leastSquaresCovariance } from './least-squares-covariance';
import { parameterIntervals } from './parameter-intervals';
import { regularizedUpperGamma } from './regularized-incomplete-gamma';
import { singularValues } from '../linalg/singular-value-decomposition';
import { studentTCdf, studentTDensity } from './student-t-cdf';
import { studentTQuantile } from './student-t-quantile';

// The numbers in the @example lines of the stats and random TSDoc, checked.
describe('TSDoc examples of core/stats and core/random', () => {
  it('every @example value holds', () => {
    // exact: Q(1, x) = e^(−x); P(χ²₂ > x) = e^(−x/2)
    expectClose(regularizedUpperGamma(1, 2), Math.exp(-2), { rel: 1e-14 });
    expectClose(chiSquareSurvival(2, 2), Math.exp(-1), { rel: 1e-14 });
    // Cauchy density at 0 is 1/π
    expectClose(studentTDensity(0, 1), 1 / Math.PI, { rel: 1e-14 });
    // DOMAIN.md §9 row 61, 6 decimals
    expectClose(studentTCdf(2.570582, 5), 0.975, { abs: 1e-6 });
    expectClose(studentTQuantile(0.975, 8), 2.306004, { abs: 5e-7 });
    // 10 − t_0.975(8)·√4 with t from the same row: 10 − 2·2.306004 = 5.387992
    expectClose(parameterIntervals([10], Float64Array.of(4), 8).intervals[0]![0], 5.387992, { abs: 5e-7 });
    // a diagonal matrix's singular values are its |diagonal entries|, largest first
    expect(singularValues([3, 0, 0, 4], 2, 2).values).toEqual([4, 3]);
    // line through x = 0, 1, 2 with σ = 1: Var(slope) = 1/Σ(x − x̄)² = 1/2
    const line = leastSquaresCovariance([1, 0, 1, 1, 1, 2], 3, 2, { scale: 'stated', chiSquare: 0 });
    expectClose(line.covariance![3]!, 0.5, { rel: 1e-14 });
    // regression pin, not truth (the BigInt reference test checks the generator itself)
    expect(mulberry32(42)()).toBe(0.6011037519201636);
  });
});
