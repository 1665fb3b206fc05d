import { mulberry32, normalRandom } from '../../random';
import { coilOnlyMask, coilOnlyValues } from '../coil-only-values';
import { deltaVariance, type FittedModel } from '../fitted-model';
import { choleskyFactor } from '../../linalg/cholesky';
import { sampleQuantile } from '../../numeric/order-statistics';
import { fallDistance } from './fall-distance';

/** A threshold distance of the coil's own field with its 95 % interval. */
export interface ThresholdEstimate {
  readonly distance: number | null;
  readonly ci95: readonly [number, number] | null;
  readonly method: 'delta' | 'monte-carlo' | null;
  readonly notes: readonly string[];
}

/** Options of the interval: Monte Carlo sample count and seed (reproducible). */
export interface ThresholdIntervalOptions {
  readonly samples?: number;
  readonly seed?: number;
  /** Relative departure from linearity that switches to Monte Carlo. Default 0.1. */
  readonly nonlinearity?: number;
}

const normal975 = 1.959963984540054;

/**
 * Distance from the datum where the fitted coil's on-axis field falls to `level`, with a
 * 95 % interval by the delta method through the implicit-function derivative
 * dz/dθ = −(∂B/∂θ)/(∂B/∂z) (JCGM 100:2008 §5.1.2). The linearisation is checked at the two
 * ends of the interval: the parameters are moved to the edge of the confidence ellipsoid
 * along C·∇z and the distance recomputed; when either end departs from the linear value by
 * more than 10 % of the half-width, the interval is instead the 2.5–97.5 % range of a seeded
 * Monte Carlo propagation of the covariance (JCGM 101:2008, GUM Supplement 1), normal
 * deviates scaled by the fit's coverage factor/1.96 and draws outside the model's bounds
 * rejected.
 */
export function thresholdInterval(fitted: FittedModel, level: number, scale: number, options: ThresholdIntervalOptions = {}): ThresholdEstimate {
  const model = fitted.point.model;
  const coil = coilOnlyValues(model, fitted.values);
  const distanceFor = (values: Float64Array): number | null => fallDistance((z) => fitted.point.field(values, z, 0), level, scale).distance;
  const distance = distanceFor(coil);
  if (distance === null) return { distance: null, ci95: null, method: null, notes: [] };
  const mask = coilOnlyMask(model);
  const undetermined = model.parameters
    .filter((p, j) => !mask[j] && fitted.fit.params[p.name] && !fitted.fit.params[p.name]!.fixed && !fitted.fit.params[p.name]!.determined)
    .map((p) => p.name);
  if (undetermined.length > 0) {
    return { distance, ci95: null, method: null, notes: [`No interval: these readings do not determine ${undetermined.join(', ')}.`] };
  }
  const k = fitted.freeIndex.length;
  const coverage = fitted.coverageFactor;
  if (fitted.covariance === null || coverage === null || k === 0) {
    return { distance, ci95: null, method: null, notes: ['No interval: the fit has no covariance.'] };
  }
  const gradient = new Float64Array(model.parameters.length);
  fitted.point.gradient(coil, distance, 0, gradient);
  const slope = fitted.point.slope(coil, distance, 0);
  for (let j = 0; j < gradient.length; j += 1) gradient[j] = mask[j] ? 0 : -gradient[j]! / slope;
  const sd = Math.sqrt(deltaVariance(fitted, gradient)!);
  const half = coverage * sd;
  const linear: [number, number] = [distance - half, distance + half];
  if (!(sd > 0)) return { distance, ci95: linear, method: 'delta', notes: [] };

  // Ends of the confidence ellipsoid along C·∇z (free coordinates).
  const shifted = new Float64Array(coil);
  const ends: (number | null)[] = [-1, 1].map((direction) => {
    shifted.set(coil);
    for (let a = 0; a < k; a += 1) {
      let move = 0;
      for (let b = 0; b < k; b += 1) move += fitted.covariance![a * k + b]! * gradient[fitted.freeIndex[b]!]!;
      const index = fitted.freeIndex[a]!;
      if (!mask[index]) shifted[index] = coil[index]! + (direction * coverage * move) / sd;
    }
    return inBounds(fitted, shifted) ? distanceFor(shifted) : null;
  });
  const limit = options.nonlinearity ?? 0.1;
  const linearEnough = ends.every((end, i) => end !== null && Math.abs(end - linear[i]!) <= limit * half);
  if (linearEnough) return { distance, ci95: linear, method: 'delta', notes: [] };
  return monteCarlo(fitted, level, scale, distance, options, distanceFor);
}

function monteCarlo(
  fitted: FittedModel,
  level: number,
  scale: number,
  distance: number,
  options: ThresholdIntervalOptions,
  distanceFor: (values: Float64Array) => number | null,
): ThresholdEstimate {
  const k = fitted.freeIndex.length;
  const lower = choleskyFactor(fitted.covariance!, k, 0);
  if (lower === null) return { distance, ci95: null, method: null, notes: ['No interval: the covariance is not positive definite.'] };
  const samples = options.samples ?? 1000;
  const gaussian = normalRandom(mulberry32(options.seed ?? 20100818));
  const factor = fitted.coverageFactor! / normal975;
  const mask = coilOnlyMask(fitted.point.model);
  const draw = new Float64Array(fitted.values);
  const deviates = new Float64Array(k);
  const distances: number[] = [];
  let rejected = 0;
  while (distances.length < samples && rejected < 4 * samples) {
    for (let a = 0; a < k; a += 1) deviates[a] = gaussian();
    draw.set(fitted.values);
    for (let a = 0; a < k; a += 1) {
      let move = 0;
      for (let b = 0; b <= a; b += 1) move += lower[a * k + b]! * deviates[b]!;
      draw[fitted.freeIndex[a]!] = fitted.values[fitted.freeIndex[a]!]! + factor * move;
    }
    if (!inBounds(fitted, draw)) {
      rejected += 1;
      continue;
    }
    mask.forEach((zero, j) => { if (zero) draw[j] = 0; });
    distances.push(distanceFor(draw) ?? 0);
  }
  const notes = [`Interval by Monte Carlo propagation of the fit covariance (${distances.length} seeded draws; JCGM 101:2008), because the distance depends nonlinearly on the parameters here.`];
  if (rejected > 0) notes.push(`${rejected} draws fell outside the parameters' bounds and were redrawn.`);
  if (distances.length < samples / 2) return { distance, ci95: null, method: null, notes: [...notes, 'Too few valid draws for an interval.'] };
  distances.sort((x, y) => x - y);
  return { distance, ci95: [sampleQuantile(distances, 0.025), sampleQuantile(distances, 0.975)], method: 'monte-carlo', notes };
}

function inBounds(fitted: FittedModel, values: Float64Array): boolean {
  return fitted.point.model.parameters.every((p, j) => values[j]! >= p.lower && values[j]! <= p.upper);
}
