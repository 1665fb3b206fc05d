import type { FieldModel, SurveyPoints } from '../../models/field-model';
import { surveyReach } from '../../models/initial-guess';
import type { LeastSquaresSolution } from '../engine/least-squares-types';

/**
 * Whether the fit from a profile-scanned start (profile-start.ts) can stand without the
 * extra starts of a multi-start: it converged at a stationary point of χ² within the box
 * (Karush–Kuhn–Tucker conditions) with sane parameters —
 * - for every free parameter inside its bounds the cosine between the weighted residuals
 *   and its weighted Jacobian column is ≤ 1e-5: moving that parameter alone could lower χ²
 *   by at most cos² = 1e-10 of itself, the fit's own cost tolerance, so this is a minimum
 *   and not a stall (MINPACK's gradient test, Moré 1978);
 * - a parameter on a bound is the scanned one, the bound lies in the range the scan
 *   searched, and the parameter is pushed against it: χ² would fall beyond the bound;
 * - the source itself (prediction minus background) reaches 1e-3 of the largest reading:
 *   a fit that has shrunk to a constant says nothing about this model's shape;
 * - every coil length (radius, sides, length) lies within 0.1 %–100× the survey's reach: a
 *   coil far larger or smaller than the surveyed region is a degenerate fit (a huge loop
 *   reads like a background) that other starts should challenge.
 * Anything else calls for the extra starts.
 *
 * @param sigma σᵢ of the weights (T) or null; scanned model index of the scanned parameter
 *   or −1, range the values it was scanned over; box the fit's bounds (model order).
 */
export function settledFit(
  model: FieldModel,
  points: SurveyPoints,
  fit: LeastSquaresSolution,
  sigma: ArrayLike<number> | null,
  scanned: number,
  range: readonly number[],
  box: { readonly lower?: ArrayLike<number>; readonly upper?: ArrayLike<number> },
): boolean {
  if (!fit.converged || fit.stopCode === 'no-free-parameters') return false;
  const k = fit.freeIndices.length;
  const n = fit.residuals.length;
  const jacobian = fit.jacobian;
  if (jacobian.length !== n * k) return false;
  const background = model.parameters.findIndex((p) => p.role === 'background');
  const level = background >= 0 ? fit.params[background]! : 0;
  let largest = 0;
  let source = 0;
  for (let i = 0; i < n; i++) {
    largest = Math.max(largest, Math.abs(points.field[i]!));
    source = Math.max(source, Math.abs(fit.predicted[i]! - level));
  }
  if (!(source >= 1e-3 * largest)) return false;
  const reach = surveyReach(points);
  for (const j of fit.freeIndices) {
    const spec = model.parameters[j]!;
    const size = Math.abs(fit.params[j]!);
    if (spec.role === 'geometry' && !(size >= 1e-3 * reach && size <= 100 * reach)) return false;
  }
  const norm = Math.sqrt(fit.chiSquare);
  for (let c = 0; c < k; c++) {
    const j = fit.freeIndices[c]!;
    let dot = 0;
    let column = 0;
    for (let i = 0; i < n; i++) {
      const a = jacobian[i * k + c]!;
      dot += (a * fit.residuals[i]!) / (sigma === null ? 1 : sigma[i]!);
      column += a * a;
    }
    if (fit.atBound[j] === true) {
      // dχ²/dθⱼ = −2·dot (residuals are y − f): at the upper bound it must be ≤ 0, at the lower ≥ 0.
      const x = fit.params[j]!;
      const upper = box.upper?.[j] ?? Infinity;
      const lower = box.lower?.[j] ?? -Infinity;
      const outward = Math.abs(upper - x) < Math.abs(x - lower) ? dot >= 0 : dot <= 0;
      if (j !== scanned || !outward || !(x >= range[0]! - 1e-9 * Math.abs(x) && x <= range[1]! + 1e-9 * Math.abs(x))) return false;
    } else if (column > 0 && Math.abs(dot) > 1e-5 * norm * Math.sqrt(column)) {
      return false;
    }
  }
  return true;
}
