/**
 * The on-axis shape of a circular loop, f(z) = (R² + z²)^(−3/2), and its first five
 * z-derivatives, so that B_axis(z) = (μ0 N I R²/2)·f(z) (DOMAIN.md §1.1). SI: R, z in
 * metres; f^(n) in m^(−3−n).
 *
 * Closed forms (s² = R² + z²), obtained by repeated differentiation (checked with
 * sympy 1.14 `diff`):
 *   f'   = −3z / s⁵
 *   f''  = 3(4z² − R²) / s⁷
 *   f''' = 15z(3R² − 4z²) / s⁹
 *   f⁗   = 45(R⁴ − 12R²z² + 8z⁴) / s¹¹
 *   f⁽⁵⁾ = −315z(5R⁴ − 20R²z² + 8z⁴) / s¹³
 *
 * They feed the paraxial (near-axis) expansion of a current-free axisymmetric field,
 * B_z = Σ (−1)^k (ρ/2)^{2k} B^{(2k)}/(k!)², B_ρ = Σ (−1)^{k+1} (ρ/2)^{2k+1} B^{(2k+1)}/(k!(k+1)!)
 * (from ∇·B = 0 and ∇×B = 0; Jackson 3rd ed. §5.5, Problem 5.3).
 *
 * @param radius loop radius R (m), > 0
 * @param z axial distance from the loop plane (m)
 * @param out Float64Array of length ≥ 6 receiving f, f', …, f⁽⁵⁾
 * @example loopAxisDerivatives(0.1, 0, out); // out[0] = 1000 (= 0.1⁻³), out[1] = 0
 */
export function loopAxisDerivatives(radius: number, z: number, out: Float64Array): void {
  const r2 = radius * radius;
  const z2 = z * z;
  const inverseS2 = 1 / (r2 + z2);
  const f = inverseS2 * Math.sqrt(inverseS2);
  const f2 = f * inverseS2;
  const f4 = f2 * inverseS2;
  const f6 = f4 * inverseS2;
  const f8 = f6 * inverseS2;
  const f10 = f8 * inverseS2;
  out[0] = f;
  out[1] = -3 * z * f2;
  out[2] = 3 * (4 * z2 - r2) * f4;
  out[3] = 15 * z * (3 * r2 - 4 * z2) * f6;
  out[4] = 45 * (r2 * r2 - 12 * r2 * z2 + 8 * z2 * z2) * f8;
  out[5] = -315 * z * (5 * r2 * r2 - 20 * r2 * z2 + 8 * z2 * z2) * f10;
}
