/**
 * Closed-form coil fields (DOMAIN.md §1), written apart from src/core so that the sample
 * data, generated with the model catalog, can be checked against an independent
 * statement of the physics. SI in and out: amperes, metres, tesla. Checked against
 * DOMAIN.md §9 in test/import/sample-data.test.ts.
 */
import ellipe from '@stdlib/math-base-special-ellipe';
import ellipk from '@stdlib/math-base-special-ellipk';

/** μ0, CODATA 2018 (DOMAIN.md §6), N A⁻². */
export const mu0 = 1.25663706212e-6;

/** Circular loop on axis: B = μ0·NI·R² / (2(R² + z²)^1.5) (DOMAIN §1.1). */
export function loopOnAxis(ampereTurns: number, radius: number, z: number): number {
  return (mu0 * ampereTurns * radius ** 2) / (2 * (radius ** 2 + z ** 2) ** 1.5);
}

/**
 * Circular loop off axis (DOMAIN §1.2, Smythe §7.10): with Q = (a+ρ)² + z², D = (a−ρ)² + z²,
 * parameter m = 4aρ/Q, B_z = μ0NI/(2π√Q)·[K + (a²−ρ²−z²)/D·E],
 * B_ρ = μ0NI/(2π√Q)·(z/ρ)·[−K + (a²+ρ²+z²)/D·E]; K, E from @stdlib (parameter m).
 * Near the axis (ρ < 1e-4·a) the paraxial series of §1.2 is used instead.
 */
export function loopOffAxis(ampereTurns: number, radius: number, rho: number, z: number): { axial: number; radial: number } {
  if (rho < 1e-4 * radius) {
    return { axial: loopOnAxis(ampereTurns, radius, z), radial: (3 * mu0 * ampereTurns * radius ** 2 * z * rho) / (4 * (radius ** 2 + z ** 2) ** 2.5) };
  }
  const q = (radius + rho) ** 2 + z ** 2;
  const d = (radius - rho) ** 2 + z ** 2;
  const m = (4 * radius * rho) / q;
  const k = ellipk(m);
  const e = ellipe(m);
  const scale = (mu0 * ampereTurns) / (2 * Math.PI * Math.sqrt(q));
  return {
    axial: scale * (k + ((radius ** 2 - rho ** 2 - z ** 2) / d) * e),
    radial: scale * (z / rho) * (-k + ((radius ** 2 + rho ** 2 + z ** 2) / d) * e),
  };
}

/** Rectangular loop on its axis, sides width × height: μ0NI·ab/(π√(a²+b²+z²))·[1/(a²+z²) + 1/(b²+z²)] (DOMAIN §1.6). */
export function rectangleOnAxis(ampereTurns: number, width: number, height: number, z: number): number {
  const a = width / 2;
  const b = height / 2;
  return ((mu0 * ampereTurns * a * b) / (Math.PI * Math.sqrt(a ** 2 + b ** 2 + z ** 2))) * (1 / (a ** 2 + z ** 2) + 1 / (b ** 2 + z ** 2));
}

/**
 * Thick coil on axis, z from the winding's mid-plane (DOMAIN §1.4, Montgomery 1969):
 * B = μ0NI/(2L(a₂−a₁))·{x₊ ln[(a₂+√(a₂²+x₊²))/(a₁+√(a₁²+x₊²))] − x₋ ln[…x₋…]}, x± = z ± L/2.
 */
export function thickCoilOnAxis(ampereTurns: number, innerRadius: number, outerRadius: number, length: number, z: number): number {
  const term = (x: number) => x * Math.log((outerRadius + Math.hypot(outerRadius, x)) / (innerRadius + Math.hypot(innerRadius, x)));
  return ((mu0 * ampereTurns) / (2 * length * (outerRadius - innerRadius))) * (term(z + length / 2) - term(z - length / 2));
}
