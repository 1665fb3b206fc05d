/**
 * Akaike weights of competing models: Δᵢ = AICᵢ − min AIC, wᵢ = exp(−Δᵢ/2)/Σⱼ exp(−Δⱼ/2)
 * (Burnham & Anderson, "Model Selection and Multimodel Inference", 2nd ed., 2002, §2.9;
 * DOMAIN.md §7.2). Works with AIC, AICc or BIC values alike, as long as all come from
 * fits to the same data. A non-finite criterion (failed fit, AICc undefined) gets weight 0.
 *
 * @param criteria one information criterion per model (dimensionless).
 * @returns weights summing to 1; all NaN when no criterion is finite.
 * @example
 * akaikeWeights([0, 2, 10]); // [0.727475, 0.267623, 0.004902]
 */
export function akaikeWeights(criteria: readonly number[]): number[] {
  const finite = criteria.filter((c) => Number.isFinite(c));
  if (finite.length === 0) return criteria.map(() => NaN);
  const best = Math.min(...finite);
  const relative = criteria.map((c) => (Number.isFinite(c) ? Math.exp(-(c - best) / 2) : 0));
  const total = relative.reduce((sum, r) => sum + r, 0);
  return relative.map((r) => r / total);
}
