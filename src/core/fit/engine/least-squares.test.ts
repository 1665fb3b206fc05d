import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { isRingfallError } from '../../errors';
import { fitLeastSquares } from './least-squares';
import type { LeastSquaresProblem } from './least-squares-types';
import { createLeastSquaresWorkspace } from './least-squares-workspace';

const x = Float64Array.of(0, 1, 2, 3, 4, 5, 6, 7);
const y = Float64Array.of(1.1, 2.9, 5.2, 6.8, 9.1, 11.2, 12.8, 15.1);
const sigma = Float64Array.of(0.1, 0.2, 0.1, 0.3, 0.1, 0.2, 0.4, 0.1);

/** f = a + b·x with its analytic Jacobian. */
function line(observed = y, withJacobian = true): LeastSquaresProblem {
  const problem: LeastSquaresProblem = {
    observed,
    parameterCount: 2,
    predict: (t, out) => x.forEach((xi, i) => (out[i] = t[0]! + t[1]! * xi)),
  };
  return withJacobian
    ? { ...problem, jacobian: (_, out) => x.forEach((xi, i) => ((out[2 * i] = 1), (out[2 * i + 1] = xi))) }
    : problem;
}

/** Weighted straight-line solution in closed form (Bevington & Robinson, 3rd ed., §6.3). */
function weightedLine(weights: ArrayLike<number>): [number, number] {
  let s = 0, sx = 0, sy = 0, sxx = 0, sxy = 0;
  for (let i = 0; i < x.length; i++) {
    const w = weights[i]!;
    s += w; sx += w * x[i]!; sy += w * y[i]!; sxx += w * x[i]! ** 2; sxy += w * x[i]! * y[i]!;
  }
  const delta = s * sxx - sx * sx;
  return [(sxx * sy - sx * sxy) / delta, (s * sxy - sx * sy) / delta];
}

/** f = a·exp(−b·x), nonlinear. */
const decay: LeastSquaresProblem = {
  observed: Float64Array.from(x, (xi) => 3 * Math.exp(-0.4 * xi)),
  parameterCount: 2,
  predict: (t, out) => x.forEach((xi, i) => (out[i] = t[0]! * Math.exp(-t[1]! * xi))),
};

