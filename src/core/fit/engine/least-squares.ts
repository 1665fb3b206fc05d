import { choleskyFactorize } from '../../linalg/cholesky';
import { dampingParameter } from './damping-parameter';
import { finishLeastSquares } from './finish-least-squares';
import { internalDerivatives, paramsFromInternal } from './free-parameters';
import { evaluateCost, prepareLeastSquares } from './prepare-least-squares';
import { applyQTransposeAndFinishR, qrFactorize } from '../../linalg/householder-qr';
import { weightedJacobian } from './weighted-jacobian';
import { FUSED_MAX_FREE, fusedNormalEquations } from './normal-equations';
import type { AbortFlag, LeastSquaresOptions, LeastSquaresProblem, LeastSquaresSolution, StopCode } from './least-squares-types';
import { releaseWorkspace, takeWorkspace, type LeastSquaresWorkspace } from './least-squares-workspace';

const EPSILON = 2.220446049250313e-16;

/**
 * Weighted nonlinear least squares by Levenberg–Marquardt, after MINPACK `lmder`
 * (J. J. Moré, "The Levenberg–Marquardt algorithm: implementation and theory", Lecture
 * Notes in Mathematics 630, 1978; Moré, Garbow & Hillstrom, ANL-80-74, 1980):
 * minimises χ²(θ) = Σ ((yᵢ − fᵢ(θ))/σᵢ)² over the free parameters.
 *
 * Each iteration factors the weighted Jacobian — pivoted Cholesky of the normal
 * equations when they are well conditioned, Householder QR with column pivoting
 * otherwise (both give the same R) — chooses the damping so the step fits a trust region measured in Marquardt's scaled
 * norm ‖D·δ‖ (D = running maximum of Jacobian column norms), and takes the step only if
 * it lowers χ² (ratio of actual to predicted reduction ≥ 10⁻⁴); the radius grows or
 * shrinks with that ratio. Stops on relative tolerances (cost, step, gradient),
 * the evaluation/iteration budget or `signal.aborted`, and says which.
 * Bounds are honoured through smooth transforms (bound-transform.ts); fixed parameters
 * are removed from the problem. Never throws for non-convergence.
 *
 * @param workspace buffers to reuse (see createLeastSquaresWorkspace); when absent one is
 *   taken from the spares (takeWorkspace) and given back after the solution is copied out.
 * @throws RingfallError FIT_UNDERDETERMINED when there are fewer observations than free
 *   parameters; RangeError for malformed input (lengths, σ ≤ 0, non-finite data).
 * @example
 * // y = a·x fitted to (1, 2), (2, 4): a = 2
 * fitLeastSquares({ observed: Float64Array.of(2, 4), parameterCount: 1,
 *   predict: (t, out) => { out[0] = t[0]!; out[1] = 2 * t[0]!; } }, { initial: [1] }).params[0] // 2
 */
export function fitLeastSquares(
  problem: LeastSquaresProblem,
  options: LeastSquaresOptions,
  workspace?: LeastSquaresWorkspace,
): LeastSquaresSolution {
  const m = problem.observed.length;
  const p = problem.parameterCount;
  if (workspace !== undefined && workspace.m === m && workspace.p === p) return iterate(problem, options, workspace);
  const borrowed = takeWorkspace(m, p);
  try {
    return iterate(problem, options, borrowed);
  } finally {
    releaseWorkspace(borrowed);
  }
}

