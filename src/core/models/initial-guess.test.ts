import { describe, expect, it } from 'vitest';
import { getModel } from './index';
import type { FieldModel, SurveyPoints } from './field-model';
import { halfValueRadius } from './half-value-radius';
import { radialDistance, readingSign } from './initial-guess';
import { medianOf } from '../numeric/order-statistics';
import { fitLeastSquares } from '../fit/engine/least-squares';
import { fieldModelProblem } from '../fit/strategy/field-model-problem';
import { expectClose } from '../../../test/support/expect-close';

/** A survey whose readings are the model's own predictions (noise-free). */
const synthetic = (model: FieldModel, params: number[], distance: number[], radial?: number[], kind: SurveyPoints['kind'] = 'magnitude'): SurveyPoints => {
  const points: SurveyPoints = {
    n: distance.length,
    distance: Float64Array.from(distance),
    radial: Float64Array.from(radial ?? distance.map(() => 0)),
    field: new Float64Array(distance.length),
    kind,
  };
  model.evaluate(Float64Array.from(params), points, points.field as Float64Array);
  return points;
};
const evenly = (from: number, to: number, count: number) => Array.from({ length: count }, (_, i) => from + ((to - from) * i) / (count - 1));

describe('initialGuess()', () => {
  it('halfValueRadius() finds R from the distance where the field halves (z½ = 0.7664 R)', () => {
    // DOMAIN.md §1.1 and §9 row 6
    const points = synthetic(getModel('loop'), [400, 0.05, 0, 0], evenly(0, 0.15, 301));
    expectClose(halfValueRadius(points)!, 0.05, { rel: 2e-4 });
    // starting 20 mm out still works: R² = (z½² − 2^(2/3) z₀²)/(2^(2/3) − 1)
    expectClose(halfValueRadius(synthetic(getModel('loop'), [400, 0.05, 0, 0], evenly(0.02, 0.2, 361)))!, 0.05, { rel: 2e-4 });
    expect(halfValueRadius(synthetic(getModel('loop'), [400, 0.05, 0, 0], evenly(0, 0.02, 5)))).toBeUndefined();
  });

  it('loop initialGuess() recovers N·I and R from noise-free readings', () => {
    // the guess scans R with the best N·I in closed form; exact data have zero misfit at the truth
    const guess = getModel('loop').initialGuess(synthetic(getModel('loop'), [400, 0.05, 0, 0], evenly(0, 0.15, 15)));
    expectClose(guess[0]!, 400, { rel: 1e-4 });
    expectClose(guess[1]!, 0.05, { rel: 1e-4 });
    expect(Array.from(guess.slice(2))).toEqual([0, 0]);
  });

  it('loop initialGuess() gives a negative N·I when signed axial readings are negative', () => {
    // a reversed probe reads −B_z (field-model.ts: 'axial' is signed)
    const guess = getModel('loop').initialGuess(synthetic(getModel('loop'), [-120, 0.03, 0, 0], evenly(0, 0.1, 12), undefined, 'axial'));
    expectClose(guess[0]!, -120, { rel: 1e-3 });
  });

  it('dipole initialGuess() gives the moment NIπR² from far-field loop readings within 4 %', () => {
    // DOMAIN.md §7.6: far field determines m = N·I·π·R²; §9 row 32: loop/dipole → 0.985 at 10R
    const guess = getModel('dipole').initialGuess(synthetic(getModel('loop'), [400, 0.05, 0, 0], evenly(0.25, 0.5, 12)));
    expectClose(guess[0]!, 400 * Math.PI * 0.05 ** 2, { rel: 0.04 });
  });

  it('dipole initialGuess() reads the farther half by distance whatever order the readings came in', () => {
    // the start is the median moment of the farther half of the readings (dipole-model.ts), so
    // the order a survey was walked in (outward, inward, shuffled) must not change it: against
    // the same readings in increasing distance (from 10 mm, well inside the 50 mm radius, so the near half's moments differ from the far half's)
    const forward = evenly(0.01, 0.5, 13);
    const expected = getModel('dipole').initialGuess(synthetic(getModel('loop'), [400, 0.05, 0, 0], forward))[0]!;
    for (const shuffled of [[...forward].reverse(), forward.map((_, i) => forward[(i * 5) % 13]!)]) {
      expect(getModel('dipole').initialGuess(synthetic(getModel('loop'), [400, 0.05, 0, 0], shuffled))[0]).toBe(expected);
    }
  });

  it('power-law initialGuess() is the log–log slope: n = 1.378, 2.240, 2.923 for a 50 mm loop over three ranges', () => {
    // DOMAIN.md §9 row 64 (OLS of ln B on ln z, 15 equally spaced points, exact loop data)
    const ranges: [number, number, number][] = [[0.01, 0.15, 1.378], [0.05, 0.15, 2.240], [0.2, 0.5, 2.923]];
    for (const [from, to, exponent] of ranges) {
      const points = synthetic(getModel('loop'), [400, 0.05, 0, 0], evenly(from, to, 15));
      expectClose(getModel('power-law').initialGuess(points)[1]!, exponent, { abs: 1e-3 }, `${from}–${to} m`);
    }
  });

  it('radialDistance() is √(d² + ρ²), and |d| on the axis (its TSDoc example: 3, 4 → 5)', () => {
    // Pythagoras
    expect(radialDistance(3, 4)).toBe(5);
    expect(radialDistance(-0.02, 0)).toBe(0.02);
    expectClose(radialDistance(0.1, 0.05), Math.hypot(0.1, 0.05), { rel: 1e-15 });
  });

  it('inverse-square and inverse-cube initialGuess() recover the amplitude of exact power-law data', () => {
    // median of |B|·d^n over the points equals A for exact data
    expectClose(getModel('inverse-square').initialGuess(synthetic(getModel('inverse-square'), [3e-6, 0, 0], evenly(0.02, 0.2, 9)))[0]!, 3e-6, { rel: 1e-12 });
    expectClose(getModel('inverse-cube').initialGuess(synthetic(getModel('inverse-cube'), [3e-8, 0, 0], evenly(0.02, 0.2, 9)))[0]!, 3e-8, { rel: 1e-12 });
  });

  const recoveries: [string, number[], boolean[], number[], number[]?][] = [
    ['loop', [400, 0.05, 0.004, 3e-5], [false, false, false, false], evenly(0, 0.2, 20)],
    ['loop', [400, 0.05, 0.004, 3e-5], [false, false, false, false], evenly(0, 0.15, 16), evenly(0, 0.06, 16)],
    ['solenoid', [300, 0.03, 0.08, 0.002, 0], [false, false, false, false, true], evenly(0, 0.25, 20)],
    ['thick-coil', [500, 0.02, 0.04, 0.05, 0.003, 0], [false, true, true, true, false, true], evenly(0, 0.2, 16)],
    ['coil-pair', [100, 0.15, 0.15, 0, 0], [false, false, false, true, true], evenly(0, 0.4, 20)],
    ['rectangle', [20, 0.3, 0.2, 0.002, 0], [false, false, false, false, true], evenly(0, 0.4, 20)],
    ['dipole', [0.5, 0.01, 1e-6], [false, false, false], evenly(0.1, 0.6, 12)],
    ['power-law', [2e-6, 2.2, 0.01, 0], [false, false, false, true], evenly(0.02, 0.3, 12)],
  ];
  for (const [id, truth, fixed, distance, radial] of recoveries) {
    it(`${id} initialGuess() starts a fit that recovers the true parameters${radial ? ' (off-axis survey)' : ''}`, () => {
      // data generated from known parameters is recovered (STYLE.md property); engine: src/core/fit
      const model = getModel(id);
      const points = synthetic(model, truth, distance, radial);
      const guess = model.initialGuess(points);
      const initial = guess.map((value, j) => (fixed[j] ? truth[j]! : value));
      const fit = fitLeastSquares(fieldModelProblem(model, points), {
        initial,
        fixed,
        lower: model.parameters.map((p) => p.lower),
        upper: model.parameters.map((p) => p.upper),
      });
      expect(fit.converged).toBe(true);
      truth.forEach((value, j) => expectClose(fit.params[j]!, value, { rel: 1e-5, abs: 1e-9 }, `${id} ${model.parameters[j]!.name}`));
    });
  }

  it('readingSign() is the sign of the median of the finite readings, counted without sorting', () => {
    // the definition: the median of the sorted finite values (medianOf), an independent method
    const cases = [[1, -2, 3], [-1, -2, 3], [-1, 2, -0.5, 0.25], [-3, 2, -0.5, 1], [-0, 0, -1, 1], [0, -0], [], [NaN, -1], [-1, 1], [-1, Infinity, 0.5, -2]];
    let state = 7;
    for (let c = 0; c < 200; c++) {
      const values: number[] = [];
      for (let i = 0; i < 1 + (c % 9); i++) {
        state = (state * 1103515245 + 12345) % 2147483648;
        values.push(Math.round((state / 2147483648 - 0.45) * 8) / 4);
      }
      cases.push(values);
    }
    for (const values of cases) {
      const points: SurveyPoints = { n: values.length, distance: new Float64Array(values.length), radial: new Float64Array(values.length), field: Float64Array.from(values), kind: 'axial' };
      expect(readingSign(points), JSON.stringify(values)).toBe(medianOf(points.field) < 0 ? -1 : 1);
      expect(readingSign({ ...points, kind: 'magnitude' })).toBe(1);
    }
  });
});
