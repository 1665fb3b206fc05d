/**
 * Minimum of f on [a, b] by Brent's method (R. P. Brent, "Algorithms for Minimization
 * without Derivatives", 1973, ch. 5, procedure localmin): parabolic interpolation through
 * the three best points, with a golden-section step whenever the parabola is not trusted,
 * so it never does worse than golden section and converges superlinearly on a smooth
 * minimum. Stops when x is known to within `tolerance` (absolute, in x's units) or after
 * `maxEvaluations`.
 *
 * @param start a point inside [a, b] to begin from (e.g. the best of a grid), with `startValue` = f(start) when known
 * @returns the best x found
 * @example brentMinimum((x) => (x - 1) ** 2, 0, 3, 1e-8, 50) // 1 (within 1e-8)
 */
export function brentMinimum(
  f: (x: number) => number, a: number, b: number, tolerance: number, maxEvaluations: number, start?: number, startValue?: number,
): number {
  const c = (3 - Math.sqrt(5)) / 2;
  let x = start !== undefined && start > a && start < b ? start : a + c * (b - a);
  let fx = start === x && startValue !== undefined ? startValue : f(x);
  let evaluations = start === x && startValue !== undefined ? 0 : 1;
  let w = x;
  let v = x;
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  while (evaluations < maxEvaluations) {
    const middle = 0.5 * (a + b);
    const tol1 = 1.4901161193847656e-8 * Math.abs(x) + tolerance / 3;
    const tol2 = 2 * tol1;
    if (Math.abs(x - middle) <= tol2 - 0.5 * (b - a)) break;
    let parabolic = false;
    if (Math.abs(e) > tol1) {
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = x < middle ? tol1 : -tol1;
        parabolic = true;
      }
    }
    if (!parabolic) {
      e = (x < middle ? b : a) - x;
      d = c * e;
    }
    const u = x + (Math.abs(d) >= tol1 ? d : d > 0 ? tol1 : -tol1);
    const fu = f(u);
    evaluations += 1;
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return x;
}
