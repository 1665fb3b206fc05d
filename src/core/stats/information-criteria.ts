/** Akaike and Bayesian information criteria of one least-squares fit. */
export interface InformationCriteria {
  /** AIC = D + 2K. */
  readonly aic: number;
  /** AICc = AIC + 2K(K + 1)/(n − K − 1); Infinity when n ≤ K + 1 (too few points to support K). */
  readonly aicc: number;
  /** BIC = D + K·ln n. */
  readonly bic: number;
}

/**
 * Information criteria for least squares with an unknown common σ (ordinary LS):
 * D = n·ln(RSS/n), AIC = D + 2K, AICc = AIC + 2K(K+1)/(n−K−1), BIC = D + K·ln n
 * (Burnham & Anderson, "Model Selection and Multimodel Inference", 2nd ed., 2002,
 * §2.2 and §2.4; DOMAIN.md §7.2). Additive constants are dropped, so only differences
 * between models fitted to the same data, transform and weights mean anything.
 *
 * @param n number of readings; parameterCount K (B&A count the estimated σ² too: pass
 *   k + 1, and do the same for every model compared); rss Σ(y − f)² in the reading's unit².
 * @example
 * leastSquaresCriteria(10, 2, 0.5); // { aic: −25.957323, aicc: −24.243037, bic: −25.352153 }
 */
export function leastSquaresCriteria(n: number, parameterCount: number, rss: number): InformationCriteria {
  return criteria(n, parameterCount, n * Math.log(rss / n));
}

/**
 * Information criteria for least squares with known σᵢ: D = χ²_min = Σ((y − f)/σ)²
 * (Burnham & Anderson 2002, §2.2; DOMAIN.md §7.2), then AIC, AICc and BIC as in
 * {@link leastSquaresCriteria}.
 *
 * @param chiSquare χ² at the optimum (dimensionless).
 * @example
 * chiSquareCriteria(10, 2, 8); // { aic: 12, aicc: 13.714286, bic: 12.605170 }
 */
export function chiSquareCriteria(n: number, parameterCount: number, chiSquare: number): InformationCriteria {
  return criteria(n, parameterCount, chiSquare);
}

function criteria(n: number, k: number, deviance: number): InformationCriteria {
  const aic = deviance + 2 * k;
  const aicc = n - k - 1 > 0 ? aic + (2 * k * (k + 1)) / (n - k - 1) : Infinity;
  return { aic, aicc, bic: deviance + k * Math.log(n) };
}
