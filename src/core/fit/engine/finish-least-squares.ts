import { onBound } from './free-parameters';
import type { LeastSquaresProblem, LeastSquaresSolution, StopCode } from './least-squares-types';
import type { PreparedLeastSquares } from './prepare-least-squares';
import { weightedJacobian } from './weighted-jacobian';

/** Stop codes that mean a tolerance test (or nothing to do) ended the search. */
function isConverged(code: StopCode): boolean {
  return (
    code !== 'max-evaluations' &&
    code !== 'zero-gradient-plateau' &&
    code !== 'max-iterations' &&
    code !== 'aborted' &&
    code !== 'non-finite-start' &&
    code !== 'non-finite-jacobian'
  );
}

/**
 * Package the state of a finished {@link fitLeastSquares} run: copy θ̂, predictions and
 * residuals out of the workspace, flag parameters on a bound, and keep what the weighted
 * Jacobian in the ORIGINAL parameters at θ̂ (for the covariance) and the stop sentence
 * need. With an analytic Jacobian both are worked out on first read, from copies of θ̂
 * and the weights (the workspace and the caller's σ may change meanwhile): a start the
 * multi-start search throws away never pays for them. By finite differences the
 * Jacobian is evaluated here, its evaluations counted in `evaluations`.
 */
export function finishLeastSquares(
  problem: LeastSquaresProblem,
  setup: PreparedLeastSquares,
  stopCode: StopCode,
  iterations: number,
  evaluations: number,
): LeastSquaresSolution {
  const { ws, map, settings } = setup;
  const { m, p } = ws;
  const k = map.count;
  const warnings = setup.warnings;
  let spent = evaluations;
  const freeIndices = new Array<number>(k);
  for (let j = 0; j < k; j++) freeIndices[j] = map.index[j]!;
  // Plain arrays filled by index: far cheaper than off-heap typed arrays for a per-fit result.
  let jacobian: number[] | null = [];
  let weights: number[] = [];
  if (stopCode !== 'non-finite-start' && k > 0) {
    if (problem.jacobian !== undefined) {
      jacobian = null;
      weights = new Array<number>(m);
      for (let i = 0; i < m; i++) weights[i] = ws.inverseUncertainty[i]!;
    } else {
      jacobian = new Array<number>(m * k);
      spent += weightedJacobian(problem, map, ws, settings.differenceStep, ws.jacobian);
      for (let i = 0; i < m; i++) for (let j = 0; j < k; j++) jacobian[i * k + j] = ws.jacobian[i + j * m]!;
    }
  }
  const atBound = new Array<boolean>(p);
  for (let j = 0; j < p; j++) atBound[j] = false;
  for (let j = 0; map.bounded && j < k; j++) {
    const at = map.index[j]!;
    if (onBound(map, j, ws.params[at]!)) {
      atBound[at] = true;
      warnings.push(`parameter ${at} ended on its bound (${ws.params[at]})`);
    }
  }
  const predicted = new Array<number>(m);
  const residuals = new Array<number>(m);
  let chiSquare = 0;
  let rss = 0;
  for (let i = 0; i < m; i++) {
    const f = ws.predicted[i]!;
    const r = problem.observed[i]! - f;
    predicted[i] = f;
    residuals[i] = r;
    rss += r * r;
    const z = r * ws.inverseUncertainty[i]!;
    chiSquare += z * z;
  }
  return new FinishedSolution(
    isConverged(stopCode), stopCode, iterations, spent, copyOf(ws.params), freeIndices, chiSquare, rss, predicted, residuals,
    atBound, warnings, problem, settings, jacobian, weights,
  );
}

/** A {@link LeastSquaresSolution} whose Jacobian and stop sentence are made on first read. */
class FinishedSolution implements LeastSquaresSolution {
  #jacobian: number[] | null;
  #stopReason: string | null = null;
  readonly #problem: LeastSquaresProblem;
  readonly #settings: PreparedLeastSquares['settings'];
  /** 1/σᵢ as the fit ended, and θ̂ (own copies; `params` is the caller's to change). */
  readonly #weights: readonly number[];
  readonly #at: Float64Array;

