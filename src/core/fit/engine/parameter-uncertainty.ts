import { correlationMatrix } from '../../stats/correlation-matrix';
import { identifiability, type Identifiability } from '../../stats/identifiability';
import { leastSquaresCovariance } from '../../stats/least-squares-covariance';
import { parameterIntervals } from '../../stats/parameter-intervals';
import type { LeastSquaresSolution } from './least-squares-types';

/** Uncertainty of the free parameters of one least-squares solution (free-parameter order). */
export interface ParameterUncertainty {
  /** 'stated': σ were standard uncertainties; 'estimated': scale s² = χ²/ν from the residuals. */
  readonly uncertaintyScale: 'stated' | 'estimated';
  /** ν = n − k. */
  readonly degreesOfFreedom: number;
  /** χ²/ν when σ were stated (≈ 1 if σ and model are right, SD √(2/ν)); null when estimated. */
  readonly reducedChiSquare: number | null;
  /** Row-major k×k, or null when singular or ν = 0 with an estimated scale. */
  readonly covariance: readonly number[] | null;
  readonly correlation: readonly number[] | null;
  /** √Cⱼⱼ, or null with the covariance. */
  readonly standardErrors: Float64Array | null;
  /** Intervals at `level`: normal quantile when σ were stated, t with ν = n − k when estimated; or null. */
  readonly intervals: readonly (readonly [number, number])[] | null;
  /** Of the column-equilibrated weighted Jacobian (its condition number: leastSquaresCovariance, on demand). */
  readonly rank: number;
  readonly identifiability: Identifiability;
}

/**
 * Linearised uncertainty of a fit (DOMAIN.md §7.4–7.6): covariance c·(JᵀWJ)⁻¹ from the
 * solution's weighted Jacobian in the original parameters (c = 1 for stated σ, s² =
 * χ²/(n − k) otherwise), standard errors, intervals (θ̂ ± z·se for stated σ, where the
 * pivot is normal; θ̂ ± t_{n−k}·se when s² is estimated, DOMAIN.md §7.5), correlations,
 * rank and which parameters the data determine.
 *
 * @param level coverage of the intervals (default 0.95).
 */
export function parameterUncertainty(
  solution: LeastSquaresSolution,
  uncertaintyScale: 'stated' | 'estimated',
  level = 0.95,
): ParameterUncertainty {
  const n = solution.residuals.length;
  const k = solution.freeIndices.length;
  const degreesOfFreedom = n - k;
  const reducedChiSquare = uncertaintyScale === 'stated' && degreesOfFreedom > 0 ? solution.chiSquare / degreesOfFreedom : null;
  const result = leastSquaresCovariance(solution.jacobian, n, k, { scale: uncertaintyScale, chiSquare: solution.chiSquare });
  const covariance = result.covariance;
  const correlation = covariance === null ? null : correlationMatrix(covariance, k);
  let standardErrors: Float64Array | null = null;
  let intervals: readonly (readonly [number, number])[] | null = null;
  if (covariance !== null && degreesOfFreedom > 0) {
    const values = new Array<number>(k);
    for (let j = 0; j < k; j++) values[j] = solution.params[solution.freeIndices[j]!]!;
    const intervalFreedom = uncertaintyScale === 'stated' ? Infinity : degreesOfFreedom;
    ({ standardErrors, intervals } = parameterIntervals(values, covariance, intervalFreedom, level));
  }
  return {
    uncertaintyScale,
    degreesOfFreedom,
    reducedChiSquare,
    covariance,
    correlation,
    standardErrors,
    intervals,
    rank: result.rank,
    identifiability: identifiability(result, correlation),
  };
}
