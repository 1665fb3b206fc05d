import type { FitResult } from '../fit/fit-result';
import type { FieldModel, SurveyPoints } from '../models/field-model';

/**
 * Report curves: what a view needs to draw a fitted model — its on-axis falloff curve,
 * the delta-method 95 % confidence band of that curve, and |B| on a grid in the plane
 * through the coil axis. Pure functions of a FitResult and its FieldModel; SI in and
 * out (m, T). Views call these instead of touching physics themselves.
 */

/** Parameter vector of a fit in the model's parameter order (SI). */
export function fittedParameters(model: FieldModel, fit: FitResult): Float64Array {
  return Float64Array.from(model.parameters, (spec) => {
    const estimate = fit.params[spec.name];
    if (!estimate) throw new RangeError(`fittedParameters: fit of ${fit.model} has no parameter "${spec.name}"`);
    return estimate.value;
  });
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
 * Student-t factor of the fit's 95 % intervals, read back from any free parameter as
 * (ci95_upper − value)/stderr, so the band uses exactly the engine's t(0.975, n − k).
 * Null when no free parameter has an interval.
 */
export function intervalFactor(fit: FitResult): number | null {
  for (const name of fit.freeParameters) {
    const estimate = fit.params[name];
    if (estimate?.ci95 && estimate.stderr !== null && estimate.stderr > 0) {
      const factor = (estimate.ci95[1] - estimate.value) / estimate.stderr;
      if (Number.isFinite(factor) && factor > 0) return factor;
    }
  }
  return null;
}

/**
 * 95 % confidence band of the fitted on-axis curve by the delta method:
 * f(d) ± t·√(gᵀ C g), g_j = ∂f(d)/∂θ_j over the free parameters, C their covariance
 * (GUM, JCGM 100:2008 §5.1.2, law of propagation of uncertainty). Derivatives by
 * central differences with a step of 10⁻³ standard errors. Null when the fit has no
 * covariance or no intervals. Values in T.
 */
export function confidenceBand(
  model: FieldModel,
  fit: FitResult,
  distances: Float64Array,
): { lower: Float64Array; upper: Float64Array } | null {
  const factor = intervalFactor(fit);
  const covariance = fit.covariance;
  const k = fit.freeParameters.length;
  if (factor === null || covariance === null || covariance.length !== k * k || k === 0) return null;
  const n = distances.length;
  const base = fittedParameters(model, fit);
  const points = pointsAt(distances, new Float64Array(n));
  const centre = new Float64Array(n);
  model.evaluate(base, points, centre);
  const gradient = new Float64Array(n * k);
  const plus = new Float64Array(n);
  const minus = new Float64Array(n);
  for (let j = 0; j < k; j++) {
    const name = fit.freeParameters[j]!;
    const index = model.parameters.findIndex((spec) => spec.name === name);
    const stderr = Math.sqrt(Math.max(covariance[j * k + j]!, 0));
    const step = stderr > 0 ? 1e-3 * stderr : 1e-8 * Math.max(Math.abs(base[index]!), 1e-12);
    const shifted = Float64Array.from(base);
    shifted[index] = base[index]! + step;
    model.evaluate(shifted, points, plus);
    shifted[index] = base[index]! - step;
    model.evaluate(shifted, points, minus);
    for (let i = 0; i < n; i++) gradient[i * k + j] = (plus[i]! - minus[i]!) / (2 * step);
  }
  const lower = new Float64Array(n);
  const upper = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let variance = 0;
    for (let a = 0; a < k; a++) {
      const ga = gradient[i * k + a]!;
      for (let b = 0; b < k; b++) variance += ga * covariance[a * k + b]! * gradient[i * k + b]!;
    }
    const half = factor * Math.sqrt(Math.max(variance, 0));
    lower[i] = centre[i]! - half;
    upper[i] = centre[i]! + half;
  }
  return { lower, upper };
}

/** A grid of |B| over the plane through the coil axis. */
export interface FieldMapGrid {
  /** Axial positions (stated distance from the datum), m, ascending; length nz. */
  readonly distance: Float64Array;
  /** Radial offsets from the axis, m, ascending from 0; length nRadial. */
  readonly radial: Float64Array;
  /** |B| in T, row-major by radial then distance: values[r * nz + z]. */
  readonly values: Float64Array;
}

/**
 * |B| of the fitted coil on a regular grid in the plane through its axis, with the
 * fitted background set to zero (the map shows the coil's own field). Distances are
 * measured like the survey's (from the datum, probe offset applied by the model).
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
  const pointDistance = new Float64Array(nz * nRadial);
  const pointRadial = new Float64Array(nz * nRadial);
  for (let r = 0; r < nRadial; r++) {
    for (let z = 0; z < nz; z++) {
      pointDistance[r * nz + z] = distance[z]!;
      pointRadial[r * nz + z] = radial[r]!;
    }
  }
  const parameters = fittedParameters(model, fit);
  const backgroundIndex = model.parameters.findIndex((spec) => spec.name === 'background');
  if (backgroundIndex >= 0) parameters[backgroundIndex] = 0;
  const values = new Float64Array(nz * nRadial);
  model.evaluate(parameters, pointsAt(pointDistance, pointRadial), values);
  for (let i = 0; i < values.length; i++) values[i] = Math.abs(values[i]!);
  return { distance, radial, values };
}
