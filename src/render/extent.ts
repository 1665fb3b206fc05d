/**
 * Smallest and largest of many numbers by a plain loop: `Math.min(...values)` passes
 * every value as an argument and overflows the call stack beyond ~100,000 readings.
 * Empty input gives +Infinity / −Infinity, as Math.min() / Math.max() do.
 * @example largest([3, 9, 4]) // 9
 */
export function largest(values: Iterable<number>): number {
  let result = Number.NEGATIVE_INFINITY;
  for (const value of values) if (value > result) result = value;
  return result;
}

/** Smallest of many numbers (see `largest`). @example smallest([3, 9, 4]) // 3 */
export function smallest(values: Iterable<number>): number {
  let result = Number.POSITIVE_INFINITY;
  for (const value of values) if (value < result) result = value;
  return result;
}
