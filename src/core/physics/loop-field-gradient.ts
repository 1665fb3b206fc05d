import { ellipticKE } from './elliptic-ke';
import { loopAxisDerivatives } from './loop-axis-derivatives';
import { paraxialLimit } from './loop-field';
import { vacuumPermeability } from './vacuum-permeability';

const elliptic = new Float64Array(3);
const axis = new Float64Array(6);

/**
 * Field of a flat circular loop and its derivatives with respect to the field point and
 * the loop radius, for analytic fit Jacobians. SI: A, m, T, T/m.
 *
 * ∂B_z/∂z and ∂B_ρ/∂z come from differentiating DOMAIN.md §1.2 with dK/dm =
 * (E − (1 − m)K)/(2m(1 − m)) and dE/dm = (E − K)/(2m) (A&S 17.3.33–34), ∂m/∂z = −2zm/Q:
 *
 *   ∂B_z/∂z = μ0NI z/(2π√Q D) · [G K/Q − E(2G/Q + 3 + 2G/D)],   G = a² − ρ² − z²
 *   ∂B_ρ/∂z = μ0NI/(2πρ√Q) · [(−K + PE/D) + (z²/D)(3E + PK/Q − 2PE/Q − 2PE/D)],  P = a² + ρ² + z²
 *
 * and for m ≤ 0.9 both are rewritten with E = K(1 − m/2 − T) (ellipticKE; simplified with
 * sympy 1.14) so that nothing cancels near the axis or far away:
 *   ∂B_z/∂z = μ0NI z K/(2π√Q Q D²) · [−2a²(3a⁴ + 2a²ρ² + 6a²z² − 5ρ⁴ − 2ρ²z² + 3z⁴)/Q
 *             + T(7a⁴ − 6a²ρ² + 6a²z² − ρ⁴ − 2ρ²z² − z⁴)]
 *   ∂B_ρ/∂z = μ0NI K/(2πρ√Q D) · [4a²ρ²/Q − PT + z²(T(2P(Q + D)/(QD) − 3) − 8a²ρ²(Q + D)/(Q²D))]. The rest follows from the field equations and
 * scaling, not from more algebra: ∂B_z/∂ρ = ∂B_ρ/∂z (∇×B = 0), ∂B_ρ/∂ρ = −B_ρ/ρ − ∂B_z/∂z
 * (∇·B = 0; −½∂B_z/∂z on the axis), and because B is homogeneous of degree −1 in (a, z, ρ),
 * a·∂B/∂a = −B − z ∂B/∂z − ρ ∂B/∂ρ (Euler). Near the axis the paraxial series of loopField
 * is differentiated term by term.
 *
 * A negative `rho` is a signed transverse coordinate x, as in loopField: the radial entries
 * are then x-components and ∂/∂ρ means ∂/∂x.
 *
 * @param out Float64Array, length ≥ 7: [B_z, B_ρ, ∂B_z/∂z, ∂B_ρ/∂z (= ∂B_z/∂ρ), ∂B_ρ/∂ρ,
 *   ∂B_z/∂a, ∂B_ρ/∂a]; all NaN on the wire
 * @example loopFieldGradient(1, 0.1, 0.05, 0, out) // out[2] = −3μ0NI a² z/(2 s⁵) = −5.3951e-5 T/m
 */
export function loopFieldGradient(
  ampereTurns: number, radius: number, z: number, rho: number, out: Float64Array,
): void {
  const r = Math.abs(rho);
  const sign = rho < 0 ? -1 : 1;
  const a = radius;
  const s2 = a * a + z * z;
  let bz: number;
  let br: number;
  let dzBz: number;
  let dzBr: number;
  let drBr: number;
  if (r * r < paraxialLimit * s2) {
    loopAxisDerivatives(a, z, axis);
    const scale = 0.5 * vacuumPermeability * ampereTurns * a * a;
    const r2 = r * r;
    bz = scale * (axis[0]! - 0.25 * r2 * axis[2]! + (r2 * r2 / 64) * axis[4]!);
    br = scale * r * (-0.5 * axis[1]! + (r2 / 16) * axis[3]!);
    dzBz = scale * (axis[1]! - 0.25 * r2 * axis[3]! + (r2 * r2 / 64) * axis[5]!);
    dzBr = scale * r * (-0.5 * axis[2]! + (r2 / 16) * axis[4]!);
    // ∂B_ρ/∂ρ of the series: −½f' + (3ρ²/16) f'''
    drBr = scale * (-0.5 * axis[1]! + ((3 * r2) / 16) * axis[3]!);
  } else {
    const sum = a + r;
    const difference = a - r;
    const q = sum * sum + z * z;
    const d = difference * difference + z * z;
    const m = (4 * a * r) / q;
    ellipticKE(m, elliptic, d / q);
    const k = elliptic[0]!;
    const e = elliptic[1]!;
    const tail = elliptic[2]!;
    const scale = (vacuumPermeability * ampereTurns) / (2 * Math.PI * Math.sqrt(q));
    const aa = difference * sum;
    const g = aa - z * z;
    const p = a * a + r * r + z * z;
    const z2 = z * z;
    if (m > 0.9) {
      bz = scale * (k + (g / d) * e);
      br = scale * (z / r) * (-k + (p / d) * e);
      dzBr = (scale / r) * (-k + (p / d) * e + (z2 / d) * (3 * e + (p * k) / q - (2 * p * e) / q - (2 * p * e) / d));
    } else {
      bz = ((scale * k) / d) * ((2 * a * a * (aa + z2)) / q - g * tail);
      br = ((scale * z * k) / d) * (a * m - (p * tail) / r);
      const qd = q + d;
      const inner = tail * ((2 * p * qd) / (q * d) - 3) - (8 * a * a * r * r * qd) / (q * q * d);
      dzBr = ((scale * k) / (r * d)) * ((4 * a * a * r * r) / q - p * tail + z2 * inner);
    }
    if (m > 0.9) {
      dzBz = ((scale * z) / d) * ((g * k) / q - e * ((2 * g) / q + 3 + (2 * g) / d));
    } else {
      const a2 = a * a;
      const r2 = r * r;
      const polynomial = 3 * a2 * a2 + 2 * a2 * r2 + 6 * a2 * z2 - 5 * r2 * r2 - 2 * r2 * z2 + 3 * z2 * z2;
      const tailFactor = 7 * a2 * a2 - 6 * a2 * r2 + 6 * a2 * z2 - r2 * r2 - 2 * r2 * z2 - z2 * z2;
      dzBz = ((scale * z * k) / (q * d * d)) * ((-2 * a2 * polynomial) / q + tail * tailFactor);
    }
    drBr = -br / r - dzBz;
  }
  // Euler's relation for a field homogeneous of degree −1 in (a, z, ρ)
  out[0] = bz;
  out[1] = sign * br;
  out[2] = dzBz;
  out[3] = sign * dzBr;
  out[4] = drBr;
  out[5] = (-bz - z * dzBz - r * dzBr) / a;
  out[6] = (sign * (-br - z * dzBr - r * drBr)) / a;
}
