/** medianOf's copy of the finite values, reused from call to call (grown when short): sorted in place, only its first `count` entries read. */
let medianScratch = new Float64Array(64);

/** Median of the finite values (NaN when there are none). */
export function medianOf(values: ArrayLike<number>): number {
  if (medianScratch.length < values.length) medianScratch = new Float64Array(2 * values.length);
  const finite = medianScratch;
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

/** Sample quantile by linear interpolation between order statistics (Hyndman & Fan 1996, type 7). */
export function sampleQuantile(sorted: readonly number[], probability: number): number {
  const position = (sorted.length - 1) * probability;
  const below = Math.floor(position);
  const above = Math.min(sorted.length - 1, below + 1);
  return sorted[below]! + (position - below) * (sorted[above]! - sorted[below]!);
}
