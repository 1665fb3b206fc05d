import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import type { FieldModel, SurveyPoints } from '../models/field-model';
import { fitEffectiveVariance } from './effective-variance';
import { distanceSlope, fieldModelProblem } from './field-model-problem';
import { fitLeastSquares } from './least-squares';

const MU0 = 1.25663706212e-6;

/** A test stand-in for the catalog's loop: on-axis B = μ0·NI·R²/(2(R² + z²)^1.5) (DOMAIN.md §1.1). */
const axialLoop: FieldModel = {
  id: 'loop',
  label: 'test loop on axis',
  physical: true,
  parameters: [
    { name: 'ampereTurns', unit: 'A', lower: 0, upper: Infinity, description: 'N·I' },
    { name: 'radius', unit: 'm', lower: 0, upper: Infinity, description: 'radius' },
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
