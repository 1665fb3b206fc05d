import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { fitLeastSquares } from './least-squares';
import type { LeastSquaresProblem } from './least-squares-types';
import { fitMultiStart } from './multi-start-fit';

const x = Float64Array.from({ length: 41 }, (_, i) => 0.5 * i);
/** y = cos(ω·x) with ω = 1.3: χ²(ω) has many local minima. */
const wave: LeastSquaresProblem = {
  observed: Float64Array.from(x, (xi) => Math.cos(1.3 * xi)),
  parameterCount: 1,
  predict: (t, out) => x.forEach((xi, i) => (out[i] = Math.cos(t[0]! * xi))),
};

describe('fitMultiStart(problem, options, multi)', () => {
  it('fitMultiStart() escapes a local minimum that traps a single start', () => {
    const single = fitLeastSquares(wave, { initial: [0.6] });
    expect(Math.abs(single.params[0]! - 1.3)).toBeGreaterThan(0.05);
    const multi = fitMultiStart(wave, { initial: [0.6] }, { seed: 1, starts: 30, spread: 0.6 });
    expectClose(multi.best.params[0]!, 1.3, { rel: 1e-8 });
    expect(multi.bestStart).toBeGreaterThan(0);
    expect(multi.fits).toBe(31);
  });

  it('fitMultiStart() is reproducible: the same seed gives the same best start and answer', () => {
    const a = fitMultiStart(wave, { initial: [0.6] }, { seed: 77, starts: 12 });
    const b = fitMultiStart(wave, { initial: [0.6] }, { seed: 77, starts: 12 });
    expect(b.bestStart).toBe(a.bestStart);
    expect(Array.from(b.best.params)).toEqual(Array.from(a.best.params));
  });

  it('fitMultiStart() never moves fixed parameters and evaluates only inside the bounds', () => {
    const seen: number[][] = [];
    const recorder: LeastSquaresProblem = {
      observed: wave.observed,
      parameterCount: 2,
      predict: (t, out) => {
        seen.push([t[0]!, t[1]!]);
        x.forEach((xi, i) => (out[i] = t[1]! * Math.cos(t[0]! * xi)));
      },
    };
    fitMultiStart(recorder, { initial: [1.2, 1], fixed: [false, true], lower: [1, -Infinity], upper: [1.5, Infinity] }, { seed: 5 });
    // bounds are inclusive: a transformed parameter may land exactly on one
    expect(seen.every(([omega, amplitude]) => amplitude === 1 && omega! >= 1 && omega! <= 1.5)).toBe(true);
  });
});
