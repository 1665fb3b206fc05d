import type { FitResult } from '../fit/fit-result';
import type { FieldModel, ModelId } from '../models/field-model';
import type { Report, SurveyReport } from './report';
import { bestPhysicalFit, convergedFit } from '../analysis/best-fit';

/** The fit a summary row, a verdict or a history reads a survey's coil from, and why that one. */
export interface SummaryFit {
  readonly fit: FitResult;
  /**
   * 'spec': the model of the spec that applied; 'coil-history': the model the coil's fleet
   * history trends (the physical model best by AICc most often across its surveys);
   * 'best-physical': lowest AICc among the coil models of this survey.
   */
  readonly basis: 'spec' | 'coil-history' | 'best-physical';
}

/**
 * The model a summary uses for a survey: the applied spec's model when it converged (the
 * verdict is made with it), else the best physical model by AICc (bestPhysicalFit) —
 * never a descriptive power law, which fits a distance range without describing a coil.
 * In a fleet, a survey without a spec is read with its coil's history model when that
 * converged, so a coil's rows and its history name one model. Null when no coil model
 * converged.
 *
 * @param modelOf the catalog lookup (getModel)
 * @param historyModel the model the coil's fleet history uses (FleetCoil.model), if any
 * @example summaryFit(report, getModel)?.basis // 'spec'
 */
export function summaryFit(survey: Pick<SurveyReport, 'fits' | 'spec'>, modelOf: (id: ModelId) => FieldModel, historyModel: ModelId | null = null): SummaryFit | null {
  const specModel = survey.spec?.applied === true ? survey.spec.model : null;
  const fromSpec = specModel === null ? null : convergedFit(survey.fits, specModel);
  if (fromSpec !== null) return { fit: fromSpec, basis: 'spec' };
  const fromHistory = historyModel === null || !modelOf(historyModel).physical ? null : convergedFit(survey.fits, historyModel);
  if (fromHistory !== null) return { fit: fromHistory, basis: 'coil-history' };
  const best = bestPhysicalFit(survey.fits, modelOf);
  return best === null ? null : { fit: best, basis: 'best-physical' };
}

/** summaryFit for a survey of a report, with its coil's history model when the report has a fleet section. */
export function reportSummaryFit(report: Report, survey: SurveyReport, modelOf: (id: ModelId) => FieldModel): SummaryFit | null {
  const coil = survey.coil === null || report.fleet === undefined ? undefined : historyModels(report.fleet).get(survey.coil);
  return summaryFit(survey, modelOf, coil ?? null);
}

/** Each coil's history model by coil id, made once per fleet section (a fleet of 10,000 coils is looked up per survey). */
const historyModelsOf = new WeakMap<NonNullable<Report['fleet']>, ReadonlyMap<string, ModelId | null>>();
function historyModels(fleet: NonNullable<Report['fleet']>): ReadonlyMap<string, ModelId | null> {
  let models = historyModelsOf.get(fleet);
  if (models === undefined) {
    models = new Map(fleet.coils.map((coil) => [coil.coil, coil.model] as const));
    historyModelsOf.set(fleet, models);
  }
  return models;
}

/** Why a summary uses its model, in a few words: "spec's model", "coil history's model", "best coil model by AICc". */
export const summaryBasisWords: Readonly<Record<SummaryFit['basis'], string>> = {
  'spec': "spec's model",
  'coil-history': "the coil history's model",
  'best-physical': 'best coil model by AICc',
};

/** "loop (spec's model)" or "rectangle (best coil model by AICc)": the model a summary row names. */
export function summaryModelWords(summary: SummaryFit): string {
  return `${summary.fit.model} (${summaryBasisWords[summary.basis]})`;
}
