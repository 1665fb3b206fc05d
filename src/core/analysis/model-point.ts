import type { FieldModel, SurveyPoints } from '../models/field-model';

/** A catalog model evaluated one point at a time (analyses, not fitting loops). */
export interface ModelPoint {
  readonly model: FieldModel;
  /** Predicted reading at (distance, radial), T, for the full parameter vector (SI, model order). */
  field(params: Float64Array, distance: number, radial: number): number;
  /** ∂reading/∂θⱼ for every parameter, written into `out` (length = parameter count). */
  gradient(params: Float64Array, distance: number, radial: number, out: Float64Array): void;
  /** ∂reading/∂distance, T/m, by central differences (forward at distance ≈ 0). */
  slope(params: Float64Array, distance: number, radial: number): number;
}

/**
 * Wrap a FieldModel for single-point use with preallocated one-point arrays. The gradient
 * is the model's analytic Jacobian; for a model without one, central differences with the
 * relative step h = ε^(1/3)·max(|θⱼ|, 1e-6) (Nocedal & Wright, Numerical Optimization,
 * 2nd ed., §8.1). The distance slope uses h = ε^(1/3)·max(|d|, 1 mm).
 *
 * @param kind 'magnitude' predicts |B|, 'axial' the signed axial component (SurveyPoints.kind)
 */
export function modelPoint(model: FieldModel, kind: 'magnitude' | 'axial' = 'magnitude'): ModelPoint {
  const distanceArray = new Float64Array(1);
  const radialArray = new Float64Array(1);
  const points: SurveyPoints = { n: 1, distance: distanceArray, radial: radialArray, field: new Float64Array(1), kind };
  const out = new Float64Array(1);
  const count = model.parameters.length;
  const jacobian = new Float64Array(count);
  const trial = new Float64Array(count);
  const step = Math.cbrt(Number.EPSILON);
  const field = (params: Float64Array, distance: number, radial: number): number => {
    distanceArray[0] = distance;
    radialArray[0] = radial;
    model.evaluate(params, points, out);
    return out[0]!;
  };
  return {
    model,
    field,
    gradient(params, distance, radial, target) {
      if (model.jacobian) {
        distanceArray[0] = distance;
        radialArray[0] = radial;
        model.jacobian(params, points, jacobian);
        target.set(jacobian);
        return;
      }
      trial.set(params);
      for (let j = 0; j < count; j += 1) {
        const x = params[j]!;
        const h = step * Math.max(Math.abs(x), 1e-6);
        trial[j] = x + h;
        const up = field(trial, distance, radial);
        trial[j] = x - h;
        const down = field(trial, distance, radial);
        trial[j] = x;
        target[j] = (up - down) / (2 * h);
      }
    },
    slope(params, distance, radial) {
      const h = step * Math.max(Math.abs(distance), 1e-3);
      if (distance - h < 0) return (field(params, distance + h, radial) - field(params, distance, radial)) / h;
      return (field(params, distance + h, radial) - field(params, distance - h, radial)) / (2 * h);
    },
  };
}
