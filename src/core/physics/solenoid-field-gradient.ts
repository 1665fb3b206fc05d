import { loopField } from './loop-field';
import { solenoidField } from './solenoid-field';

const field = new Float64Array(2);
const upperLoop = new Float64Array(2);
const lowerLoop = new Float64Array(2);

/**
 * Thin finite solenoid field with its derivatives with respect to the axial position z,
 * the length L and the radius a, for analytic fit Jacobians. SI: A, m, T, T/m.
 *
 * The solenoid is a uniform stack of loops, B = (NI/L) ∫_{−L/2}^{L/2} b_loop(z − t) dt, so
 * differentiating under the integral needs only two loop fields at the end planes:
 *   ∂B/∂z = (NI/L) [b_loop(z + L/2) − b_loop(z − L/2)]
 *   ∂B/∂L = −B/L + (NI/2L) [b_loop(z + L/2) + b_loop(z − L/2)]      (N·I held fixed)
 * and ∂B/∂a from Euler's relation (B homogeneous of degree −1 in a, L, z, ρ) with
 * ρ∂B_z/∂ρ = ρ∂B_ρ/∂z (∇×B = 0) and ρ∂B_ρ/∂ρ = −B_ρ − ρ∂B_z/∂z (∇·B = 0), valid off the
 * current sheet:
 *   a ∂B/∂a = −B − L ∂B/∂L − z ∂B/∂z − ρ ∂B/∂ρ.
 *
 * @param out Float64Array, length ≥ 8: [B_z, B_ρ, ∂B_z/∂z, ∂B_ρ/∂z, ∂B_z/∂L, ∂B_ρ/∂L,
 *   ∂B_z/∂a, ∂B_ρ/∂a]
 * @example solenoidFieldGradient(100, 0.02, 0.1, 0, 0, out) // out[2] = 0 (centre), out[0] = 1.16675822108e-3 T
 */
export function solenoidFieldGradient(
  ampereTurns: number, radius: number, length: number, z: number, rho: number, out: Float64Array,
): void {
  solenoidField(ampereTurns, radius, length, z, rho, field);
  const perLength = ampereTurns / length;
  loopField(perLength, radius, z + 0.5 * length, rho, upperLoop);
  loopField(perLength, radius, z - 0.5 * length, rho, lowerLoop);
  const bz = field[0]!;
  const br = field[1]!;
  const dzBz = upperLoop[0]! - lowerLoop[0]!;
  const dzBr = upperLoop[1]! - lowerLoop[1]!;
  const dlBz = -bz / length + 0.5 * (upperLoop[0]! + lowerLoop[0]!);
  const dlBr = -br / length + 0.5 * (upperLoop[1]! + lowerLoop[1]!);
  out[0] = bz;
  out[1] = br;
  out[2] = dzBz;
  out[3] = dzBr;
  out[4] = dlBz;
  out[5] = dlBr;
  // ρ·∂B/∂ρ via the field equations; rho (signed) times ∂/∂rho keeps the sign convention
  out[6] = (-bz - length * dlBz - z * dzBz - rho * dzBr) / radius;
  out[7] = (-br - length * dlBr - z * dzBr - (-br - rho * dzBz)) / radius;
}
