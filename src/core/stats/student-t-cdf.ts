import { logGamma } from './log-gamma';
import { regularizedIncompleteBeta } from './regularized-incomplete-beta';

/**
 * Cumulative distribution function of Student's t with ν degrees of freedom:
 * P(T ≤ t) = 1 − ½·I_{ν/(ν+t²)}(ν/2, ½) for t ≥ 0, and by symmetry for t < 0
 * (A&S 26.7.1 with 26.5.27).
 *
 * @param t value (dimensionless); degreesOfFreedom ν > 0 (need not be an integer).
 * @returns probability in [0, 1]; NaN for ν ≤ 0.
 * @example
 * studentTCdf(2.570582, 5); // 0.975 (DOMAIN.md §7.5)
 */
export function studentTCdf(t: number, degreesOfFreedom: number): number {
  const nu = degreesOfFreedom;
  if (!(nu > 0) || Number.isNaN(t)) return NaN;
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const tail = 0.5 * regularizedIncompleteBeta(nu / (nu + t * t), nu / 2, 0.5, (t * t) / (nu + t * t));
  return t >= 0 ? 1 - tail : tail;
}

/**
 * Probability density of Student's t: Γ((ν+1)/2)/(√(νπ)·Γ(ν/2))·(1 + t²/ν)^(−(ν+1)/2)
 * (A&S 26.7.1).
 *
 * @example
 * studentTDensity(0, 1); // 1/π
 */
export function studentTDensity(t: number, degreesOfFreedom: number): number {
  const nu = degreesOfFreedom;
  if (!(nu > 0)) return NaN;
  const logNorm = logGamma((nu + 1) / 2) - logGamma(nu / 2) - 0.5 * Math.log(nu * Math.PI);
  return Math.exp(logNorm - ((nu + 1) / 2) * Math.log1p((t * t) / nu));
}
