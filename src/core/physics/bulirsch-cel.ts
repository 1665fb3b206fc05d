/**
 * Bulirsch's generalized complete elliptic integral
 *
 *   cel(k_c, p, c, s) = ∫₀^{π/2} (c cos²φ + s sin²φ) / ((cos²φ + p sin²φ) √(cos²φ + k_c² sin²φ)) dφ,
 *
 * one function covering K, E and Π: K(m) = cel(√(1 − m), 1, 1, 1), E(m) = cel(√(1 − m), 1, 1, 1 − m),
 * Π(n, m) = cel(√(1 − m), 1 − n, 1, 1). Algorithm: R. Bulirsch, "Numerical calculation of
 * elliptic integrals and elliptic functions. III", Numer. Math. 13, 305–315 (1969), in the
 * form given by Derby & Olbert, Am. J. Phys. 78, 229 (2010), Appendix. Quadratically
 * convergent (a Landen/AGM-type iteration); it stops when |g − k_c| ≤ 2⁻²⁶ g, after which
 * the error is below rounding. Nothing allocated.
 *
 * @param kc complementary modulus k_c = √(1 − m) (not the parameter!), k_c ≠ 0
 * @param p  characteristic term (p ≤ 0 allowed: Cauchy principal value branch)
 * @returns the integral; Infinity when k_c = 0 with c + s ≠ 0 (logarithmic divergence)
 * @example bulirschCel(Math.SQRT1_2, 1, 1, 1) // 1.8540746773013719 = K(0.5)
 */
export function bulirschCel(kc: number, p: number, c: number, s: number): number {
  if (kc === 0) return c + s === 0 ? 0 : Infinity;
  let k = Math.abs(kc);
  let pp = p;
  let cc = c;
  let ss = s;
  let em = 1;
  if (pp > 0) {
    pp = Math.sqrt(pp);
    ss /= pp;
  } else {
    let f = kc * kc;
    let q = 1 - f;
    const g = 1 - pp;
    f -= pp;
    q *= ss - cc * pp;
    pp = Math.sqrt(f / g);
    cc = (cc - ss) / g;
    ss = -q / (g * g * pp) + cc * pp;
  }
  let f = cc;
  cc += ss / pp;
  let g = k / pp;
  ss = 2 * (ss + f * g);
  pp += g;
  g = em;
  em += k;
  let kk = k;
  for (let iteration = 0; Math.abs(g - k) > g * 1.4901161193847656e-8 && iteration < 40; iteration++) {
    k = 2 * Math.sqrt(kk);
    kk = k * em;
    f = cc;
    cc += ss / pp;
    g = kk / pp;
    ss = 2 * (ss + f * g);
    pp += g;
    g = em;
    em += k;
  }
  return (Math.PI / 2) * (ss + cc * em) / (em * (em + pp));
}
