import { choleskyFactor, choleskyLogDeterminant } from '../../linalg/cholesky';

/** Candidates and constraints for choosing a design. */
export interface DesignSearch {
  /** Weighted sensitivity rows of every candidate, row-major (sensitivityRows). */
  readonly rows: Float64Array;
  readonly k: number;
  /** Candidate coordinates (distance, radial), m, for the spacing rule. */
  readonly coordinates: readonly (readonly [number, number])[];
  /** Positions to choose. */
  readonly count: number;
  /** Least distance between two chosen positions, m (the probe size). */
  readonly spacing: number;
  /** Free-parameter indices (0..k−1) that matter; the rest are nuisance. */
  readonly interest: readonly number[];
  /** Exchange passes at most. Default 50. */
  readonly maxPasses?: number;
}

/**
 * Choose `count` candidate positions maximising the Ds criterion
 * ln det M − ln det M_nn (M = JᵀWJ of the chosen rows, nn the nuisance block), which
 * minimises the generalised variance of the parameters of interest after the nuisance
 * ones are fitted too (Ds-optimality: Atkinson, Donev & Tobias, Optimum Experimental
 * Designs, with SAS, 2007, ch. 10–11, from memory). Greedy forward selection from a small
 * ridge, then Fedorov-style exchange (swap a chosen point for a candidate while the
 * criterion rises) until no swap helps. Chosen positions keep at least `spacing` apart,
 * since readings closer than the probe size are not independent in practice.
 *
 * @returns candidate indices, sorted by distance; fewer than `count` if the spacing rule runs out of room
 */
export function optimalDesign(search: DesignSearch): number[] {
  const { rows, k, count } = search;
  const candidates = search.coordinates.length;
  const nuisance = [...Array(k).keys()].filter((a) => !search.interest.includes(a));
  const scale = columnScale(rows, k, candidates);
  const criterion = (chosen: readonly number[], ridge: number): number => dsCriterion(rows, k, scale, chosen, nuisance, ridge);
  const fits = (chosen: readonly number[], candidate: number, skip = -1): boolean =>
    chosen.every((c, i) => i === skip || separation(search.coordinates[c]!, search.coordinates[candidate]!) >= search.spacing * (1 - 1e-9));

  const chosen: number[] = [];
  while (chosen.length < count) {
    let best = -1;
    let bestValue = -Infinity;
    for (let c = 0; c < candidates; c += 1) {
      if (!fits(chosen, c)) continue;
      const value = criterion([...chosen, c], 1e-6);
      if (value > bestValue) {
        bestValue = value;
        best = c;
      }
    }
    if (best < 0) break;
    chosen.push(best);
  }
  let current = criterion(chosen, 0);
  for (let pass = 0; pass < (search.maxPasses ?? 50); pass += 1) {
    let improved = false;
    for (let i = 0; i < chosen.length; i += 1) {
      let bestCandidate = -1;
      let bestValue = current;
      for (let c = 0; c < candidates; c += 1) {
        if (chosen.includes(c) || !fits(chosen, c, i)) continue;
        const trial = chosen.slice();
        trial[i] = c;
        const value = criterion(trial, 0);
        if (value > bestValue + 1e-12 * Math.max(1, Math.abs(bestValue))) {
          bestValue = value;
          bestCandidate = c;
        }
      }
      if (bestCandidate >= 0) {
        chosen[i] = bestCandidate;
        current = bestValue;
        improved = true;
      }
    }
    if (!improved) break;
  }
  return chosen.sort((a, b) => search.coordinates[a]![0] - search.coordinates[b]![0] || search.coordinates[a]![1] - search.coordinates[b]![1]);
}

/** Ds criterion on column-scaled rows; −Infinity when singular. */
function dsCriterion(rows: Float64Array, k: number, scale: Float64Array, chosen: readonly number[], nuisance: readonly number[], ridge: number): number {
  const full = new Float64Array(k * k);
  for (const c of chosen) {
    for (let a = 0; a < k; a += 1) {
      const ra = rows[c * k + a]! / scale[a]!;
      for (let b = 0; b < k; b += 1) full[a * k + b]! += ra * (rows[c * k + b]! / scale[b]!);
    }
  }
  for (let a = 0; a < k; a += 1) full[a * k + a]! += ridge;
  const lower = choleskyFactor(full, k, 1e-14);
  if (!lower) return -Infinity;
  let value = choleskyLogDeterminant(lower, k);
  if (nuisance.length > 0) {
    const q = nuisance.length;
    const block = new Float64Array(q * q);
    nuisance.forEach((a, i) => nuisance.forEach((b, j) => { block[i * q + j] = full[a * k + b]!; }));
    const blockLower = choleskyFactor(block, q, 1e-14);
    if (!blockLower) return -Infinity;
    value -= choleskyLogDeterminant(blockLower, q);
  }
  return value;
}

/** Root-mean-square of each column over all candidates (the criterion is scale-invariant up to a constant; this only conditions the ridge). */
function columnScale(rows: Float64Array, k: number, n: number): Float64Array {
  const scale = new Float64Array(k);
  for (let c = 0; c < n; c += 1) for (let a = 0; a < k; a += 1) scale[a]! += rows[c * k + a]! ** 2;
  for (let a = 0; a < k; a += 1) scale[a] = Math.sqrt(scale[a]! / n) || 1;
  return scale;
}

function separation(a: readonly [number, number], b: readonly [number, number]): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1]);
}
