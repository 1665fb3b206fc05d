import { describe, expect, it } from 'vitest';
import { getModel } from '../../models';
import type { SurveyPoints } from '../../models/field-model';
import { fieldModelProblem } from './field-model-problem';
import { fitLeastSquares } from '../engine/least-squares';
import { settledFit } from './settled-fit';

const square = getModel('inverse-square');
const distance = Array.from({ length: 15 }, (_, i) => 0.02 + 0.02 * i);
/** A/(d + δ)² + b at θ with a ripple of ±1 % so that χ² > 0. */
function readings(theta: number[]): SurveyPoints {
  const points: SurveyPoints = {
    n: distance.length, distance: Float64Array.from(distance), radial: new Float64Array(distance.length), field: new Float64Array(distance.length), kind: 'magnitude',
  };
  square.evaluate(Float64Array.from(theta), points, points.field as Float64Array);
  (points.field as Float64Array).forEach((b, i, all) => (all[i] = b * (1 + 0.01 * Math.cos(3 * i))));
  return points;
}

describe('settledFit(model, points, fit, sigma, scanned, range, box)', () => {
  const points = readings([4e-6, 0.01, 2e-6]);
  const problem = fieldModelProblem(square, points);

  it('settledFit() accepts a converged fit inside its box (gradient cosines ≤ 1e-5) and refuses the same fit stopped early', () => {
    // KKT: an interior minimum has the residuals orthogonal to every Jacobian column
    const box = { lower: [-Infinity, -0.02, -Infinity], upper: [Infinity, 0.3, Infinity] };
    const fit = fitLeastSquares(problem, { initial: [1e-6, 0.005, 0], ...box });
    expect(fit.converged).toBe(true);
    expect(settledFit(square, points, fit, null, 1, [0, 0.3], box)).toBe(true);
    const early = fitLeastSquares(problem, { initial: [1e-6, 0.005, 0], ...box, maxEvaluations: 2 });
    expect(settledFit(square, points, early, null, 1, [0, 0.3], box)).toBe(false);
  });

  it('settledFit() accepts the scanned offset on the bound it is pushed against, and no other parameter there', () => {
    // the optimum δ = 10 mm lies above an upper bound of 5 mm: the fit ends on it (active constraint)
    const box = { lower: [-Infinity, -0.02, -Infinity], upper: [Infinity, 0.005, Infinity] };
    const fit = fitLeastSquares(problem, { initial: [1e-6, 0.004, 0], ...box });
    expect(fit.atBound[1]).toBe(true);
    expect(settledFit(square, points, fit, null, 1, [0, 0.005], box)).toBe(true);
    expect(settledFit(square, points, fit, null, -1, [], box)).toBe(false);
    // a bound the scan never reached is no evidence
    expect(settledFit(square, points, fit, null, 1, [0, 0.004], box)).toBe(false);
  });

  it('settledFit() refuses a fit whose source part has shrunk below 1e-3 of the largest reading (a constant)', () => {
    // only the background free, amplitude held near 0: the curve says nothing about the model's shape
    const box = { lower: [-Infinity, -0.02, -Infinity], upper: [Infinity, 0.3, Infinity] };
    const flat = fitLeastSquares(problem, { initial: [1e-12, 0.01, 0], fixed: [true, true, false], ...box });
    expect(flat.converged).toBe(true);
    expect(settledFit(square, points, flat, null, -1, [], box)).toBe(false);
  });
});
