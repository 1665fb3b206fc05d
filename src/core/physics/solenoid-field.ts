import { bulirschCel } from './bulirsch-cel';
import { ellipticKE } from './elliptic-ke';
import { vacuumPermeability } from './vacuum-permeability';

const elliptic = new Float64Array(3);

/**
 * On-axis field of a thin finite solenoid (N turns spread evenly over length L on radius
 * R, centred at z = 0): B_z = μ0NI/(2L) · [(z + L/2)/√((z + L/2)² + R²) − (z − L/2)/√((z − L/2)² + R²)]
 * (DOMAIN.md §1.3; Griffiths 4th ed. Problem 5.11). SI: A, m, T. z from the coil's centre.
 * Beyond the ends the bracket is evaluated as R²·L·2z/(S₊S₋(x₊S₋ + x₋S₊)), S± = √(x±² + R²),
 * algebraically equal and free of the cancellation that costs (z/R)² digits far away.
 *
 * @example solenoidFieldOnAxis(100, 0.02, 0.1, 0) // 1.16675822108e-3 T (DOMAIN.md §9 row 14)
 */
export function solenoidFieldOnAxis(ampereTurns: number, radius: number, length: number, z: number): number {
  const upper = z + 0.5 * length;
  const lower = z - 0.5 * length;
  const r2 = radius * radius;
  const upperRoot = Math.sqrt(upper * upper + r2);
  const lowerRoot = Math.sqrt(lower * lower + r2);
  const scale = (vacuumPermeability * ampereTurns) / (2 * length);
  if (upper * lower <= 0) return scale * (upper / upperRoot - lower / lowerRoot);
  // beyond an end the two terms nearly cancel; their difference is R²·L·2z/(S₊S₋(x₊S₋ + x₋S₊))
  return (scale * r2 * length * 2 * z) / (upperRoot * lowerRoot * (upper * lowerRoot + lower * upperRoot));
}

/**
 * Field of a thin finite solenoid at any point, in the closed form of Derby & Olbert,
 * "Cylindrical magnets and ideal solenoids", Am. J. Phys. 78, 229 (2010), eqs. for B_ρ, B_z
 * with Bulirsch's cel: with n = N/L, z± = z ± L/2, γ = (a − ρ)/(a + ρ),
 * k± = √((z±² + (a − ρ)²)/(z±² + (a + ρ)²)), α± = a/√(z±² + (a + ρ)²), β± = z±/√(z±² + (a + ρ)²),
 *
 *   B_ρ = (μ0nI/π) [α₊ cel(k₊, 1, 1, −1) − α₋ cel(k₋, 1, 1, −1)]
 *   B_z = (μ0nI/π) a/(a + ρ) [β₊ cel(k₊, γ², 1, γ) − β₋ cel(k₋, γ², 1, γ)]
 *
 * cel(k, 1, 1, −1) = K(m) − 2(K − E)/m with m = 1 − k², which cancels near the axis; it is
 * evaluated as −2K·T/m from ellipticKE (K − E = K(m/2 + T)), exact to rounding for all ρ.
 *
 * Checked against Gauss–Kronrod integration of loop fields over the length (mpmath) to 1e-15.
 * ρ = 0 uses solenoidFieldOnAxis. On the current sheet itself (ρ = a, |z| < L/2) B_z is the
 * mean of the inside and outside values; at the rims (ρ = a, z = ±L/2) B_ρ is infinite
 * (logarithmic) and B_z finite.
 * Far away the two end terms nearly cancel: relative error ≈ 1e-16·(distance/L)² off the
 * axis (measured against mpmath: 2e-12 at 100 L, 8e-11 at 1000 L, 5e-9 at 10⁴ L).
 * A negative `rho` is a signed transverse coordinate, as in loopField.
 *
 * @param out Float64Array, length ≥ 2: out[0] = B_z (axial), out[1] = B_ρ (radial), T
 * @example solenoidField(100, 0.02, 0.1, 0.03, 0.01, out) // out = [1.074555732377212e-3, 4.931193774059803e-5]
 */
export function solenoidField(
  ampereTurns: number, radius: number, length: number, z: number, rho: number, out: Float64Array,
): void {
  const r = Math.abs(rho);
  if (r === 0) {
    out[0] = solenoidFieldOnAxis(ampereTurns, radius, length, z);
    out[1] = 0;
    return;
  }
  const a = radius;
  const scale = (vacuumPermeability * ampereTurns) / (Math.PI * length);
  const sum = a + r;
  const difference = a - r;
  const gamma = difference / sum;
  const gamma2 = gamma * gamma;
  let radial = 0;
  let axial = 0;
  for (let end = 0; end < 2; end++) {
    const x = end === 0 ? z + 0.5 * length : z - 0.5 * length;
    const weight = end === 0 ? 1 : -1;
    const outer2 = x * x + sum * sum;
    const outer = Math.sqrt(outer2);
    // m = 1 − k_c² = 4aρ/outer², complement k_c² formed from geometry
    const complement = (x * x + difference * difference) / outer2;
    ellipticKE((4 * a * r) / outer2, elliptic, complement);
    // cel(k_c, 1, 1, −1) = K − 2(K − E)/m = −2K·T/m, without the cancellation near the axis
    radial += (weight * a * -2 * elliptic[0]! * elliptic[2]! * outer2) / (outer * 4 * a * r);
    // β·cel → 0 at a rim (x = 0, k_c = 0): the x·ln x limit
    if (x !== 0) axial += ((weight * x) / outer) * bulirschCel(Math.sqrt(complement), gamma2, 1, gamma);
  }
  out[0] = scale * (a / sum) * axial;
  out[1] = (rho < 0 ? -scale : scale) * radial;
}