/** The Levenberg–Marquardt iteration of {@link fitLeastSquares} in a workspace of the right size. */
function iterate(problem: LeastSquaresProblem, options: LeastSquaresOptions, workspace: LeastSquaresWorkspace): LeastSquaresSolution {
  const setup = prepareLeastSquares(problem, options, workspace);
  const { ws, map, settings } = setup;
  const { m } = ws;
  const k = map.count;
  const { internal, trialInternal, step, scale, qtf, work, jacobian: J, pivot, params, trialParams } = ws;
  let evaluations = 1;
  let trials = 0;
  let iterations = 0;
  let fnorm = setup.startNorm;
  let stop: StopCode | null = !Number.isFinite(fnorm) ? 'non-finite-start' : k === 0 ? 'no-free-parameters' : null;
  let damping = 0;
  let trustRadius = 0;
  let xnorm = 0;
  let first = true;
  const fusedPass = problem.jacobian !== undefined && k <= FUSED_MAX_FREE;
  while (stop === null) {
    if (aborted(settings.signal)) { stop = 'aborted'; break; }
    if (iterations >= settings.maxIterations) { stop = 'max-iterations'; break; }
    if (map.bounded) internalDerivatives(map, internal, ws.derivative);
    // Normal equations when they are well conditioned (cheap for small k), else Householder
    // QR. With an analytic Jacobian and few free parameters they are formed in one pass
    // (normal-equations.ts) and J itself is built only for the QR fallback.
    const fused = fusedPass && fusedNormalEquations(problem, map, ws);
    if (!fused) {
      evaluations += weightedJacobian(problem, map, ws, settings.differenceStep, J);
      if (map.bounded) {
        // Chain rule into the internal variables: ∂f/∂u = ∂f/∂θ · dθ/du.
        for (let j = 0; j < k; j++) {
          const d = ws.derivative[j]!;
          for (let i = j * m, end = i + m; i < end; i++) J[i]! *= d;
        }
      }
      // After a fused pass the same normal equations have already failed the test.
      if (fusedPass || !choleskyFactorize(m, k, J, ws.residuals, pivot, ws.columnNorms, qtf, ws.gram, work)) {
        qrFactorize(m, k, J, pivot, ws.rdiag, ws.columnNorms, work);
        ws.trialResiduals.set(ws.residuals);
        applyQTransposeAndFinishR(m, k, J, ws.rdiag, ws.trialResiduals, qtf);
      }
    }
    if (!allFinite(ws.columnNorms, k)) { stop = 'non-finite-jacobian'; break; }
    if (first) {
      for (let j = 0; j < k; j++) scale[j] = ws.columnNorms[j] === 0 ? 1 : ws.columnNorms[j]!;
      xnorm = scaledNorm(scale, internal, k);
      trustRadius = xnorm === 0 ? settings.initialStepFactor : settings.initialStepFactor * xnorm;
    }
    // Largest cosine between the residual vector and a Jacobian column.
    let gnorm = 0;
    if (fnorm !== 0) {
      // Qᵀf/‖f‖ once into `work` (free until the step's predicted reduction): the same
      // quotients as dividing inside the sum, k divisions instead of k(k+1)/2.
      for (let i = 0; i < k; i++) work[i] = qtf[i]! / fnorm;
      for (let j = 0; j < k; j++) {
        const columnNorm = ws.columnNorms[pivot[j]!]!;
        if (columnNorm === 0) continue;
        let sum = 0;
        for (let i = 0; i <= j; i++) sum += J[i + j * m]! * work[i]!;
        gnorm = Math.max(gnorm, Math.abs(sum / columnNorm));
      }
    }
    if (gnorm <= settings.gradientTolerance) {
      stop = fnorm === 0 ? 'exact-fit' : onPlateau(ws, k, map.bounded) ? 'zero-gradient-plateau' : 'gradient-tolerance';
      break;
    }
    for (let j = 0; j < k; j++) scale[j] = Math.max(scale[j]!, ws.columnNorms[j]!);

    let ratio = 0;
    do {
      damping = dampingParameter(k, J, m, pivot, scale, qtf, trustRadius, damping, step, ws.damping);
      for (let j = 0; j < k; j++) {
        step[j] = -step[j]!;
        trialInternal[j] = internal[j]! + step[j]!;
      }
      const pnorm = scaledNorm(scale, step, k);
      if (first) trustRadius = Math.min(trustRadius, pnorm);
      paramsFromInternal(map, trialInternal, trialParams);
      const fnorm1 = evaluateCost(problem, ws, trialParams, ws.trialPredicted, ws.trialResiduals);
      evaluations += 1;
      trials += 1;
      // A non-finite or much larger cost counts as no reduction (actred = −1), as in MINPACK.
      const actual = 0.1 * fnorm1 < fnorm ? 1 - (fnorm1 / fnorm) ** 2 : -1;
      for (let j = 0; j < k; j++) {
        work[j] = 0;
        const temp = step[pivot[j]!]!;
        for (let i = 0; i <= j; i++) work[i]! += J[i + j * m]! * temp;
      }
      const temp1 = norm(work, k) / fnorm;
      const temp2 = (Math.sqrt(damping) * pnorm) / fnorm;
      const predicted = temp1 * temp1 + (temp2 * temp2) / 0.5;
      const directional = -(temp1 * temp1 + temp2 * temp2);
      ratio = predicted !== 0 ? actual / predicted : 0;
      if (ratio <= 0.25) {
        let shrink = actual >= 0 ? 0.5 : (0.5 * directional) / (directional + 0.5 * actual);
        if (0.1 * fnorm1 >= fnorm || !(shrink >= 0.1)) shrink = 0.1;
        trustRadius = shrink * Math.min(trustRadius, pnorm / 0.1);
        damping /= shrink;
      } else if (damping === 0 || ratio >= 0.75) {
        trustRadius = pnorm / 0.5;
        damping *= 0.5;
      }
      if (ratio >= 1e-4) {
        for (let j = 0; j < k; j++) internal[j] = trialInternal[j]!;
        // A loop, not set(): a builtin call costs more than a few stores.
        for (let j = 0; j < params.length; j++) params[j] = trialParams[j]!;
        // The trial's predictions and residuals become the current ones by swapping buffers.
        const predicted = ws.predicted;
        ws.predicted = ws.trialPredicted;
        ws.trialPredicted = predicted;
        const residuals = ws.residuals;
        ws.residuals = ws.trialResiduals;
        ws.trialResiduals = residuals;
        xnorm = scaledNorm(scale, internal, k);
        fnorm = fnorm1;
        iterations += 1;
      }
      first = false;
      const costSmall = Math.abs(actual) <= settings.costTolerance && predicted <= settings.costTolerance && 0.5 * ratio <= 1;
      const stepSmall = trustRadius <= settings.stepTolerance * xnorm;
      if (costSmall || stepSmall) stop = costSmall ? (stepSmall ? 'cost-and-step-tolerance' : 'cost-tolerance') : 'step-tolerance';
      else if (trials >= settings.maxEvaluations) stop = 'max-evaluations';
      else if (
        (Math.abs(actual) <= EPSILON && predicted <= EPSILON && 0.5 * ratio <= 1) ||
        trustRadius <= EPSILON * xnorm ||
        gnorm <= EPSILON
      ) stop = 'machine-precision';
      else if (aborted(settings.signal)) stop = 'aborted';
    } while (stop === null && ratio < 1e-4);
  }
  return finishLeastSquares(problem, setup, stop, iterations, evaluations);
}

