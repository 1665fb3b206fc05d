import { normalRandom } from '../random/normal-random';
import { mulberry32 } from '../random/mulberry32';
import { fitLeastSquares } from './least-squares';
import type { LeastSquaresOptions, LeastSquaresProblem, LeastSquaresSolution } from './least-squares-types';
import { createLeastSquaresWorkspace } from './least-squares-workspace';

/** Options of {@link fitMultiStart}. */
export interface MultiStartOptions {
  /** Extra starts besides `options.initial`. Default 8. */
  readonly starts?: number;
  /** Seed of the mulberry32 stream: same seed, same starts, same answer. */
  readonly seed: number;
  /** Log-normal spread of a nonzero start (factor exp(spread·z)); zero starts get spread·typicalSize·z. Default 0.5. */
  readonly spread?: number;
}

/** The best fit over all starts. */
export interface MultiStartFit {
  /** Lowest χ² among converged fits; among all fits when none converged. */
  readonly best: LeastSquaresSolution;
  /** Index of the winning start: 0 = options.initial. */
  readonly bestStart: number;
  readonly fits: number;
  readonly convergedFits: number;
}

/**
 * Seeded multi-start: fit from `options.initial` and from `starts` perturbed copies of it
 * (free parameters only; θⱼ·exp(spread·z) keeps each start's sign and order of magnitude,
 * z ~ N(0, 1) from mulberry32 + Box–Muller), each start moved inside the bounds; keep the
 * converged fit with the lowest χ² (common practice against local minima). Stops early
 * when `options.signal` is aborted, keeping the best so far.
 */
export function fitMultiStart(problem: LeastSquaresProblem, options: LeastSquaresOptions, multi: MultiStartOptions): MultiStartFit {
  const p = problem.parameterCount;
  const spread = multi.spread ?? 0.5;
  const count = multi.starts ?? 8;
  const gaussian = normalRandom(mulberry32(multi.seed));
  const workspace = createLeastSquaresWorkspace(problem.observed.length, p);
  let best = fitLeastSquares(problem, options, workspace);
  let bestStart = 0;
  let convergedFits = best.converged ? 1 : 0;
  let fits = 1;
  for (let s = 1; s <= count && options.signal?.aborted !== true; s++) {
    const start = Float64Array.from(options.initial);
    for (let j = 0; j < p; j++) {
      if (options.fixed?.[j] === true) continue;
      const z = gaussian();
      const x = start[j]!;
      let moved = x !== 0 ? x * Math.exp(spread * z) : spread * (options.typicalSize?.[j] ?? 1) * z;
      const lo = options.lower?.[j] ?? -Infinity;
      const hi = options.upper?.[j] ?? Infinity;
      if (!(moved > lo && moved < hi)) moved = x;
      start[j] = moved;
    }
    const fit = fitLeastSquares(problem, { ...options, initial: start }, workspace);
    fits += 1;
    if (fit.converged) convergedFits += 1;
    const better = fit.converged === best.converged ? fit.chiSquare < best.chiSquare : fit.converged;
    if (better) {
      best = fit;
      bestStart = s;
    }
  }
  return { best, bestStart, fits, convergedFits };
}
