import { solenoidField } from './solenoid-field';
import { isBeyondLogFormula, radialLog, thickCoilFieldOnAxis } from './thick-coil-field';
import { integrateOverWindingDepth } from './winding-depth-quadrature';
import { vacuumPermeability } from './vacuum-permeability';

const sums = new Float64Array(6);
const innerShell = new Float64Array(2);
const outerShell = new Float64Array(2);

/**
 * Thick-coil field with its derivatives with respect to axial position z, length L and the
 * radii a₁, a₂, for analytic fit Jacobians. SI: A, m, T, T/m.
 *
 * The coil is B = (1/w) ∫_{a₁}^{a₂} B_solenoid(r) dr with w = a₂ − a₁, and each solenoid a
 * stack of loops, so (N·I held fixed):
 *   ∂B/∂z  = (NI/(Lw)) ∫ [b(r; z + L/2) − b(r; z − L/2)] dr
 *   ∂B/∂L  = −B/L + (NI/(2Lw)) ∫ [b(r; z + L/2) + b(r; z − L/2)] dr
 *   ∂B/∂a₂ = (B_solenoid(a₂) − B)/w,   ∂B/∂a₁ = (B − B_solenoid(a₁))/w
 * (b = field of a unit-current loop of radius r). Off axis the integrals use the same graded
 * quadrature as thickCoilField (also on the axis far beyond the ends, where the closed forms
 * cancel); near the coil on the axis they are closed forms: with S = √(a² + x²),
 * ∫ r²/(r² + x²)^{3/2} dr = ln(r + S) − r/S, and ∂/∂x [x·ln((a₂ + S₂)/(a₁ + S₁))] =
 * ln(…) + x²[1/(S₂(a₂ + S₂)) − 1/(S₁(a₁ + S₁))].
 *
 * @param out Float64Array, length ≥ 10: [B_z, B_ρ, ∂B_z/∂z, ∂B_ρ/∂z, ∂B_z/∂L, ∂B_ρ/∂L,
 *   ∂B_z/∂a₁, ∂B_ρ/∂a₁, ∂B_z/∂a₂, ∂B_ρ/∂a₂]
 * @example thickCoilFieldGradient(500, 0.02, 0.04, 0.05, 0, 0, out) // out[2] = 0 at the centre
 */
export function thickCoilFieldGradient(
  ampereTurns: number, innerRadius: number, outerRadius: number, length: number,
  z: number, rho: number, out: Float64Array,
): void {
  const depth = outerRadius - innerRadius;
  const upper = z + 0.5 * length;
  const lower = z - 0.5 * length;
  if (rho === 0 && !isBeyondLogFormula(outerRadius, length, z)) {
    const scale = (vacuumPermeability * ampereTurns) / (2 * length * depth);
    const field = thickCoilFieldOnAxis(ampereTurns, innerRadius, outerRadius, length, z);
    const slopeUpper = slope(innerRadius, outerRadius, upper);
    const slopeLower = slope(innerRadius, outerRadius, lower);
    out[0] = field;
    out[1] = 0;
    out[2] = scale * (slopeUpper - slopeLower);
    out[3] = 0;
    out[4] = -field / length + 0.5 * scale * (slopeUpper + slopeLower);
    out[5] = 0;
    const innerUpper = Math.sqrt(innerRadius * innerRadius + upper * upper);
    const innerLower = Math.sqrt(innerRadius * innerRadius + lower * lower);
    const outerUpper = Math.sqrt(outerRadius * outerRadius + upper * upper);
    const outerLower = Math.sqrt(outerRadius * outerRadius + lower * lower);
    out[6] = field / depth - scale * (upper / innerUpper - lower / innerLower);
    out[7] = 0;
    out[8] = -field / depth + scale * (upper / outerUpper - lower / outerLower);
    out[9] = 0;
    return;
  }
  integrateOverWindingDepth(ampereTurns, innerRadius, outerRadius, length, z, rho, true, sums);
  const bz = sums[0]! / depth;
  const br = sums[1]! / depth;
  solenoidField(ampereTurns, innerRadius, length, z, rho, innerShell);
  solenoidField(ampereTurns, outerRadius, length, z, rho, outerShell);
  out[0] = bz;
  out[1] = br;
  out[2] = (sums[2]! - sums[4]!) / depth;
  out[3] = (sums[3]! - sums[5]!) / depth;
  out[4] = -bz / length + (0.5 * (sums[2]! + sums[4]!)) / depth;
  out[5] = -br / length + (0.5 * (sums[3]! + sums[5]!)) / depth;
  out[6] = (bz - innerShell[0]!) / depth;
  out[7] = (br - innerShell[1]!) / depth;
  out[8] = (outerShell[0]! - bz) / depth;
  out[9] = (outerShell[1]! - br) / depth;
}

/** d/dx [x·radialLog(a₁, a₂, x)]. */
function slope(innerRadius: number, outerRadius: number, x: number): number {
  const innerRoot = Math.sqrt(innerRadius * innerRadius + x * x);
  const outerRoot = Math.sqrt(outerRadius * outerRadius + x * x);
  return radialLog(innerRadius, outerRadius, x) +
    x * x * (1 / (outerRoot * (outerRadius + outerRoot)) - 1 / (innerRoot * (innerRadius + innerRoot)));
}
