import type { FitResult } from '../fit/fit-result';
import { deltaVariance, fittedModel, probeOffsetOf } from '../analysis/fitted-model';
import type { FieldModel, SurveyPoints } from '../models/field-model';

/**
 * Report curves: what a view needs to draw a fitted model — its on-axis falloff curve,
 * the delta-method 95 % confidence band of that curve, and |B| on a grid in the plane
 * through the coil axis. Pure functions of a FitResult and its FieldModel; SI in and
 * out (m, T). Views call these instead of touching physics themselves.
 */

/** Parameter vector of a fit in the model's parameter order (SI). */
export function fittedParameters(model: FieldModel, fit: FitResult): Float64Array {
  return fittedModel(fit, model).values;
}

/**
 * `count` distances spaced evenly in log(distance) from `from` to `to` (m, both > 0).
 * @example logSpacedDistances(0.001, 0.1, 3) // [0.001, 0.01, 0.1]
 */
export function logSpacedDistances(from: number, to: number, count: number): Float64Array {
  if (!(from > 0) || !(to > from) || count < 2) {
    throw new RangeError(`logSpacedDistances: need 0 < from < to and count ≥ 2, got ${from}, ${to}, ${count}`);
  }
  const start = Math.log(from);
  const step = (Math.log(to) - start) / (count - 1);
  return Float64Array.from({ length: count }, (_, i) => (i === count - 1 ? to : Math.exp(start + i * step)));
}

function pointsAt(distance: Float64Array, radial: Float64Array): SurveyPoints {
  return { n: distance.length, distance, radial, field: new Float64Array(distance.length), kind: 'magnitude' };
}

/**
 * The fitted model's predicted reading |B| on the coil axis (ρ = 0) at each stated
 * distance (m), in T, background included — the curve drawn through the readings.
 */
export function fittedCurve(model: FieldModel, fit: FitResult, distances: Float64Array): Float64Array {
  const out = new Float64Array(distances.length);
  model.evaluate(fittedParameters(model, fit), pointsAt(distances, new Float64Array(distances.length)), out);
  return out;
}

/**
 * 95 % confidence band of the fitted on-axis curve by the delta method:
 * f(d) ± t·√(gᵀ C g), g_j = ∂f(d)/∂θ_j over the free parameters, C their covariance
 * (JCGM 100:2008 §5.1.2, law of propagation of uncertainty), t read back from the
 * fit's own parameter intervals so the band matches the parameter table. Null when the
 * fit has no covariance or no intervals. Values in T.
 */
export function confidenceBand(
  model: FieldModel,
  fit: FitResult,
  distances: Float64Array,
): { lower: Float64Array; upper: Float64Array } | null {
  const fitted = fittedModel(fit, model);
  const factor = fitted.coverageFactor;
  if (factor === null || fitted.covariance === null || fit.freeParameters.length === 0) return null;
  const gradient = new Float64Array(model.parameters.length);
  const lower = new Float64Array(distances.length);
  const upper = new Float64Array(distances.length);
  distances.forEach((distance, i) => {
    const centre = fitted.point.field(fitted.values, distance, 0);
    fitted.point.gradient(fitted.values, distance, 0, gradient);
    const half = factor * Math.sqrt(deltaVariance(fitted, gradient) ?? 0);
    lower[i] = centre - half;
    upper[i] = centre + half;
  });
  return { lower, upper };
}

/** The fit's probe offset δ (m, 0 for a model without one): field point = stated distance + δ. */
export function probeOffset(model: FieldModel, fit: FitResult): number {
  return probeOffsetOf(fittedModel(fit, model));
}

/** A grid of |B| over the plane through the coil axis. */
export interface FieldMapGrid {
  /** Axial positions of the field point from the datum (winding plane or near face), m, ascending; length nz. */
  readonly distance: Float64Array;
  /** Radial offsets from the axis, m, ascending from 0; length nRadial. */
  readonly radial: Float64Array;
  /** |B| in T, row-major by radial then distance: values[r * nz + z]. */
  readonly values: Float64Array;
}

/**
 * |B| of the fitted coil on a regular grid in the plane through its axis, at true field
 * points: distance is measured from the datum to the point itself, so the model is
 * evaluated at the stated distance (distance − fitted probe offset). The fitted
 * background is set to zero: the map shows the coil's own field.
 */
export function fieldMapGrid(
  model: FieldModel,
  fit: FitResult,
  extent: { maxDistance: number; maxRadial: number; nz: number; nRadial: number; minDistance?: number },
): FieldMapGrid {
  const { maxDistance, maxRadial, nz, nRadial } = extent;
  const minDistance = extent.minDistance ?? 0;
  const distance = Float64Array.from({ length: nz }, (_, i) => minDistance + ((maxDistance - minDistance) * i) / (nz - 1));
  const radial = Float64Array.from({ length: nRadial }, (_, i) => (maxRadial * i) / (nRadial - 1));
  const fitted = fittedModel(fit, model);
  const offset = probeOffsetOf(fitted);
  const pointDistance = new Float64Array(nz * nRadial);
  const pointRadial = new Float64Array(nz * nRadial);
  for (let r = 0; r < nRadial; r++) {
    for (let z = 0; z < nz; z++) {
      pointDistance[r * nz + z] = distance[z]! - offset;
      pointRadial[r * nz + z] = radial[r]!;
    }
  }
  const parameters = Float64Array.from(fitted.values);
  const backgroundIndex = model.parameters.findIndex((spec) => spec.role === 'background');
  if (backgroundIndex >= 0) parameters[backgroundIndex] = 0;
  const values = new Float64Array(nz * nRadial);
  model.evaluate(parameters, pointsAt(pointDistance, pointRadial), values);
  for (let i = 0; i < values.length; i++) values[i] = Math.abs(values[i]!);
  return { distance, radial, values };
}
