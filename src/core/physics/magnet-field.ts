/**
 * On-axis field of an axially magnetised cylinder magnet (radius R, length L, remanence
 * B_r), z measured outward from a pole face (DOMAIN.md §1.8; the equivalent surface current
 * K = B_r/μ0 makes it a thin solenoid):
 *   B(z) = (B_r/2) [ (z + L)/√((z + L)² + R²) − z/√(z² + R²) ].
 * SI: T, m. Ideal rigid uniform magnetisation, recoil permeability 1.
 *
 * @example cylinderMagnetFieldOnAxis(1.2, 0.005, 0.01, 0) // 0.5366563146 T (DOMAIN.md §9 row 34)
 */
export function cylinderMagnetFieldOnAxis(remanence: number, radius: number, length: number, z: number): number {
  const far = z + length;
  return 0.5 * remanence * (far / Math.sqrt(far * far + radius * radius) - z / Math.sqrt(z * z + radius * radius));
}

/**
 * On-axis field of a rectangular block magnet magnetised through its thickness: pole face
 * A × B, thickness C, z outward from the pole face on the central axis (DOMAIN.md §1.8;
 * a stack of rectangular current loops):
 *   B(z) = (B_r/π) [ atan(AB / (2z√(4z² + A² + B²))) − atan(AB / (2(z + C)√(4(z + C)² + A² + B²))) ].
 * At z = 0 the first term is π/2. SI: T, m.
 *
 * @example blockMagnetFieldOnAxis(1.2, 0.02, 0.01, 0.005, 0.001) // 0.293677750365 T (DOMAIN.md §9 row 35)
 */
export function blockMagnetFieldOnAxis(
  remanence: number, width: number, height: number, thickness: number, z: number,
): number {
  const area = width * height;
  const diagonal2 = width * width + height * height;
  const far = z + thickness;
  // atan2 keeps z = 0 exact (π/2) instead of atan(∞)
  const near = Math.atan2(area, 2 * z * Math.sqrt(4 * z * z + diagonal2));
  const back = Math.atan2(area, 2 * far * Math.sqrt(4 * far * far + diagonal2));
  return (remanence / Math.PI) * (near - back);
}
