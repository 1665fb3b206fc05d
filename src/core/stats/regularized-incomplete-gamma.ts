import { logGamma } from './log-gamma';

/**
 * Regularised upper incomplete gamma function Q(a, x) = Γ(a, x)/Γ(a), by the series of
 * P = 1 − Q for x < a + 1 and the continued fraction of Q otherwise (modified Lentz) —
 * W. H. Press et al., "Numerical Recipes", 3rd ed., §6.2; A&S 6.5.29 and 6.5.31.
 * Relative accuracy ≈ 1e-14 where Q is not tiny compared with 1 − Q.
 *
 * @param a > 0; x ≥ 0 (dimensionless).
 * @returns Q(a, x) in [0, 1]; NaN outside the domain.
 * @example
 * regularizedUpperGamma(1, 2); // e⁻² = 0.1353352832366127
 */
export function regularizedUpperGamma(a: number, x: number): number {
  if (!(a > 0 && x >= 0)) return NaN;
  if (x === 0) return 1;
  if (x === Infinity) return 0;
  const logFront = a * Math.log(x) - x - logGamma(a);
  if (x < a + 1) {
    let term = 1 / a;
    let sum = term;
    for (let n = 1; n < 1000; n++) {
      term *= x / (a + n);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * 1e-17) break;
    }
    return 1 - sum * Math.exp(logFront);
  }
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 1000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(logFront) * h;
}
