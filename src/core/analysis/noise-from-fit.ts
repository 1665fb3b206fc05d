import type { FitResult } from '../fit/fit-result';
import type { NoiseModel } from './plan/design-problem';

/**
 * The per-reading uncertainty a fit implies, as a NoiseModel for planning more readings
 * "as good as these": with stated uncertainties, σ² = (p·B)² + c² fitted to the σᵢ used
 * (linear least squares of σᵢ² on Bᵢ², both coefficients kept ≥ 0), times the reduced χ²
 * when the scatter exceeded them; without, the residual scale s = √(RSS/(n − k)) for every
 * reading (the scale the covariance used, DOMAIN.md §7.4). Position uncertainty is already
 * inside the σᵢ (effective variance), so `position` is 0.
 */
export function noiseFromFit(fit: FitResult): NoiseModel {
  const { n, k, rss } = fit.stats;
  const stated = fit.points.filter((p) => p.standardUncertainty !== null && p.standardUncertainty > 0);
  if (fit.uncertaintyScale === 'estimated' || stated.length < 2) {
    return { relative: 0, absolute: Math.sqrt(rss / Math.max(1, n - k)), position: 0 };
  }
  const x = stated.map((p) => p.predicted * p.predicted);
  const y = stated.map((p) => p.standardUncertainty! ** 2);
  const meanX = x.reduce((s, v) => s + v, 0) / x.length;
  const meanY = y.reduce((s, v) => s + v, 0) / y.length;
  let sxx = 0;
  let sxy = 0;
  x.forEach((xi, i) => {
    sxx += (xi - meanX) ** 2;
    sxy += (xi - meanX) * (y[i]! - meanY);
  });
  let slope = sxx > 0 ? Math.max(0, sxy / sxx) : 0;
  let intercept = meanY - slope * meanX;
  if (intercept < 0) {
    // Through the origin: σ² = p²B².
    slope = x.reduce((s, xi, i) => s + xi * y[i]!, 0) / x.reduce((s, xi) => s + xi * xi, 0);
    intercept = 0;
  }
  const inflation = Math.max(1, fit.stats.reducedChiSquare ?? 1);
  return { relative: Math.sqrt(slope * inflation), absolute: Math.sqrt(intercept * inflation), position: 0 };
}
