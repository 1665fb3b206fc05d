/** Spare arrays by slot; each grows to the longest length asked for. */
const slots: Float64Array[] = [];

/**
 * A reusable Float64Array of exactly n entries (a view), one per slot: scratch for code
 * that runs to completion without calling itself, so that a batch of fits does not
 * allocate (and collect) arrays of survey length per model. Contents are left over from
 * the last use: write before reading.
 *
 * @param slot 0–9, one per array a caller needs at the same time
 * @example scratchArray(30, 0).length // 30
 */
export function scratchArray(n: number, slot: number): Float64Array {
  if (!(slot >= 0 && slot < 10)) throw new RangeError(`scratchArray: slot ${slot}, expected 0–9`);
  let array = slots[slot];
  if (array === undefined || array.length < n) {
    array = new Float64Array(Math.max(n, 2 * (array?.length ?? 0)));
    slots[slot] = array;
  }
  return array.length === n ? array : array.subarray(0, n);
}
