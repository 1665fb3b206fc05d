/**
 * The naive power law B = A / r^n that datasheets extrapolate with (DOMAIN.md §1.9). It is
 * a description of a distance range, not a field source: a loop's local exponent runs from
 * 0 at its centre to 3 far away, n_eff = 3z²/(R² + z²). SI: amplitude in T·m^n, r in m,
 * result T; r ≤ 0 gives NaN (no physical meaning).
 *
 * @example powerLawField(1e-6, 2, 0.1) // 1e-4 T
 */
export function powerLawField(amplitude: number, exponent: number, distance: number): number {
  return distance > 0 ? amplitude * Math.pow(distance, -exponent) : NaN;
}
