import { RingfallError } from '../../errors';
import { getModel, modelIds, scanModel } from '../../models';
import type { Survey } from '../../survey/survey';
import { withAkaikeWeights } from './compare-models';
import type { FitResult } from '../fit-result';
import { fitModel } from './fit-model';
import { checkFixedParameters, defaultModels, type FitSurveyOptions } from '../fit-survey-options';
import { readingUncertainty } from './reading-uncertainty';
import { surveyPoints } from './survey-points';

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
 *   position uncertainty that is not a length ≥ 0, `FIT_POSITION_WITHOUT_READING` when a
 *   position uncertainty comes without any reading uncertainty, `FIT_UNCERTAINTY_ZERO`;
 *   RangeError when `options.models` is empty.
 * @example fitSurvey(survey, { models: ['loop'], instrumentUncertainty: { relative: 0.01, absolute: 1e-6 } })[0].params.radius.ci95
 */
export function fitSurvey(survey: Survey, options: FitSurveyOptions = {}): FitResult[] {
  const ids = options.models ?? defaultModels;
  if (ids.length === 0) throw new RangeError('fitSurvey: options.models is empty; expected at least one model id');
  // A scan (signed positions along the axis) fits the coil centre's position in place of the probe offset.
  const models = ids.map((id) => (survey.axis === 'position' ? scanModel(getModel(id)) : getModel(id)));
  checkFixedParameters(models, options.fixed ?? {});
  const uncertainty = readingUncertainty(survey, options.instrumentUncertainty);
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
  const points = surveyPoints(survey);
  const seed = options.seed ?? 1;
  const fits = models.map((model) => fitModel(model, survey, points, uncertainty.standardUncertainty, options, seed + modelIds.indexOf(model.id)));
  return withAkaikeWeights(fits);
}

/**
 * Sentences about how a survey was weighted, for the report (not about any one model):
 * where the reading uncertainty came from, or that there was none and intervals come from
 * the scatter of the residuals (DOMAIN.md §7.4).
 */
export function fitSurveyNotes(survey: Survey, options: FitSurveyOptions = {}): string[] {
  const uncertainty = readingUncertainty(survey, options.instrumentUncertainty);
  const notes = [...uncertainty.notes];
  if (uncertainty.standardUncertainty === null) {
    notes.push('No uncertainty was given for the readings: every reading weighs the same and the intervals are scaled by the scatter of the residuals. Give the meter\'s accuracy (--uncertainty 1.5%+2µT) to weight readings and test the scatter against it.');
  } else if ((options.positionUncertainty ?? 0) > 0) {
    notes.push(`Each reading's uncertainty includes the position uncertainty carried through the local slope of each model (effective variance).`);
  }
  return notes;
}
