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

/**
 * Starting values for a coil model with one amplitude (linear) and one overall size: for
 * each candidate size s, `shape(s)` gives a parameter vector with amplitude 1, the model
 * predicts the survey, the amplitude A that best matches the readings in relative terms
 * is solved in closed form, A = Σ(f/y)/Σ(f²/y²) (minimising Σ(1 − A f/y)²), and the size
 * with the least misfit wins; then a golden-section search on ln s refines it. Candidates:
 * `hint` (e.g. the half-value estimate of DOMAIN.md §1.1) and 48 sizes spaced evenly in
 * ln s from 1 % to 10× the survey's reach. Deterministic, no randomness.
 *
 * @returns the winning parameter vector with the amplitude filled in
 */
export function scanSize(
  model: FieldModel, points: SurveyPoints, shape: (size: number) => Float64Array, amplitudeIndex: number, hint?: number,
): Float64Array {
  const predicted = new Float64Array(points.n);
  const misfit = (size: number): { cost: number; amplitude: number } => {
    model.evaluate(shape(size), points, predicted);
    let numerator = 0;
    let denominator = 0;
    for (let i = 0; i < points.n; i++) {
      const y = points.field[i]!;
      const f = predicted[i]!;
      if (y === 0 || !Number.isFinite(y) || !Number.isFinite(f)) continue;
      numerator += f / y;
      denominator += (f * f) / (y * y);
    }
    if (!(denominator > 0)) return { cost: Infinity, amplitude: 1 };
    const amplitude = numerator / denominator;
    let cost = 0;
    for (let i = 0; i < points.n; i++) {
      const y = points.field[i]!;
      const f = predicted[i]!;
      if (y === 0 || !Number.isFinite(y) || !Number.isFinite(f)) continue;
      cost += (1 - (amplitude * f) / y) ** 2;
    }
    return { cost, amplitude };
  };
  const reach = surveyReach(points);
  let bestSize = reach;
  let best = misfit(reach);
  const candidates: number[] = [];
  for (let i = 0; i < 48; i++) candidates.push(reach * 0.01 * 1000 ** (i / 47));
  if (hint !== undefined && hint > 0 && Number.isFinite(hint)) candidates.push(hint);
  for (const size of candidates) {
    const trial = misfit(size);
    if (trial.cost < best.cost) {
      best = trial;
      bestSize = size;
    }
  }
  // golden-section search on ln(size) within one grid step either side
  const ratio = 1000 ** (1 / 47);
  let lo = Math.log(bestSize / ratio);
  let hi = Math.log(bestSize * ratio);
  const golden = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 30; i++) {
    const left = hi - golden * (hi - lo);
    const right = lo + golden * (hi - lo);
    if (misfit(Math.exp(left)).cost <= misfit(Math.exp(right)).cost) hi = right;
    else lo = left;
  }
  const refined = Math.exp(0.5 * (lo + hi));
  const final = misfit(refined);
  const size = final.cost <= best.cost ? refined : bestSize;
  const params = shape(size);
  params[amplitudeIndex] = final.cost <= best.cost ? final.amplitude : best.amplitude;
  return params;
}
