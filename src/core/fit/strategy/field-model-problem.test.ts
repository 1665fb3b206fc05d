import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import type { FieldModel, SurveyPoints } from '../../models/field-model';
import { fitEffectiveVariance } from './effective-variance';
import { getModel } from '../../models';
import { distanceSlope, fieldModelProblem } from './field-model-problem';
import { fitLeastSquares } from '../engine/least-squares';

const MU0 = 1.25663706212e-6;

/** A test stand-in for the catalog's loop: on-axis B = μ0·NI·R²/(2(R² + z²)^1.5) (DOMAIN.md §1.1). */
const axialLoop: FieldModel = {
  id: 'loop',
  label: 'test loop on axis',
  physical: true,
  parameters: [
    { name: 'ampereTurns', unit: 'A', role: 'amplitude', lower: 0, upper: Infinity, description: 'N·I' },
    { name: 'radius', unit: 'm', role: 'geometry', lower: 0, upper: Infinity, description: 'radius' },
  ],
  evaluate(params, points, out) {
    for (let i = 0; i < points.n; i++) {
      const s = params[1]! ** 2 + points.distance[i]! ** 2;
      out[i] = (MU0 * params[0]! * params[1]! ** 2) / (2 * s * Math.sqrt(s));
    }
  },
  initialGuess: () => Float64Array.of(300, 0.04),
};

function points(distance: number[], field?: Float64Array): SurveyPoints {
  return {
    n: distance.length,
    distance: Float64Array.from(distance),
    radial: new Float64Array(distance.length),
    field: field ?? new Float64Array(distance.length),
    kind: 'axial',
  };
}

describe('fieldModelProblem(model, points) and distanceSlope()', () => {
  it('distanceSlope() of the loop at z = R equals dB/dz of DOMAIN.md §9 row 51', () => {
    const out = new Float64Array(2);
    distanceSlope(axialLoop, Float64Array.of(400, 0.05), points([0.05, 0]), out);
    // DOMAIN.md §9 row 51 [C]: −0.0533146 T/m; on the axis at the centre the slope is 0
    expectClose(out[0]!, -0.0533146, { abs: 5e-8 });
    expectClose(out[1]!, 0, { abs: 1e-12 });
  });

  it('distanceSlope() takes the one-sided difference where the backward step crosses a power law\'s singularity at r = 0', () => {
    // B = A/(d + δ)² is undefined for d + δ ≤ 0; with d + δ = h/2 (h = ε^(1/3)·1 mm ≈ 6 µm) the backward
    // step lands at −h/2, so the forward difference is the one to take; elsewhere the central one (≈ −2A/r³)
    const law = getModel('inverse-square');
    const out = new Float64Array(2);
    const h = Math.cbrt(2.220446049250313e-16) * 1e-3;
    const theta = Float64Array.of(1e-8, 0.5 * h, 0);
    distanceSlope(law, theta, points([0, 0.01]), out);
    const r = 0.5 * h;
    expect(Number.isFinite(out[0])).toBe(true);
    expect(out[0]).toBeLessThan(0);
    // forward difference of A/r² from r to r + h, exactly: A(1/(r + h)² − 1/r²)/h
    expectClose(out[0]!, (1e-8 * (1 / (r + h) ** 2 - 1 / r ** 2)) / h, { rel: 1e-6 });
    expectClose(out[1]!, (-2 * 1e-8) / (0.01 + 0.5 * h) ** 3, { rel: 1e-6 });
  });

  it('fitEffectiveVariance() keeps σ_B for a reading whose slope is not finite and reports the weights as not settled, without throwing', () => {
    // a stand-in slope that the model cannot give at the first reading
    const survey = points([0.01, 0.03, 0.05, 0.08, 0.12], new Float64Array(5));
    axialLoop.evaluate(Float64Array.of(400, 0.05), survey, survey.field as Float64Array);
    const sigmaB = Float64Array.from(survey.field, (b) => 0.01 * b);
    const fit = fitEffectiveVariance(fieldModelProblem(axialLoop, survey), { initial: [350, 0.045] }, {
      readingUncertainty: sigmaB,
      positionUncertainty: new Float64Array(5).fill(0.001),
      slope: (params, out) => {
        distanceSlope(axialLoop, params, survey, out);
        out[0] = NaN;
      },
    });
    expect(fit.settled).toBe(false);
    expect(fit.effectiveUncertainty[0]).toBe(sigmaB[0]);
    expect(fit.effectiveUncertainty[1]!).toBeGreaterThan(sigmaB[1]!);
    expect(fit.solution.converged).toBe(true);
  });

  it('fieldModelProblem() fits a loop survey, and the effective-variance hook uses the model slope', () => {
    const distance = Array.from({ length: 12 }, (_, i) => 0.01 * i);
    const clean = new Float64Array(12);
    axialLoop.evaluate(Float64Array.of(400, 0.05), points(distance), clean);
    const survey = points(distance, clean);
    const problem = fieldModelProblem(axialLoop, survey);
    const fit = fitLeastSquares(problem, { initial: axialLoop.initialGuess(survey), lower: [0, 0] });
    expectClose(fit.params[0]!, 400, { rel: 1e-8 });
    expectClose(fit.params[1]!, 0.05, { rel: 1e-8 });
    const weighted = fitEffectiveVariance(
      problem,
      { initial: axialLoop.initialGuess(survey) },
      {
        readingUncertainty: Float64Array.from(clean, (b) => 0.01 * b),
        positionUncertainty: new Float64Array(12).fill(0.001),
        slope: (params, out) => distanceSlope(axialLoop, params, survey, out),
      },
    );
    expect(weighted.settled).toBe(true);
    // at z = 0.05 m the position term is 53.3 µT (DOMAIN.md §9 row 51)
    expectClose(weighted.effectiveUncertainty[5]!, Math.hypot(0.01 * clean[5]!, 5.33146e-5), { rel: 1e-5 });
  });
});

