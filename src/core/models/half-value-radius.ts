import type { SurveyPoints } from './field-model';

/**
 * Loop radius from where the readings fall to half their value at the nearest point
 * (DOMAIN.md §1.1): on axis B ∝ (R² + z²)^(−3/2), so B(z½) = B(z₀)/2 gives
 * R² = (z½² − 2^(2/3) z₀²)/(2^(2/3) − 1); with z₀ = 0 this is z½ = 0.7664 R. z½ is found by
 * linear interpolation of |B| between neighbouring distances (points sorted by distance,
 * radial offsets ignored). Returns undefined when the readings never halve or the
 * estimate is not positive. SI: m.
 *
 * @example halfValueRadius(points measured from 0 to 0.2 m of a 0.05 m loop) // ≈ 0.05
 */
export function halfValueRadius(points: SurveyPoints): number | undefined {
  const order: number[] = [];
  let sorted = true;
  for (let i = 0; i < points.n; i++) {
    if (!Number.isFinite(points.distance[i]!) || !Number.isFinite(points.field[i]!)) continue;
    if (order.length > 0 && points.distance[i]! < points.distance[order[order.length - 1]!]!) sorted = false;
    order.push(i);
  }
  // A survey usually comes in order of distance; the sort is stable, so it would change nothing then.
  if (!sorted) order.sort((i, j) => points.distance[i]! - points.distance[j]!);
  if (order.length < 2) return undefined;
  const nearest = order[0]!;
  const z0 = points.distance[nearest]!;
  const half = 0.5 * Math.abs(points.field[nearest]!);
  for (let k = 1; k < order.length; k++) {
    const before = Math.abs(points.field[order[k - 1]!]!);
    const after = Math.abs(points.field[order[k]!]!);
    if (after <= half && before > half) {
      const d0 = points.distance[order[k - 1]!]!;
      const d1 = points.distance[order[k]!]!;
      const zHalf = d0 + ((before - half) / (before - after)) * (d1 - d0);
      const factor = 2 ** (2 / 3);
      const radius2 = (zHalf * zHalf - factor * z0 * z0) / (factor - 1);
      return radius2 > 0 ? Math.sqrt(radius2) : undefined;
    }
  }
  return undefined;
}
