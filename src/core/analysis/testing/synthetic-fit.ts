import type { FitResult, ParameterEstimate } from '../../fit/fit-result';
import type { ModelId, ParameterUnit } from '../../models/field-model';

/** One parameter of a synthetic fit: value, unit and standard error (null = fixed). */
export interface SyntheticParameter {
  readonly name: string;
  readonly unit: ParameterUnit;
  readonly value: number;
  readonly stderr: number | null;
}

/**
 * A FitResult with chosen values and uncorrelated standard errors, for testing analyses
 * whose logic does not depend on how a fit was obtained (fleet trends, decision rules).
 * Intervals are value ± coverage·stderr (default 1.96); n readings (or one point per
 * given distance, with zero field and a stated σ of 10 µT), k free parameters; a full
 * covariance may be given.
 * Not a fit: nothing is evaluated.
 */
export function syntheticFit(
  model: ModelId,
  parameters: readonly SyntheticParameter[],
  options: { n?: number; coverage?: number; aicc?: number; covariance?: readonly number[]; distances?: readonly number[] } = {},
): FitResult {
  const coverage = options.coverage ?? 1.959963984540054;
  const free = parameters.filter((p) => p.stderr !== null);
  const k = free.length;
  const n = options.distances?.length ?? options.n ?? 20;
  const params: Record<string, ParameterEstimate> = {};
  for (const p of parameters) {
    params[p.name] = {
      name: p.name,
      unit: p.unit,
      value: p.value,
      stderr: p.stderr,
      ci95: p.stderr === null ? null : [p.value - coverage * p.stderr, p.value + coverage * p.stderr],
      fixed: p.stderr === null,
      determined: true,
    };
  }
  const covariance = options.covariance ?? free.flatMap((a) => free.map((b) => (a === b ? a.stderr! ** 2 : 0)));
  return {
    model,
    converged: true,
    stopReason: 'synthetic',
    iterations: 0,
    params,
    freeParameters: free.map((p) => p.name),
    covariance,
    correlation: free.flatMap((a) => free.map((b) => (a === b ? 1 : 0))),
    uncertaintyScale: 'stated',
    stats: { n, k, rss: 0, rmse: 0, chiSquare: n - k, reducedChiSquare: 1, aicc: options.aicc ?? 0, bic: 0, akaikeWeight: null },
    points: (options.distances ?? []).map((distance, i) => ({ line: i + 2, distance, radial: 0, field: 0, predicted: 0, residual: 0, standardUncertainty: 1e-5 })),
    warnings: [],
  };
}
