import { scratchArray } from './scratch-array';
import type { FieldModel, SurveyPoints } from '../../models/field-model';
import type { LeastSquaresProblem } from '../engine/least-squares-types';

/**
 * A catalog model and a survey as a least-squares problem: observations are the
 * readings (T), predictions `model.evaluate`, and the model's analytic Jacobian when it
 * has one (central differences otherwise, inside the engine).
 *
 * @example
 * fitLeastSquares(fieldModelProblem(model, points), { initial: model.initialGuess(points) });
 */
export function fieldModelProblem(model: FieldModel, points: SurveyPoints): LeastSquaresProblem {
  const predict = (params: Float64Array, out: Float64Array): void => model.evaluate(params, points, out);
  const jacobian = model.jacobian;
  if (jacobian === undefined) return { observed: points.field, parameterCount: model.parameters.length, predict };
  const modelJacobian = (params: Float64Array, out: Float64Array): void => jacobian.call(model, params, points, out);
  const normalEquations = model.normalEquations;
  if (normalEquations === undefined) {
    return { observed: points.field, parameterCount: model.parameters.length, predict, jacobian: modelJacobian };
  }
  return {
    observed: points.field,
    parameterCount: model.parameters.length,
    predict,
    jacobian: modelJacobian,
    normalEquations: (params, weight, scale, residuals, gram, gradient) =>
      normalEquations.call(model, params, points, weight, scale, residuals, gram, gradient),
  };
}

/**
 * Slope of each prediction with respect to its own distance, ∂fᵢ/∂dᵢ (T/m), by central
 * differences with hᵢ = ε^(1/3)·max(|dᵢ|, 1 mm): two evaluations move every distance at
 * once, since a reading's prediction depends only on its own position; where one side is
 * not finite (a step across a power law's singularity at r = 0) a one-sided difference on
 * the other side. The input of the effective-variance weights (effective-variance.ts,
 * DOMAIN.md §3.7–3.8).
 *
 * @param out receives the slopes (length n).
 */
export function distanceSlope(model: FieldModel, params: Float64Array, points: SurveyPoints, out: Float64Array): void {
  const n = points.n;
  // Scratch slots 3–6 (scratch-array.ts): a call runs to completion and models do not call back here.
  const shifted = scratchArray(n, 3);
  const step = scratchArray(n, 4);
  const plus = scratchArray(n, 5);
  const minus = scratchArray(n, 6);
  for (let i = 0; i < n; i++) {
    const d = points.distance[i]!;
    const h = Math.cbrt(2.220446049250313e-16) * Math.max(Math.abs(d), 1e-3);
    // The step actually taken, after rounding d + h.
    step[i] = d + h - d;
    shifted[i] = d + step[i]!;
  }
  model.evaluate(params, { ...points, distance: shifted }, plus);
  for (let i = 0; i < n; i++) shifted[i] = points.distance[i]! - step[i]!;
  model.evaluate(params, { ...points, distance: shifted }, minus);
  let center: Float64Array | null = null;
  for (let i = 0; i < n; i++) {
    const up = plus[i]!;
    const down = minus[i]!;
    if (Number.isFinite(up) && Number.isFinite(down)) {
      out[i] = (up - down) / (2 * step[i]!);
      continue;
    }
    // A step across a singularity (a power law's sensing point at r = 0): one-sided on the finite side.
    if (center === null) {
      center = new Float64Array(n);
      model.evaluate(params, points, center);
    }
    const here = center[i]!;
    out[i] = Number.isFinite(up) ? (up - here) / step[i]! : (here - down) / step[i]!;
  }
}
