import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { dipoleModel, loopModel } from '../../models';
import { fitSurvey } from './fit-survey';
import { leastSquaresOptions } from './search-model-fit';
import { surveyPoints } from './survey-points';
import { evenlySpaced, simulatedSurvey } from '../testing/simulated-survey';

describe('fitSurvey() search limits', () => {
  it('fitSurvey() reports the longer side of an on-axis rectangle as width (width and height swap on the axis)', () => {
    // DOMAIN.md §1.6: the on-axis formula is symmetric in a and b, so only the pair is determined
    const survey = simulatedSurvey({
      model: 'rectangle', params: { ampereTurns: 150, width: 0.2, height: 0.3, probeOffset: 0.006, background: 0 },
      distances: evenlySpaced(0, 0.5, 24), noise: { relative: 0.005, absolute: 2e-7 }, seed: 5, statedUncertainty: true,
    });
    const [fit] = fitSurvey(survey, { models: ['rectangle'] });
    const width = fit!.params['width']!;
    const height = fit!.params['height']!;
    expect(width.value).toBeGreaterThanOrEqual(height.value);
    // truth (generated): longer side 0.3 m, shorter 0.2 m, within 3 standard errors
    expect(Math.abs(width.value - 0.3)).toBeLessThan(3 * (width.stderr ?? Infinity));
    expect(Math.abs(height.value - 0.2)).toBeLessThan(3 * (height.stderr ?? Infinity));
  });

  it('leastSquaresOptions() bounds every model\'s probeOffset to [−(nearest distance + 5 % of reach), reach]', () => {
    // DOMAIN.md §3.1: the offset is a probe recess plus a housing depth (millimetres), so the
    // sensing point stays in front of the datum; the limits are ringfall's own (common practice: a
    // fitted offset larger than the survey's reach means the model does not describe the coil)
    const survey = simulatedSurvey({
      model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0.002, background: 0 },
      distances: evenlySpaced(0.25, 0.5, 12), noise: { relative: 0.01, absolute: 0 }, seed: 3, statedUncertainty: true,
    });
    const points = surveyPoints(survey);
    for (const model of [loopModel, dipoleModel]) {
      const index = model.parameters.findIndex((p) => p.name === 'probeOffset');
      const initial = model.initialGuess(points);
      const limits = leastSquaresOptions(model, points, initial, model.parameters.map(() => false), {});
      // nearest reading 0.25 m, reach 0.5 m (on axis)
      expectClose(limits.lower![index]!, -0.25 - 0.05 * 0.5, { rel: 1e-12 });
      expectClose(limits.upper![index]!, 0.5, { rel: 1e-12 });
    }
  });

  it('fitSurvey() keeps the fitted probe offset of a far-field-only survey inside those limits', () => {
    // DOMAIN.md §7.6 example geometry: NI = 400 A, R = 50 mm, readings 5R–10R only
    const survey = simulatedSurvey({
      model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0.002, background: 0 },
      distances: evenlySpaced(0.25, 0.5, 12), noise: { relative: 0.01, absolute: 0 }, seed: 3, statedUncertainty: true,
    });
    for (const fit of fitSurvey(survey, { models: ['loop', 'dipole'] })) {
      const offset = fit.params['probeOffset']!.value;
      expect(offset).toBeGreaterThanOrEqual(-0.25 - 0.05 * 0.5);
      expect(offset).toBeLessThanOrEqual(0.5);
    }
  });
});
