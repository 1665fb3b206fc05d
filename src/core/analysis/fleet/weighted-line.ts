/** A weighted straight-line fit y = intercept + slope·x. */
export interface WeightedLine {
  readonly intercept: number;
  readonly slope: number;
  /** Standard error of the slope, inflated by `scatterScale` (units of y per unit x). */
  readonly slopeStandardError: number;
  /** Standard error of the intercept at x = 0, inflated likewise. */
  readonly interceptStandardError: number;
  /** Σ w_i (y_i − a − b x_i)² with w_i = 1/σ_i². */
  readonly chiSquare: number;
  /** n − 2. */
  readonly degreesOfFreedom: number;
  /**
   * √(max(1, χ²/(n − 2))): the Birge ratio when the points scatter more than their
   * stated uncertainties, else 1 (never shrinks stated uncertainties); 1 when n = 2.
   */
  readonly scatterScale: number;
}

/**
 * Weighted least-squares straight line with weights 1/σ_i² (Bevington & Robinson, Data
 * Reduction and Error Analysis, 3rd ed., §6.3, from memory), centred on the weighted mean
 * of x for accuracy: b = Σw(x − x̄)(y − ȳ) / Σw(x − x̄)², a = ȳ − b·x̄,
 * σ_b² = 1/Σw(x − x̄)², σ_a² = 1/Σw + x̄²·σ_b². When χ²/(n − 2) > 1 the standard errors
 * are multiplied by the Birge ratio √(χ²/(n − 2)) (Birge 1932, Phys. Rev. 40:207): stated
 * uncertainties that the scatter contradicts are not trusted.
 *
 * @param x abscissae (e.g. time in years)
 * @param y ordinates (e.g. ampere-turns, A)
 * @param standardUncertainty σ_i of each y, > 0
 * @throws RangeError when lengths differ, n < 2, a σ is not positive, or all x are equal
 * @example weightedLine([0, 1, 2], [10, 9, 8], [1, 1, 1]).slope // -1
 */
export function weightedLine(x: readonly number[], y: readonly number[], standardUncertainty: readonly number[]): WeightedLine {
  const n = x.length;
  if (y.length !== n || standardUncertainty.length !== n || n < 2) {
    throw new RangeError(`weightedLine: need ≥ 2 points with matching lengths, got x ${n}, y ${y.length}, σ ${standardUncertainty.length}`);
  }
  let sumW = 0;
  let sumWx = 0;
  let sumWy = 0;
  for (let i = 0; i < n; i += 1) {
    const sigma = standardUncertainty[i]!;
    if (!(sigma > 0) || !Number.isFinite(sigma)) throw new RangeError(`weightedLine: σ[${i}] must be a positive number, got ${sigma}`);
    const w = 1 / (sigma * sigma);
    sumW += w;
    sumWx += w * x[i]!;
    sumWy += w * y[i]!;
  }
  const meanX = sumWx / sumW;
  const meanY = sumWy / sumW;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i += 1) {
    const w = 1 / standardUncertainty[i]! ** 2;
    sxx += w * (x[i]! - meanX) ** 2;
    sxy += w * (x[i]! - meanX) * (y[i]! - meanY);
  }
  if (!(sxx > 0)) throw new RangeError('weightedLine: all x are equal, the slope is undefined');
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  let chiSquare = 0;
  for (let i = 0; i < n; i += 1) chiSquare += ((y[i]! - intercept - slope * x[i]!) / standardUncertainty[i]!) ** 2;
  const degreesOfFreedom = n - 2;
  const scatterScale = degreesOfFreedom > 0 ? Math.sqrt(Math.max(1, chiSquare / degreesOfFreedom)) : 1;
  const slopeVariance = 1 / sxx;
  return {
    intercept,
    slope,
    slopeStandardError: scatterScale * Math.sqrt(slopeVariance),
    interceptStandardError: scatterScale * Math.sqrt(1 / sumW + meanX * meanX * slopeVariance),
    chiSquare,
    degreesOfFreedom,
    scatterScale,
  };
}
