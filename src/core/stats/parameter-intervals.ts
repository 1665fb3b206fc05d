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
  covariance: Float64Array,
  degreesOfFreedom: number,
  level = 0.95,
): ParameterIntervals {
  const k = values.length;
  const coverageFactor = coverageQuantile((1 + level) / 2, degreesOfFreedom);
  const standardErrors = Float64Array.from({ length: k }, (_, j) => Math.sqrt(Math.max(0, covariance[j * k + j]!)));
  const intervals = Array.from({ length: k }, (_, j): readonly [number, number] => {
    const half = coverageFactor * standardErrors[j]!;
    return [values[j]! - half, values[j]! + half];
  });
  return { standardErrors, intervals, coverageFactor };
}

// One-entry memo: fits of one survey ask for the same quantile over and over.
let memoProbability = NaN;
let memoFreedom = NaN;
let memoValue = NaN;

function coverageQuantile(probability: number, degreesOfFreedom: number): number {
  if (probability !== memoProbability || degreesOfFreedom !== memoFreedom) {
    memoValue = studentTQuantile(probability, degreesOfFreedom);
    memoProbability = probability;
    memoFreedom = degreesOfFreedom;
  }
  return memoValue;
}
