import { regularizedUpperGamma } from './regularized-incomplete-gamma';

/**
 * Upper tail of the standard normal, 1 − Φ(z) = ½·erfc(z/√2) = ½·Q(½, z²/2) for z ≥ 0
 * (A&S 7.1.2 and 6.5.17), and by symmetry for z < 0.
 *
 * @example
 * normalUpperTail(1.959963984540054); // 0.025
 */
export function normalUpperTail(z: number): number {
  if (Number.isNaN(z)) return NaN;
  const tail = 0.5 * regularizedUpperGamma(0.5, 0.5 * z * z);
  return z >= 0 ? tail : 1 - tail;
}

/**
 * Quantile of the standard normal: z with Φ(z) = p. Start from A&S 26.2.23 (|error| <
 * 4.5e-4), then Newton steps on the upper tail with the density φ(z) = e^(−z²/2)/√(2π)
 * until the step is below 1e-15·|z|.
 *
 * @param probability p in [0, 1].
 * @returns z (dimensionless); ±Infinity at 1 / 0; NaN outside [0, 1].
 * @example
 * normalQuantile(0.975); // 1.959963984540054
 */
export function normalQuantile(probability: number): number {
  const p = probability;
  if (!(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  if (p === 0.5) return 0;
  const q = Math.min(p, 1 - p);
  const t = Math.sqrt(-2 * Math.log(q));
  let z = t - (2.515517 + t * (0.802853 + t * 0.010328)) / (1 + t * (1.432788 + t * (0.189269 + t * 0.001308)));
  for (let iteration = 0; iteration < 50; iteration++) {
    const density = Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
    const step = (normalUpperTail(z) - q) / density;
    z += step;
    if (Math.abs(step) <= 1e-15 * Math.abs(z)) break;
  }
  return p > 0.5 ? z : -z;
}