/** ‖D·v‖ over the first k entries. Plain sum of squares: weighted residuals are O(1). */
function scaledNorm(d: Float64Array, v: Float64Array, k: number): number {
  let sum = 0;
  for (let j = 0; j < k; j++) {
    const x = d[j]! * v[j]!;
    sum += x * x;
  }
  return Math.sqrt(sum);
}

/**
 * ‖v‖ over the first k entries, as scaledNorm: a function of its own rather than a null D,
 * so that each inlined copy is small (V8's inlining budget, prepare-least-squares.ts).
 */
function norm(v: Float64Array, k: number): number {
  let sum = 0;
  for (let j = 0; j < k; j++) sum += v[j]! * v[j]!;
  return Math.sqrt(sum);
}

/**
 * A zero gradient proves nothing when a Jacobian column is exactly zero: the model has
 * stopped depending on that parameter (an exponential underflowed, a source moved out of
 * reach), so the search stands on a plateau, not at a minimum. A column zeroed by the bound
 * transform (dθ/du = 0 on a bound) does not count: that is a parameter at its bound.
 */
function onPlateau(ws: LeastSquaresWorkspace, k: number, bounded: boolean): boolean {
  for (let j = 0; j < k; j++) {
    if (ws.columnNorms[j] === 0 && !(bounded && ws.derivative[j] === 0)) return true;
  }
  return false;
}

function aborted(signal: AbortFlag | undefined): boolean {
  return signal !== undefined && signal.aborted;
}

function allFinite(values: Float64Array, k: number): boolean {
  for (let j = 0; j < k; j++) if (!Number.isFinite(values[j])) return false;
  return true;
}
