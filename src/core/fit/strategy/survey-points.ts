import type { SurveyPoints } from '../../models/field-model';
import type { Survey } from '../../survey/survey';

/**
 * A Survey's readings as the struct-of-arrays SurveyPoints the models evaluate (SI: m, T),
 * in survey order. Component readings were combined into a magnitude on import, so they
 * are fitted as 'magnitude'; a plain single-axis column is 'axial' (signed B_z).
 *
 * @example surveyPoints(survey).distance[0] // survey.readings[0].distance
 */
export function surveyPoints(survey: Survey): SurveyPoints {
  const readings = survey.readings;
  const n = readings.length;
  // The three columns share one buffer: one off-heap allocation per survey instead of three.
  const columns = new Float64Array(3 * n);
  const distance = columns.subarray(0, n);
  const radial = columns.subarray(n, 2 * n);
  const field = columns.subarray(2 * n, 3 * n);
  // Plain loops: Float64Array.from with a map function goes through the iterator protocol.
  for (let i = 0; i < n; i++) {
    const reading = readings[i]!;
    distance[i] = reading.distance;
    radial[i] = reading.radial;
    field[i] = reading.field;
  }
  return { n, distance, radial, field, kind: survey.fieldKind === 'axial' ? 'axial' : 'magnitude' };
}
