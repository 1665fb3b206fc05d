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
export function medianOf(values: readonly number[]): number {
  const sorted = values.filter(Number.isFinite).sort((a, b) => a - b);
  if (sorted.length === 0) return NaN;
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle]! : 0.5 * (sorted[middle - 1]! + sorted[middle]!);
}

/** Sign of the median reading: −1 when most signed (axial) readings are negative, else +1. */
export function readingSign(points: SurveyPoints): 1 | -1 {
  return points.kind === 'axial' && medianOf(Array.from(points.field)) < 0 ? -1 : 1;
}

/** Largest distance of the survey from the datum, √(d² + ρ²), or 0.05 m when all are 0. */
export function surveyReach(points: SurveyPoints): number {
  let reach = 0;
  for (let i = 0; i < points.n; i++) reach = Math.max(reach, Math.hypot(points.distance[i]!, points.radial[i]!));
  return reach > 0 && Number.isFinite(reach) ? reach : 0.05;
}

/** Candidate sizes of {@link scanSize}: log-spaced over 1 % to 10× the survey's reach. */
const SIZE_CANDIDATES = 16;
/** Golden-section steps of {@link scanSize}: the bracket of two grid steps shrinks to ~2e-5 of the size. */
const SIZE_REFINE = 22;
const GOLDEN = (Math.sqrt(5) - 1) / 2;

/**
 * Starting values for a coil model with one amplitude (linear) and one overall size: for
 * each candidate size s, `shape(s, out)` writes a parameter vector with amplitude 1, the
 * model predicts the survey, the amplitude A that best matches the readings in relative
 * terms is solved in closed form, A = Σ(f/y)/Σ(f²/y²) (minimising Σ(1 − A f/y)²), and the
 * size with the least misfit wins; then a golden-section search on ln s (one evaluation
 * per step) refines it within a grid step either side. Candidates: `hint` (e.g. the
 * half-value estimate of DOMAIN.md §1.1), the reach, and 16 sizes spaced evenly in ln s
 * from 1 % to 10× the survey's reach. Deterministic, no randomness; two buffers allocated.
 *
 * @returns the winning parameter vector with the amplitude filled in
 */
export function scanSize(
  model: FieldModel, points: SurveyPoints, shape: (size: number, out: Float64Array) => void, amplitudeIndex: number, hint?: number,
): Float64Array {
  const predicted = new Float64Array(points.n);
  const params = new Float64Array(model.parameters.length);
  let amplitude = 1;
  /** Relative misfit at `size`; leaves its best amplitude in `amplitude`. */
  const misfit = (size: number): number => {
    shape(size, params);
    model.evaluate(params, points, predicted);
    let numerator = 0;
    let denominator = 0;
    for (let i = 0; i < points.n; i++) {
      const y = points.field[i]!;
      const f = predicted[i]!;
      if (y === 0 || !Number.isFinite(y) || !Number.isFinite(f)) continue;
      numerator += f / y;
      denominator += (f * f) / (y * y);
    }
    amplitude = 1;
    if (!(denominator > 0)) return Infinity;
    amplitude = numerator / denominator;
    let cost = 0;
    for (let i = 0; i < points.n; i++) {
      const y = points.field[i]!;
      const f = predicted[i]!;
      if (y === 0 || !Number.isFinite(y) || !Number.isFinite(f)) continue;
      cost += (1 - (amplitude * f) / y) ** 2;
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
  // golden-section search on ln(size) within one grid step either side
  const refined = Math.exp(goldenSection((x) => misfit(Math.exp(x)), Math.log(bestSize / ratio), Math.log(bestSize * ratio), SIZE_REFINE));
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
 * Golden-section search for the least f on [a, b] (J. Kiefer, Proc. AMS 4 (1953) 502):
 * the bracket shrinks by 0.618 per step, one evaluation each, for a function with one
 * minimum in it. f keeps track of its own best point.
 *
 * @returns the middle of the final bracket
 * @example goldenSection((x) => (x - 1) ** 2, 0, 3, 40) // 1 (within 3·0.618^40)
 */
export function goldenSection(f: (x: number) => number, a: number, b: number, steps: number): number {
  let x1 = b - GOLDEN * (b - a);
  let x2 = a + GOLDEN * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let s = 0; s < steps; s++) {
    if (f1 <= f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - GOLDEN * (b - a);
      f1 = f(x1);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + GOLDEN * (b - a);
      f2 = f(x2);
    }
  }
  return 0.5 * (a + b);
}
