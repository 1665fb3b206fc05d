/** A point on the drawing, px. */
export type Point = readonly [number, number];

/**
 * A polyline with the points it can do without removed: no point of the original lies
 * farther than `tolerance` from the simplified line (Ramer–Douglas–Peucker: Douglas &
 * Peucker 1973, The Canadian Cartographer 10(2):112–122). The first and last points stay.
 * Contours traced on a grid carry a point per grid cell, most of them on straight runs;
 * at a tolerance under half a pixel the drawing is the same and the path a fraction of it.
 * @example simplifyPolyline([[0, 0], [1, 0.01], [2, 0]], 0.1) // [[0, 0], [2, 0]]
 */
export function simplifyPolyline(points: readonly Point[], tolerance: number): Point[] {
  if (points.length <= 2) return [...points];
  const keep = new Uint8Array(points.length);
  keep[0] = 1;
  keep[points.length - 1] = 1;
  const stack: [number, number][] = [[0, points.length - 1]];
  while (stack.length > 0) {
    const [first, last] = stack.pop()!;
    let farthest = -1;
    let largest = tolerance;
    for (let i = first + 1; i < last; i += 1) {
      const distance = distanceToSegment(points[i]!, points[first]!, points[last]!);
      if (distance > largest) {
        largest = distance;
        farthest = i;
      }
    }
    if (farthest >= 0) {
      keep[farthest] = 1;
      stack.push([first, farthest], [farthest, last]);
    }
  }
  return points.filter((_, i) => keep[i] === 1);
}

/** Distance from p to the segment a–b (to a when a = b). */
function distanceToSegment(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const length2 = dx * dx + dy * dy;
  const t = length2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / length2));
  return Math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy);
}
