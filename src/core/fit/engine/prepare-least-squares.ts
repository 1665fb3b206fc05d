import { RingfallError } from '../../errors';
import { freeParameters, internalFromParams, paramsFromInternal, type FreeParameters } from './free-parameters';
import type { AbortFlag, LeastSquaresOptions, LeastSquaresProblem } from './least-squares-types';
import { createLeastSquaresWorkspace, type LeastSquaresWorkspace } from './least-squares-workspace';

/** Resolved tolerances and budgets of one fit. */
export interface LeastSquaresSettings {
  readonly costTolerance: number;
  readonly stepTolerance: number;
  readonly gradientTolerance: number;
  readonly maxEvaluations: number;
  readonly maxIterations: number;
  readonly differenceStep: number;
  readonly initialStepFactor: number;
  readonly signal: AbortFlag | undefined;
}

/** A validated fit ready to iterate: workspace filled with θ₀, u₀, 1/σ and f(θ₀) with its residuals. */
export interface PreparedLeastSquares {
  readonly ws: LeastSquaresWorkspace;
  readonly map: FreeParameters;
  readonly warnings: string[];
  readonly settings: LeastSquaresSettings;
  /** √χ² at θ₀ (evaluateCost), NaN or Infinity when the model gave a non-finite value. */
  readonly startNorm: number;
}

/**
 * Validate a problem and its options, fill a workspace, resolve defaults (see
 * LeastSquaresOptions) and evaluate the model at the start. Part of {@link fitLeastSquares}.
 * (The start's evaluation is here, not in the iteration, so that V8's cumulative inlining
 * budget of the iteration goes to the trial evaluations' call of the model, which run
 * several times per fit; see also normal-equations.ts.)
 * @throws RingfallError FIT_UNDERDETERMINED (fewer observations than free parameters);
 *   RangeError for malformed input.
 */
export function prepareLeastSquares(
  problem: LeastSquaresProblem,
  options: LeastSquaresOptions,
  workspace: LeastSquaresWorkspace | undefined,
): PreparedLeastSquares {
  const m = problem.observed.length;
  const p = problem.parameterCount;
  if (options.initial.length !== p) {
    throw new RangeError(`least squares: initial has length ${options.initial.length}, expected ${p}`);
  }
  const ws = workspace !== undefined && workspace.m === m && workspace.p === p ? workspace : createLeastSquaresWorkspace(m, p);
  for (let j = 0; j < p; j++) {
    const x = options.initial[j]!;
    if (!Number.isFinite(x)) throw new RangeError(`least squares: initial[${j}] is ${x}, expected a finite number`);
    ws.params[j] = x;
  }
  for (let i = 0; i < m; i++) {
    if (!Number.isFinite(problem.observed[i])) {
      throw new RangeError(`least squares: observed[${i}] is ${problem.observed[i]}, expected a finite number`);
    }
  }
  const sigma = options.standardUncertainty;
  if (sigma !== undefined && sigma.length !== m) {
    throw new RangeError(`least squares: standardUncertainty has length ${sigma.length}, expected ${m}`);
  }
  for (let i = 0; i < m; i++) {
    const s = sigma === undefined ? 1 : sigma[i]!;
    if (!(s > 0 && s < Infinity)) {
      throw new RangeError(`least squares: standardUncertainty[${i}] is ${s}, expected a finite number > 0`);
    }
    ws.inverseUncertainty[i] = 1 / s;
  }
  const warnings: string[] = [];
  const map = freeParameters(ws.params, options.fixed, options.lower, options.upper, options.typicalSize, warnings, ws.free);
  if (m < map.count) {
    throw new RingfallError(
      'FIT_UNDERDETERMINED',
      `Fit failed: ${m} readings for ${map.count} free parameters (least squares). ` +
        'Add readings or fix parameters at known values.',
      { value: { readings: m, freeParameters: map.count } },
    );
  }
  internalFromParams(map, ws.params, ws.internal);
  // Start exactly at the image of u₀ so that θ and u agree to the last bit.
  paramsFromInternal(map, ws.internal, ws.params);
  for (let j = 0; j < p; j++) ws.trialParams[j] = ws.params[j]!;
  const k = map.count;
  const settings: LeastSquaresSettings = {
    costTolerance: nonNegative(options.costTolerance, 1e-10, 'costTolerance'),
    stepTolerance: nonNegative(options.stepTolerance, 1e-10, 'stepTolerance'),
    gradientTolerance: nonNegative(options.gradientTolerance, 1e-12, 'gradientTolerance'),
    maxEvaluations: positive(options.maxEvaluations, 200 * (k + 1), 'maxEvaluations'),
    maxIterations: positive(options.maxIterations, Infinity, 'maxIterations'),
    differenceStep: positive(options.differenceStep, CUBE_ROOT_EPSILON, 'differenceStep'),
    initialStepFactor: positive(options.initialStepFactor, 100, 'initialStepFactor'),
    signal: options.signal,
  };
  const startNorm = evaluateCost(problem, ws, ws.params, ws.predicted, ws.residuals);
  return { ws, map, warnings, settings, startNorm };
}

/**
 * Predict at θ, write weighted residuals (fᵢ − yᵢ)/σᵢ and return their Euclidean norm
 * (√χ²); NaN or Infinity when the model gave a non-finite value.
 */
export function evaluateCost(
  problem: LeastSquaresProblem,
  ws: LeastSquaresWorkspace,
  params: Float64Array,
  predicted: Float64Array,
  residuals: Float64Array,
): number {
  problem.predict(params, predicted);
  const y = problem.observed;
  const w = ws.inverseUncertainty;
  let sum = 0;
  for (let i = 0; i < ws.m; i++) {
    const r = (predicted[i]! - y[i]!) * w[i]!;
    residuals[i] = r;
    sum += r * r;
  }
  return Math.sqrt(sum);
}

/** ε^(1/3), the default relative difference step (computed once, not per fit). */
const CUBE_ROOT_EPSILON = Math.cbrt(2.220446049250313e-16);

function nonNegative(value: number | undefined, fallback: number, name: string): number {
  if (value === undefined) return fallback;
  if (!(value >= 0)) throw new RangeError(`least squares: ${name} is ${value}, expected a number ≥ 0`);
  return value;
}

function positive(value: number | undefined, fallback: number, name: string): number {
  if (value === undefined) return fallback;
  if (!(value > 0)) throw new RangeError(`least squares: ${name} is ${value}, expected a number > 0`);
  return value;
}
