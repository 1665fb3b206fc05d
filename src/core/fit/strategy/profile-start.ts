import type { FieldModel, SurveyPoints } from '../../models/field-model';
import { radialDistance } from '../../models/initial-guess';
import { brentMinimum } from '../../numeric/brent-minimum';
import { scratchArray } from './scratch-array';

/** Offsets tried: nearest sensing point at this many log-spaced distances from the datum. */
const GRID = 10;
/** Most evaluations refining the best grid offset between its neighbours (Brent's method to 0.1 % of d + δ). */
const REFINE = 8;
/** Most evaluations settling a free exponent on [n/2, 2n] at the chosen offset (Brent's method to 0.1 % of n). */
const EXPONENT_REFINE = 10;

/** A start refined by {@link profileStart}. */
export interface ProfileStart {
  /** Parameters (model order, SI): scanned probe offset, amplitude and background solved, exponent re-read. */
  readonly initial: Float64Array;
  /**
   * True when the start came from a search of the nonlinear direction that matters: the
   * offset was scanned (scannedRange), or every free parameter is linear (amplitude,
   * background) and was solved exactly.
   */
  readonly scanned: boolean;
  /** Model index of the probe offset when the scan's best offset is on a bound of the box, else −1. */
  readonly offsetOnBound: number;
  /** Model index of the parameter that was scanned (the probe offset), else −1. */
  readonly scannedIndex: number;
  /** The offsets the scan covered, [first, last] (m); empty when none was scanned. */
  readonly scannedRange: readonly number[];
  /** Weighted χ² at `initial`. */
  readonly chiSquare: number;
}

/**
 * Refine a data-driven start by a profile scan over the probe offset δ (variable
 * projection, Golub & Pereyra, SIAM J. Numer. Anal. 10 (1973) 413): every catalog model's
 * reading is A·g(d + δ; shape) + b with the amplitude A and background b entering
 * linearly, so for each trial δ they are solved exactly by weighted linear least squares
 * (a 2×2 system; an offset where A would take the other sign than the start's, or where
 * the shape cannot be told from a constant, is passed over) and only δ is searched, over
 * the box in front of the nearest reading: the nearest sensing point at 10 log-spaced
 * distances from 0.2 % of the survey's reach out to the box's upper offset, then Brent's
 * method between the best one's neighbours. A free power-law exponent is re-read at each
 * δ as the log–log slope of |B| against d + δ (DOMAIN.md §1.9), then settled by Brent's
 * method on [n/2, 2n] at the chosen δ (the slope ignores the background). The misfit of a
 * model that does not describe the coil (a dipole or power law in the near field) often
 * has its minimum far from the start's offset; other shape parameters (radius, lengths)
 * stay as the model's initialGuess set them. Deterministic, same weights as the fit
 * (1/σ², or 1). Returns the start unchanged (scanned false) when nothing applies, and
 * never a start worse than the one given.
 *
 * @param sigma σᵢ (T) or null for equal weights; lower, upper the fit's box (model order);
 *   predicted the model's prediction at `start` when the caller has it (saves evaluating it again).
 */
