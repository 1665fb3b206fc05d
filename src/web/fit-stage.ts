import type { FieldModel, ModelId, ParameterUnit } from '../core/models/field-model';
import type { SurveyReport } from '../core/report/report';
import type { Survey } from '../core/survey/survey';
import type { FitSettings, ParsedSettings } from './fit-settings';

// TEMPORARY ADAPTER — replaced by the engine's fitSurvey and the report builder as they
// land (issue 4/5). Until then a survey is reported with its readings counted and a
// warning that fitting is not in this build.

const parameterUnits: Readonly<Record<string, ParameterUnit>> = {
  ampereTurns: 'A', radius: 'm', innerRadius: 'm', outerRadius: 'm', length: 'm', separation: 'm', width: 'm', height: 'm',
  probeOffset: 'm', background: 'T', moment: 'A·m²', exponent: '1', amplitude: 'T·m^n',
};

/** SI unit of a catalog parameter name, or undefined for an unknown name. */
export function parameterUnit(name: string): ParameterUnit | undefined {
  return parameterUnits[name];
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

/** The model catalog's FieldModel for an id (none until the catalog lands). */
export function modelLookup(_id: ModelId): FieldModel | undefined {
  return undefined;
}

/** Parameter names of the chosen models, in catalog order without repeats. */
export function parameterNames(_models: readonly ModelId[]): string[] {
  return Object.keys(parameterUnits);
}
