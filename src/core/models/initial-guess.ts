import type { FieldModel, SurveyPoints } from './field-model';

/**
 * Ordinary least-squares line through (ln d, ln |B|) over the points with d > 0 and B ≠ 0:
 * ln|B| = intercept + slope·ln d. The log–log slope is what a datasheet's power law is
 * (DOMAIN.md §1.9). Returns null with fewer than two usable points or one distance only.
 *
 * @example logLogLine(Float64Array.of(1, 2), Float64Array.of(1, 0.25)) // { slope: −2, intercept: 0, count: 2 }
 */
export function logLogLine(distance: Float64Array, field: Float64Array): { slope: number; intercept: number; count: number } | null {
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < distance.length; i++) {
    const d = distance[i]!;
    const b = Math.abs(field[i]!);
    if (d > 0 && b > 0 && Number.isFinite(d) && Number.isFinite(b)) {
      xs.push(Math.log(d));
      ys.push(Math.log(b));
    }
  }
  const count = xs.length;
  if (count < 2) return null;
  const meanX = xs.reduce((sum, x) => sum + x, 0) / count;
  const meanY = ys.reduce((sum, y) => sum + y, 0) / count;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < count; i++) {
    sxx += (xs[i]! - meanX) ** 2;
    sxy += (xs[i]! - meanX) * (ys[i]! - meanY);
  }
  if (!(sxx > 0)) return null;
  const slope = sxy / sxx;
  return { slope, intercept: meanY - slope * meanX, count };
}

/** Median of the finite values (NaN when there are none). */
export function medianOf(values: ArrayLike<number>): number {
  const finite = new Float64Array(values.length);
  let count = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (Number.isFinite(v)) finite[count++] = v;
  }
  if (count === 0) return NaN;
  const sorted = finite.subarray(0, count).sort();
  const middle = count >> 1;
  return count % 2 === 1 ? sorted[middle]! : 0.5 * (sorted[middle - 1]! + sorted[middle]!);
}

/** Sign of the median reading: −1 when most signed (axial) readings are negative, else +1. */
export function readingSign(points: SurveyPoints): 1 | -1 {
  return points.kind === 'axial' && medianOf(points.field) < 0 ? -1 : 1;
}

/**
 * Distance √(d² + ρ²) of a point from the datum (m): |d| on the axis. Math.hypot guards
 * against overflow that lengths in metres never reach, at several times the cost.
 *
 * @example radialDistance(3, 4) // 5
 */
export function radialDistance(distance: number, radial: number): number {
  return radial === 0 ? Math.abs(distance) : Math.sqrt(distance * distance + radial * radial);
}

/** Largest distance of the survey from the datum, √(d² + ρ²), or 0.05 m when all are 0. */
export function surveyReach(points: SurveyPoints): number {
  let reach = 0;
  for (let i = 0; i < points.n; i++) reach = Math.max(reach, radialDistance(points.distance[i]!, points.radial[i]!));
  return reach > 0 && Number.isFinite(reach) ? reach : 0.05;
}

/** Candidate sizes of {@link scanSize}: log-spaced over 1 % to 10× the survey's reach. */
const SIZE_CANDIDATES = 48;
/** Most evaluations of {@link scanSize}'s refinement (Brent's method to 1e-6 in ln s). */
const SIZE_REFINE = 24;

/**
 * Starting values for a coil model with one amplitude (linear) and one overall size: for
 * each candidate size s, `shape(s, out)` writes a parameter vector with amplitude 1, the
 * model predicts the survey, the amplitude A that best matches the readings in relative
 * terms is solved in closed form, A = Σ(f/y)/Σ(f²/y²) (minimising Σ(1 − A f/y)²), and the
 * size with the least misfit wins; then Brent's method on ln s (brentMinimum) refines it
 * within a grid step either side. Candidates: `hint` (e.g. the
 * half-value estimate of DOMAIN.md §1.1), the reach, and SIZE_CANDIDATES (48) sizes spaced
 * evenly in ln s from 1 % to 10× the survey's reach. Deterministic, no randomness; four
 * buffers allocated per call (none per candidate).
 *
 * @returns the winning parameter vector with the amplitude filled in
 */
