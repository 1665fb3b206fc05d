import type { CovarianceResult } from './least-squares-covariance';

/** How well the data separate the free parameters (DOMAIN.md §7.6). */
export interface Identifiability {
  /**
   * Per free parameter, the multiple correlation Rⱼ of its estimate with all the others:
   * Rⱼ² = 1 − 1/VIFⱼ, VIFⱼ = [(D⁻¹JᵀWJD⁻¹)⁻¹]ⱼⱼ; 1 when it lies in a flat direction.
   */
  readonly multipleCorrelation: Float64Array;
  /** False when Rⱼ ≥ the degenerate limit or the parameter moves along a flat direction. */
  readonly determined: readonly boolean[];
  /** Pairs (indices into the free parameters) with |ρ| above the warning limit. */
  readonly strongPairs: readonly { readonly first: number; readonly second: number; readonly correlation: number }[];
}

/**
 * Decide which free parameters the data determine. A parameter is undetermined when
 * the Jacobian is rank-deficient along a direction that moves it, or when its estimate
 * is almost a linear function of the others: multiple correlation Rⱼ ≥ 0.999 (the
 * variance inflation factor of regression diagnostics, VIF = 1/(1 − R²) ≥ 500; Belsley,
 * Kuh & Welsch, "Regression Diagnostics", 1980, ch. 3). Pairs with |ρ| > 0.95 are listed
 * for a warning (DOMAIN.md §7.6 product rule). Far-field loop data give R ≈ 0.9999 for
 * ampereTurns and radius: both undetermined, while their moment is well determined.
 *
 * @param result from leastSquaresCovariance; correlation row-major k×k or null.
 * @example
 * // two parameters with ρ = −0.99991 (DOMAIN.md §9 row 63): determined [false, false]
 */
export function identifiability(
  result: CovarianceResult,
  correlation: ArrayLike<number> | null,
  options: { readonly degenerateCorrelation?: number; readonly warningCorrelation?: number } = {},
): Identifiability {
  const degenerate = options.degenerateCorrelation ?? 0.999;
  const warning = options.warningCorrelation ?? 0.95;
  const k = result.columnNorms.length;
  const multipleCorrelation = new Float64Array(k);
  const flatDirections = result.flatDirections;
  for (let j = 0; j < k; j++) {
    let flat = false;
    for (let d = 0; d < flatDirections.length && !flat; d++) flat = Math.abs(flatDirections[d]![j]!) > 1e-6;
    if (flat || result.covariance === null) {
      multipleCorrelation[j] = flat ? 1 : NaN;
      continue;
    }
    const inflation = (result.covariance[j * k + j]! * result.columnNorms[j]! ** 2) / result.scaleFactor;
    multipleCorrelation[j] = Math.sqrt(Math.max(0, 1 - 1 / inflation));
  }
  const determined = new Array<boolean>(k);
  for (let j = 0; j < k; j++) determined[j] = !(multipleCorrelation[j]! >= degenerate);
  const strongPairs: { first: number; second: number; correlation: number }[] = [];
  if (correlation !== null) {
    for (let a = 0; a < k; a++) {
      for (let b = a + 1; b < k; b++) {
        const rho = correlation[a * k + b]!;
        if (Math.abs(rho) > warning) strongPairs.push({ first: a, second: b, correlation: rho });
      }
    }
  }
  return { multipleCorrelation, determined, strongPairs };
}