describe('fitLeastSquares(problem, options)', () => {
  it('fitLeastSquares() reproduces the closed-form weighted straight line, with and without a Jacobian', () => {
    const [a, b] = weightedLine(Array.from(sigma, (s) => 1 / (s * s)));
    for (const analytic of [true, false]) {
      const fit = fitLeastSquares(line(y, analytic), { initial: [0, 0], standardUncertainty: sigma });
      expect(fit.converged).toBe(true);
      expectClose(fit.params[0]!, a, { rel: 1e-9 });
      expectClose(fit.params[1]!, b, { rel: 1e-9 });
      let chiSquare = 0;
      x.forEach((xi, i) => (chiSquare += ((y[i]! - a - b * xi) / sigma[i]!) ** 2));
      expectClose(fit.chiSquare, chiSquare, { rel: 1e-12 });
    }
  });

  it('fitLeastSquares() recovers the parameters that generated noiseless data (exact fit)', () => {
    const fit = fitLeastSquares(decay, { initial: [1, 1] });
    expect(fit.converged).toBe(true);
    // the values that generated `decay` (a = 3, b = 0.4); noiseless, so RSS is rounding only
    expectClose(fit.params[0]!, 3, { rel: 1e-10 });
    expectClose(fit.params[1]!, 0.4, { rel: 1e-10 });
    expect(fit.rss).toBeLessThan(1e-20);
  });

  it('fitLeastSquares() removes a fixed parameter: its value stays exact and the rest is the 1-D optimum', () => {
    const fit = fitLeastSquares(line(), { initial: [0, 2.05], fixed: [false, true], standardUncertainty: sigma });
    expect(fit.params[1]).toBe(2.05);
    expect(fit.freeIndices).toEqual([0]);
    expect(fit.jacobian).toHaveLength(x.length);
    // with b fixed, â = Σw(y − b·x)/Σw
    let num = 0, den = 0;
    x.forEach((xi, i) => ((num += (y[i]! - 2.05 * xi) / sigma[i]! ** 2), (den += 1 / sigma[i]! ** 2)));
    expectClose(fit.params[0]!, num / den, { rel: 1e-10 });
  });

  it('fitLeastSquares() stops on an active bound at the constrained optimum instead of clamping', () => {
    const [, slope] = weightedLine(Array.from(sigma, (s) => 1 / (s * s)));
    const cap = 1.9;
    expect(slope).toBeGreaterThan(cap);
    const fit = fitLeastSquares(line(), { initial: [0, 1], upper: [Infinity, cap], standardUncertainty: sigma });
    expect(fit.converged).toBe(true);
    expectClose(fit.params[1]!, cap, { rel: 1e-7 });
    expect(fit.atBound).toEqual([false, true]);
    // on the bound, â is the 1-D optimum with b = cap (Karush–Kuhn–Tucker)
    let num = 0, den = 0;
    x.forEach((xi, i) => ((num += (y[i]! - cap * xi) / sigma[i]! ** 2), (den += 1 / sigma[i]! ** 2)));
    expectClose(fit.params[0]!, num / den, { rel: 1e-6 });
    expect(fit.warnings.some((w) => w.includes('bound'))).toBe(true);
  });

  it('fitLeastSquares() with inactive two-sided bounds gives the unbounded answer', () => {
    const free = fitLeastSquares(decay, { initial: [1, 1] });
    const boxed = fitLeastSquares(decay, { initial: [1, 1], lower: [0, 0.01], upper: [10, 5] });
    expectClose(boxed.params[0]!, free.params[0]!, { rel: 1e-9 });
    expectClose(boxed.params[1]!, free.params[1]!, { rel: 1e-9 });
    expect(boxed.atBound).toEqual([false, false]);
  });

  it('fitLeastSquares() moves a start that sits on its bound inside and says so', () => {
    const fit = fitLeastSquares(decay, { initial: [0, 1], lower: [0, -Infinity] });
    expect(fit.warnings[0]).toMatch(/start of parameter 0 .* moved/);
    // a = 3 generated `decay`
    expectClose(fit.params[0]!, 3, { rel: 1e-8 });
  });

  it('fitLeastSquares() moves a start within rounding of a two-sided bound inside, so the search does not stall there', () => {
    // the sine transform is flat on the bound (bound-transform.ts); noiseless data: a = 3, b = 0.4 exactly
    const fit = fitLeastSquares(decay, { initial: [1, 2 - 1e-15], lower: [-Infinity, 0], upper: [Infinity, 2] });
    expect(fit.converged).toBe(true);
    expect(fit.warnings[0]).toMatch(/start of parameter 1 .* moved to 1\.998/);
    expectClose(fit.params[0]!, 3, { rel: 1e-10 });
    expectClose(fit.params[1]!, 0.4, { rel: 1e-10 });
  });

  it('fitLeastSquares() never throws on non-convergence: budget and abort give converged false and a reason', () => {
    const budget = fitLeastSquares(decay, { initial: [100, 5], maxEvaluations: 2 });
    expect(budget).toMatchObject({ converged: false, stopCode: 'max-evaluations' });
    expect(budget.stopReason).toMatch(/budget of 2 evaluations/);
    const aborted = fitLeastSquares(decay, { initial: [1, 1], signal: { aborted: true } });
    expect(aborted).toMatchObject({ converged: false, stopCode: 'aborted', iterations: 0 });
    const iterations = fitLeastSquares(decay, { initial: [1, 1], maxIterations: 1 });
    expect(iterations).toMatchObject({ converged: false, stopCode: 'max-iterations', iterations: 1 });
  });

  it('fitLeastSquares() reports a non-finite start and rejects non-finite trial points', () => {
    let nonFinite = 0;
    const sqrtModel: LeastSquaresProblem = {
      observed: Float64Array.of(1, 2, 3),
      parameterCount: 1,
      predict: (t, out) => {
        [1, 2, 3].forEach((k, i) => (out[i] = k * Math.sqrt(t[0]! - 1)));
        if (!Number.isFinite(out[0])) nonFinite += 1;
      },
    };
    expect(fitLeastSquares(sqrtModel, { initial: [0] })).toMatchObject({ converged: false, stopCode: 'non-finite-start' });
    // from θ = 50 the first long step crosses θ = 1 into NaN; such steps count as failures
    nonFinite = 0;
    const fit = fitLeastSquares(sqrtModel, { initial: [50] });
    expect(nonFinite).toBeGreaterThan(0);
    expect(fit.converged).toBe(true);
    // k·√(θ − 1) = k for k = 1, 2, 3 at θ = 2
    expectClose(fit.params[0]!, 2, { rel: 1e-9 });
  });

  it('fitLeastSquares() stops with non-finite-jacobian instead of iterating on NaN derivatives', () => {
    const broken: LeastSquaresProblem = { ...decay, jacobian: (_, out) => out.fill(NaN) };
    const fit = fitLeastSquares(broken, { initial: [1, 1] });
    expect(fit).toMatchObject({ converged: false, stopCode: 'non-finite-jacobian', iterations: 0 });
  });

  it('every accepted step lowers χ²: χ² after i iterations decreases strictly with i', () => {
    const start = new Float64Array(x.length);
    decay.predict(Float64Array.of(10, 2), start);
    let previous = start.reduce((sum, f, i) => sum + (decay.observed[i]! - f) ** 2, 0);
    let steps = 0;
    for (let i = 1; i <= 50; i++) {
      const fit = fitLeastSquares(decay, { initial: [10, 2], maxIterations: i });
      expect(fit.chiSquare).toBeLessThan(previous);
      previous = fit.chiSquare;
      steps = fit.iterations;
      if (fit.converged) break;
    }
    // regression pin, not truth: the search from (10, 2) takes more than 4 steps, so the loop above checked several
    expect(steps).toBeGreaterThan(4);
  });

  it('fitLeastSquares() result does not depend on the order of the observations', () => {
    fc.assert(
      fc.property(fc.shuffledSubarray([0, 1, 2, 3, 4, 5, 6, 7], { minLength: 8, maxLength: 8 }), (order) => {
        const xs = Float64Array.from(order, (i) => x[i]!);
        const ys = Float64Array.from(order, (i) => y[i]! * Math.exp(-0.1 * x[i]!));
        const problem: LeastSquaresProblem = {
          observed: ys,
          parameterCount: 2,
          predict: (t, out) => xs.forEach((xi, i) => (out[i] = t[0]! * xi * Math.exp(-t[1]! * xi))),
        };
        const fit = fitLeastSquares(problem, { initial: [1, 0.5] });
        const reference = fitLeastSquares(
          { ...problem, observed: Float64Array.from(x, (xi, i) => y[i]! * Math.exp(-0.1 * xi)), predict: (t, out) => x.forEach((xi, i) => (out[i] = t[0]! * xi * Math.exp(-t[1]! * xi))) },
          { initial: [1, 0.5] },
        );
        expectClose(fit.params[0]!, reference.params[0]!, { rel: 1e-9 });
        expectClose(fit.params[1]!, reference.params[1]!, { rel: 1e-9 });
      }),
      { numRuns: 30, seed: 3 },
    );
  });

  it('fitLeastSquares() gives bit-identical results whatever a reused workspace held before (pooled workspaces keep batches deterministic)', () => {
    // every buffer filled with garbage, including entries past the free-parameter count
    const dirty = createLeastSquaresWorkspace(x.length, 2);
    const fill = (value: unknown, garbage: number): void => {
      if (value instanceof Float64Array || value instanceof Int32Array || value instanceof Uint8Array) value.fill(garbage);
      else if (value !== null && typeof value === 'object') Object.values(value).forEach((inner) => fill(inner, garbage));
    };
    const bounded = { initial: [1, 1], lower: [0, 0.01], upper: [10, 5], standardUncertainty: sigma };
    for (const options of [bounded, { ...bounded, fixed: [false, true] }]) {
      for (const garbage of [NaN, 1e300, -3]) {
        fill(dirty, garbage);
        const fresh = fitLeastSquares(decay, options, createLeastSquaresWorkspace(x.length, 2));
        const reused = fitLeastSquares(decay, options, dirty);
        expect(Array.from(reused.params)).toEqual(Array.from(fresh.params));
        expect(reused.jacobian).toEqual(fresh.jacobian);
        expect(reused.evaluations).toBe(fresh.evaluations);
      }
    }
  });

  it('fitLeastSquares() gives identical results with a reused workspace', () => {
    const workspace = createLeastSquaresWorkspace(x.length, 2);
    const first = fitLeastSquares(decay, { initial: [1, 1] }, workspace);
    fitLeastSquares(line(), { initial: [5, 5] }, workspace);
    const again = fitLeastSquares(decay, { initial: [1, 1] }, workspace);
    expect(Array.from(again.params)).toEqual(Array.from(first.params));
    expect(again.evaluations).toBe(first.evaluations);
  });

  it('fitLeastSquares() with every parameter fixed evaluates once and reports nothing to fit', () => {
    const fit = fitLeastSquares(line(), { initial: [1, 2], fixed: [true, true] });
    expect(fit).toMatchObject({ converged: true, stopCode: 'no-free-parameters', evaluations: 1 });
    expect(Array.from(fit.params)).toEqual([1, 2]);
  });

  it('fitLeastSquares() throws FIT_UNDERDETERMINED for fewer readings than free parameters', () => {
    const tiny: LeastSquaresProblem = { observed: Float64Array.of(1), parameterCount: 2, predict: (t, out) => (out[0] = t[0]! + t[1]!) };
    try {
      fitLeastSquares(tiny, { initial: [0, 0] });
      expect.unreachable();
    } catch (error) {
      expect(isRingfallError(error, 'FIT_UNDERDETERMINED')).toBe(true);
      expect((error as Error).message).toMatch(/1 readings for 2 free parameters/);
    }
  });

  it('fitLeastSquares() rejects malformed input with RangeError naming the field', () => {
    expect(() => fitLeastSquares(line(), { initial: [0] })).toThrow(/initial has length 1, expected 2/);
    expect(() => fitLeastSquares(line(), { initial: [0, 0], standardUncertainty: new Float64Array(8) })).toThrow(RangeError);
    expect(() => fitLeastSquares(line(), { initial: [0, 0], lower: [1, 0], upper: [0, 1] })).toThrow(/lower bound 1 above upper bound 0/);
    expect(() => fitLeastSquares(line(Float64Array.of(1, 2, 3, 4, 5, 6, 7, NaN)), { initial: [0, 0] })).toThrow(/observed\[7\]/);
  });
});
