import { getModel, isModelId, modelIds, type FieldModel, type ModelId, type ParameterUnit } from '../core/models';
import type { SurveyReport } from '../core/report/report';
import type { Survey } from '../core/survey/survey';
import type { FitSettings, ParsedSettings } from './fit-settings';

// TEMPORARY ADAPTER — replaced by the engine's fitSurvey and the report builder as they
// land (issue 4/5). Until then a survey is reported with its readings counted and a
// warning that fitting is not in this build.

/** SI unit of a parameter name in the first of `models` that has it, or undefined when none has it. */
export function parameterUnit(name: string, models: readonly ModelId[] = modelIds): ParameterUnit | undefined {
  for (const id of models) {
    const spec = getModel(id).parameters.find((p) => p.name === name);
    if (spec) return spec.unit;
  }
  return undefined;
}

/** Fit one survey with the parsed settings and build its SurveyReport. */
export function fitStage(survey: Survey, _parsed: ParsedSettings, _settings: FitSettings): SurveyReport {
  return {
    source: survey.source, coil: survey.coil, date: survey.date, readingType: survey.readingType,
    readings: { total: survey.totalRows, used: survey.readings.length, rejected: survey.rejected },
    fits: [], best: null, comparison: [], verdict: null, thresholds: [],
    warnings: ['Model fitting is not in this build yet.'], cautions: [], notes: survey.notes,
  };
}

/** The catalog's FieldModel for an id. */
export function modelLookup(id: ModelId): FieldModel | undefined {
  return isModelId(id) ? getModel(id) : undefined;
}

/** Parameter names of the chosen models, in catalog order without repeats. */
export function parameterNames(models: readonly ModelId[]): string[] {
  return [...new Set(models.flatMap((id) => getModel(id).parameters.map((p) => p.name)))];
}
