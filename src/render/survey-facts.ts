import { inDistanceForm } from '../core/fit/strategy/distance-form-fit';
import type { FitResult } from '../core/fit/fit-result';
import { getModel, isModelId, type FieldModel, type ModelId } from '../core/models';
import { probeOffset } from '../core/report/curves';
import type { SurveyReport } from '../core/report/report';

/** Finds the FieldModel for a catalog id (the core catalog's getModel, or a stand-in in tests). */
export type ModelLookup = (id: ModelId) => FieldModel | undefined;

/** The core model catalog as a ModelLookup. */
export const catalogLookup: ModelLookup = (id) => (isModelId(id) ? getModel(id) : undefined);

/** The fit the report names best, or null. */
export function bestFit(survey: SurveyReport): FitResult | null {
  return survey.fits.find((fit) => fit.model === survey.best) ?? null;
}

/** The fit whose per-reading points describe the survey's readings: the best, else the first. */
export function readingsFit(survey: SurveyReport): FitResult | null {
  return bestFit(survey) ?? survey.fits[0] ?? null;
}

/** Models that are rotationally symmetric about the coil axis (field map is meaningful). */
const axisymmetric: ReadonlySet<ModelId> = new Set<ModelId>(['loop', 'thick-coil', 'solenoid', 'coil-pair', 'dipole']);

/** True when the model's field is rotationally symmetric about the coil axis. */
export function isAxisymmetric(model: ModelId): boolean {
  return axisymmetric.has(model);
}

/** Converged fits ranked by AICc (lowest first), non-converged ones after them in report order. */
export function rankedFits(survey: SurveyReport): FitResult[] {
  const converged = survey.fits.filter((fit) => fit.converged && Number.isFinite(fit.stats.aicc));
  converged.sort((a, b) => a.stats.aicc - b.stats.aicc);
  return [...converged, ...survey.fits.filter((fit) => !converged.includes(fit))];
}

/** Best-ranked power law (power-law, inverse-square, inverse-cube) among converged fits, or null. */
export function bestPowerLaw(survey: SurveyReport): FitResult | null {
  return rankedFits(survey).find((fit) => fit.converged && ['power-law', 'inverse-square', 'inverse-cube'].includes(fit.model)) ?? null;
}

/**
 * The distance axis every chart shares: from the datum to the sensing point, i.e. the
 * ruler distance plus the probe offset of the model the threshold distances use (the
 * best physical fit), so readings, curves, threshold distances and the field map line up.
 */
export function chartFrame(survey: SurveyReport, lookup: ModelLookup): { offset: number; model: ModelId | null } {
  const fit = frameFit(survey, lookup);
  const model = fit ? lookup(fit.model) : undefined;
  return fit && model ? { offset: probeOffset(model, fit), model: fit.model } : { offset: 0, model: null };
}

function frameFit(survey: SurveyReport, lookup: ModelLookup): FitResult | null {
  const thresholdModel = survey.thresholds[0]?.model;
  return rankedFits(survey).find((f) => f.converged && (thresholdModel ? f.model === thresholdModel : lookup(f.model)?.physical === true))
    ?? bestFit(survey);
}

/**
 * The readings as the charts draw them: readingsFit's points, or for a scan (signed ruler
 * positions) the chart frame's fit in distance form, each reading at its distance from
 * that fit's coil datum (both sides of the coil folded onto one axis).
 */
export function chartReadings(survey: SurveyReport, lookup: ModelLookup): FitResult['points'] {
  const fit = survey.axis === 'position' ? frameFit(survey, lookup) : null;
  return fit ? inDistanceForm(fit).points : readingsFit(survey)?.points ?? [];
}
