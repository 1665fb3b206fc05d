import { integrateOverWindingDepth } from './winding-depth-quadrature';
import { vacuumPermeability } from './vacuum-permeability';

const sums = new Float64Array(2);

/**
 * On-axis field of a thick (multilayer) coil with uniform turn density over the winding
 * cross-section a₁ ≤ r ≤ a₂, |z| ≤ L/2 (DOMAIN.md §1.4; Montgomery, Solenoid Magnet Design,
 * 1969): with x± = z ± L/2,
 *   B_z = μ0NI/(2L(a₂ − a₁)) · { x₊ ln[(a₂ + √(a₂² + x₊²))/(a₁ + √(a₁² + x₊²))] − (same at x₋) }.
 * SI: A, m, T; z from the coil's centre. Needs a₂ > a₁ (for a₂ = a₁ use solenoidFieldOnAxis).
 * More than a₂ beyond an end face the two log terms cancel (1e-11 lost at ten coil sizes,
 * 1e-3 at a thousand), so there the thin-shell on-axis field is integrated over the depth
 * by Gauss–Legendre instead, exact to rounding (the integrand's singularities at r = ±i·x
 * are then far from the interval).
 *
 * @example thickCoilFieldOnAxis(500, 0.02, 0.04, 0.05, 0) // 8.11025818787e-3 T (DOMAIN.md §9 row 18)
 */
export function thickCoilFieldOnAxis(
  ampereTurns: number, innerRadius: number, outerRadius: number, length: number, z: number,
): number {
  const upper = z + 0.5 * length;
  const lower = z - 0.5 * length;
  if (isBeyondLogFormula(outerRadius, length, z)) {
    // far beyond an end the two log terms cancel to (size/z)³; integrate the thin-shell
    // on-axis field over the depth instead (smooth there: Gauss–Legendre is exact to rounding)
    integrateOverWindingDepth(ampereTurns, innerRadius, outerRadius, length, z, 0, false, sums);
    return sums[0]! / (outerRadius - innerRadius);
  }
  return ((vacuumPermeability * ampereTurns) / (2 * length * (outerRadius - innerRadius))) *
    (upper * radialLog(innerRadius, outerRadius, upper) - lower * radialLog(innerRadius, outerRadius, lower));
}

/**
 * True more than a₂ beyond an end face on the axis, where the log formula's two terms
 * cancel and the radial quadrature of thin-shell fields takes over (thickCoilFieldOnAxis).
 */
export function isBeyondLogFormula(outerRadius: number, length: number, z: number): boolean {
  return Math.abs(z) - 0.5 * length > outerRadius;
}

/**
 * ln[(a₂ + √(a₂² + x²))/(a₁ + √(a₁² + x²))] = ∫_{a₁}^{a₂} dr/√(r² + x²), the radial integral
 * in the thick-coil log formula (DOMAIN.md §1.4), evaluated as log1p of the ratio minus one
 * written without subtraction. Dimensionless; radii and x in m.
 *
 * @example radialLog(0.02, 0.04, 0) // ln 2
 */
export function radialLog(innerRadius: number, outerRadius: number, x: number): number {
  const x2 = x * x;
  const innerRoot = Math.sqrt(innerRadius * innerRadius + x2);
  const outerRoot = Math.sqrt(outerRadius * outerRadius + x2);
  // ratio − 1 = (a₂ − a₁)(1 + (a₂ + a₁)/(S₁ + S₂))/(a₁ + S₁): exact for thin windings too
  return Math.log1p(((outerRadius - innerRadius) * (1 + (outerRadius + innerRadius) / (innerRoot + outerRoot))) /
    (innerRadius + innerRoot));
}

/**
 * Field of a thick coil at any point: the average over the winding depth of thin-solenoid
 * fields, B = (1/(a₂ − a₁)) ∫_{a₁}^{a₂} B_solenoid(N I, r, L; z, ρ) dr, each shell in the
 * closed form of solenoidField (Derby & Olbert 2010), the radial integral by graded
 * Gauss–Legendre (integrateOverWindingDepth). On the axis thickCoilFieldOnAxis is used (the
 * log formula, or the depth quadrature more than a₂ beyond an end).
 *
 * Accuracy target (tested against adaptive Gauss–Kronrod integration of loop fields over
 * the cross-section): relative error ≤ 1e-12 of |B| anywhere outside the winding
 * cross-section down to 0.1 % of the winding depth from its surfaces; measured ≤ 2e-15.
 * Inside the winding bundle the value is the uniform-current-density model's, which is
 * itself the limit there (DOMAIN.md §1.4). A negative `rho` is a signed transverse
 * coordinate, as in loopField.
 *
 * @param out Float64Array, length ≥ 2: out[0] = B_z (axial), out[1] = B_ρ (radial), T
 * @example thickCoilField(500, 0.02, 0.04, 0.05, 0.05, 0.01, out) // out = [1.664591500793674e-3, 3.933462329428194e-4]
 */
export function thickCoilField(
  ampereTurns: number, innerRadius: number, outerRadius: number, length: number,
  z: number, rho: number, out: Float64Array,
): void {
  if (rho === 0) {
    out[0] = thickCoilFieldOnAxis(ampereTurns, innerRadius, outerRadius, length, z);
    out[1] = 0;
    return;
  }
  integrateOverWindingDepth(ampereTurns, innerRadius, outerRadius, length, z, rho, false, sums);
  const depth = outerRadius - innerRadius;
  out[0] = sums[0]! / depth;
  out[1] = sums[1]! / depth;
}