export function scanSize(
  model: FieldModel, points: SurveyPoints, shape: (size: number, out: Float64Array) => void, amplitudeIndex: number, hint?: number,
): Float64Array {
  const predicted = new Float64Array(points.n);
  const params = new Float64Array(model.parameters.length);
  // 1/y of the usable readings (0 marks one to skip): products instead of divisions per candidate.
  const inverse = new Float64Array(points.n);
  for (let i = 0; i < points.n; i++) {
    const y = points.field[i]!;
    inverse[i] = y === 0 || !Number.isFinite(y) ? 0 : 1 / y;
  }
  let amplitude = 1;
  /** Relative misfit at `size`; leaves its best amplitude in `amplitude`. */
  const misfit = (size: number): number => {
    shape(size, params);
    model.evaluate(params, points, predicted);
    let numerator = 0;
    let denominator = 0;
    for (let i = 0; i < points.n; i++) {
      const q = predicted[i]! * inverse[i]!;
      predicted[i] = q;
      if (inverse[i] === 0 || !Number.isFinite(q)) continue;
      numerator += q;
      denominator += q * q;
    }
    amplitude = 1;
    if (!(denominator > 0)) return Infinity;
    amplitude = numerator / denominator;
    let cost = 0;
    for (let i = 0; i < points.n; i++) {
      const q = predicted[i]!;
      if (inverse[i] === 0 || !Number.isFinite(q)) continue;
      cost += (1 - amplitude * q) ** 2;
    }
    return cost;
  };
  const reach = surveyReach(points);
  let bestSize = reach;
  let bestCost = misfit(reach);
  let bestAmplitude = amplitude;
  const consider = (size: number): void => {
    const cost = misfit(size);
    if (cost < bestCost) {
      bestCost = cost;
      bestSize = size;
      bestAmplitude = amplitude;
    }
  };
  const ratio = 1000 ** (1 / (SIZE_CANDIDATES - 1));
  for (let i = 0; i < SIZE_CANDIDATES; i++) consider(reach * 0.01 * ratio ** i);
  if (hint !== undefined && hint > 0 && Number.isFinite(hint)) consider(hint);
  // Brent's method on ln(size) within one grid step either side, from the best candidate
  const refined = Math.exp(brentMinimum((x) => misfit(Math.exp(x)), Math.log(bestSize / ratio), Math.log(bestSize * ratio), 1e-6, SIZE_REFINE, Math.log(bestSize), bestCost));
  const refinedCost = misfit(refined);
  if (refinedCost <= bestCost) {
    bestSize = refined;
    bestAmplitude = amplitude;
  }
  const result = new Float64Array(model.parameters.length);
  shape(bestSize, result);
  result[amplitudeIndex] = bestAmplitude;
  return result;
}

/**
 * Minimum of f on [a, b] by Brent's method (R. P. Brent, "Algorithms for Minimization
 * without Derivatives", 1973, ch. 5, procedure localmin): parabolic interpolation through
 * the three best points, with a golden-section step whenever the parabola is not trusted,
 * so it never does worse than golden section and converges superlinearly on a smooth
 * minimum. Stops when x is known to within `tolerance` (absolute, in x's units) or after
 * `maxEvaluations`.
 *
 * @param start a point inside [a, b] to begin from (e.g. the best of a grid), with `startValue` = f(start) when known
 * @returns the best x found
 * @example brentMinimum((x) => (x - 1) ** 2, 0, 3, 1e-8, 50) // 1 (within 1e-8)
 */
export function brentMinimum(
  f: (x: number) => number, a: number, b: number, tolerance: number, maxEvaluations: number, start?: number, startValue?: number,
): number {
  const c = (3 - Math.sqrt(5)) / 2;
  let x = start !== undefined && start > a && start < b ? start : a + c * (b - a);
  let fx = start === x && startValue !== undefined ? startValue : f(x);
  let evaluations = start === x && startValue !== undefined ? 0 : 1;
  let w = x;
  let v = x;
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  while (evaluations < maxEvaluations) {
    const middle = 0.5 * (a + b);
    const tol1 = 1.4901161193847656e-8 * Math.abs(x) + tolerance / 3;
    const tol2 = 2 * tol1;
    if (Math.abs(x - middle) <= tol2 - 0.5 * (b - a)) break;
    let parabolic = false;
    if (Math.abs(e) > tol1) {
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = x < middle ? tol1 : -tol1;
        parabolic = true;
      }
    }
    if (!parabolic) {
      e = (x < middle ? b : a) - x;
      d = c * e;
    }
    const u = x + (Math.abs(d) >= tol1 ? d : d > 0 ? tol1 : -tol1);
    const fu = f(u);
    evaluations += 1;
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return x;
}
