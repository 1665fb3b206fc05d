import type { FieldModel, SurveyPoints } from '../../models/field-model';
import { surveyReach } from '../../models/initial-guess';
import { fitEffectiveVariance } from './effective-variance';
import { distanceSlope, fieldModelProblem } from './field-model-problem';
import type { FitSurveyOptions } from '../fit-survey-options';
import type { LeastSquaresOptions, LeastSquaresSolution } from '../engine/least-squares-types';
import { fitLeastSquares } from '../engine/least-squares';
import { fitMultiStart } from './multi-start-fit';
import { fitRobust } from './robust-fit';
import { profileStart } from './profile-start';
import { scratchArray } from './scratch-array';
import { settledFit } from './settled-fit';

/** What the search for one model's best parameters found. */
export interface ModelSearch {
  readonly solution: LeastSquaresSolution;
  /** σ used in the final fit (T): stated σ, widened by position uncertainty; null when none were stated. */
  readonly standardUncertainty: Float64Array | null;
  /** Per reading, set by a robust loss: |standardised residual| beyond the cut. */
  readonly outliers: readonly boolean[] | null;
  /** Fixed flags in model parameter order (the caller's fixed parameters). */
  readonly fixed: readonly boolean[];
  /**
   * Model-order indices of free parameters that ended on a bound in the multi-start and
   * were held there for the re-weighted fits (an active set, as in bounded least squares:
   * a search that restarts on its bound only crawls along it). They count as fitted
   * parameters but have no covariance row.
   */
  readonly pinned: readonly number[];
  /** Sentences for the fit's warnings (effective variance not settled, start moved, …). */
  readonly notes: readonly string[];
}

/**
 * Find one model's best parameters for one survey: data-driven start
 * (`model.initialGuess`, DOMAIN.md §1.1), fixed values put in, refined by a profile scan
 * of the probe offset with amplitude and background solved exactly (profile-start.ts; when
 * the best offset is on the edge of its box the rest is first fitted with it held there),
 * then a seeded multi-start keeping the lowest-χ² converged fit. The multi-start is
 * adaptive: no extra start when the fit from the scanned start is settled (settled-fit.ts:
 * a KKT point inside the box with sane parameters); otherwise extra starts — the plain
 * data-driven start, then up to `options.starts` (8) seeded perturbations of it, as before
 * the scan existed — until two agree with the best (sameMinimum). `options.exhaustiveStarts`
 * runs them all. Same inputs and seed, same answer. With a position uncertainty the
 * effective variance is iterated from there (DOMAIN.md §3.8); with a robust loss IRLS runs
 * last, on those weights. Never throws for a fit that fails: the solution says converged
 * false and why.
 *
 * @param readingUncertainty σ_B,i (T) or null; seed of this model's multi-start.
 */
