import { describe, expect, it } from 'vitest';
import { fitLeastSquares } from './least-squares';

// The number in fitLeastSquares' @example, checked.
describe('TSDoc example of fitLeastSquares()', () => {
  it('y = a·x through (1, 2) and (2, 4) gives a = 2', () => {
    const fit = fitLeastSquares(
      { observed: Float64Array.of(2, 4), parameterCount: 1, predict: (t, out) => ((out[0] = t[0]!), (out[1] = 2 * t[0]!)) },
      { initial: [1] },
    );
    expect(fit.params[0]).toBeCloseTo(2, 12);
    expect(fit.stopCode).toBe('exact-fit');
  });
});
