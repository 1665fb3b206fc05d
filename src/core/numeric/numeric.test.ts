import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { brentMinimum } from './brent-minimum';
import { logLogLine } from './log-log-line';
import { medianOf, sampleQuantile } from './order-statistics';

describe('core/numeric', () => {
  it('brentMinimum() finds the minimum of (x − 1)² on [0, 3] to 1e-8 (its TSDoc example), and of cos x on [2, 4] at π in few evaluations', () => {
    // exact minima: x = 1; cos x is least at x = π (parabolic steps converge superlinearly, Brent 1973 ch. 5)
    expectClose(brentMinimum((x) => (x - 1) ** 2, 0, 3, 1e-8, 50), 1, { abs: 1e-8 });
    let evaluations = 0;
    const x = brentMinimum((t) => (evaluations++, Math.cos(t)), 2, 4, 1e-7, 50);
    expectClose(x, Math.PI, { abs: 1e-7 });
    // golden section alone would need log(2/1e-7)/log(1.618) ≈ 35 evaluations
    expect(evaluations).toBeLessThan(15);
  });

  it('logLogLine() returns slope −2 for exact inverse-square data and null with one usable point', () => {
    // definition of the OLS line (common practice)
    const line = logLogLine(Float64Array.of(0.1, 0.2, 0.4), Float64Array.of(1e-4, 2.5e-5, 6.25e-6))!;
    expectClose(line.slope, -2, { rel: 1e-14 });
    expectClose(Math.exp(line.intercept), 1e-6, { rel: 1e-12 });
    expect(logLogLine(Float64Array.of(0, 0.2), Float64Array.of(1, 2))).toBeNull();
  });

  it('medianOf() is the middle value, or the mean of the middle two, of the finite values', () => {
    // definition of the sample median (common practice)
    expect(medianOf([3, 1, 2])).toBe(2);
    expect(medianOf([4, NaN, 1, 3, 2, Infinity])).toBe(2.5);
    expect(medianOf([NaN])).toBeNaN();
  });

  it('sampleQuantile() interpolates between order statistics (Hyndman & Fan 1996, type 7)', () => {
    // type 7 is R's default quantile(): quantile(c(1, 2, 4, 8), 0.25) = 1.75
    expect(sampleQuantile([1, 2, 4, 8], 0.25)).toBe(1.75);
    expect(sampleQuantile([1, 2, 4, 8], 1)).toBe(8);
  });
});
