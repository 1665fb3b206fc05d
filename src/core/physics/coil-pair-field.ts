import { loopField } from './loop-field';
import { loopFieldGradient } from './loop-field-gradient';

const single = new Float64Array(2);
const singleGradient = new Float64Array(7);

/**
 * Field of two identical coaxial flat loops (radius R, N·I ampere-turns each) at
 * z = ±d/2: B(z, ρ) = B_loop(z − d/2, ρ) + s·B_loop(z + d/2, ρ), s = +1 aiding, −1 opposing
 * (DOMAIN.md §1.5). Helmholtz when d = R: centre field (4/5)^(3/2) μ0NI/R, flat to fourth
 * order; opposing with d = R is the anti-Helmholtz (gradient) pair. SI: A, m, T; z from
 * the midpoint between the coils. Each loop via loopField, so off-axis values are exact.
 *
 * @param sense +1 (currents aiding, default) or −1 (the coil at −d/2 reversed)
 * @param out Float64Array, length ≥ 2: out[0] = B_z (axial), out[1] = B_ρ (radial), T
 * @example coilPairField(1, 0.1, 0.1, 0, 0, out) // out[0] = 8.991762861e-6 T (DOMAIN.md §9 row 23)
 */
export function coilPairField(
  ampereTurns: number, radius: number, separation: number, z: number, rho: number,
  out: Float64Array, sense: 1 | -1 = 1,
): void {
  loopField(ampereTurns, radius, z - 0.5 * separation, rho, single);
  const bz = single[0]!;
  const br = single[1]!;
  loopField(sense * ampereTurns, radius, z + 0.5 * separation, rho, single);
  out[0] = bz + single[0]!;
  out[1] = br + single[1]!;
}

/**
 * Coil-pair field (aiding) with derivatives for analytic fit Jacobians, from the two loops'
 * loopFieldGradient: ∂/∂z adds, ∂/∂R adds, and ∂/∂d = −½∂_z(loop at +d/2) + ½∂_z(loop at −d/2).
 * SI: A, m, T, T/m.
 *
 * @param out Float64Array, length ≥ 8: [B_z, B_ρ, ∂B_z/∂z, ∂B_ρ/∂z, ∂B_z/∂R, ∂B_ρ/∂R,
 *   ∂B_z/∂d, ∂B_ρ/∂d]
 * @example coilPairFieldGradient(1, 0.1, 0.1, 0, 0, out) // out[2] = 0, out[6] = 0 (Helmholtz centre)
 */
export function coilPairFieldGradient(
  ampereTurns: number, radius: number, separation: number, z: number, rho: number, out: Float64Array,
): void {
  out.fill(0, 0, 8);
  for (let coil = 0; coil < 2; coil++) {
    const position = coil === 0 ? 0.5 * separation : -0.5 * separation;
    loopFieldGradient(ampereTurns, radius, z - position, rho, singleGradient);
    const towardsD = coil === 0 ? -0.5 : 0.5;
    out[0] = out[0]! + singleGradient[0]!;
    out[1] = out[1]! + singleGradient[1]!;
    out[2] = out[2]! + singleGradient[2]!;
    out[3] = out[3]! + singleGradient[3]!;
    out[4] = out[4]! + singleGradient[5]!;
    out[5] = out[5]! + singleGradient[6]!;
    out[6] = out[6]! + towardsD * singleGradient[2]!;
    out[7] = out[7]! + towardsD * singleGradient[3]!;
  }
}
