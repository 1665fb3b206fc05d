/**
 * A coil's pose in a map's frame: centre c = (x, y, z) and axis direction n from two
 * angles, tilt θ from +z and azimuth φ from +x towards +y (the physicist's spherical
 * angles, ISO 80000-2:2019 item 2-17.16):
 *
 *   n = (sin θ cos φ, sin θ sin φ, cos θ).
 *
 * A point p is described in the coil's own cylinder coordinates by the signed axial
 * coordinate u = (p − c)·n and the radial vector ρ⃗ = (p − c) − u n (length ρ, unit ρ̂).
 * An axisymmetric source's field there is B = B_z n + B_ρ ρ̂; B_z is even and B_ρ odd in u
 * (mirror symmetry of a coil about its mid-plane), so the catalog's components at |u|
 * give B_ρ(u) = sign(u)·B_ρ(|u|). Pure functions, SI (m, rad, T); no allocation.
 */

/** Writes the unit axis n of tilt θ and azimuth φ (rad) into out[0..2]. */
export function axisDirection(tilt: number, azimuth: number, out: Float64Array): void {
  const s = Math.sin(tilt);
  out[0] = s * Math.cos(azimuth);
  out[1] = s * Math.sin(azimuth);
  out[2] = Math.cos(tilt);
}

/**
 * Cylinder coordinates of point p about the axis through `centre` along unit `axis`:
 * out[0] = u (signed axial), out[1] = ρ ≥ 0, out[2..4] = ρ̂ (zero vector when ρ = 0).
 *
 * @example coilFrame(0, 0, 2, Float64Array.of(0, 0, 0), Float64Array.of(0, 0, 1), out) // out = [2, 0, 0, 0, 0]
 */
export function coilFrame(px: number, py: number, pz: number, centre: ArrayLike<number>, axis: ArrayLike<number>, out: Float64Array): void {
  const dx = px - centre[0]!;
  const dy = py - centre[1]!;
  const dz = pz - centre[2]!;
  const u = dx * axis[0]! + dy * axis[1]! + dz * axis[2]!;
  const rx = dx - u * axis[0]!;
  const ry = dy - u * axis[1]!;
  const rz = dz - u * axis[2]!;
  const rho = Math.sqrt(rx * rx + ry * ry + rz * rz);
  out[0] = u;
  out[1] = rho;
  if (rho > 0) {
    out[2] = rx / rho;
    out[3] = ry / rho;
    out[4] = rz / rho;
  } else {
    out[2] = 0;
    out[3] = 0;
    out[4] = 0;
  }
}

/**
 * The canonical pair of angles for an axis that cannot be told from its opposite: n and −n
 * describe the same coil with the current reversed (B(−n, N·I) = B(n, −N·I), since B_z n
 * and B_ρ ρ̂ both change sign), and |B| does not change at all. Canonical: 0 ≤ tilt ≤ π/2
 * and −π < azimuth ≤ π. Returns [tilt, azimuth, flipped]; `flipped` means n was replaced
 * by −n (the caller negates the amplitude for vector readings).
 *
 * @example canonicalAxis(Math.PI, 0) // [0, Math.PI, true]
 */
export function canonicalAxis(tilt: number, azimuth: number): [number, number, boolean] {
  let t = tilt % (2 * Math.PI);
  if (t < 0) t += 2 * Math.PI;
  let a = azimuth;
  // tilt in (π, 2π): the same axis as tilt 2π − t seen from the opposite azimuth
  if (t > Math.PI) {
    t = 2 * Math.PI - t;
    a += Math.PI;
  }
  let flipped = false;
  if (t > Math.PI / 2) {
    t = Math.PI - t;
    a += Math.PI;
    flipped = true;
  }
  a = wrapAngle(a);
  return [t, a, flipped];
}

/** An angle brought into (−π, π]. */
export function wrapAngle(angle: number): number {
  let a = angle % (2 * Math.PI);
  if (a <= -Math.PI) a += 2 * Math.PI;
  if (a > Math.PI) a -= 2 * Math.PI;
  return a;
}
