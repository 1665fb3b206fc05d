import { inFormOf } from '../fit/strategy/distance-form-fit';
import type { FitResult } from '../fit/fit-result';
import { deltaMethodVariance } from '../stats';
import type { FieldModel } from '../models/field-model';
import { modelPoint, type ModelPoint } from './model-point';
import { parameterRole } from './parameter-roles';

/** A FitResult joined to its catalog model: parameter vector, free indices, covariance. */
export interface FittedModel {
  readonly fit: FitResult;
  readonly point: ModelPoint;
  /** Fitted values of every parameter, SI, in the model's parameter order. */
  readonly values: Float64Array;
  /** Model-order index of each free parameter, in covariance order. */
  readonly freeIndex: readonly number[];
  /** Covariance of the free parameters (row-major k×k), or null when the fit has none. */
  readonly covariance: readonly number[] | null;
  /**
   * Multiplier from a standard error to the fit's own 95 % half-width (t with n − k
   * degrees of freedom, or whatever the fit used), read off a free parameter's interval.
   */
  readonly coverageFactor: number | null;
}

/**
 * Join a fit to its model so analyses can evaluate the fitted curve and propagate the
 * covariance. The coverage factor is taken from the fit's own intervals so that derived
 * intervals (claims, threshold distances) use the same convention as the parameter table.
 *
 * @throws RangeError when the fit does not belong to the model
 */
export function fittedModel(given: FitResult, model: FieldModel): FittedModel {
  // a fit in a survey's own frame (scan, transverse scan, 3-D map) is read in the model's form: what the model lacks is folded away
  const fit = inFormOf(given, model.parameters.map((p) => p.name));
  if (fit.model !== model.id) throw new RangeError(`fittedModel: fit of "${fit.model}" given with model "${model.id}"`);
  const values = new Float64Array(model.parameters.map((p) => fit.params[p.name]?.value ?? Number.NaN));
  const freeIndex = fit.freeParameters.map((name) => model.parameters.findIndex((p) => p.name === name));
  if (freeIndex.some((i) => i < 0)) throw new RangeError(`fittedModel: free parameters ${fit.freeParameters.join(', ')} are not all in model "${model.id}"`);
  let coverageFactor: number | null = null;
  for (const name of fit.freeParameters) {
    const estimate = fit.params[name];
    if (estimate?.ci95 && estimate.stderr !== null && estimate.stderr > 0) {
      coverageFactor = (estimate.ci95[1] - estimate.ci95[0]) / (2 * estimate.stderr);
      break;
    }
  }
  return { fit, point: modelPoint(model), values, freeIndex, covariance: fit.covariance, coverageFactor };
}

/**
 * Delta-method variance gᵀCg of a derived quantity from its gradient over all model
 * parameters (fixed ones ignored): Var(g(θ̂)) ≈ ∇gᵀ C ∇g (JCGM 100:2008 §5.1.2, law of
 * propagation of uncertainty). Null when the fit has no covariance.
 */
export function deltaVariance(fitted: FittedModel, gradient: ArrayLike<number>): number | null {
  if (fitted.covariance === null) return null;
  const free = fitted.freeIndex.map((j) => gradient[j]!);
  return Math.max(0, deltaMethodVariance(free, Float64Array.from(fitted.covariance)));
}

/** The fitted probe offset (m), 0 for a model without one. */
export function probeOffsetOf(fitted: FittedModel): number {
  const index = fitted.point.model.parameters.findIndex((p) => parameterRole(p.name) === 'offset');
  return index < 0 ? 0 : fitted.values[index]!;
}

/** Surveyed distances moved to the field point (reading + offset), as [nearest, farthest], m; null without points. */
export function surveyedFieldRange(fitted: FittedModel, offset = probeOffsetOf(fitted)): [number, number] | null {
  // A loop, not Math.min(...array): spreading 10⁵ readings overflows a worker's stack.
  let nearest = Infinity;
  let farthest = -Infinity;
  for (const point of fitted.fit.points) {
    nearest = Math.min(nearest, point.distance + offset);
    farthest = Math.max(farthest, point.distance + offset);
  }
  return fitted.fit.points.length === 0 ? null : [nearest, farthest];
}

/** True when a field-point distance lies outside the surveyed range (relative slack 1e-9). */
export function beyondSurvey(distance: number | null, range: readonly [number, number] | null): boolean {
  return distance !== null && range !== null && (distance > range[1] * (1 + 1e-9) || distance < range[0] * (1 - 1e-9));
}
