import { ellipticKE } from './elliptic-ke';
import { loopAxisDerivatives } from './loop-axis-derivatives';
import { vacuumPermeability } from './vacuum-permeability';

const elliptic = new Float64Array(3);
const axis = new Float64Array(6);

/** Points with ρ² < paraxialLimit·(R² + z²) use the near-axis series (truncation < 1e-16). */
export const paraxialLimit = 1e-8;

/** Points with m = 4aρ/Q ≤ bulkParameterLimit (and off the paraxial zone) use loopFieldBulk. */
export const bulkParameterLimit = 0.999;

/**
 * On-axis field of a flat circular loop of N turns: B_z = μ0 N I R² / (2 (R² + z²)^(3/2))
 * (DOMAIN.md §1.1; Griffiths 4th ed. Example 5.6). SI: ampere-turns N·I in A, R and z in
 * m, result in T. z is measured from the loop plane.
 *
 * @example loopFieldOnAxis(1, 0.1, 0) // 6.2831853106e-6 T (μ0 N I / 2R)
 */
export function loopFieldOnAxis(ampereTurns: number, radius: number, z: number): number {
  const s2 = radius * radius + z * z;
  return (vacuumPermeability * ampereTurns * radius * radius) / (2 * s2 * Math.sqrt(s2));
}

/**
 * Field of a flat circular loop of N turns at any point, by complete elliptic integrals
 * in the parameter convention (DOMAIN.md §1.2; Smythe 3rd ed. §7.10; Simpson et al.,
 * NASA NTRS 20010038494 (2001)): with Q = (a + ρ)² + z², D = (a − ρ)² + z², m = 4aρ/Q,
 *
 *   B_z = μ0NI/(2π√Q) · [K + (a² − ρ² − z²)/D · E]
 *   B_ρ = μ0NI/(2π√Q) · (z/ρ) · [−K + (a² + ρ² + z²)/D · E]
 *
 * Kept exact to rounding everywhere off the wire:
 *  - ρ = 0: the on-axis formula, B_ρ = 0 (the bracket would be 0·(z/0));
 *  - ρ² < 1e-8 (a² + z²): paraxial series through (ρ/s)⁴, truncation below 1e-16;
 *  - m ≤ 0.999 (all but the wire's neighbourhood): both brackets rewritten with
 *    E = K(1 − m/2 − T) from the AGM (see ellipticKE), giving
 *    B_z = μ0NI K/(2π√Q D) · [2a²(a² − ρ² + z²)/Q − (a² − ρ² − z²)T] and
 *    B_ρ = μ0NI z K/(2π√Q D) · [a m − (a² + ρ² + z²) T/ρ], evaluated by loopFieldBulk;
 *    these have no cancellation near the axis or far away, so no dipole switch is needed
 *    (a dipole at 100a would be 1.5e-4 off on axis: loop/dipole = (1 + a²/z²)^(−3/2),
 *    DOMAIN.md §1.7);
 *  - m > 0.999 (within about 0.06 a of the wire): the textbook brackets, with
 *    1 − m = D/Q from geometry.
 * On the wire itself (D = 0) the filament field is undefined and both components are NaN;
 * callers that take user input refuse such points.
 *
 * A negative `rho` is read as a signed transverse coordinate x: out[1] is then B_x =
 * −B_ρ(|x|), the component along +x.
 *
 * @param ampereTurns N·I (A)
 * @param radius loop radius a (m), > 0
 * @param z axial distance from the loop plane (m)
 * @param rho radial offset ρ from the axis (m)
 * @param out Float64Array, length ≥ 2: out[0] = B_z (axial), out[1] = B_ρ (radial), T
 * @example loopField(1, 0.1, 0.05, 0.05, out) // out = [4.345848938e-6, 1.616890842e-6] T (DOMAIN.md §9 row 7)
 */
export function loopField(ampereTurns: number, radius: number, z: number, rho: number, out: Float64Array): void {
  const r = Math.abs(rho);
  const a = radius;
  const s2 = a * a + z * z;
  if (r === 0) {
    out[0] = (vacuumPermeability * ampereTurns * a * a) / (2 * s2 * Math.sqrt(s2));
    out[1] = 0;
    return;
  }
  const sign = rho < 0 ? -1 : 1;
  if (r * r < paraxialLimit * s2) {
    loopAxisDerivatives(a, z, axis);
    const scale = 0.5 * vacuumPermeability * ampereTurns * a * a;
    const r2 = r * r;
    out[0] = scale * (axis[0]! - 0.25 * r2 * axis[2]! + (r2 * r2 / 64) * axis[4]!);
    out[1] = sign * scale * r * (-0.5 * axis[1]! + (r2 / 16) * axis[3]!);
    return;
  }
  const sum = a + r;
  const difference = a - r;
  const z2 = z * z;
  const q = sum * sum + z2;
  const d = difference * difference + z2;
  if (4 * a * r <= bulkParameterLimit * q) {
    loopFieldBulk(ampereTurns, a, z, rho, out, 0, out, 1);
    return;
  }
  if (d === 0) {
    out[0] = NaN;
    out[1] = NaN;
    return;
  }
  // near the wire (m > 0.999): the textbook brackets, 1 − m = D/Q from geometry
  const inverseQ = 1 / q;
  ellipticKE(4 * a * r * inverseQ, elliptic, d * inverseQ);
  const k = elliptic[0]!;
  const e = elliptic[1]!;
  const scale = (vacuumPermeability / (2 * Math.PI)) * ampereTurns * Math.sqrt(inverseQ);
  // (a − ρ)(a + ρ) rather than a² − ρ²: exact where ρ ≈ a
  const aa = difference * sum;
  out[0] = scale * (k + ((aa - z2) / d) * e);
  out[1] = sign * scale * (z / r) * (-k + ((a * a + r * r + z2) / d) * e);
}

