import { normalQuantile } from './normal-quantile';
import { regularizedIncompleteBeta } from './regularized-incomplete-beta';
import { studentTDensity } from './student-t-cdf';

/**
 * Quantile of Student's t with ν degrees of freedom: the t with P(T ≤ t) = p.
 * ν = ∞ is the normal quantile. Closed forms for ν = 1 (tan π(p − ½)) and ν = 2
 * ((2p − 1)/√(2p(1 − p))); otherwise
 * the Cornish–Fisher expansion about the normal quantile (A&S 26.7.5, normal start by
 * A&S 26.2.23) refined by safeguarded Newton steps on the upper tail
 * ½·I_{ν/(ν+t²)}(ν/2, ½) (A&S 26.7.1). Relative accuracy ≈ 1e-13 for ν ≤ 10⁴; beyond,
 * ln Γ(ν/2) rounding costs about ν·1e-16 (1e-8 at ν = 10⁸).
 *
 * @param probability p in [0, 1]; degreesOfFreedom ν > 0.
 * @returns t (dimensionless); ±Infinity at p = 1 / 0; NaN outside the domain.
 * @example
 * studentTQuantile(0.975, 8); // 2.306004135… (DOMAIN.md §9 row 61: 2.306004)
 */
export function studentTQuantile(probability: number, degreesOfFreedom: number): number {
  const p = probability;
  const nu = degreesOfFreedom;
  if (!(p >= 0 && p <= 1 && nu > 0)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  if (p === 0.5) return 0;
  if (nu === Infinity) return normalQuantile(p);
  if (nu === 1) return Math.tan(Math.PI * (p - 0.5));
  if (nu === 2) return (2 * p - 1) / Math.sqrt(2 * p * (1 - p));
  const tail = Math.min(p, 1 - p);
  const sign = p > 0.5 ? 1 : -1;
  return sign * upperTailQuantile(tail, nu);
}

/** t ≥ 0 with P(T > t) = q, q ∈ (0, ½). */
function upperTailQuantile(q: number, nu: number): number {
  let t = Math.max(cornishFisher(normalUpperQuantile(q), nu), 1e-3);
  let lower = 0;
  let upper = Infinity;
  for (let iteration = 0; iteration < 200; iteration++) {
    const excess = 0.5 * regularizedIncompleteBeta(nu / (nu + t * t), nu / 2, 0.5, (t * t) / (nu + t * t)) - q;
    if (excess === 0) return t;
    // The tail falls as t grows: positive excess means t is still too small.
    if (excess > 0) lower = t;
    else upper = t;
    let next = t + excess / studentTDensity(t, nu);
    if (!(next > lower && next < upper)) next = upper === Infinity ? 2 * t : 0.5 * (lower + upper);
    if (Math.abs(next - t) <= 1e-14 * next) return next;
    t = next;
  }
  return t;
}

/** Cornish–Fisher expansion of the t quantile in powers of 1/ν (A&S 26.7.5). */
function cornishFisher(z: number, nu: number): number {
  const z2 = z * z;
  const g1 = (z * (z2 + 1)) / 4;
  const g2 = (z * ((5 * z2 + 16) * z2 + 3)) / 96;
  const g3 = (z * (((3 * z2 + 19) * z2 + 17) * z2 - 15)) / 384;
  const g4 = (z * ((((79 * z2 + 776) * z2 + 1482) * z2 - 1920) * z2 - 945)) / 92160;
  return z + g1 / nu + g2 / nu ** 2 + g3 / nu ** 3 + g4 / nu ** 4;
}

/** Upper-tail standard normal quantile, |error| < 4.5e-4 (A&S 26.2.23); a starting value only. */
function normalUpperQuantile(q: number): number {
  const t = Math.sqrt(-2 * Math.log(q));
  return t - (2.515517 + t * (0.802853 + t * 0.010328)) / (1 + t * (1.432788 + t * (0.189269 + t * 0.001308)));
}