export function profileStart(
  model: FieldModel,
  points: SurveyPoints,
  start: Float64Array,
  fixed: readonly boolean[],
  lower: readonly number[],
  upper: readonly number[],
  sigma: ArrayLike<number> | null,
  predicted: ArrayLike<number> | null = null,
): ProfileStart {
  const specs = model.parameters;
  // Every catalog model's reading is linear in its amplitude (Biot–Savart is linear in the current).
  const amplitude = specs.findIndex((p) => p.role === 'amplitude');
  const background = specs.findIndex((p) => p.role === 'background');
  const offset = specs.findIndex((p) => p.role === 'offset');
  const exponent = specs.findIndex((p) => p.role === 'exponent');
  const n = points.n;
  const shape = scratchArray(n, 0);
  const trial = start.slice();
  const freeAmplitude = amplitude >= 0 && !fixed[amplitude];
  const freeBackground = background >= 0 && !fixed[background];
  const freeExponent = exponent >= 0 && !fixed[exponent];
  const sign = amplitude >= 0 && start[amplitude]! < 0 ? -1 : 1;
  if (predicted === null) model.evaluate(start, points, shape);
  const honest = chiSquareOf(points, predicted ?? shape, sigma);
  const freeOffset = offset >= 0 && !fixed[offset] && lower[offset]! < upper[offset]!;
  if (!freeOffset && !freeAmplitude && !freeBackground) return { initial: start, scanned: false, offsetOnBound: -1, scannedIndex: -1, scannedRange: [], chiSquare: honest };

  // ln|B| for the log–log slope, read only when the exponent is free.
  const logField = scratchArray(n, 1);
  if (freeExponent) for (let i = 0; i < n; i++) logField[i] = Math.log(Math.abs(points.field[i]!));
  // The weights 1/σ², worked out once for every offset tried.
  const weights = scratchArray(n, 2);
  for (let i = 0; i < n; i++) {
    const s = sigma === null ? 1 : sigma[i]!;
    weights[i] = 1 / (s * s);
  }
  // A model that reads the points only through r(δ) (sourceDistances): r and ln r are worked
  // out once per offset tried, for the log–log slope and for every exponent tried there.
  const distances = freeExponent && offset >= 0 ? SourceDistances.of(model, points) : null;
  const best = start.slice();
  let bestCost = Infinity;
  /** χ² at offset δ with A, b solved and the exponent given or re-read; the winner is copied to best. */
  const profile = (delta: number, power?: number): number => {
    trial.set(start);
    if (offset >= 0) trial[offset] = delta;
    if (freeExponent) {
      const slope = power !== undefined
        ? -power
        : logLogSlope(points, logField, offset >= 0 ? delta : 0, distances === null ? null : distances.at(delta));
      if (slope < 0 && -slope < upper[exponent]!) trial[exponent] = -slope;
    }
    const cost = solveLinear(model, points, distances === null ? null : distances.at(trial[offset]!), trial, shape, sigma, weights, amplitude, background, freeAmplitude, freeBackground, sign);
    if (cost < bestCost) {
      bestCost = cost;
      best.set(trial);
    }
    return cost;
  };
  profile(offset >= 0 ? start[offset]! : 0);
  let onBound = -1;
  let range: number[] = [];
  if (freeOffset) {
    let nearest = Infinity;
    let reach = 0;
    for (let i = 0; i < n; i++) {
      nearest = Math.min(nearest, points.distance[i]!);
      reach = Math.max(reach, radialDistance(points.distance[i]!, points.radial[i]!));
    }
    const lo = lower[offset]!;
    const hi = upper[offset]!;
    const closest = 0.002 * (reach > 0 ? reach : 0.05);
    const first = Math.log(closest);
    const last = Math.log(Math.max(nearest + Math.min(hi, reach > 0 ? reach : 0.05), closest * 1.01));
    const grid: number[] = [];
    for (let g = 0; g < GRID; g++) grid.push(Math.min(hi, Math.max(lo, Math.exp(first + (g * (last - first)) / (GRID - 1)) - nearest)));
    range = [grid[0]!, grid[GRID - 1]!];
    let bestIndex = -1;
    let gridCost = Infinity;
    for (let g = 0; g < GRID; g++) {
      const cost = profile(grid[g]!);
      if (cost < gridCost) {
        gridCost = cost;
        bestIndex = g;
      }
    }
    if (bestIndex >= 0 && Number.isFinite(gridCost)) {
      const left = grid[Math.max(0, bestIndex - 1)]!;
      const right = grid[Math.min(grid.length - 1, bestIndex + 1)]!;
      brentMinimum(profile, left, right, 1e-3 * (right - left), REFINE, grid[bestIndex]!, gridCost);
    }
    // Within rounding of an edge (exp and log of the grid): put it on the edge.
    const width = 1e-9 * (Number.isFinite(hi - lo) ? hi - lo : Math.abs(best[offset]!) + 1);
    if (best[offset]! >= hi - width) best[offset] = hi;
    if (best[offset]! <= lo + width) best[offset] = lo;
    if (best[offset] === hi || best[offset] === lo) onBound = offset;
  }
  if (freeExponent && Number.isFinite(bestCost)) {
    // The log–log slope ignores the background: settle the exponent itself at the chosen offset.
    const delta = offset >= 0 ? best[offset]! : 0;
    const power = best[exponent]!;
    bestCost = Infinity;
    const atPower = profile(delta, power);
    brentMinimum((x) => profile(delta, x), Math.max(lower[exponent]!, 0.5 * power), Math.min(upper[exponent]!, 2 * power), 1e-3 * power, EXPONENT_REFINE, power, atPower);
  }
  if (!Number.isFinite(bestCost)) return { initial: start, scanned: false, offsetOnBound: -1, scannedIndex: -1, scannedRange: [], chiSquare: honest };
  // The linear solve assumed the reading is linear in A for A of the start's sign; check with the model itself.
  const cost = chiSquareAt(model, points, best, shape, sigma);
  if (!(cost <= honest)) return { initial: start, scanned: false, offsetOnBound: -1, scannedIndex: -1, scannedRange: [], chiSquare: honest };
  const onlyLinear = fixed.every((f, j) => f || j === amplitude || j === background);
  return { initial: best, scanned: freeOffset || onlyLinear, offsetOnBound: onBound, scannedIndex: freeOffset ? offset : -1, scannedRange: range, chiSquare: cost };
}