  constructor(
    readonly converged: boolean,
    readonly stopCode: StopCode,
    readonly iterations: number,
    readonly evaluations: number,
    readonly params: Float64Array,
    readonly freeIndices: readonly number[],
    readonly chiSquare: number,
    readonly rss: number,
    readonly predicted: readonly number[],
    readonly residuals: readonly number[],
    readonly atBound: readonly boolean[],
    readonly warnings: readonly string[],
    problem: LeastSquaresProblem,
    settings: PreparedLeastSquares['settings'],
    jacobian: number[] | null,
    weights: readonly number[],
  ) {
    this.#problem = problem;
    this.#settings = settings;
    this.#jacobian = jacobian;
    this.#weights = weights;
    this.#at = jacobian === null ? copyOf(params) : params;
  }

  get stopReason(): string {
    if (this.#stopReason === null) this.#stopReason = describeStop(this.stopCode, this.#settings);
    return this.#stopReason;
  }

  get jacobian(): readonly number[] {
    if (this.#jacobian === null) this.#jacobian = this.weightedJacobian();
    return this.#jacobian;
  }

  /** (∂fᵢ/∂θⱼ)·(1/σᵢ) of the free columns, row-major, from the model's row-major Jacobian at θ̂. */
  private weightedJacobian(): number[] {
    const m = this.residuals.length;
    const p = this.params.length;
    const k = this.freeIndices.length;
    if (scratch.length < m * p) scratch = new Float64Array(m * p);
    const full = scratch;
    this.#problem.jacobian!(this.#at, full);
    const weight = this.#weights;
    const index = this.freeIndices;
    const out = new Array<number>(m * k);
    for (let i = 0; i < m; i++) for (let j = 0; j < k; j++) out[i * k + j] = full[i * p + index[j]!]! * weight[i]!;
    return out;
  }
}

/** A copy of a short vector by a loop: cheaper than slice(), a builtin call, for a few entries. */
function copyOf(v: Float64Array): Float64Array {
  const out = new Float64Array(v.length);
  for (let j = 0; j < v.length; j++) out[j] = v[j]!;
  return out;
}

/** The model's row-major Jacobian, reused from solution to solution (read synchronously). */
let scratch = new Float64Array(256);

function describeStop(code: StopCode, s: PreparedLeastSquares['settings']): string {
  switch (code) {
    case 'cost-tolerance':
      return `converged: relative reduction of χ² below ${s.costTolerance}`;
    case 'step-tolerance':
      return `converged: relative step below ${s.stepTolerance}`;
    case 'cost-and-step-tolerance':
      return `converged: relative reduction of χ² below ${s.costTolerance} and relative step below ${s.stepTolerance}`;
    case 'gradient-tolerance':
      return `converged: residuals orthogonal to every Jacobian column within ${s.gradientTolerance}`;
    case 'zero-gradient-plateau':
      return 'not converged: the gradient vanished on a plateau where the model no longer depends on a parameter, not at a minimum';
    case 'exact-fit':
      return 'converged: the residuals are exactly zero';
    case 'machine-precision':
      return 'converged: no further reduction is possible at machine precision';
    case 'no-free-parameters':
      return 'nothing to fit: every parameter is fixed';
    case 'max-evaluations':
      return `not converged: the budget of ${s.maxEvaluations} evaluations ran out`;
    case 'max-iterations':
      return `not converged: the budget of ${s.maxIterations} iterations ran out`;
    case 'aborted':
      return 'not converged: aborted by the caller';
    case 'non-finite-start':
      return 'not converged: the model gave a non-finite value at the starting point';
    case 'non-finite-jacobian':
      return 'not converged: the Jacobian has a non-finite entry at the current point';
  }
}
