import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { akaikeWeights } from './akaike-weights';
import { chiSquareCriteria, leastSquaresCriteria } from './information-criteria';

describe('leastSquaresCriteria(n, K, rss) and chiSquareCriteria(n, K, χ²)', () => {
  it('leastSquaresCriteria(10, 2, 0.5) equals DOMAIN.md §9 row 59', () => {
    const c = leastSquaresCriteria(10, 2, 0.5);
    // DOMAIN.md §9 row 59 [C]: AIC −25.957323, AICc −24.243037, BIC −25.352153
    expectClose(c.aic, -25.957323, { abs: 5e-7 });
    expectClose(c.aicc, -24.243037, { abs: 5e-7 });
    expectClose(c.bic, -25.352153, { abs: 5e-7 });
  });

  it('chiSquareCriteria() replaces n·ln(RSS/n) by χ² (Burnham & Anderson 2002 §2.2)', () => {
    const c = chiSquareCriteria(10, 2, 8);
    // by the definitions in DOMAIN.md §7.2: 8 + 4; + 2·2·3/7; 8 + 2·ln 10
    expectClose(c.aic, 12, { rel: 1e-15 });
    expectClose(c.aicc, 12 + 12 / 7, { rel: 1e-15 });
    expectClose(c.bic, 8 + 2 * Math.log(10), { rel: 1e-15 });
  });

  it('AICc is Infinity when n ≤ K + 1 (the correction is undefined)', () => {
    expect(leastSquaresCriteria(3, 2, 0.1).aicc).toBe(Infinity);
    expect(chiSquareCriteria(4, 4, 1).aicc).toBe(Infinity);
  });
});

describe('akaikeWeights(criteria)', () => {
  it('akaikeWeights([0, 2, 10]) equals DOMAIN.md §9 row 60 and does not depend on the offset', () => {
    // DOMAIN.md §9 row 60 [C]: 0.727475, 0.267623, 0.004902
    const expected = [0.727475, 0.267623, 0.004902];
    for (const offset of [0, -1234.5, 1e4]) {
      akaikeWeights([offset, offset + 2, offset + 10]).forEach((w, i) => expectClose(w, expected[i]!, { abs: 5e-7 }));
    }
  });

  it('akaikeWeights() gives weight 0 to a non-finite criterion and NaN when none is finite', () => {
    expect(akaikeWeights([Infinity, 5, NaN])).toEqual([0, 1, 0]);
    expect(akaikeWeights([Infinity, NaN]).every(Number.isNaN)).toBe(true);
    expect(akaikeWeights([])).toEqual([]);
  });
});
