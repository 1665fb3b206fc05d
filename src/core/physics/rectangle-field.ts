import { polygonField } from './segment-field';
import { vacuumPermeability } from './vacuum-permeability';

const corners = new Float64Array(8);
const cartesian = new Float64Array(3);

/**
 * On-axis field of a flat rectangular loop, sides A × B (full lengths), N·I ampere-turns,
 * at distance z on the normal through its centre (DOMAIN.md §1.6; four Biot–Savart segments):
 *   B_z = μ0NI ab / (π √(a² + b² + z²)) · [1/(a² + z²) + 1/(b² + z²)],  a = A/2, b = B/2.
 * SI: A, m, T.
 *
 * @example rectangleFieldOnAxis(1, 0.2, 0.1, 0) // 8.94427191487e-6 T (DOMAIN.md §9 row 28)
 */
export function rectangleFieldOnAxis(ampereTurns: number, width: number, height: number, z: number): number {
  const a = 0.5 * width;
  const b = 0.5 * height;
  const z2 = z * z;
  return ((vacuumPermeability * ampereTurns * a * b) / (Math.PI * Math.sqrt(a * a + b * b + z2))) *
    (1 / (a * a + z2) + 1 / (b * b + z2));
}

/**
 * On-axis rectangle field and its derivatives, differentiating rectangleFieldOnAxis:
 * with S = √(a² + b² + z²), u = a² + z², v = b² + z², F = 1/u + 1/v, c = μ0NI/π,
 *   ∂B/∂z = c ab z [−F/S³ − 2(1/u² + 1/v²)/S]
 *   ∂B/∂a = c b [F/S − a²F/S³ − 2a²/(u²S)],   ∂B/∂b likewise with a ↔ b, u ↔ v,
 * and ∂/∂A = ½∂/∂a, ∂/∂B = ½∂/∂b. SI: A, m, T, T/m.
 *
 * @param out Float64Array, length ≥ 4: [B_z, ∂B_z/∂z, ∂B_z/∂width, ∂B_z/∂height]
 * @example rectangleFieldOnAxisGradient(1, 0.2, 0.1, 0, out) // out[1] = 0 in the loop plane
 */
export function rectangleFieldOnAxisGradient(
  ampereTurns: number, width: number, height: number, z: number, out: Float64Array,
): void {
  const a = 0.5 * width;
  const b = 0.5 * height;
  const z2 = z * z;
  const u = a * a + z2;
  const v = b * b + z2;
  const s = Math.sqrt(a * a + b * b + z2);
  const s3 = s * s * s;
  const f = 1 / u + 1 / v;
  const c = (vacuumPermeability * ampereTurns) / Math.PI;
  out[0] = (c * a * b * f) / s;
  out[1] = c * a * b * z * (-f / s3 - (2 * (1 / (u * u) + 1 / (v * v))) / s);
  out[2] = 0.5 * c * b * (f / s - (a * a * f) / s3 - (2 * a * a) / (u * u * s));
  out[3] = 0.5 * c * a * (f / s - (b * b * f) / s3 - (2 * b * b) / (v * v * s));
}

/**
 * Field of a flat rectangular loop at any point, by the closed-form Biot–Savart field of its
 * four straight sides (polygonField; DOMAIN.md §1.6 "off axis"). The loop lies in z = 0,
 * centred on the axis, width along x, height along y; the point is offset by `x` along the
 * width direction (the survey's radial offset), so B_y = 0 there by mirror symmetry and
 * out[1] is B_x. SI: A, m, T.
 *
 * @param out Float64Array, length ≥ 2: out[0] = B_z (axial), out[1] = B_x (transverse), T
 * @example rectangleField(1, 0.1, 0.1, 0, 0, out) // out[0] = 1.131370851e-5 T (DOMAIN.md §9 row 30)
 */
export function rectangleField(
  ampereTurns: number, width: number, height: number, z: number, x: number, out: Float64Array,
): void {
  if (x === 0) {
    out[0] = rectangleFieldOnAxis(ampereTurns, width, height, z);
    out[1] = 0;
    return;
  }
  const a = 0.5 * width;
  const b = 0.5 * height;
  // counter-clockwise seen from +z: positive N·I gives +B_z inside
  corners[0] = -a; corners[1] = -b;
  corners[2] = a; corners[3] = -b;
  corners[4] = a; corners[5] = b;
  corners[6] = -a; corners[7] = b;
  polygonField(ampereTurns, corners, x, 0, z, cartesian);
  out[0] = cartesian[2]!;
  out[1] = cartesian[0]!;
}
