import { choleskyFromNormalEquations } from '../../linalg/cholesky';
import type { FreeParameters } from './free-parameters';
import type { LeastSquaresProblem } from './least-squares-types';
import type { LeastSquaresWorkspace } from './least-squares-workspace';

/** Largest number of free parameters for which the engine forms the normal equations in one pass. */
export const FUSED_MAX_FREE = 8;

/**
 * The normal equations of the free parameters in the internal variables, in one pass over
 * the readings: `ws.gram` (k×k, row-major, lower triangle) = JᵀJ and `ws.work` (k) = Jᵀr,
 * with J the weighted Jacobian (∂fᵢ/∂θⱼ)/σᵢ times the bound transform's dθⱼ/duⱼ and r the
 * weighted residuals in `ws.residuals`. From the problem's `normalEquations` when it has
 * one; else from its row-major `jacobian`, accumulated row by row. Either way the products
 * and the order of the additions are those of forming J column by column and taking the
 * column dot products (weighted-jacobian.ts, choleskyFactorize), so the result is the same
 * to the last bit; only the m×k column-major copy of J is saved.
 *
 * Then factors them (choleskyFromNormalEquations into `ws.jacobian`, `ws.pivot`,
 * `ws.columnNorms`, `ws.qtf`) and returns whether the factor was accepted. The factoring is
 * called from here rather than from the iteration so that V8, whose inlining into one
 * optimised function has a cumulative bytecode budget, never spends the iteration's budget
 * on it and keeps that for the model's own `predict`: with both candidates about equally
 * hot, which one won varied from process to process, and bench/fit.bench.ts's speed with it.
 *
 * Needs `problem.jacobian`; `ws.derivative` holds dθ/du of the free parameters when
 * `map.bounded`.
 */
export function fusedNormalEquations(problem: LeastSquaresProblem, map: FreeParameters, ws: LeastSquaresWorkspace): boolean {
  const { m, p } = ws;
  const k = map.count;
  const scale = ws.columnScale;
  // Loops, not fill(): a builtin call costs more than these few stores.
  for (let j = 0; j < p; j++) scale[j] = 1;
  if (map.bounded) for (let j = 0; j < k; j++) scale[map.index[j]!] = ws.derivative[j]!;
  const gram = ws.gram;
  const gradient = ws.work;
  if (problem.normalEquations !== undefined) {
    // With every parameter free (k = p) the problem's p×p system is the free one: it is
    // written straight into ws.gram and ws.work, with nothing to pick out and copy.
    const all = k === p;
    const full = all ? gram : ws.fullGram;
    const fullGradient = all ? gradient : ws.fullGradient;
    // Cleared because a problem may accumulate (+=) into them; the upper triangle is never read.
    for (let a = 0; a < p; a++) {
      fullGradient[a] = 0;
      for (let b = a * p, end = b + a; b <= end; b++) full[b] = 0;
    }
    problem.normalEquations(ws.params, ws.inverseUncertainty, scale, ws.residuals, full, fullGradient);
    if (!all) {
      for (let a = 0; a < k; a++) {
        const u = map.index[a]!;
        gradient[a] = fullGradient[u]!;
        for (let b = 0; b <= a; b++) gram[a * k + b] = full[u * p + map.index[b]!]!;
      }
    }
  } else {
    const jacobian = ws.modelJacobian;
    problem.jacobian!(ws.params, jacobian);
    const row = ws.plus; // k ≤ m entries of scratch
    gram.fill(0, 0, k * k);
    gradient.fill(0, 0, k);
    const weight = ws.inverseUncertainty;
    const residuals = ws.residuals;
    for (let i = 0; i < m; i++) {
      const w = weight[i]!;
      const r = residuals[i]!;
      const at = i * p;
      for (let a = 0; a < k; a++) {
        const column = map.index[a]!;
        const value = jacobian[at + column]! * w * scale[column]!;
        row[a] = value;
        gradient[a]! += value * r;
        for (let b = 0; b <= a; b++) gram[a * k + b]! += value * row[b]!;
      }
    }
  }
  return choleskyFromNormalEquations(m, k, ws.jacobian, ws.pivot, ws.columnNorms, ws.qtf, gram, gradient);
}
