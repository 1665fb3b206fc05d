import { normalRandom } from '../../random/normal-random';
import { mulberry32 } from '../../random/mulberry32';
import { fitLeastSquares } from '../engine/least-squares';
import type { LeastSquaresOptions, LeastSquaresProblem, LeastSquaresSolution } from '../engine/least-squares-types';
import { releaseWorkspace, takeWorkspace, type LeastSquaresWorkspace } from '../engine/least-squares-workspace';

/** Options of {@link fitMultiStart}. */
export interface MultiStartOptions {
  /** Extra starts besides `options.initial` (the most that run, plus `origin` itself when given). 0: none. Default 8. */
  readonly starts?: number;
  /** Seed of the mulberry32 stream: same seed, same starts, same answer. */
  readonly seed: number;
  /** Log-normal spread of a nonzero start (factor exp(spread·z)); zero starts get spread·typicalSize·z. Default 0.5. */
  readonly spread?: number;
  /**
   * Stop the extra starts once this many of them have ended at the best fit so far (see
   * {@link sameMinimum}); a better fit found later starts the count again. Default: run all.
   */
  readonly agreement?: number;
  /** When true for the fit from `options.initial`, no extra start runs (the caller vouches for that start). */
  readonly settled?: (fit: LeastSquaresSolution) => boolean;
  /**
   * Where the extra starts come from when not `options.initial` (e.g. the plain data-driven
   * start when `initial` was refined from it): the first extra start is this point itself,
   * then `starts` perturbed copies of it.
   */
  readonly origin?: ArrayLike<number>;
}

/** The best fit over all starts. */
export interface MultiStartFit {
  /** Lowest χ² among converged fits; among all fits when none converged. */
  readonly best: LeastSquaresSolution;
  /** Index of the winning start: 0 = options.initial. */
  readonly bestStart: number;
  readonly fits: number;
  readonly convergedFits: number;
  /** Why the extra starts stopped: all ran, `agreement` of them agreed, the first fit was settled, or aborted. */
  readonly stoppedBy: 'all-starts' | 'agreement' | 'settled' | 'aborted';
}

/**
 * Seeded multi-start: fit from `options.initial` and from up to `starts` perturbed copies
 * of it — or of `origin`, after `origin` itself — (free parameters only; θⱼ·exp(spread·z)
 * keeps each start's sign and order of magnitude, z ~ N(0, 1) from mulberry32 +
 * Box–Muller), each start moved inside the bounds; keep the converged fit with the lowest
 * χ² (common practice against local minima).
 * Adaptive when asked: no extra start when `settled(first fit)` is true, and none after
 * `agreement` extra starts have returned to the best minimum — further starts from the
 * same spread would most likely find it again. The starts are drawn in the same order
 * whatever stops them, so the answer depends only on the inputs and the seed. Stops early
 * when `options.signal` is aborted, keeping the best so far.
 */
export function fitMultiStart(problem: LeastSquaresProblem, options: LeastSquaresOptions, multi: MultiStartOptions): MultiStartFit {
  const workspace = takeWorkspace(problem.observed.length, problem.parameterCount);
  try {
    return searchStarts(problem, options, multi, workspace);
  } finally {
    releaseWorkspace(workspace);
  }
}

/** The starts of {@link fitMultiStart}, all in one workspace. */
function searchStarts(problem: LeastSquaresProblem, options: LeastSquaresOptions, multi: MultiStartOptions, workspace: LeastSquaresWorkspace): MultiStartFit {
  const p = problem.parameterCount;
  const spread = multi.spread ?? 0.5;
  const count = multi.starts ?? 8;
  const needed = multi.agreement ?? Infinity;
  const gaussian = normalRandom(mulberry32(multi.seed));
  let best = fitLeastSquares(problem, options, workspace);
  let bestStart = 0;
  let convergedFits = best.converged ? 1 : 0;
  let fits = 1;
  let agreeing = 0;
  let stoppedBy: MultiStartFit['stoppedBy'] = 'all-starts';
  if (count > 0 && multi.settled?.(best) === true) return { best, bestStart, fits, convergedFits, stoppedBy: 'settled' };
  const origin = multi.origin ?? options.initial;
  // The origin itself first when it is not the start already fitted.
  const own = count > 0 && multi.origin !== undefined && Array.from(origin).some((x, j) => x !== options.initial[j]) ? 1 : 0;
  for (let s = 1; s <= count + own; s++) {
    if (options.signal?.aborted === true) {
      stoppedBy = 'aborted';
      break;
    }
    if (agreeing >= needed) {
      stoppedBy = 'agreement';
      break;
    }
    const start = Float64Array.from(origin);
    for (let j = 0; j < p && s > own; j++) {
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
    if (fit.converged && best.converged && sameMinimum(fit, best, options.typicalSize)) {
      agreeing += 1;
      // Of two fits at one minimum keep the lower χ², as before; it does not restart the count.
      if (fit.chiSquare < best.chiSquare) {
        best = fit;
        bestStart = s;
      }
      continue;
    }
    const better = fit.converged === best.converged ? fit.chiSquare < best.chiSquare : fit.converged;
    if (better) {
      best = fit;
      bestStart = s;
      agreeing = 0;
    }
  }
  if (stoppedBy === 'all-starts' && agreeing >= needed && fits > 1) stoppedBy = 'agreement';
  return { best, bestStart, fits, convergedFits, stoppedBy };
}

/**
 * True when two converged fits ended at the same minimum: χ² within 1e-9 relative (a
 * fit stops once the relative reduction is below 1e-10) and every free parameter within
 * 1e-4 of its size (|θⱼ| + typical size) — far inside any interval the data give.
 */
export function sameMinimum(a: LeastSquaresSolution, b: LeastSquaresSolution, typicalSize?: ArrayLike<number>): boolean {
  const scale = Math.max(a.chiSquare, b.chiSquare);
  if (!(Math.abs(a.chiSquare - b.chiSquare) <= 1e-9 * scale) && !(scale === 0)) return false;
  for (const j of b.freeIndices) {
    const x = a.params[j]!;
    const y = b.params[j]!;
    const size = Math.max(Math.abs(x), Math.abs(y)) + Math.abs(typicalSize?.[j] ?? 0);
    if (!(Math.abs(x - y) <= 1e-4 * size)) return false;
  }
  return true;
}
