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
