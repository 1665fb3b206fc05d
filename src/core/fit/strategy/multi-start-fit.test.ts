import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { fitLeastSquares } from '../engine/least-squares';
import type { LeastSquaresProblem } from '../engine/least-squares-types';
import { fitMultiStart, sameMinimum } from './multi-start-fit';

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

  /** y = 3·exp(−0.4·x) plus a small ripple (χ² > 0): one minimum, every start returns to it. */
  const xs = Float64Array.from({ length: 12 }, (_, i) => 0.5 * i);
  const decay: LeastSquaresProblem = {
    observed: Float64Array.from(xs, (xi) => 3 * Math.exp(-0.4 * xi) + 0.01 * Math.cos(7 * xi)),
    parameterCount: 2,
    predict: (t, out) => xs.forEach((xi, i) => (out[i] = t[0]! * Math.exp(-t[1]! * xi))),
  };

  it('fitMultiStart() with agreement 2 stops after two extra starts return to the best minimum, with the answer of all 8', () => {
    const all = fitMultiStart(decay, { initial: [1, 1] }, { seed: 3 });
    const adaptive = fitMultiStart(decay, { initial: [1, 1] }, { seed: 3, agreement: 2 });
    expect(all.fits).toBe(9);
    expect(adaptive.fits).toBe(3);
    expect(adaptive.stoppedBy).toBe('agreement');
    // a single minimum: the same χ² and parameters as the full search (sameMinimum's tolerances)
    expect(sameMinimum(adaptive.best, all.best)).toBe(true);
  });

  it('fitMultiStart() runs no extra start when settled() vouches for the first fit', () => {
    const seen: number[] = [];
    const fit = fitMultiStart(decay, { initial: [1, 1] }, { seed: 3, settled: (first) => (seen.push(first.iterations), first.converged) });
    expect(fit.fits).toBe(1);
    expect(fit.stoppedBy).toBe('settled');
    expect(seen).toHaveLength(1);
  });

  it('fitMultiStart() with agreement still escapes a local minimum: a better fit starts the count again', () => {
    // χ²(ω) of cos(ω·x) has many minima; the start 0.6 is trapped alone (first test)
    const multi = fitMultiStart(wave, { initial: [0.6] }, { seed: 1, starts: 30, spread: 0.6, agreement: 2 });
    expectClose(multi.best.params[0]!, 1.3, { rel: 1e-8 });
    expect(multi.fits).toBeLessThan(31);
  });

  it('sameMinimum() tells the same minimum from a different one by χ² (1e-9 relative) and parameters (1e-4 of their size)', () => {
    const a = fitMultiStart(decay, { initial: [1, 1] }, { seed: 3, starts: 0 }).best;
    const moved = { ...a, params: Float64Array.of(a.params[0]! * (1 + 1e-3), a.params[1]!) };
    const costlier = { ...a, chiSquare: a.chiSquare * (1 + 1e-8) };
    expect(sameMinimum(a, { ...a, params: a.params.slice() })).toBe(true);
    expect(sameMinimum(a, moved)).toBe(false);
    expect(sameMinimum(a, costlier)).toBe(false);
  });

  it('fitMultiStart() with an origin fits the origin itself first, then perturbations of it; starts 0 fits nothing more', () => {
    const firstPoints: number[][] = [];
    let last = -1;
    const recorder: LeastSquaresProblem = {
      ...decay,
      predict: (t, out) => {
        decay.predict(t, out);
        if (t[0] !== last) firstPoints.push([t[0]!, t[1]!]);
        last = t[0]!;
      },
    };
    const withOrigin = fitMultiStart(recorder, { initial: [2, 0.3] }, { seed: 3, starts: 3, origin: [1, 1] });
    expect(withOrigin.fits).toBe(5);
    // the origin is evaluated as it is (a start), not perturbed
    expect(firstPoints.some(([a, b]) => a === 1 && b === 1)).toBe(true);
    expect(fitMultiStart(decay, { initial: [2, 0.3] }, { seed: 3, starts: 0, origin: [1, 1] }).fits).toBe(1);
    expect(fitMultiStart(decay, { initial: [1, 1] }, { seed: 3, starts: 3, origin: [1, 1] }).fits).toBe(4);
  });
});
