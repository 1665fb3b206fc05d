import { describe, expect, it } from 'vitest';
import { placedLoopByBiotSavart } from '../../test/support/biot-savart';
import { analyseSurvey } from '../core/report/analyse-survey';
import type { Reading, Survey } from '../core/survey/survey';
import { poseView } from './pose-view';

// A loop of 250 A·turns, radius 30 mm, centred at (8, −12, −25) mm, its axis tilted 25° from
// +z towards azimuth −60°, mapped on a 7 × 7 × 3 grid with a triaxial probe: readings by
// direct Biot–Savart integration in the map's frame (test/support/biot-savart.ts).
const degrees = Math.PI / 180;
const tilt = 25 * degrees;
const azimuth = -60 * degrees;
const normal = [Math.sin(tilt) * Math.cos(azimuth), Math.sin(tilt) * Math.sin(azimuth), Math.cos(tilt)] as const;
const centre = [0.008, -0.012, -0.025] as const;
const axis = (from: number, to: number, count: number) => Array.from({ length: count }, (_, i) => from + ((to - from) * i) / (count - 1));
const readings: Reading[] = [];
for (const x of axis(-0.045, 0.045, 7)) for (const y of axis(-0.045, 0.045, 7)) for (const z of [-0.005, 0.01, 0.025]) {
  const b = placedLoopByBiotSavart(250, 0.03, centre, normal, [x, y, z]);
  const components = { x: b[0], y: b[1], z: b[2] };
  readings.push({ line: readings.length + 2, distance: z, radial: Math.hypot(x, y), field: Math.hypot(...b), components, position: { x, y, z }, standardUncertainty: 1e-3 * Math.hypot(...b) + 1e-7 });
}
const survey: Survey = {
  source: 'simulated map', coil: 'MAP-1', date: null, readingType: 'dc', fieldKind: 'components',
  readings, rejected: [], totalRows: readings.length, meta: {}, notes: [], axis: 'map',
};

describe('poseView()', () => {
  const report = analyseSurvey(survey, { fit: { models: ['loop'] }, specs: [], thresholds: [] });
  const figure = poseView(report)!;

  it('states the fitted pose the Biot–Savart map was made with', () => {
    const label = /aria-label="([^"]*)"/.exec(figure.svg.value)![1]!;
    expect(label).toContain('centre at (8.00 mm, -12.0 mm, -25.0 mm)');
    expect(label).toContain('axis tilted 25.0° from +z towards azimuth -60.0°');
  });

  it('draws the readings once per position, the winding in each view and the axis arrow', () => {
    // 147 positions, each drawn in the side and the top view (three components share a position)
    expect(figure.notes[0]).toContain('(147 positions)');
    expect(figure.svg.value.match(/<polygon /g)).toHaveLength(2);
    expect(figure.svg.value.match(/marker-end="url\(#rf-pose-arrow\)"/g)).toHaveLength(2);
  });

  it('draws the winding where the circle of the fitted radius projects: the top view an ellipse of axes 2R and 2R·cos(tilt)', () => {
    // orthographic projection of a circle of radius R onto a plane whose normal makes angle θ
    // with the circle's axis is an ellipse of semi-axes R and R·cos θ (common geometry); its
    // area ratio to the full circle is cos θ: checked with the shoelace formula on the drawn polygon
    const polygons = [...figure.svg.value.matchAll(/<polygon points="([^"]*)"/g)].map((m) => m[1]!.split(' ').map((pair) => pair.split(',').map(Number) as [number, number]));
    const area = (points: readonly [number, number][]) => Math.abs(points.reduce((sum, [x, y], i) => {
      const [nx, ny] = points[(i + 1) % points.length]!;
      return sum + x * ny - nx * y;
    }, 0)) / 2;
    const spread = (points: readonly [number, number][]) => {
      const xs = points.map((p) => p[0]);
      const ys = points.map((p) => p[1]);
      return Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
    };
    const top = polygons[1]!;
    // the longest extent is at least the major axis' projection on a pixel axis; the area ratio to π(major/2)² is cos θ,
    // read with the major axis taken from the polygon's farthest pair of points
    let major = 0;
    for (const a of top) for (const b of top) major = Math.max(major, Math.hypot(a[0] - b[0], a[1] - b[1]));
    expect(spread(top)).toBeLessThanOrEqual(major + 1e-9);
    expect(Math.abs(area(top) / (Math.PI * (major / 2) ** 2) - Math.cos(tilt))).toBeLessThan(0.01);
  });

  it('is null for a survey that is not a map', () => {
    const { axis: _map, ...plain } = report;
    expect(poseView(plain)).toBeNull();
  });
});
