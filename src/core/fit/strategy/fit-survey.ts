import { RingfallError } from '../../errors';
import { modelIds } from '../../models';
import type { Survey } from '../../survey/survey';
import { withAkaikeWeights } from './compare-models';
import type { FitResult } from '../fit-result';
import { fitModel } from './fit-model';
import { checkFixedParameters, defaultModels, type FitSurveyOptions } from '../fit-survey-options';
import { isVectorMap, omittedModelNote, surveyProblem, withMapPoints } from './map-survey';
import { readingUncertainty } from './reading-uncertainty';

/**
 * Fit every requested catalog model to one survey (DOMAIN.md §7) and compare them: per
 * model a data-driven start, a profile scan of the probe offset and an adaptive seeded
 * multi-start (search-model-fit.ts), weights from the stated reading uncertainty (widened
 * by the position uncertainty through the effective variance), optional robust loss,
 * covariance and intervals, identifiability and plausibility warnings (fit-model.ts);
 * then AICc, BIC and Akaike weights across the models (withAkaikeWeights; compareModels
 * adds the report's sentences). Deterministic: model m uses seed + its catalog index, so
 * the order models are asked in does not change any fit.
 *
 * @param options models (default loop, dipole, power-law, inverse-square, inverse-cube),
 *   fixed parameters (SI), instrument and position uncertainty, robust loss, seed, budget.
 * @returns one FitResult per model, in the order asked, Akaike weights filled in.
 * @throws RingfallError `FIT_UNKNOWN_PARAMETER` / `FIT_FIXED_OUT_OF_BOUNDS` for a bad fixed
 *   parameter, `MODEL_UNKNOWN` for an unknown model id, `FIT_POSITION_UNCERTAINTY` for a
 *   position uncertainty that is not a length ≥ 0, `OPTION_VALUE` when no asked model can
 *   be fitted to a 3-D map (rectangle, power laws only), `FIT_POSITION_WITHOUT_READING` when a
 *   position uncertainty comes without any reading uncertainty, `FIT_UNCERTAINTY_ZERO`;
 *   RangeError when `options.models` is empty.
 * @example fitSurvey(survey, { models: ['loop'], instrumentUncertainty: { relative: 0.01, absolute: 1e-6 } })[0].params.radius.ci95
 */
export function fitSurvey(survey: Survey, options: FitSurveyOptions = {}): FitResult[] {
  const ids = options.models ?? defaultModels;
  if (ids.length === 0) throw new RangeError('fitSurvey: options.models is empty; expected at least one model id');
  // A scan (signed positions along the axis) fits the coil centre's position in place of the
  // probe offset, a transverse scan the axis's lateral position, a 3-D map the coil's pose.
  const { survey: fitted, points, models } = surveyProblem(survey, ids);
  if (models.length === 0) {
    throw new RingfallError('OPTION_VALUE', `Models: ${ids.join(', ')} cannot be fitted to the 3-D map ${survey.source} (no axis to place in space). Ask for loop, thick-coil, solenoid, coil-pair or dipole (--model loop).`, { value: ids, where: '--model' });
  }
  checkFixedParameters(models, options.fixed ?? {});
  const uncertainty = readingUncertainty(fitted, options.instrumentUncertainty);
  const position = options.positionUncertainty ?? 0;
  if (!(position >= 0) || !Number.isFinite(position)) {
    throw new RingfallError('FIT_POSITION_UNCERTAINTY', `Position uncertainty: ${position} m is not a length ≥ 0 (--position-uncertainty). Give it like "0.5mm".`, { value: position });
  }
  if (position > 0 && uncertainty.standardUncertainty === null) {
    throw new RingfallError(
      'FIT_POSITION_WITHOUT_READING',
      `Position uncertainty: given without an uncertainty of the readings (${survey.source}). Add the meter's accuracy too, e.g. --uncertainty 1.5%+2µT, so both can be combined.`,
      { value: position },
    );
  }
  const seed = options.seed ?? 1;
  const fits = models.map((model) => fitModel(model, fitted, points, uncertainty.standardUncertainty, options, seed + modelIds.indexOf(model.id)));
  return withAkaikeWeights(survey.axis === 'map' ? fits.map((fit) => withMapPoints(fit, fitted, isVectorMap(survey))) : fits);
}

/**
 * Sentences about how a survey was weighted, for the report (not about any one model):
 * where the reading uncertainty came from, or that there was none and intervals come from
 * the scatter of the residuals (DOMAIN.md §7.4).
 */
export function fitSurveyNotes(survey: Survey, options: FitSurveyOptions = {}): string[] {
  // Only a 3-D map is fitted as other readings than its own, and only a map leaves models out.
  const map = survey.axis === 'map';
  const uncertainty = readingUncertainty(map ? surveyProblem(survey, []).survey : survey, options.instrumentUncertainty);
  const notes = [...uncertainty.notes, ...omittedModelNote(map ? surveyProblem(survey, options.models ?? defaultModels).omitted : [])];
  if (uncertainty.standardUncertainty === null) {
    notes.push('No uncertainty was given for the readings: every reading weighs the same and the intervals are scaled by the scatter of the residuals. Give the meter\'s accuracy (--uncertainty 1.5%+2µT) to weight readings and test the scatter against it.');
  } else if ((options.positionUncertainty ?? 0) > 0 && survey.axis === 'map') {
    notes.push('The position uncertainty is not carried into a 3-D map\'s weights (only the readings\' own uncertainty is); if the scatter is larger than stated, placement is a likely cause.');
  } else if ((options.positionUncertainty ?? 0) > 0) {
    notes.push(`Each reading's uncertainty includes the position uncertainty carried through the local slope of each model (effective variance).`);
  }
  return notes;
}