/** The points' r and ln r at one probe offset (FieldModel.sourceDistances), worked out again only when the offset changes. */
class SourceDistances {
  readonly r: Float64Array;
  readonly logR: Float64Array;
  private offset = NaN;

  private constructor(private readonly model: FieldModel, private readonly points: SurveyPoints) {
    this.r = scratchArray(points.n, 8);
    this.logR = scratchArray(points.n, 9);
  }

  /** A cache for `model`, or null when it has no sourceDistances and evaluateAtDistances. */
  static of(model: FieldModel, points: SurveyPoints): SourceDistances | null {
    return model.sourceDistances !== undefined && model.evaluateAtDistances !== undefined ? new SourceDistances(model, points) : null;
  }

  /** r and ln r at offset δ. */
  at(delta: number): SourceDistances {
    if (delta !== this.offset) {
      this.model.sourceDistances!(delta, this.points, this.r, this.logR);
      this.offset = delta;
    }
    return this;
  }
}

/** Weighted χ² of the model at θ (Infinity when any prediction is not finite). `out` is scratch. */
function chiSquareAt(model: FieldModel, points: SurveyPoints, theta: Float64Array, out: Float64Array, sigma: ArrayLike<number> | null): number {
  model.evaluate(theta, points, out);
  return chiSquareOf(points, out, sigma);
}

/** Weighted χ² of a prediction (Infinity when any entry is not finite). */
function chiSquareOf(points: SurveyPoints, out: ArrayLike<number>, sigma: ArrayLike<number> | null): number {
  let sum = 0;
  for (let i = 0; i < points.n; i++) {
    const r = (points.field[i]! - out[i]!) / (sigma === null ? 1 : sigma[i]!);
    sum += r * r;
  }
  return Number.isFinite(sum) ? sum : Infinity;
}

/**
 * OLS slope of ln|B| on ln(d + δ) over the points where both are finite (NaN with fewer
 * than two). With `at`, the points' r and ln r at δ (FieldModel.sourceDistances) are read
 * instead of worked out: on the axis that r is the signed d + δ where this takes |d + δ|,
 * so a point behind the datum (r < 0) is left out then, which changes nothing: the model
 * gives NaN there, so the trial costs Infinity whatever its exponent.
 */
