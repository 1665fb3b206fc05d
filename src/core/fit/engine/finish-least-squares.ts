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
 * residuals out of the workspace, evaluate the weighted Jacobian in the ORIGINAL
 * parameters at θ̂ (for the covariance), flag parameters on a bound, word the stop reason.
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
  // Plain arrays filled by index: far cheaper than off-heap typed arrays for a per-fit result.
  let jacobian: number[] = [];
  if (stopCode !== 'non-finite-start' && k > 0) {
    jacobian = new Array<number>(m * k);
    if (problem.jacobian !== undefined) {
      // Straight from the model's row-major Jacobian: weightedJacobian's products, one pass fewer.
      const full = ws.modelJacobian;
      const weight = ws.inverseUncertainty;
      problem.jacobian(ws.params, full);
      for (let i = 0; i < m; i++) for (let j = 0; j < k; j++) jacobian[i * k + j] = full[i * p + map.index[j]!]! * weight[i]!;
    } else {
      spent += weightedJacobian(problem, map, ws, settings.differenceStep, ws.jacobian);
      for (let i = 0; i < m; i++) for (let j = 0; j < k; j++) jacobian[i * k + j] = ws.jacobian[i + j * m]!;
    }
  }
  const atBound = new Array<boolean>(p);
  for (let j = 0; j < p; j++) atBound[j] = false;
  const freeIndices = new Array<number>(k);
  for (let j = 0; j < k; j++) freeIndices[j] = map.index[j]!;
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
  return {
    converged: isConverged(stopCode),
    stopCode,
    stopReason: describeStop(stopCode, setup),
    iterations,
    evaluations: spent,
    params: ws.params.slice(),
    freeIndices,
    chiSquare,
    rss,
    predicted,
    residuals,
    jacobian,
    atBound,
    warnings,
  };
}

function describeStop(code: StopCode, setup: PreparedLeastSquares): string {
  const s = setup.settings;
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
