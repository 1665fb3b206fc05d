import { getModel, isModelId, modelIds, type FieldModel, type ModelId, type ParameterUnit } from '../core/models';
import { fleetHistory } from '../core/analysis/fleet/fleet-history';
import { selectSpec } from '../core/analysis/spec/select-spec';
import { verifySpec } from '../core/analysis/spec/verify-spec';
import { thresholdCautions } from '../core/analysis/thresholds/threshold-cautions';
import { thresholdDistances } from '../core/analysis/thresholds/threshold-distances';
import { fitSurvey, fitSurveyNotes } from '../core/fit/fit-survey';
import type { FitResult } from '../core/fit/fit-result';
import type { FitSurveyOptions } from '../core/fit/fit-survey-options';
import { buildSurveyReport } from '../core/report/build-survey-report';
import type { FleetSummary, SurveyReport } from '../core/report/report';
import type { Survey } from '../core/survey/survey';
import type { ParsedSettings } from './fit-settings';

// The page's fit stage: the engine's fitSurvey, the analyses (spec verdict, threshold
// distances, fleet history) and the core report builder, wired like the CLI's fit.

/** SI unit of a parameter name in the first of `models` that has it, or undefined when none has it. */
export function parameterUnit(name: string, models: readonly ModelId[] = modelIds): ParameterUnit | undefined {
  for (const id of models) {
    const spec = getModel(id).parameters.find((p) => p.name === name);
    if (spec) return spec.unit;
  }
  return undefined;
}

/**
 * Fit one survey with the parsed settings and build its SurveyReport: the spec that
 * names its coil (its model is fitted too, CONTRACT.md), the threshold distances with
 * their cautions, and how the readings were weighted.
 */
export function fitStage(
  survey: Survey,
  parsed: ParsedSettings,
  fileNotes: readonly string[] = [],
  onModel: (model: ModelId, index: number, count: number) => void = () => {},
): SurveyReport {
  const spec = selectSpec(parsed.specs, survey.coil);
  const models = spec && !parsed.models.includes(spec.model) ? [...parsed.models, spec.model] : parsed.models;
  const options: FitSurveyOptions = {
    models,
    fixed: parsed.fixed,
    ...(parsed.uncertainty ? { instrumentUncertainty: parsed.uncertainty } : {}),
    ...(parsed.positionUncertainty !== null ? { positionUncertainty: parsed.positionUncertainty } : {}),
  };
  const fits = fitModels(survey, options, models, onModel);
  const thresholds = parsed.thresholds.length > 0 ? thresholdDistances(fits, parsed.thresholds, { readingType: survey.readingType }) : [];
  return buildSurveyReport(survey, fits, {
    verdict: spec ? verifySpec(spec, fits, survey.readingType) : null,
    thresholds,
    cautions: thresholds.length > 0 ? thresholdCautions : [],
    notes: [...fileNotes, ...fitSurveyNotes(survey, options)],
  });
}

/**
 * fitSurvey one model at a time, so the page can say which model it is fitting. The
 * result is the same as one call with every model: each model's multi-start is seeded by
 * its catalog index, not its place in the list, and the comparison (Akaike weights) is
 * redone over all fits by buildSurveyReport. When a fixed parameter belongs to only some
 * of the models, fitSurvey itself notes that in the other models' warnings, so such a
 * run is left to a single call.
 */
function fitModels(survey: Survey, options: FitSurveyOptions, models: readonly ModelId[], onModel: (model: ModelId, index: number, count: number) => void): FitResult[] {
  const fixedNames = Object.keys(options.fixed ?? {});
  const separable = fixedNames.every((name) => models.every((id) => getModel(id).parameters.some((p) => p.name === name)));
  if (!separable) {
    onModel(models[0]!, 0, 1);
    return fitSurvey(survey, options);
  }
  return models.map((id, index) => {
    onModel(id, index, models.length);
    return fitSurvey(survey, { ...options, models: [id] })[0]!;
  });
}

/** The report of a survey that was not fitted, saying why. */
export function unfittedReport(survey: Survey, reason: string, fileNotes: readonly string[] = []): SurveyReport {
  return buildSurveyReport(survey, [], { warnings: [`Not fitted: ${reason}`], notes: fileNotes });
}

/** The fleet section for several surveys (coil histories, trends, flags). */
export function fleetStage(reports: readonly SurveyReport[], parsed: ParsedSettings, unreadable: readonly { source: string; reason: string }[]): FleetSummary {
  return fleetHistory(reports.map((r) => ({ source: r.source, coil: r.coil, date: r.date, fits: r.fits, verdict: r.verdict })), { specs: parsed.specs, unreadable });
}

/** The catalog's FieldModel for an id. */
export function modelLookup(id: ModelId): FieldModel | undefined {
  return isModelId(id) ? getModel(id) : undefined;
}

/** Parameter names of the chosen models, in catalog order without repeats. */
export function parameterNames(models: readonly ModelId[]): string[] {
  return [...new Set(models.flatMap((id) => getModel(id).parameters.map((p) => p.name)))];
}
