import { logGamma } from './log-gamma';

/**
 * Regularised incomplete beta function I_x(a, b) = B(x; a, b)/B(a, b), evaluated by its
 * continued fraction (A&S 26.5.8) with the modified Lentz method, using the symmetry
 * I_x(a, b) = 1 − I_{1−x}(b, a) where the fraction converges slowly (x > (a+1)/(a+b+2))
 * — W. H. Press et al., "Numerical Recipes", 3rd ed., §6.4. Relative accuracy ≈ 1e-14.
 *
 * @param x in [0, 1]; a, b > 0 (dimensionless).
 * @param complement 1 − x, when the caller knows it more accurately than 1 − x rounds.
 * @returns I_x(a, b) in [0, 1]; NaN for arguments outside the domain.
 * @example
 * regularizedIncompleteBeta(0.5, 2, 3); // 0.6875 (= 11/16)
 */
export function regularizedIncompleteBeta(x: number, a: number, b: number, complement = 1 - x): number {
  if (!(x >= 0 && x <= 1 && a > 0 && b > 0)) return NaN;
  if (x === 0 || x === 1) return x;
  const y = complement;
  const logFront = logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(y);
  if (x < (a + 1) / (a + b + 2)) return (Math.exp(logFront) * continuedFraction(x, a, b)) / a;
  return 1 - (Math.exp(logFront) * continuedFraction(y, b, a)) / b;
}

const TINY = 1e-300;

function continuedFraction(x: number, a: number, b: number): number {
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m;
    // Even step of the fraction.
    let numerator = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + numerator * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + numerator / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    // Odd step.
    numerator = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + numerator * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + numerator / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return h;
}
