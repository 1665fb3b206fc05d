import type { FreeParameters } from './free-parameters';
import type { LeastSquaresProblem } from './least-squares-types';
import type { LeastSquaresWorkspace } from './least-squares-workspace';

/**
 * Weighted Jacobian Jᵢⱼ = (∂fᵢ/∂θⱼ)/σᵢ of the free parameters in the original θ, written
 * column-major (out[i + j·m]). Uses the problem's analytic Jacobian when it has one;
 * otherwise central differences (fᵢ(θ + hⱼ) − fᵢ(θ − hⱼ))/(2hⱼ) with the relative step
 * hⱼ = step·|θⱼ| (step·typicalSizeⱼ when θⱼ = 0, as MINPACK `fdjac2`); error O(h²), and
 * step = ε^(1/3) balances truncation and rounding (Nocedal & Wright, "Numerical
 * Optimization", 2nd ed., §8.1). Near a bound
 * the stencil turns one-sided so that the model is never evaluated outside the box.
 *
 * Reads θ from `ws.params` and f(θ) from `ws.predicted`; uses `ws.trialParams`,
 * `ws.plus`, `ws.minus` as scratch. Returns the number of model evaluations spent.
 */
export function weightedJacobian(
  problem: LeastSquaresProblem,
  map: FreeParameters,
  ws: LeastSquaresWorkspace,
  step: number,
  out: Float64Array,
): number {
  const m = ws.m;
  const p = ws.p;
  const weight = ws.inverseUncertainty;
  if (problem.jacobian !== undefined) {
    const full = ws.modelJacobian;
    problem.jacobian(ws.params, full);
    for (let j = 0; j < map.count; j++) {
      const column = map.index[j]!;
      const offset = j * m;
      for (let i = 0; i < m; i++) out[offset + i] = full[i * p + column]! * weight[i]!;
    }
    return 0;
  }
  const trial = ws.trialParams;
  trial.set(ws.params);
  let evaluations = 0;
  for (let j = 0; j < map.count; j++) {
    const at = map.index[j]!;
    const x = ws.params[at]!;
    const h = step * (x === 0 ? map.typicalSize[j]! : Math.abs(x));
    let up = x + h;
    let down = x - h;
    if (up > map.upper[j]!) up = x;
    else if (down < map.lower[j]!) down = x;
    trial[at] = up;
    if (up !== x) {
      problem.predict(trial, ws.plus);
      evaluations += 1;
    } else ws.plus.set(ws.predicted);
    trial[at] = down;
    if (down !== x) {
      problem.predict(trial, ws.minus);
      evaluations += 1;
    } else ws.minus.set(ws.predicted);
    trial[at] = x;
    // Divide by the difference of the representable arguments, not by the nominal 2h.
    const inverseWidth = 1 / (up - down);
    const offset = j * m;
    for (let i = 0; i < m; i++) out[offset + i] = (ws.plus[i]! - ws.minus[i]!) * inverseWidth * weight[i]!;
  }
  return evaluations;
}
