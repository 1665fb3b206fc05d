import { describe, expect, it } from 'vitest';
import { thresholdDistances } from './thresholds/threshold-distances';
import { parseThresholdLevel } from './thresholds/threshold-level';
import { fitSurvey } from '../fit/strategy/fit-survey';
import { evenlySpaced, simulatedSurvey } from '../fit/testing/simulated-survey';

describe('analyses on very long surveys', () => {
  it('thresholdDistances() works on a 200,000-reading survey (no argument spreading over readings)', () => {
    const survey = simulatedSurvey({
      model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0.002, background: 0 },
      distances: evenlySpaced(0, 0.2, 200_000), noise: { relative: 0.01, absolute: 1e-7 }, seed: 7, statedUncertainty: true,
    });
    const fits = fitSurvey(survey, { models: ['loop'], starts: 0 });
    const [result] = thresholdDistances(fits, [parseThresholdLevel('0.5mT')], { readingType: 'dc' });
    // DOMAIN.md §9 row 36 [C]: NI = 400 A, R = 50 mm, 0.5 mT → 95.630 mm from the loop plane (field point);
    // the distance is measured from the datum to the field point, so the probe offset does not enter
    expect(result!.distance!.value).toBeGreaterThan(0.0950);
    expect(result!.distance!.value).toBeLessThan(0.0963);
  });
});
