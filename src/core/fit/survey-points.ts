import type { SurveyPoints } from '../models/field-model';
import type { Survey } from '../survey/survey';

/**
 * A Survey's readings as the struct-of-arrays SurveyPoints the models evaluate (SI: m, T),
 * in survey order. Component readings were combined into a magnitude on import, so they
 * are fitted as 'magnitude'; a plain single-axis column is 'axial' (signed B_z).
 *
 * @example surveyPoints(survey).distance[0] // survey.readings[0].distance
 */
export function surveyPoints(survey: Survey): SurveyPoints {
  const readings = survey.readings;
  return {
    n: readings.length,
    distance: Float64Array.from(readings, (r) => r.distance),
    radial: Float64Array.from(readings, (r) => r.radial),
    field: Float64Array.from(readings, (r) => r.field),
    kind: survey.fieldKind === 'axial' ? 'axial' : 'magnitude',
  };
}
