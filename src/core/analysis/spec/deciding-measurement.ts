import type { QuantityKind } from '../../units';
import { valueWords, type ValueWords } from '../describe-value';
import type { FittedModel } from '../fitted-model';
import { noiseFromFit } from '../noise-from-fit';
import { sensitivityRows } from '../plan/design-problem';

/** The quantity an inconclusive check is about, and how narrow its interval must get. */
export interface DecisionTarget {
  /** ∂quantity/∂θ over every model parameter (model order). */
  readonly gradient: ArrayLike<number>;
  /** 95 % half-width the interval must shrink to, SI. */
  readonly neededHalfWidth: number;
  /** For the sentence: "the radius interval". */
  readonly words: string;
  readonly kind: QuantityKind | null;
}

const candidateCount = 80;

/**
 * One sentence saying what measurement would decide an inconclusive check: how many more
 * readings, and where, would shrink its 95 % interval enough. Readings are added greedily
 * where each one cuts the variance most, by the rank-one update
 * C ← C − (C·g)(C·g)ᵀ/(1 + gᵀ·C·g) of the covariance for a new weighted sensitivity row g
 * (Sherman–Morrison; the sequential design idea of Atkinson, Donev & Tobias 2007, ch. 11,
 * from memory), at on-axis distances from 0 to 1.5× the farthest reading, each as
 * precise as the survey's own readings (noiseFromFit). Stops at 4× the survey's size.
 */
export function decidingMeasurement(fitted: FittedModel, target: DecisionTarget, shown: ValueWords = valueWords()): string {
  const k = fitted.freeIndex.length;
  const coverage = fitted.coverageFactor;
  if (fitted.covariance === null || coverage === null || k === 0) return 'Free the parameters in the fit so that it reports intervals.';
  const covariance = Float64Array.from(fitted.covariance);
  const u = fitted.freeIndex.map((j) => target.gradient[j]!);
  let farthest = 1e-3;
  for (const point of fitted.fit.points) farthest = Math.max(farthest, point.distance);
  const candidates = Array.from({ length: candidateCount }, (_, i) => ({ distance: (1.5 * farthest * i) / (candidateCount - 1), radial: 0 }));
  const noise = noiseFromFit(fitted.fit);
  if (!(noise.relative > 0 || noise.absolute > 0)) return 'The fit gives no reading uncertainty to plan further readings with; give the meter\'s accuracy (--uncertainty).';
  const rows = sensitivityRows({ model: fitted.point.model, values: fitted.values, free: fitted.freeIndex, noise }, candidates);
  const budget = Math.max(10, 4 * fitted.fit.stats.n);
  const halfWidth = () => coverage * Math.sqrt(Math.max(0, quadratic(covariance, u, u, k)));
  const chosen: number[] = [];
  const cg = new Float64Array(k);
  while (halfWidth() > target.neededHalfWidth && chosen.length < budget) {
    let best = -1;
    let bestGain = 0;
    for (let c = 0; c < candidateCount; c += 1) {
      const g = rows.subarray(c * k, c * k + k);
      const gain = quadratic(covariance, u, g, k) ** 2 / (1 + quadratic(covariance, g, g, k));
      if (gain > bestGain) {
        bestGain = gain;
        best = c;
      }
    }
    if (best < 0) break;
    const g = rows.subarray(best * k, best * k + k);
    for (let a = 0; a < k; a += 1) {
      let sum = 0;
      for (let b = 0; b < k; b += 1) sum += covariance[a * k + b]! * g[b]!;
      cg[a] = sum;
    }
    const denominator = 1 + quadratic(covariance, g, g, k);
    for (let a = 0; a < k; a += 1) for (let b = 0; b < k; b += 1) covariance[a * k + b] = covariance[a * k + b]! - (cg[a]! * cg[b]!) / denominator;
    chosen.push(best);
  }
  const reached = halfWidth();
  const needed = `±${shown.value(target.neededHalfWidth, target.kind)}`;
  if (reached > target.neededHalfWidth) {
    return `Even ${chosen.length} more readings as precise as these would only shrink ${target.words} to ±${shown.value(reached, target.kind)} (${needed} needed): reduce the reading uncertainty — a positioning jig near the steep part of the curve, a better meter — rather than add points.`;
  }
  // Where most of them go: the middle half of the chosen distances.
  const distances = chosen.map((c) => candidates[c]!.distance).sort((a, b) => a - b);
  const low = distances[Math.floor((distances.length - 1) / 4)]!;
  const high = distances[Math.ceil((3 * (distances.length - 1)) / 4)]!;
  const where = high - low <= 0.1 * high
    ? `near ${shown.value((low + high) / 2, 'length', null, 2)}`
    : `${distances.length >= 4 ? 'mostly ' : ''}between ${shown.value(low, 'length', null, 2)} and ${shown.value(high, 'length', null, 2)}`;
  return `About ${chosen.length} more on-axis reading${chosen.length === 1 ? '' : 's'} ${where}, as precise as these, would shrink ${target.words} to ±${shown.value(reached, target.kind)} (${needed} decides it).`;
}

function quadratic(matrix: Float64Array, x: ArrayLike<number>, y: ArrayLike<number>, k: number): number {
  let sum = 0;
  for (let a = 0; a < k; a += 1) {
    if (x[a] === 0) continue;
    for (let b = 0; b < k; b += 1) sum += x[a]! * matrix[a * k + b]! * y[b]!;
  }
  return sum;
}
