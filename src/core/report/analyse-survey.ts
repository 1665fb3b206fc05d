import type { Spec } from '../analysis/spec/spec';
import { selectSpec } from '../analysis/spec/select-spec';
import { specUse } from '../analysis/spec/spec-use';
import { verifySpec } from '../analysis/spec/verify-spec';
import { valueWords } from '../analysis/describe-value';
import { isRingfallError } from '../errors';
import { thresholdCautions } from '../analysis/thresholds/threshold-cautions';
import { thresholdDistances } from '../analysis/thresholds/threshold-distances';
import type { ThresholdLevel } from '../analysis/thresholds/threshold-level';
import { fitSurvey, fitSurveyNotes } from '../fit/strategy/fit-survey';
import type { FitSurveyOptions } from '../fit/fit-survey-options';
import type { ModelId } from '../models';
import type { Survey } from '../survey/survey';
import { surveyUnits } from '../units';
import { buildSurveyReport } from './build-survey-report';
import type { SurveyReport } from './report';

/** What to do with each survey: the fit options, the specs to check against, the levels to find distances for. */
export interface SurveyAnalysisSettings {
  readonly fit: FitSurveyOptions & { readonly models: readonly ModelId[] };
  /** Parsed spec file(s); the one naming the survey's coil (else the one naming none) applies. */
  readonly specs: readonly Spec[];
  readonly thresholds: readonly ThresholdLevel[];
}

/**
 * The whole per-survey pipeline, shared by `ringfall fit`, `ringfall batch` and the web
 * page: pick the spec for the coil (its model is fitted too, CONTRACT.md; when specs are
 * given and none applies, the report says so: specUse), fit every model
 * (fitSurvey), check the spec (verifySpec, refitting its model with the label's geometry
 * held when the readings cannot determine it), find the threshold distances with their
 * cautions (DOMAIN.md §1.10, §4.5) and assemble the SurveyReport. The verdict's sentences
 * write fields and lengths in the units the survey's file was written in (surveyUnits).
 *
 * @throws RingfallError from fitSurvey for settings this survey cannot be fitted with
 */
export function analyseSurvey(survey: Survey, settings: SurveyAnalysisSettings): SurveyReport {
  const spec = selectSpec(settings.specs, survey.coil);
  const models = spec && !settings.fit.models.includes(spec.model) ? [...settings.fit.models, spec.model] : settings.fit.models;
  const options: FitSurveyOptions & { models: readonly ModelId[] } = { ...settings.fit, models };
  const fits = fitSurvey(survey, options);
  // the spec's model again with label values held, for checks the free fit cannot decide;
  // a held value fitSurvey refuses (RingfallError) gives null, which the verdict explains
  const refit = (held: Readonly<Record<string, number>>) => {
    try {
      return fitSurvey(survey, { ...options, models: [spec!.model], fixed: { ...options.fixed, ...held } })[0] ?? null;
    } catch (error) {
      if (isRingfallError(error)) return null;
      throw error;
    }
  };
  const thresholds = settings.thresholds.length > 0 ? thresholdDistances(fits, settings.thresholds, { readingType: survey.readingType, ...(survey.units ? { units: survey.units } : {}) }) : [];
  return buildSurveyReport(survey, fits, {
    verdict: spec ? verifySpec(spec, fits, survey.readingType, refit, valueWords(surveyUnits(survey))) : null,
    spec: specUse(settings.specs, spec, survey.coil),
    thresholds,
    cautions: thresholds.length > 0 ? thresholdCautions : [],
    notes: fitSurveyNotes(survey, options),
  });
}

/** The report of a survey that could not be fitted, saying why (nothing is dropped silently). */
export function unfittedSurveyReport(survey: Survey, reason: string): SurveyReport {
  return buildSurveyReport(survey, [], { warnings: [`Not fitted: ${reason}`] });
}
