import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { simplifyPolyline, type Point } from './simplify-path';

function distanceToSegment(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const length2 = dx * dx + dy * dy;
  const t = length2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / length2));
  return Math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy);
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
