import { fleetHistory } from '../core/analysis/fleet/fleet-history';
import { getModel, isModelId, modelIds, type FieldModel, type ModelId, type ParameterUnit } from '../core/models';
import { analyseSurvey, unfittedSurveyReport } from '../core/report/analyse-survey';
import type { FleetSummary, SurveyReport } from '../core/report/report';
import type { Survey } from '../core/survey/survey';
import type { ParsedSettings } from './fit-settings';

// The page's fit stage: the same per-survey pipeline as `ringfall fit` (analyseSurvey:
// fitSurvey, spec verdict, threshold distances, report builder) and the fleet history.

/** SI unit of a parameter name in the first of `models` that has it, or undefined when none has it. */
export function parameterUnit(name: string, models: readonly ModelId[] = modelIds): ParameterUnit | undefined {
  for (const id of models) {
    const spec = getModel(id).parameters.find((p) => p.name === name);
    if (spec) return spec.unit;
  }
  return undefined;
}

/**
 * Fit one survey with the parsed settings and build its SurveyReport, exactly as the CLI
 * does: the spec naming its coil applies (and its model is fitted too), thresholds come
 * with their cautions.
 * @throws RingfallError from fitSurvey for settings this survey cannot be fitted with
 */
export function fitStage(survey: Survey, parsed: ParsedSettings): SurveyReport {
  return analyseSurvey(survey, {
    fit: {
      models: parsed.models,
      fixed: parsed.fixed,
      ...(parsed.uncertainty ? { instrumentUncertainty: parsed.uncertainty } : {}),
      ...(parsed.positionUncertainty !== null ? { positionUncertainty: parsed.positionUncertainty } : {}),
    },
    specs: parsed.specs,
    thresholds: parsed.thresholds,
  });
}

/** The report of a survey that was not fitted, saying why. */
export function unfittedReport(survey: Survey, reason: string): SurveyReport {
  return unfittedSurveyReport(survey, reason);
}

/** The fleet section for several surveys (coil histories, trends, flags). */
export function fleetStage(reports: readonly SurveyReport[], parsed: ParsedSettings, unreadable: readonly { source: string; reason: string }[]): FleetSummary {
  return fleetHistory(reports.map((r) => ({ source: r.source, coil: r.coil, date: r.date, fits: r.fits, verdict: r.verdict, ...(r.units ? { units: r.units } : {}) })), { specs: parsed.specs, unreadable });
}

/** The catalog's FieldModel for an id. */
export function modelLookup(id: ModelId): FieldModel | undefined {
  return isModelId(id) ? getModel(id) : undefined;
}

/** Parameter names of the chosen models, in catalog order without repeats. */
export function parameterNames(models: readonly ModelId[]): string[] {
  return [...new Set(models.flatMap((id) => getModel(id).parameters.map((p) => p.name)))];
}
