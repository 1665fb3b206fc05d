import type { FieldModel, SurveyPoints } from './field-model';
import { brentMinimum } from '../numeric/brent-minimum';

/**
 * Sign of the median reading: −1 when most signed (axial) readings are negative, else +1.
 * The median of the finite readings (medianOf) is negative exactly when more than half of
 * them are, or, for an even count with exactly half negative, when the mean of the largest
 * negative and the smallest non-negative one is: counted in one pass, no copy or sort (every
 * model's start asks for it).
 */
export function readingSign(points: SurveyPoints): 1 | -1 {
  if (points.kind !== 'axial') return 1;
  let count = 0;
  let negative = 0;
  let largestNegative = -Infinity;
  let smallestOther = Infinity;
  for (let i = 0; i < points.field.length; i++) {
    const v = points.field[i]!;
    if (!Number.isFinite(v)) continue;
    count += 1;
    if (v < 0) {
      negative += 1;
      if (v > largestNegative) largestNegative = v;
    } else if (v < smallestOther) {
      smallestOther = v;
    }
  }
  const middle = count >> 1;
  if (count % 2 === 1 || negative !== middle) return negative > middle ? -1 : 1;
  return 0.5 * (largestNegative + smallestOther) < 0 ? -1 : 1;
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
/** Stride of {@link scanSize}'s coarse pass over the candidates. */
const SIZE_STRIDE = 3;
const gridCosts = new Float64Array(SIZE_CANDIDATES);
const gridAmplitudes = new Float64Array(SIZE_CANDIDATES);
/**
 * scanSize's predictions and 1/y, reused from call to call (a scan runs to completion;
 * only their first n entries are read). A model's evaluate reads `points.n`, not the length.
 */
let sizeScratch = { predicted: new Float64Array(64), inverse: new Float64Array(64) };
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
 * evenly in ln s from 1 % to 10× the survey's reach. Deterministic, no randomness; one
 * buffer allocated per call (none per candidate: the catalog's `shape`s write their entries
 * into `out` one by one rather than copy an array literal made for each size).
 *
 * @returns the winning parameter vector with the amplitude filled in
 */
export function scanSize(
  model: FieldModel, points: SurveyPoints, shape: (size: number, out: Float64Array) => void, amplitudeIndex: number, hint?: number,
): Float64Array {
  if (sizeScratch.predicted.length < points.n) sizeScratch = { predicted: new Float64Array(2 * points.n), inverse: new Float64Array(2 * points.n) };
  const { predicted, inverse } = sizeScratch;
  const params = new Float64Array(model.parameters.length);
  // 1/y of the usable readings (0 marks one to skip): products instead of divisions per candidate.
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
  // Coarse to fine over the same grid: every SIZE_STRIDE-th candidate (and the last), then
  // the candidates around the coarse winner. Where the misfit has one valley per grid
  // stride (the coil models' does), the winner is the whole grid's, in a third of the work.
  const costs = gridCosts;
  const amplitudes = gridAmplitudes;
  costs.fill(NaN);
  let coarseBest = -1;
  for (let i = 0; i < SIZE_CANDIDATES; i += i + SIZE_STRIDE < SIZE_CANDIDATES || i === SIZE_CANDIDATES - 1 ? SIZE_STRIDE : SIZE_CANDIDATES - 1 - i) {
    costs[i] = misfit(reach * 0.01 * ratio ** i);
    amplitudes[i] = amplitude;
    if (coarseBest < 0 || costs[i]! < costs[coarseBest]!) coarseBest = i;
  }
  for (let i = Math.max(0, coarseBest - SIZE_STRIDE + 1); i < Math.min(SIZE_CANDIDATES, coarseBest + SIZE_STRIDE); i++) {
    if (!Number.isNaN(costs[i]!)) continue;
    costs[i] = misfit(reach * 0.01 * ratio ** i);
    amplitudes[i] = amplitude;
  }
  // The same choice, in the same order, as a pass over every candidate would make.
  for (let i = 0; i < SIZE_CANDIDATES; i++) {
    const cost = costs[i]!;
    if (cost < bestCost) {
      bestCost = cost;
      bestSize = reach * 0.01 * ratio ** i;
      bestAmplitude = amplitudes[i]!;
    }
  }
  if (hint !== undefined && hint > 0 && Number.isFinite(hint)) consider(hint);
  // Brent's method on ln(size) within one grid step either side, from the best candidate.
  // It returns the point of least misfit it evaluated (the later one on a tie), which is
  // kept with its amplitude here rather than evaluated again.
  let keptLog = NaN;
  let keptCost = bestCost;
  let keptAmplitude = bestAmplitude;
  const refinedLog = brentMinimum((x) => {
    const cost = misfit(Math.exp(x));
    if (cost <= keptCost) {
      keptLog = x;
      keptCost = cost;
      keptAmplitude = amplitude;
    }
    return cost;
  }, Math.log(bestSize / ratio), Math.log(bestSize * ratio), 1e-6, SIZE_REFINE, Math.log(bestSize), bestCost);
  const refined = Math.exp(refinedLog);
  const refinedCost = refinedLog === keptLog ? keptCost : misfit(refined);
  if (refinedCost <= bestCost) {
    bestSize = refined;
    bestAmplitude = refinedLog === keptLog ? keptAmplitude : amplitude;
  }
  const result = new Float64Array(model.parameters.length);
  shape(bestSize, result);
  result[amplitudeIndex] = bestAmplitude;
  return result;
}
