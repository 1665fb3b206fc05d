import type { FitResult } from '../fit/fit-result';
import type { FieldModel, ModelId } from '../models/field-model';
import type { SurveyReport } from '../report/report';
import { bestPhysicalFit, convergedFit } from './best-fit';

/** The fit a summary row, a verdict or a history reads a survey's coil from, and why that one. */
export interface SummaryFit {
  readonly fit: FitResult;
  /** 'spec': the model of the spec that applied; 'best-physical': lowest AICc among the coil models. */
  readonly basis: 'spec' | 'best-physical';
}

/**
 * The model a summary uses for a survey: the applied spec's model when it converged (the
 * verdict is made with it), else the best physical model by AICc (bestPhysicalFit) —
 * never a descriptive power law, which fits a distance range without describing a coil.
 * Null when no coil model converged.
 *
 * @param modelOf the catalog lookup (getModel)
 * @example summaryFit(report, getModel)?.basis // 'spec'
 */
export function summaryFit(survey: Pick<SurveyReport, 'fits' | 'spec'>, modelOf: (id: ModelId) => FieldModel): SummaryFit | null {
  const specModel = survey.spec?.applied === true ? survey.spec.model : null;
  const fromSpec = specModel === null ? null : convergedFit(survey.fits, specModel);
  if (fromSpec !== null) return { fit: fromSpec, basis: 'spec' };
  const best = bestPhysicalFit(survey.fits, modelOf);
  return best === null ? null : { fit: best, basis: 'best-physical' };
}

/** "loop (spec's model)" or "rectangle (best coil model by AICc)": the model a summary row names. */
export function summaryModelWords(summary: SummaryFit): string {
  return `${summary.fit.model} (${summary.basis === 'spec' ? "spec's model" : 'best coil model by AICc'})`;
}
