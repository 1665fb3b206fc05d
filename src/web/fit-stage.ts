import { getModel, isModelId, modelIds, type FieldModel, type ModelId, type ParameterUnit } from '../core/models';
import { fleetHistory } from '../core/analysis/fleet/fleet-history';
import { selectSpec } from '../core/analysis/spec/select-spec';
import { verifySpec } from '../core/analysis/spec/verify-spec';
import { thresholdCautions } from '../core/analysis/thresholds/threshold-cautions';
import { thresholdDistances } from '../core/analysis/thresholds/threshold-distances';
import { compareModels } from '../core/fit/compare-models';
import { fitSurvey, fitSurveyNotes } from '../core/fit/fit-survey';
import type { FitSurveyOptions } from '../core/fit/fit-survey-options';
import type { FleetSummary, SurveyReport } from '../core/report/report';
import type { Survey } from '../core/survey/survey';
import type { ParsedSettings } from './fit-settings';

// TEMPORARY ADAPTER — builds the SurveyReport from the engine's fitSurvey and the
// analyses (spec verdict, threshold distances) until the core report builder lands;
// then this file keeps only the catalog helpers below and calls that builder.

/** SI unit of a parameter name in the first of `models` that has it, or undefined when none has it. */
export function parameterUnit(name: string, models: readonly ModelId[] = modelIds): ParameterUnit | undefined {
  for (const id of models) {
    const spec = getModel(id).parameters.find((p) => p.name === name);
    if (spec) return spec.unit;
  }
  return undefined;
}

/** Fit one survey with the parsed settings and build its SurveyReport. */
export function fitStage(survey: Survey, parsed: ParsedSettings): SurveyReport {
  const spec = selectSpec(parsed.specs, survey.coil);
  const models = spec && !parsed.models.includes(spec.model) ? [...parsed.models, spec.model] : parsed.models;
  const options: FitSurveyOptions = {
    models,
    fixed: parsed.fixed,
    ...(parsed.uncertainty ? { instrumentUncertainty: parsed.uncertainty } : {}),
    ...(parsed.positionUncertainty !== null ? { positionUncertainty: parsed.positionUncertainty } : {}),
  };
  const fits = fitSurvey(survey, options);
  const { best, comparison } = compareModels(fits);
  const thresholds = parsed.thresholds.length > 0 ? thresholdDistances(fits, parsed.thresholds, { readingType: survey.readingType }) : [];
  return {
    source: survey.source, coil: survey.coil, date: survey.date, readingType: survey.readingType,
    readings: { total: survey.totalRows, used: survey.readings.length, rejected: survey.rejected },
    fits, best, comparison,
    verdict: spec ? verifySpec(spec, fits, survey.readingType) : null,
    thresholds,
    warnings: [],
    cautions: thresholds.length > 0 ? thresholdCautions : [],
    notes: [...survey.notes, ...fitSurveyNotes(survey, options)],
  };
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
