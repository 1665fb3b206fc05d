import { studentTQuantile } from './student-t-quantile';

/** Standard errors and confidence intervals of fitted parameters. */
export interface ParameterIntervals {
  /** √Cᵢᵢ, in each parameter's unit. */
  readonly standardErrors: Float64Array;
  /** [θ̂ᵢ − t·seᵢ, θ̂ᵢ + t·seᵢ] per parameter. */
  readonly intervals: readonly (readonly [number, number])[];
  /** The t quantile used, t_{(1+level)/2, ν}. */
  readonly coverageFactor: number;
}

/**
 * Linearised confidence intervals θ̂ⱼ ± t_{(1+level)/2, ν}·√Cⱼⱼ with ν = n − k degrees
 * of freedom when the scale was estimated, ν = ∞ (normal quantile) when σ were stated
 * (DOMAIN.md §7.5; NIST/SEMATECH e-Handbook of Statistical Methods §4.4).
 * Asymmetric uncertainty of strongly nonlinear models is not captured.
 *
 * @param values θ̂ (k); covariance row-major k×k; degreesOfFreedom ν > 0 or Infinity; level in (0, 1).
 * @example
 * // θ̂ = 10, Var = 4, ν = 8: 10 ± 2.306004·2 = [5.388, 14.612]
 * parameterIntervals([10], Float64Array.of(4), 8).intervals[0]; // [5.387992, 14.612008]
 */
export function parameterIntervals(
  values: ArrayLike<number>,
  covariance: ArrayLike<number>,
  degreesOfFreedom: number,
  level = 0.95,
): ParameterIntervals {
  const k = values.length;
  const coverageFactor = coverageQuantile((1 + level) / 2, degreesOfFreedom);
  const standardErrors = new Float64Array(k);
  const intervals = new Array<readonly [number, number]>(k);
  for (let j = 0; j < k; j++) {
    const se = Math.sqrt(Math.max(0, covariance[j * k + j]!));
    standardErrors[j] = se;
    const half = coverageFactor * se;
    intervals[j] = [values[j]! - half, values[j]! + half];
  }
  return { standardErrors, intervals, coverageFactor };
}

// Quantiles kept per (probability, ν): the fits of a batch ask for a few values over and
// over (one per model's n − k), each an iterative inversion (student-t-quantile.ts).
const quantiles = new Map<number, Map<number, number>>();

function coverageQuantile(probability: number, degreesOfFreedom: number): number {
  let byFreedom = quantiles.get(probability);
  if (byFreedom === undefined) {
    if (quantiles.size >= 8) quantiles.clear();
    byFreedom = new Map<number, number>();
    quantiles.set(probability, byFreedom);
  }
  let value = byFreedom.get(degreesOfFreedom);
  if (value === undefined) {
    value = studentTQuantile(probability, degreesOfFreedom);
    if (byFreedom.size >= 256) byFreedom.clear();
    byFreedom.set(degreesOfFreedom, value);
  }
  return value;
}
