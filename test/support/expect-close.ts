import { expect } from 'vitest';

/**
 * Assert |actual − expected| ≤ abs + rel·|expected|. On failure the message shows
 * both values, the difference and the relative difference. No rounding before comparing.
 */
export function expectClose(
  actual: number,
  expected: number,
  tolerance: { rel?: number; abs?: number } = { rel: 1e-12 },
  label = '',
): void {
  const rel = tolerance.rel ?? 0;
  const abs = tolerance.abs ?? 0;
  const difference = actual - expected;
  const allowed = abs + rel * Math.abs(expected);
  const ok = Number.isFinite(actual) && Math.abs(difference) <= allowed;
  if (!ok) {
    const relative = expected === 0 ? Infinity : difference / Math.abs(expected);
    expect.fail(
      `${label ? label + ': ' : ''}expected ${expected} got ${actual} ` +
        `(difference ${difference.toExponential(3)}, relative ${relative.toExponential(3)}, ` +
        `allowed rel ${rel} abs ${abs})`,
    );
  }
  expect(ok).toBe(true);
}
