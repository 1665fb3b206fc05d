import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { getModel } from '../../models';
import type { FieldModel, SurveyPoints } from '../../models/field-model';
import { profileStart } from './profile-start';

const evenly = (from: number, to: number, count: number) => Array.from({ length: count }, (_, i) => from + ((to - from) * i) / (count - 1));

/** On-axis readings that are the model's own predictions at θ (noise-free). */
function exact(model: FieldModel, theta: number[], distance: number[]): SurveyPoints {
  const points: SurveyPoints = {
    n: distance.length, distance: Float64Array.from(distance), radial: new Float64Array(distance.length), field: new Float64Array(distance.length), kind: 'magnitude',
  };
  model.evaluate(Float64Array.from(theta), points, points.field as Float64Array);
  return points;
}

describe('profileStart(model, points, start, fixed, lower, upper, sigma)', () => {
  const cube = getModel('inverse-cube');
  const free = [false, false, false];

  it('profileStart() finds the probe offset of exact inverse-cube data within 5 % from a start at 20 mm', () => {
    // data generated from known parameters (STYLE.md): A = 2e-8 T·m³, δ = 30 mm, b = 20 µT
    const points = exact(cube, [2e-8, 0.03, 2e-5], evenly(0, 0.2, 20));
    const start = Float64Array.of(1e-8, 0.02, 0);
    const result = profileStart(cube, points, start, free, [-Infinity, -0.01, -Infinity], [Infinity, 0.2, Infinity], null);
    expect(result.scanned).toBe(true);
    expect(result.offsetOnBound).toBe(-1);
    expectClose(result.initial[1]!, 0.03, { rel: 0.05 });
    // a start no worse than the one given, and far better here
    let before = 0;
    const out = new Float64Array(points.n);
    cube.evaluate(start, points, out);
    out.forEach((f, i) => (before += (points.field[i]! - f) ** 2));
    expect(result.chiSquare).toBeLessThan(1e-3 * before);
  });

  it('profileStart() with the offset fixed solves amplitude and background exactly (a linear problem)', () => {
    // B = A/(d + δ)² + b is linear in A and b at fixed δ: weighted least squares recovers them
    const square = getModel('inverse-square');
    const points = exact(square, [3e-6, 0.01, -4e-6], evenly(0.02, 0.3, 12));
    const sigma = Float64Array.from(points.field, (b) => 0.01 * Math.abs(b) + 1e-7);
    const result = profileStart(square, points, Float64Array.of(1e-6, 0.01, 0), [false, true, false], [-Infinity, -0.03, -Infinity], [Infinity, 0.3, Infinity], sigma);
    expect(result.scanned).toBe(true);
    expectClose(result.initial[0]!, 3e-6, { rel: 1e-9 });
    expectClose(result.initial[2]!, -4e-6, { rel: 1e-6 });
    expect(result.initial[1]).toBe(0.01);
  });

  it('profileStart() puts the offset on the edge of its box when the misfit falls towards it, and says so', () => {
    // true δ = 80 mm but the box stops at 50 mm: the profile χ² falls all the way to the edge
    const points = exact(cube, [2e-8, 0.08, 0], evenly(0, 0.2, 20));
    const result = profileStart(cube, points, Float64Array.of(1e-8, 0.004, 0), free, [-Infinity, -0.01, -Infinity], [Infinity, 0.05, Infinity], null);
    expect(result.offsetOnBound).toBe(1);
    expect(result.initial[1]).toBe(0.05);
  });

  it('profileStart() leaves the start alone when the readings cannot tell the shape from a constant (all at one distance)', () => {
    const loop = getModel('loop');
    const points = exact(loop, [400, 0.05, 0, 0], [0.05, 0.05, 0.05, 0.05, 0.05]);
    const start = Float64Array.of(300, 0.04, 0, 0);
    const result = profileStart(loop, points, start, [false, false, false, false], [-Infinity, 0, -0.06, -Infinity], [Infinity, Infinity, 0.05, Infinity], null);
    expect(result.scanned).toBe(false);
    expect(Array.from(result.initial)).toEqual([300, 0.04, 0, 0]);
  });

  it('profileStart() re-reads a free power-law exponent at each offset: exact A/(d + δ)^2.5 data give n within 2 % of 2.5', () => {
    // log–log slope of |B| on d + δ (DOMAIN.md §1.9) is exactly −n at the true δ with b = 0
    const law = getModel('power-law');
    const points = exact(law, [1e-7, 2.5, 0.02, 0], evenly(0, 0.25, 20));
    const result = profileStart(law, points, Float64Array.of(1e-7, 1.2, 0.005, 0), [false, false, false, true], [-Infinity, 0, -0.0125, -Infinity], [Infinity, 12, 0.25, Infinity], null);
    expectClose(result.initial[1]!, 2.5, { rel: 0.02 });
    expectClose(result.initial[2]!, 0.02, { rel: 0.05 });
  });

  it('profileStart() gives a power law the same start, bit for bit, with r and ln r worked out once per offset (sourceDistances) or by evaluate', () => {
    // independent method: the same model with sourceDistances and evaluateAtDistances taken away, so every
    // trial goes through evaluate and the slope through |d + δ|. Readings off the 2.5 law by a fixed ripple,
    // on and off the axis, weighted and not, offset free or held (held behind the first reading: every trial NaN)
    const law = getModel('power-law');
    const { sourceDistances: _r, evaluateAtDistances: _e, ...rest } = law;
    const plain: FieldModel = rest;
    expect(plain.sourceDistances).toBeUndefined();
    const distance = evenly(0.004, 0.25, 24);
    const cases: [string, number[], boolean[], number][] = [
      ['on the axis', distance.map(() => 0), [false, false, false, false], 0.005],
      ['off the axis', distance.map((_, i) => (i % 3) * 0.01), [false, false, false, false], 0.005],
      ['offset held', distance.map(() => 0), [false, false, true, false], 0.011],
      ['offset held behind the first reading', distance.map(() => 0), [false, false, true, false], -0.006],
    ];
    for (const [label, radial, fixed, offset] of cases) {
      const points: SurveyPoints = { n: distance.length, distance: Float64Array.from(distance), radial: Float64Array.from(radial), field: new Float64Array(distance.length), kind: 'magnitude' };
      law.evaluate(Float64Array.of(1e-7, 2.5, 0.02, 3e-6), points, points.field as Float64Array);
      const field = points.field as Float64Array;
      field.forEach((b, i) => (field[i] = b * (1 + 0.03 * Math.sin(7 * i))));
      for (const sigma of [null, Float64Array.from(field, (b) => 0.02 * Math.abs(b) + 1e-7)]) {
        const run = (model: FieldModel) => profileStart(model, points, Float64Array.of(1e-7, 1.8, offset, 0), fixed, [-Infinity, 0, -0.008, -Infinity], [Infinity, 12, 0.25, Infinity], sigma);
        const fast = run(law);
        const slow = run(plain);
        expect(Array.from(fast.initial), label).toEqual(Array.from(slow.initial));
        expect(fast.chiSquare, label).toBe(slow.chiSquare);
        expect([fast.scanned, fast.offsetOnBound, fast.scannedRange], label).toEqual([slow.scanned, slow.offsetOnBound, slow.scannedRange]);
        if (offset > 0) expect(fast.initial[1], label).not.toBe(1.8);
      }
    }
  });
});
