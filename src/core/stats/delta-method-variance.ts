/**
 * Variance of a derived quantity g(θ̂) by the delta method, Var(g) ≈ ∇gᵀ·C·∇g
 * (DOMAIN.md §7.5; e.g. JCGM 100:2008 "GUM" eq. (13), law of propagation of
 * uncertainty). First order only: for strongly nonlinear g prefer a profile or bootstrap.
 *
 * @param gradient ∂g/∂θⱼ at θ̂ (k); covariance row-major k×k.
 * @returns Var(g) in g's unit².
 * @example
 * // g = θ₁ + θ₂ with Var 1 and 4, covariance −1: 1 + 4 − 2 = 3
 * deltaMethodVariance([1, 1], Float64Array.of(1, -1, -1, 4)); // 3
 */
export function deltaMethodVariance(gradient: ArrayLike<number>, covariance: ArrayLike<number>): number {
  const k = gradient.length;
  let sum = 0;
  for (let a = 0; a < k; a++) for (let b = 0; b < k; b++) sum += gradient[a]! * covariance[a * k + b]! * gradient[b]!;
  return sum;
}
