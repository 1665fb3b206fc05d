import { regularizedUpperGamma } from './regularized-incomplete-gamma';

/**
 * Probability that a χ² variable with ν degrees of freedom exceeds x:
 * P(χ²_ν > x) = Q(ν/2, x/2) (A&S 26.4.19). Small values say the scatter is larger than
 * the stated uncertainties allow (DOMAIN.md §7.3).
 *
 * @param x observed χ² ≥ 0; degreesOfFreedom ν > 0.
 * @example
 * chiSquareSurvival(2, 2); // e⁻¹ = 0.36787944117144233
 */
export function chiSquareSurvival(x: number, degreesOfFreedom: number): number {
  return regularizedUpperGamma(degreesOfFreedom / 2, x / 2);
}
