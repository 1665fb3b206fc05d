import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { getModel } from '../../models';
import { checkFixedParameters } from '../fit-survey-options';
import { formatParameter } from '../diagnostics/format-parameter';
import { readingUncertainty } from './reading-uncertainty';
import { surveyPoints } from './survey-points';
import { simulatedSurvey } from '../testing/simulated-survey';

const survey = simulatedSurvey({ model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0, background: 0 }, distances: [0, 0.05, 0.1] });

describe('TSDoc examples of the survey-level fit', () => {
  it('surveyPoints() keeps the survey order and reads magnitude surveys as kind magnitude', () => {
    const points = surveyPoints(survey);
    expect(Array.from(points.distance)).toEqual([0, 0.05, 0.1]);
    expect(points.kind).toBe('magnitude');
    expect(surveyPoints({ ...survey, fieldKind: 'axial' }).kind).toBe('axial');
  });

  it('readingUncertainty() with 1.5 % + 2 µT gives σ = 0.015·|B| + 2 µT per reading', () => {
    const result = readingUncertainty(survey, { relative: 0.015, absolute: 2e-6 });
    expect(result.source).toBe('option');
    survey.readings.forEach((r, i) => expectClose(result.standardUncertainty![i]!, 0.015 * Math.abs(r.field) + 2e-6, { rel: 1e-15 }));
  });

  it('readingUncertainty() refuses a pure percentage when a reading is zero (FIT_UNCERTAINTY_ZERO), names the line, and says the column was replaced', () => {
    const zero = { ...survey, readings: survey.readings.map((r, i) => (i === 1 ? { ...r, field: 0 } : r)) };
    expect(() => readingUncertainty(zero, { relative: 0.02, absolute: 0 })).toThrow(/line 3 of simulated loop.*"2%\+1µT"/);
    expect(() => readingUncertainty(zero, { relative: 0.02, absolute: 0 })).toThrow(expect.objectContaining({ code: 'FIT_UNCERTAINTY_ZERO' }));
    // a negative absolute part is named as such, not as a zero reading
    expect(() => readingUncertainty(survey, { relative: 0.01, absolute: -1 })).toThrow(
      expect.objectContaining({ code: 'FIT_UNCERTAINTY_ZERO', message: expect.stringMatching(/^Uncertainty: 1% \+ .* gives σ = .* for the reading on line 2 of simulated loop, not more than 0\. Give a relative and an absolute part ≥ 0/) }),
    );
    const withColumn = { ...survey, readings: survey.readings.map((r) => ({ ...r, standardUncertainty: 1e-6 })) };
    expect(readingUncertainty(withColumn).source).toBe('file');
    expect(readingUncertainty(withColumn, { relative: 0.01, absolute: 0 }).notes[0]).toContain("replaced the file's uncertainty column");
  });

  it('checkFixedParameters() example: "radii" for a loop throws, naming the loop\'s parameters', () => {
    expect(() => checkFixedParameters([getModel('loop')], { radii: 0.045 })).toThrow(/Parameters — loop: ampereTurns, radius, probeOffset, background\./);
  });

  it('formatParameter() example: 0.04502 m → "45.02 mm"; exponent plain; T·m^n with its unit', () => {
    expect(formatParameter(0.04502, 'm')).toBe('45.02 mm');
    expect(formatParameter(2.5, '1')).toBe('2.500');
    expect(formatParameter(3e-6, 'T·m^n')).toBe('3.000e-6 T·m^n');
  });
});
