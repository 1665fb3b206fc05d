import { describe, expect, it } from 'vitest';
import { loopByBiotSavart } from '../../../test/support/biot-savart';
import { fitSurvey } from '../fit/strategy/fit-survey';
import { evenlySpaced } from '../fit/testing/simulated-survey';
import { getModel, scanModel } from '../models';
import type { Reading, Survey } from '../survey/survey';
import { fittedModel } from './fitted-model';

describe('fittedModel() of a grid (signed axial and lateral positions)', () => {
  // |B| of a 40 mm loop of 300 ampere-turns by direct Biot–Savart (test/support/biot-savart.ts), centre 5.2 mm and axis 13.7 mm from the rulers' zeros
  const readings: Reading[] = [];
  for (const p of [-0.04, -0.02, 0.02, 0.04]) {
    for (const x of evenlySpaced(-0.04, 0.04, 17)) {
      const [bz, br] = loopByBiotSavart(300, 0.04, p - 0.0052, Math.abs(x - 0.0137));
      readings.push({ line: readings.length + 2, distance: p, radial: x, field: Math.hypot(bz, br), standardUncertainty: 1e-7 });
    }
  }
  const survey: Survey = {
    source: 'grid', coil: null, date: null, readingType: 'dc', fieldKind: 'magnitude', readings, rejected: [], totalRows: readings.length,
    meta: {}, notes: [], axis: 'position', lateral: 'position',
  };
  const [fit] = fitSurvey(survey, { models: ['loop'] });

  it('with the scan model: the centre kept, the lateral positions folded to radial offsets', () => {
    const fitted = fittedModel(fit!, scanModel(getModel('loop')));
    // noise-free Biot–Savart readings: the centre to 1e-6 of the coil's size (independent method)
    expect(Math.abs(fitted.values[2]! - 0.0052)).toBeLessThan(4e-8);
    expect(fitted.fit.params['lateralCentre']).toBeUndefined();
    expect(Math.min(...fitted.fit.points.map((p) => p.radial))).toBeGreaterThanOrEqual(0);
  });

  it('with the catalog model: both folded, distances from the winding plane', () => {
    const fitted = fittedModel(fit!, getModel('loop'));
    expect(fitted.fit.params['centre']).toBeUndefined();
    expect(fitted.fit.params['probeOffset']!.value).toBe(0);
    expect(fitted.fit.points[0]!.distance).toBeCloseTo(Math.abs(-0.04 - 0.0052), 9);
  });
});
