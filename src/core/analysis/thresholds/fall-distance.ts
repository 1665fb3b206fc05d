/** Where an on-axis field curve falls to a level, and where its maximum is. */
export interface FallDistance {
  /** Outermost distance (m) beyond the field maximum where |B| = level, or null when |B| never reaches the level. */
  readonly distance: number | null;
  /** Distance of the largest |B| found on the axis, m. */
  readonly peakDistance: number;
  /** That largest |B|, T (Infinity for a curve singular at the datum). */
  readonly peakField: number;
}

const peakSamples = 256;
const maxDoublings = 200;
const bisections = 60;

/**
 * Find the distance beyond the field maximum at which |B(z)| falls to `level`, by robust
 * bracketing: locate the maximum of |B| on a grid over [0, 4·scale], double z outward from
 * it until |B| is below the level (and stays below at 1.5× and 2× that distance, so the
 * outermost crossing is kept), then bisect in ln z to full double precision. Bisection
 * needs only a sign change, so it cannot diverge on the flat near-field part of a curve
 * (Press et al., Numerical Recipes 3rd ed. §9.1, bracketing and bisection).
 *
 * @param field |B| or signed B as a function of distance z (m), T
 * @param level T, > 0
 * @param scale a length setting the grid (m): the coil's largest dimension, or the surveyed range
 * @example fallDistance((z) => 1e-3 / (1 + z * z) ** 1.5, 1e-3 / 8, 1).distance // √3 (loop with R = 1 m)
 */
export function fallDistance(field: (z: number) => number, level: number, scale: number): FallDistance {
  if (!(level > 0) || !(scale > 0)) throw new RangeError(`fallDistance: level and scale must be > 0, got ${level} and ${scale}`);
  const magnitude = (z: number): number => Math.abs(field(z));
  let peakDistance = 0;
  let peakField = -Infinity;
  const gridEnd = 4 * scale;
  for (let i = 0; i <= peakSamples; i += 1) {
    const z = (gridEnd * i) / peakSamples;
    const b = magnitude(z);
    if (b > peakField || (Number.isNaN(peakField) && !Number.isNaN(b))) {
      peakField = b;
      peakDistance = z;
    }
  }
  if (!Number.isFinite(peakField)) {
    // Singular at the datum (dipole, power laws): the maximum is at z → 0.
    peakField = Infinity;
    peakDistance = 0;
  }
  if (!(peakField >= level)) return { distance: null, peakDistance, peakField };

  let low = peakDistance > 0 ? peakDistance : scale / 1024;
  while (!(magnitude(low) >= level) && low > scale * 1e-12) low /= 2;
  if (!(magnitude(low) >= level)) return { distance: low, peakDistance, peakField };
  let high = low * 2;
  for (let step = 0; step < maxDoublings; step += 1) {
    if (magnitude(high) >= level) {
      low = high;
      high *= 2;
      continue;
    }
    const beyond = [1.5 * high, 2 * high].find((z) => magnitude(z) >= level);
    if (beyond === undefined) break;
    low = beyond;
    high = 2 * beyond;
  }
  if (!(magnitude(high) < level)) return { distance: null, peakDistance, peakField };
  let logLow = Math.log(low);
  let logHigh = Math.log(high);
  for (let i = 0; i < bisections && logHigh - logLow > 1e-15; i += 1) {
    const middle = 0.5 * (logLow + logHigh);
    if (magnitude(Math.exp(middle)) >= level) logLow = middle;
    else logHigh = middle;
  }
  return { distance: Math.exp(0.5 * (logLow + logHigh)), peakDistance, peakField };
}
