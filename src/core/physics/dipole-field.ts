import { vacuumPermeability } from './vacuum-permeability';

/**
 * Field of a point magnetic dipole of moment m along +z at the origin (DOMAIN.md §1.7;
 * Jackson 3rd ed. eq. 5.56, B = μ0/4π [3(m·r̂)r̂ − m]/r³):
 *   B_z = μ0 m (2z² − ρ²) / (4π r⁵),  B_ρ = 3μ0 m z ρ / (4π r⁵),  r² = z² + ρ².
 * On the axis μ0m/(2πz³); in the equatorial plane −μ0m/(4πr³). At the origin it is
 * singular (NaN). SI: m in A·m², lengths m, result T. A negative `rho` is a signed
 * transverse coordinate, as in loopField.
 *
 * @param out Float64Array, length ≥ 2: out[0] = B_z (axial), out[1] = B_ρ (radial), T
 * @example dipoleField(Math.PI * 0.01, 0.1, 0, out) // out[0] = 6.283185311e-6 T (DOMAIN.md §9 row 31)
 */
export function dipoleField(moment: number, z: number, rho: number, out: Float64Array): void {
  const r2 = z * z + rho * rho;
  if (r2 === 0) {
    out[0] = NaN;
    out[1] = NaN;
    return;
  }
  const scale = (vacuumPermeability * moment) / (4 * Math.PI * r2 * r2 * Math.sqrt(r2));
  out[0] = scale * (2 * z * z - rho * rho);
  out[1] = scale * 3 * z * rho;
}

/**
 * Dipole field and its z-derivatives, differentiating dipoleField:
 *   ∂B_z/∂z = μ0 m z (9ρ² − 6z²)/(4π r⁷),  ∂B_ρ/∂z = 3μ0 m ρ (ρ² − 4z²)/(4π r⁷).
 * SI: A·m², m, T, T/m.
 *
 * @param out Float64Array, length ≥ 4: [B_z, B_ρ, ∂B_z/∂z, ∂B_ρ/∂z]
 * @example dipoleFieldGradient(1, 0.1, 0, out) // out[2] = −3μ0/(2π z⁴) = −6.000000001e-3 T/m
 */
export function dipoleFieldGradient(moment: number, z: number, rho: number, out: Float64Array): void {
  dipoleField(moment, z, rho, out);
  const r2 = z * z + rho * rho;
  const scale = (vacuumPermeability * moment) / (4 * Math.PI * r2 * r2 * r2 * Math.sqrt(r2));
  out[2] = scale * z * (9 * rho * rho - 6 * z * z);
  out[3] = scale * 3 * rho * (rho * rho - 4 * z * z);
}