/**
 * The loop field where the parameter m = 4aρ/Q ≤ bulkParameterLimit (0.999) off the axis:
 * everywhere except within about 0.06 a of the wire and the paraxial zone. Written into
 * axialOut[axialIndex] and radialOut[radialIndex]. Same closed form as loopField (DOMAIN.md
 * §1.2), arranged for speed without losing digits:
 *  - the AGM runs unnormalised from a₀ = √Q, g₀ = √D, so μ0NI K/(2π√Q) = μ0NI/(4M) with
 *    M = M(√Q, √D) (A&S §17.6), and c₁ = (√Q − √D)/2 = 2aρ/(√Q + √D) has no cancellation;
 *  - three steps, unrolled with no branch (so the processor overlaps consecutive points),
 *    leave a₃, g₃ = a₄(1 ± x) with x = c₄/a₄ ≤ 1.2e-3 for m ≤ 0.999; the rest of the AGM
 *    is the series M(a₄(1 + x), a₄(1 − x)) = a₄(1 − x²/4 − 5x⁴/64 − 11x⁶/256 − …) (Taylor
 *    series of agm(1 + x, 1 − x) = π/(2K(x²)), checked with mpmath 1.3.0), cut after x⁴
 *    (next term < 1e-19), and the rest of the sum Σ 2^{n−1} c_n², 16c₅² + … = c₄⁴/a₄²
 *    (from 1 − E/K = m/2 + m²/16 + … at m = x², A&S 17.3.11–12; next term a₄²x⁶/2);
 *  - everything is put over one denominator, so one division remains: with
 *    s = √Q + √D and S = s²·T_Q, T_Q = Q·T = Σ 2^{n−1} c_n² (ellipticKE's T, unnormalised),
 *      B_z = μ0NI a₄ ρ [2a²(a² − ρ² + z²) a₄² s² − (a² − ρ² − z²) S] / (4M a₄³ · D Q ρ s²)
 *      B_ρ = μ0NI a₄ z [4a²ρ² a₄² s² − (a² + ρ² + z²) S] / (4M a₄³ · D Q ρ s²).
 * Measured against mpmath (40 digits) at 4,000 points spread in m up to 0.999: ≤ 1.3e-15
 * of |B|. E = K(1 − m/2 − T) loses about K(m)·ε as m → 1, which is why the wire's
 * neighbourhood (m > 0.999) keeps the textbook brackets in loopField.
 *
 * The operations and their order are exactly those of the WebAssembly kernel
 * (loop-field-kernel.wat) that loopFieldBatch runs, so both give the same bits; change
 * them together. Callers guarantee m ≤ bulkParameterLimit and ρ off the paraxial zone.
 * SI: A, m, T.
 */
export function loopFieldBulk(
  ampereTurns: number, a: number, z: number, rho: number,
  axialOut: Float64Array, axialIndex: number, radialOut: Float64Array, radialIndex: number,
): void {
  const r = rho < 0 ? -rho : rho;
  const sum = a + r;
  const difference = a - r;
  const z2 = z * z;
  const q = sum * sum + z2;
  const d = difference * difference + z2;
  const a0 = Math.sqrt(q);
  const g0 = Math.sqrt(d);
  const s = a0 + g0;
  const s2 = s * s;
  const twoAR = 2 * a * r;
  const a1 = 0.5 * s;
  const g1 = Math.sqrt(a0 * g0);
  const c2 = 0.5 * (a1 - g1);
  const a2 = 0.5 * (a1 + g1);
  const g2 = Math.sqrt(a1 * g1);
  const c3 = 0.5 * (a2 - g2);
  const a3 = 0.5 * (a2 + g2);
  const g3 = Math.sqrt(a2 * g2);
  const c4 = 0.5 * (a3 - g3);
  const a4 = 0.5 * (a3 + g3);
  const a4Squared = a4 * a4;
  const c4Squared = c4 * c4;
  const twoARSquared = twoAR * twoAR;
  // S = s²·T_Q·a₄² (c₁ = 2aρ/s, so s²c₁² = (2aρ)²) and a₄³·4M, neither with its own division
  const tail = (twoARSquared + (2 * c2 * c2 + 4 * c3 * c3 + 8 * c4Squared) * s2) * a4Squared +
    c4Squared * c4Squared * s2;
  const fourM = 4 * a4Squared * a4Squared - a4Squared * c4Squared - 0.3125 * c4Squared * c4Squared;
  const inverse = (vacuumPermeability * ampereTurns * a4) / (fourM * d * q * r * s2);
  // (a − ρ)(a + ρ) rather than a² − ρ²: exact where ρ ≈ a
  const aa = difference * sum;
  axialOut[axialIndex] = inverse * r * (2 * (a * a) * (aa + z2) * a4Squared * s2 - (aa - z2) * tail);
  radialOut[radialIndex] = (rho < 0 ? -inverse : inverse) * z *
    (twoARSquared * a4Squared * s2 - (a * a + r * r + z2) * tail);
}