function logLogSlope(points: SurveyPoints, logField: Float64Array, delta: number, at: { readonly r: Float64Array; readonly logR: Float64Array } | null): number {
  let count = 0;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < points.n; i++) {
    const y = logField[i]!;
    let x: number;
    if (at === null) {
      const r = radialDistance(points.distance[i]! + delta, points.radial[i]!);
      if (!(r > 0) || !Number.isFinite(y)) continue;
      x = Math.log(r);
    } else {
      if (!(at.r[i]! > 0) || !Number.isFinite(y)) continue;
      x = at.logR[i]!;
    }
    count += 1;
    sx += x;
    sy += y;
    sxx += x * x;
    sxy += x * y;
  }
  const spread = count * sxx - sx * sx;
  return count >= 2 && spread > 0 ? (count * sxy - sx * sy) / spread : NaN;
}

/**
 * Weighted least-squares amplitude A and background b for the shape at θ, written into θ;
 * returns χ². The shape comes from the model's evaluate, or from evaluateAtDistances given the points' r and ln r at θ's offset (`distances`). `weights` holds 1/σᵢ² (1 when sigma is null). The shape is the model at θ with A = 1 (or the fixed A) and b = 0 (or the fixed b).
 */
function solveLinear(
  model: FieldModel, points: SurveyPoints, distances: { readonly r: Float64Array; readonly logR: Float64Array } | null, theta: Float64Array, shape: Float64Array, sigma: ArrayLike<number> | null, weights: Float64Array,
  amplitude: number, background: number, freeAmplitude: boolean, freeBackground: boolean, sign: number,
): number {
  if (freeAmplitude) theta[amplitude] = 1;
  const fixedBackground = background >= 0 ? theta[background]! : 0;
  if (background >= 0) theta[background] = 0;
  if (distances === null) model.evaluate(theta, points, shape);
  else model.evaluateAtDistances!(theta, distances.r, distances.logR, shape);
  let sw = 0;
  let sg = 0;
  let sy = 0;
  let sgg = 0;
  let sgy = 0;
  const level = freeBackground ? 0 : fixedBackground;
  if (sigma === null) {
    // Every weight is 1/1² = 1: the products by it left out (1·x is x, so the sums are the same).
    for (let i = 0; i < points.n; i++) {
      const g = shape[i]!;
      if (!Number.isFinite(g)) return Infinity;
      const y = points.field[i]! - level;
      sw += 1;
      sg += g;
      sy += y;
      sgg += g * g;
      sgy += g * y;
    }
  } else {
    for (let i = 0; i < points.n; i++) {
      const g = shape[i]!;
      if (!Number.isFinite(g)) return Infinity;
      const w = weights[i]!;
      const y = points.field[i]! - level;
      sw += w;
      sg += w * g;
      sy += w * y;
      sgg += w * g * g;
      sgy += w * g * y;
    }
  }
  let a = 1;
  let b = freeBackground ? 0 : fixedBackground;
  if (freeAmplitude && freeBackground) {
    const mg = sg / sw;
    const my = sy / sw;
    const vgg = sgg - sw * mg * mg;
    // A shape that barely varies over the readings cannot be told from the background.
    if (!(vgg > 1e-12 * sgg)) return Infinity;
    a = (sgy - sw * mg * my) / vgg;
    b = my - a * mg;
  } else if (freeAmplitude) {
    if (!(sgg > 0)) return Infinity;
    a = sgy / sgg;
  } else if (freeBackground) {
    b = (sy - sg) / sw;
  }
  // An amplitude of the other sign (or 0) is no start: a magnitude reading cannot follow it.
  if (freeAmplitude && !(a * sign > 0)) return Infinity;
  if (freeAmplitude) theta[amplitude] = a;
  if (background >= 0) theta[background] = b;
  let chi = 0;
  if (sigma === null) {
    // the division by σ = 1 left out (x / 1 is x)
    for (let i = 0; i < points.n; i++) {
      const r = points.field[i]! - a * shape[i]! - b;
      chi += r * r;
    }
    return chi;
  }
  for (let i = 0; i < points.n; i++) {
    const r = (points.field[i]! - a * shape[i]! - b) / sigma[i]!;
    chi += r * r;
  }
  return chi;
}
