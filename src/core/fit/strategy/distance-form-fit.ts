import { nearFaceModels } from '../../models/scan-model';
import type { FitResult } from '../fit-result';
import { lateralDistanceForm, poseDistanceForm } from './frame-distance-form';

/**
 * A fit of a scan (signed ruler positions, parameter `centre`) restated in the catalog's
 * distance form, so that thresholds, curves and claims keep measuring from the model's
 * datum: each reading's distance becomes |position − centre| − length/2 for a near-face
 * model (solenoid, thick coil; negative inside the winding), |position − centre|
 * otherwise; `probeOffset` is 0 and held; the covariance is that of the other
 * parameters (the centre's row and column dropped: their marginal covariance).
 *
 * @example distanceFormFit(scanFit).params.probeOffset.value // 0
 */
export function distanceFormFit(fit: FitResult): FitResult {
  const centre = fit.params['centre']!.value;
  const shift = nearFaceModels.has(fit.model) ? 0.5 * (fit.params['length']?.value ?? 0) : 0;
  const params: Record<string, FitResult['params'][string]> = {};
  for (const [name, estimate] of Object.entries(fit.params)) {
    params[name === 'centre' ? 'probeOffset' : name] = name === 'centre'
      ? { name: 'probeOffset', unit: 'm', value: 0, stderr: null, ci95: null, fixed: true, determined: true }
      : estimate;
  }
  const keep = fit.freeParameters.map((name, i) => (name === 'centre' ? -1 : i)).filter((i) => i >= 0);
  const k = fit.freeParameters.length;
  const sub = (matrix: readonly number[] | null) => (matrix === null ? null : keep.flatMap((r) => keep.map((c) => matrix[r * k + c]!)));
  return {
    ...fit,
    params,
    freeParameters: keep.map((i) => fit.freeParameters[i]!),
    covariance: sub(fit.covariance),
    correlation: sub(fit.correlation),
    points: fit.points.map((point) => ({ ...point, distance: Math.abs(point.distance - centre) - shift })),
  };
}

/**
 * The fit as analyses read it: a 3-D map's fit (poseDistanceForm), a transverse scan's
 * (lateralDistanceForm) and a scan's (distanceFormFit) in distance form, any other as it is.
 */
export function inDistanceForm(fit: FitResult): FitResult {
  if (fit.params['tilt'] !== undefined) return poseDistanceForm(fit);
  const folded = lateralDistanceForm(fit);
  return folded.params['centre'] === undefined ? folded : distanceFormFit(folded);
}

/**
 * The fit restated only as far as `names` (a model's parameter names) need: a 3-D map's
 * pose, a transverse scan's lateral centre and a scan's centre are each folded away when
 * the model does not have them — so a scan model (with `centre`) can draw a grid's fit
 * along the axis while a catalog model reads it in distance form.
 */
export function inFormOf(fit: FitResult, names: readonly string[]): FitResult {
  const has = (name: string) => names.includes(name);
  if (fit.params['tilt'] !== undefined && !has('tilt')) return poseDistanceForm(fit);
  const folded = fit.params['lateralCentre'] !== undefined && !has('lateralCentre') ? lateralDistanceForm(fit) : fit;
  return folded.params['centre'] !== undefined && !has('centre') ? distanceFormFit(folded) : folded;
}
