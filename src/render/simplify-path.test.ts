import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { simplifyPolyline, type Point } from './simplify-path';

// distance from p to the segment a–b worked out another way than the code under test: the
// perpendicular distance |(b − a) × (p − a)| / |b − a| when p projects inside the segment,
// else the distance to the nearer end (analytic geometry, any textbook)
function distanceToSegment(p: Point, a: Point, b: Point): number {
  const along = [b[0] - a[0], b[1] - a[1]] as const;
  const length = Math.hypot(along[0], along[1]);
  if (length === 0) return Math.hypot(p[0] - a[0], p[1] - a[1]);
  const projection = ((p[0] - a[0]) * along[0] + (p[1] - a[1]) * along[1]) / length;
  if (projection <= 0) return Math.hypot(p[0] - a[0], p[1] - a[1]);
  if (projection >= length) return Math.hypot(p[0] - b[0], p[1] - b[1]);
  return Math.abs(along[0] * (p[1] - a[1]) - along[1] * (p[0] - a[0])) / length;
}

describe('simplifyPolyline() (Douglas & Peucker 1973)', () => {
  it('keeps the ends and drops the points of a straight run', () => {
    const run: Point[] = Array.from({ length: 50 }, (_, i) => [i, 2 * i + 1]);
    expect(simplifyPolyline(run, 0.25)).toEqual([[0, 1], [49, 99]]);
    expect(simplifyPolyline([[0, 0], [5, 5], [10, 0]], 0.25)).toEqual([[0, 0], [5, 5], [10, 0]]);
  });

  // the defining property: no dropped point lies farther than the tolerance from the simplified line
  it('leaves no original point farther than the tolerance from the result (seeded property)', () => {
    const point = fc.tuple(fc.double({ min: -500, max: 500, noNaN: true }), fc.double({ min: -500, max: 500, noNaN: true }));
    fc.assert(fc.property(fc.array(point, { minLength: 2, maxLength: 200 }), fc.double({ min: 0.01, max: 5, noNaN: true }), (points, tolerance) => {
      const kept = simplifyPolyline(points, tolerance);
      expect(kept[0]).toEqual(points[0]);
      expect(kept[kept.length - 1]).toEqual(points[points.length - 1]);
      // every original point is within tolerance of the kept segment spanning it
      let segment = 0;
      const index = points.map((p) => kept.indexOf(p));
      for (let i = 0; i < points.length; i += 1) {
        if (index[i]! >= 0) { segment = index[i]!; continue; }
        expect(distanceToSegment(points[i]!, kept[segment]!, kept[segment + 1]!)).toBeLessThanOrEqual(tolerance + 1e-9);
      }
    }), { seed: 20261204, numRuns: 300 });
  });
});