export function searchModelFit(
  model: FieldModel,
  points: SurveyPoints,
  readingUncertainty: Float64Array | null,
  options: FitSurveyOptions,
  seed: number,
): ModelSearch {
  const notes: string[] = [];
  const specs = model.parameters;
  const fixedValues = options.fixed ?? {};
  const fixed = specs.map((p) => Object.prototype.hasOwnProperty.call(fixedValues, p.name));
  const initial = model.initialGuess(points);
  specs.forEach((p, j) => {
    if (fixed[j]) initial[j] = fixedValues[p.name]!;
  });
  const offsetIndex = specs.findIndex((p) => p.role === 'offset');
  // The prediction at the start, handed on to profileStart for its χ² there (same values).
  let predicted: Float64Array | null = scratchArray(points.n, 7);
  if (!evaluatesEverywhere(model, initial, points, predicted) && offsetIndex >= 0 && !fixed[offsetIndex]) {
    // A power law cannot be evaluated at distance 0: start with the sensing point a little out.
    let nearest = Infinity;
    for (let i = 0; i < points.n; i++) nearest = Math.min(nearest, points.distance[i]!);
    initial[offsetIndex] = Math.max(0, -nearest) + 0.02 * surveyReach(points);
    predicted = null;
  }
  const problem = fieldModelProblem(model, points);
  const base = leastSquaresOptions(model, points, initial, fixed, options);
  const profiled = profileStart(model, points, initial, fixed, base.lower as number[], base.upper as number[], readingUncertainty, predicted);
  let start = profiled.initial;
  const edge = profiled.offsetOnBound;
  if (edge >= 0) {
    // The best offset is on the box's edge: settle the rest there first with the offset held
    // (an active set), then release it from 1e-9 of its range inside; from farther in, a
    // sine-transformed parameter crawls back to its bound for many iterations.
    const held = fixed.map((f, j) => f || j === edge);
    const first = fitLeastSquares(problem, { ...base, fixed: held, initial: start, ...(readingUncertainty === null ? {} : { standardUncertainty: readingUncertainty }) });
    if (first.converged && first.chiSquare <= profiled.chiSquare) {
      start = first.params;
      const inward = 1e-9 * (base.upper![edge]! - base.lower![edge]!);
      start[edge] = start[edge] === base.upper![edge] ? start[edge]! - inward : start[edge]! + inward;
    }
  }
  const startOptions = { ...base, initial: start };
  const weighted: LeastSquaresOptions = readingUncertainty === null ? startOptions : { ...startOptions, standardUncertainty: readingUncertainty };
  const adaptive = options.exhaustiveStarts !== true;
  let solution = fitMultiStart(problem, weighted, {
    seed,
    starts: options.starts ?? 8,
    // Extra starts around the plain data-driven start, as before the scan: the search with
    // every start is then a superset of the one without the scan.
    origin: initial,
    ...(adaptive ? {
      agreement: 2,
      settled: (fit: LeastSquaresSolution) => profiled.scanned && settledFit(model, points, fit, readingUncertainty, profiled.scannedIndex, profiled.scannedRange, base),
    } : {}),
  }).best;
  const canonical = Float64Array.from(solution.params);
  if (model.canonicalParameters?.(canonical, points, fixed)) {
    // the mirror-image optimum (same χ²): re-solve from it so the Jacobian and covariance match
    solution = fitLeastSquares(problem, { ...weighted, initial: canonical });
  }
  let sigma = readingUncertainty;
  const pinned = solution.freeIndices.filter((j) => solution.atBound[j] === true);
  const refit: LeastSquaresOptions = pinned.length === 0 ? base : { ...base, fixed: fixed.map((f, j) => f || pinned.includes(j)) };
  const position = options.positionUncertainty ?? 0;
  if (readingUncertainty !== null && position > 0 && solution.converged) {
    const effective = fitEffectiveVariance(problem, { ...refit, initial: solution.params }, {
      readingUncertainty,
      positionUncertainty: new Float64Array(points.n).fill(position),
      slope: (params, out) => distanceSlope(model, params, points, out),
    });
    solution = effective.solution;
    sigma = effective.effectiveUncertainty;
    if (!effective.settled) notes.push(`the position-uncertainty weights had not settled after ${effective.rounds} rounds; intervals are approximate.`);
  }
  let outliers: readonly boolean[] | null = null;
  if (options.robust && solution.converged) {
    const robustOptions = { ...refit, initial: solution.params };
    const robust = fitRobust(problem, sigma === null ? robustOptions : { ...robustOptions, standardUncertainty: sigma }, {
      loss: options.robust,
      ...(options.outlierCut === undefined ? {} : { outlierCut: options.outlierCut }),
    });
    solution = robust.solution;
    outliers = robust.outliers;
    if (!robust.settled) notes.push(`the robust weights had not settled after ${robust.rounds} rounds.`);
  }
  // Held only if a re-weighted fit ran; otherwise they are still free in the solution.
  const held = pinned.filter((j) => !solution.freeIndices.includes(j));
  return { solution, standardUncertainty: sigma, outliers, fixed, pinned: held, notes };
}

/** Engine options: bounds from the catalog, typical sizes from the survey (multi-start spread of zero starts). */
export function leastSquaresOptions(
  model: FieldModel, points: SurveyPoints, initial: Float64Array, fixed: readonly boolean[], options: FitSurveyOptions,
): LeastSquaresOptions {
  const reach = surveyReach(points);
  let largest = 0;
  for (let i = 0; i < points.n; i++) largest = Math.max(largest, Math.abs(points.field[i]!));
  const typicalSize = model.parameters.map((p, j) => {
    if (p.role === 'geometry' || p.role === 'offset' || p.role === 'centre') return 0.02 * reach;
    if (p.role === 'background') return 0.01 * (largest > 0 ? largest : 1e-6);
    return Math.abs(initial[j]!) > 0 ? Math.abs(initial[j]!) : 1;
  });
  // A power law with a free offset can drift to the exponential limit (δ, n → ∞ with n/δ
  // fixed), where χ² keeps falling without end; a descriptive fit is kept in a box:
  // offset at most the survey's reach, exponent at most 12. Ending on it is reported.
  // Every model: the sensing point stays in front of the datum at the nearest reading
  // (d + probeOffset ≥ −5 % of the reach, a margin for a misplaced datum that also keeps
  // a zero start off the bound) and the offset is at most the survey's reach. Without this
  // a far-field-only survey can "fit" with the probe far behind the coil (DOMAIN.md §3.1:
  // the offset is a recess plus a housing, millimetres).
  let nearest = Infinity;
  for (let i = 0; i < points.n; i++) nearest = Math.min(nearest, points.distance[i]!);
  const upper = model.parameters.map((p) => {
    if (p.role === 'offset') return Math.min(p.upper, reach);
    if (!model.physical && p.role === 'exponent') return Math.min(p.upper, 12);
    return p.upper;
  });
  const lower = model.parameters.map((p) => (p.role === 'offset' && Number.isFinite(nearest) ? Math.max(p.lower, -nearest - 0.05 * reach) : p.lower));
  return {
    initial,
    fixed,
    lower,
    upper,
    typicalSize,
    ...(options.signal === undefined ? {} : { signal: options.signal }),
    ...(options.maxEvaluations === undefined ? {} : { maxEvaluations: options.maxEvaluations }),
  };
}

/** True when the model's prediction at `params` (written to `out`) is finite at every point. */
function evaluatesEverywhere(model: FieldModel, params: Float64Array, points: SurveyPoints, out: Float64Array): boolean {
  model.evaluate(params, points, out);
  for (let i = 0; i < points.n; i++) if (!Number.isFinite(out[i]!)) return false;
  return true;
}
