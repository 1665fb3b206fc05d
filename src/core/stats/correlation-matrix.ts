/**
 * Correlation matrix ρⱼₗ = Cⱼₗ/√(Cⱼⱼ·Cₗₗ) of a covariance matrix (DOMAIN.md §7.4).
 * A row and column with zero variance give NaN off the diagonal (correlation undefined).
 *
 * @param covariance row-major k×k.
 * @returns row-major k×k, ones on the diagonal (dimensionless).
 * @example
 * correlationMatrix(Float64Array.of(4, -3, -3, 9), 2); // [1, −0.5, −0.5, 1]
 */
export function correlationMatrix(covariance: ArrayLike<number>, k: number): number[] {
  // A plain array: a typed array over 64 bytes is allocated off-heap, dearer than the sums.
  const out = new Array<number>(k * k);
  for (let a = 0; a < k; a++) {
    for (let b = 0; b < k; b++) {
      out[a * k + b] = a === b ? 1 : covariance[a * k + b]! / Math.sqrt(covariance[a * k + a]! * covariance[b * k + b]!);
    }
  }
  return out;
}