describe('fieldModelProblem() with a model that has normalEquations', () => {
  it('fits the catalog loop to the same bits with or without the fused pass (bounds and a fixed parameter)', () => {
    // independent method: the same engine fed the model's row-major jacobian only
    const loop = getModel('loop');
    const distance = Float64Array.from({ length: 20 }, (_, i) => 0.004 + 0.012 * i);
    for (const radial of [0, 0.01]) {
      const points: SurveyPoints = { n: 20, distance, radial: new Float64Array(20).fill(radial), field: new Float64Array(20), kind: radial === 0 ? 'axial' : 'magnitude' };
      loop.evaluate(Float64Array.of(420, 0.045, 0.003, 0), points, points.field as Float64Array);
      for (let i = 0; i < 20; i++) (points.field as Float64Array)[i]! *= 1 + 0.01 * Math.sin(7 * i);
      const fused = fieldModelProblem(loop, points);
      expect(fused.normalEquations).toBeDefined();
      const { observed, parameterCount, predict, jacobian } = fused;
      const rows = { observed, parameterCount, predict, jacobian: jacobian! };
      const options = {
        initial: [300, 0.06, 0, 0], fixed: [false, false, false, true], lower: loop.parameters.map((p) => p.lower), upper: loop.parameters.map((p) => p.upper),
        standardUncertainty: Array.from(points.field, (b) => 0.01 * Math.abs(b) + 1e-7),
      };
      const a = fitLeastSquares(fused, options);
      const b = fitLeastSquares(rows, options);
      expect(a.converged).toBe(true);
      expect(Array.from(a.params)).toEqual(Array.from(b.params));
      expect([a.iterations, a.evaluations, a.chiSquare]).toEqual([b.iterations, b.evaluations, b.chiSquare]);
      expect(a.jacobian).toEqual(b.jacobian);
    }
  });

  it('fits the dipole and the power laws to the same bits with or without the fused pass (a fixed background, a free offset)', () => {
    // independent method: the same engine fed the model's row-major jacobian only
    const distance = Float64Array.from({ length: 20 }, (_, i) => 0.02 + 0.012 * i);
    for (const id of ['dipole', 'power-law', 'inverse-square', 'inverse-cube'] as const) {
      const model = getModel(id);
      for (const radial of [0, 0.01]) {
        const points: SurveyPoints = { n: 20, distance, radial: new Float64Array(20).fill(radial), field: new Float64Array(20), kind: radial === 0 ? 'axial' : 'magnitude' };
        getModel('loop').evaluate(Float64Array.of(420, 0.045, 0.003, 0), points, points.field as Float64Array);
        for (let i = 0; i < 20; i++) (points.field as Float64Array)[i]! *= 1 + 0.01 * Math.sin(7 * i);
        const fused = fieldModelProblem(model, points);
        expect(fused.normalEquations, id).toBeDefined();
        const { observed, parameterCount, predict, jacobian } = fused;
        const rows = { observed, parameterCount, predict, jacobian: jacobian! };
        const p = model.parameters.length;
        const options = {
          initial: Array.from(model.initialGuess(points)), fixed: model.parameters.map((_, j) => j === p - 1),
          lower: model.parameters.map((q) => q.lower), upper: model.parameters.map((q) => q.upper),
          standardUncertainty: Array.from(points.field, (b) => 0.01 * Math.abs(b) + 1e-7),
        };
        const a = fitLeastSquares(fused, options);
        const b = fitLeastSquares(rows, options);
        expect(a.iterations, id).toBeGreaterThan(1);
        expect(Array.from(a.params), id).toEqual(Array.from(b.params));
        expect([a.iterations, a.evaluations, a.chiSquare, a.stopCode], id).toEqual([b.iterations, b.evaluations, b.chiSquare, b.stopCode]);
        expect(a.jacobian, id).toEqual(b.jacobian);
      }
    }
  });
});
