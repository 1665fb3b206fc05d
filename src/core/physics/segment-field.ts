import { vacuumPermeability } from './vacuum-permeability';

/**
 * Adds to `out` the field of a straight current segment from A to B at point P
 * (Biot–Savart integrated in closed form; e.g. Griffiths 4th ed. Example 5.5 in vector form):
 *
 *   B = μ0I/(4π) · (L × r₁)(|r₁| + |r₂|) / (|r₁||r₂| (|r₁||r₂| + r₁·r₂)),
 *   L = B − A, r₁ = P − A, r₂ = P − B.
 *
 * L × r₁ replaces r₁ × r₂ (equal, without cancellation far away), and where r₁·r₂ < 0
 * (P beside the segment) the denominator uses |r₁||r₂| + r₁·r₂ = |L × r₁|²/(|r₁||r₂| − r₁·r₂),
 * so points close to the wire keep their digits. On the segment's line the field is zero
 * beyond its ends and undefined (NaN) on it. Summing segments gives any polygonal coil.
 * SI: A, m, T; out is [B_x, B_y, B_z] and is accumulated into, not overwritten.
 *
 * @example a 0.1 m square of 1 A from four calls: centre B_z = 2√2 μ0 I/(π s) = 1.131370851e-5 T
 */
export function addSegmentField(
  current: number,
  ax: number, ay: number, az: number, bx: number, by: number, bz: number,
  px: number, py: number, pz: number, out: Float64Array,
): void {
  const lx = bx - ax;
  const ly = by - ay;
  const lz = bz - az;
  const r1x = px - ax;
  const r1y = py - ay;
  const r1z = pz - az;
  const r2x = px - bx;
  const r2y = py - by;
  const r2z = pz - bz;
  const cx = ly * r1z - lz * r1y;
  const cy = lz * r1x - lx * r1z;
  const cz = lx * r1y - ly * r1x;
  const n1 = Math.sqrt(r1x * r1x + r1y * r1y + r1z * r1z);
  const n2 = Math.sqrt(r2x * r2x + r2y * r2y + r2z * r2z);
  const product = n1 * n2;
  const dot = r1x * r2x + r1y * r2y + r1z * r2z;
  const cross2 = cx * cx + cy * cy + cz * cz;
  if (cross2 === 0) {
    // on the segment's line: zero outside the segment, undefined on the wire
    if (dot <= 0) {
      out[0] = NaN;
      out[1] = NaN;
      out[2] = NaN;
    }
    return;
  }
  const sum = dot >= 0 ? product + dot : cross2 / (product - dot);
  const factor = ((vacuumPermeability * current) / (4 * Math.PI)) * (n1 + n2) / (product * sum);
  out[0] = out[0]! + factor * cx;
  out[1] = out[1]! + factor * cy;
  out[2] = out[2]! + factor * cz;
}

/**
 * Field of a closed planar polygonal loop in the plane z = 0 with N·I ampere-turns, at
 * (x, y, z): the sum of addSegmentField over its edges, vertices in order (counter-clockwise
 * seen from +z gives +B_z inside). SI: A, m, T.
 *
 * @param vertices flat [x₀, y₀, x₁, y₁, …] (m), at least three vertices
 * @param out Float64Array, length ≥ 3, overwritten with [B_x, B_y, B_z]
 * @example polygonField(1, square, 0, 0, 0, out) // square of side 0.1 m: out[2] = 1.131370851e-5 T
 */
export function polygonField(
  ampereTurns: number, vertices: Float64Array, x: number, y: number, z: number, out: Float64Array,
): void {
  out[0] = 0;
  out[1] = 0;
  out[2] = 0;
  const count = vertices.length >> 1;
  for (let i = 0; i < count; i++) {
    const j = i + 1 === count ? 0 : i + 1;
    addSegmentField(ampereTurns, vertices[2 * i]!, vertices[2 * i + 1]!, 0, vertices[2 * j]!, vertices[2 * j + 1]!, 0, x, y, z, out);
  }
}
