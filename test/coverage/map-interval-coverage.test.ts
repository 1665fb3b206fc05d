import { describe, expect, it } from 'vitest';
import { fitSurvey } from '../../src/core/fit/fit-survey';
import { evenlySpaced } from '../../src/core/fit/testing/simulated-survey';
import { mulberry32, normalRandom } from '../../src/core/random';
import type { Reading, Survey } from '../../src/core/survey/survey';
import { placedLoopByBiotSavart } from '../support/biot-savart';

/**
 * Honest intervals on 3-D maps: 400 small vector maps (5 × 5 × 2 readings of Bx, By, Bz)
 * of a loop tilted 25° towards azimuth −60°, its centre off the map's origin, the true
 * field by direct Biot–Savart integration in the map's frame (test/support/biot-savart.ts
 * placedLoopByBiotSavart, independent of src/core/physics and of the pose code), plus
 * seeded Gaussian noise of 1 % of |B| + 0.5 µT stated per component. The share of 95 %
 * intervals containing the true ampere-turns and each centre coordinate must lie in
 * 92–98 % (binomial SD at 95 % for 400 maps is 1.1 %, so the band is about ±2.7 SD).
 */
const degrees = Math.PI / 180;
const tilt = 25 * degrees;
const azimuth = -60 * degrees;
const truth: Readonly<Record<string, number>> = { ampereTurns: 250, centreX: 0.0083, centreY: -0.0121, centreZ: -0.025 };
const normal: [number, number, number] = [Math.sin(tilt) * Math.cos(azimuth), Math.sin(tilt) * Math.sin(azimuth), Math.cos(tilt)];
const positions: [number, number, number][] = [];
for (const x of evenlySpaced(-0.04, 0.04, 5)) for (const y of evenlySpaced(-0.04, 0.04, 5)) for (const z of [0, 0.02]) positions.push([x, y, z]);
const clean = positions.map((p) => placedLoopByBiotSavart(250, 0.03, [truth['centreX']!, truth['centreY']!, truth['centreZ']!], normal, p));
const maps = 400;

describe('95 % intervals of a 3-D map fit cover the truth', () => {
  it('vector maps of a tilted loop: the intervals of ampereTurns, centreX, centreY and centreZ contain the truth in 92–98 % of 400 maps', () => {
    const hits: Record<string, number> = Object.fromEntries(Object.keys(truth).map((name) => [name, 0]));
    for (let s = 0; s < maps; s++) {
      const gaussian = normalRandom(mulberry32(31000 + s));
      const readings: Reading[] = clean.map((b, i) => {
        const sigma = 0.01 * Math.hypot(...b) + 5e-7;
        const components = { x: b[0] + sigma * gaussian(), y: b[1] + sigma * gaussian(), z: b[2] + sigma * gaussian() };
        const [x, y, z] = positions[i]!;
        return { line: i + 2, distance: z, radial: Math.hypot(x, y), field: Math.hypot(components.x, components.y, components.z), components, position: { x, y, z }, standardUncertainty: sigma };
      });
      const survey: Survey = {
        source: `map ${s}`, coil: null, date: null, readingType: 'dc', fieldKind: 'components', readings, rejected: [],
        totalRows: readings.length, meta: {}, notes: [], axis: 'map',
      };
      const [fit] = fitSurvey(survey, { models: ['loop'], starts: 1, seed: s });
      expect(fit!.converged).toBe(true);
      for (const name of Object.keys(hits)) {
        const interval = fit!.params[name]!.ci95;
        if (interval !== null && interval[0] <= truth[name]! && truth[name]! <= interval[1]) hits[name]! += 1;
      }
    }
    const shares = Object.fromEntries(Object.entries(hits).map(([name, count]) => [name, count / maps]));
    console.log(`coverage, vector maps: ${JSON.stringify(shares)}`);
    // nominal 95 %; 92–98 % is about ±2.7 binomial SD for 400 maps (see above)
    for (const name of Object.keys(truth)) {
      expect(shares[name]!, name).toBeGreaterThanOrEqual(0.92);
      expect(shares[name]!, name).toBeLessThanOrEqual(0.98);
    }
  }, 240_000);
});
