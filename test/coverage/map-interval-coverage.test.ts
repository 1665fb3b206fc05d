import { describe, expect, it } from 'vitest';
import { fitSurvey } from '../../src/core/fit/strategy/fit-survey';
import { evenlySpaced } from '../../src/core/fit/testing/simulated-survey';
import { mulberry32, normalRandom } from '../../src/core/random';
import type { Reading, Survey } from '../../src/core/survey/survey';
import { loopByBiotSavart, placedLoopByBiotSavart } from '../support/biot-savart';

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

/**
 * Honest intervals on transverse scans: 400 scans across a 40 mm loop of 300 ampere-turns
 * at two heights (10 and 25 mm from the winding plane, 17 lateral positions each, the
 * lateral ruler's zero 13.7 mm from the axis), |B| by direct Biot–Savart integration
 * (test/support/biot-savart.ts loopByBiotSavart), seeded Gaussian noise of 1 % + 1 µT
 * stated per reading. The share of 95 % intervals containing the true ampere-turns and
 * lateral centre must lie in 92–98 % (about ±2.7 binomial SD for 400 scans).
 */
describe('95 % intervals of a transverse-scan fit cover the truth', () => {
  it('transverse scans of a loop: the intervals of ampereTurns and lateralCentre contain the truth in 92–98 % of 400 scans', () => {
    const across = evenlySpaced(-0.06, 0.06, 17);
    const rows = [0.01, 0.025].flatMap((d) => across.map((x) => ({ d, x, b: Math.hypot(...loopByBiotSavart(300, 0.04, d + 0.002, Math.abs(x - 0.0137))) })));
    const scans = 400;
    const hits = { ampereTurns: 0, lateralCentre: 0 };
    const truthOf = { ampereTurns: 300, lateralCentre: 0.0137 };
    for (let s = 0; s < scans; s++) {
      const gaussian = normalRandom(mulberry32(52000 + s));
      const readings: Reading[] = rows.map(({ d, x, b }, i) => {
        const sigma = 0.01 * b + 1e-6;
        return { line: i + 2, distance: d, radial: x, field: b + sigma * gaussian(), standardUncertainty: sigma };
      });
      const survey: Survey = {
        source: `transverse ${s}`, coil: null, date: null, readingType: 'dc', fieldKind: 'magnitude', readings, rejected: [],
        totalRows: readings.length, meta: {}, notes: [], lateral: 'position',
      };
      const [fit] = fitSurvey(survey, { models: ['loop'], starts: 1, seed: s });
      expect(fit!.converged).toBe(true);
      for (const name of ['ampereTurns', 'lateralCentre'] as const) {
        const interval = fit!.params[name]!.ci95;
        if (interval !== null && interval[0] <= truthOf[name] && truthOf[name] <= interval[1]) hits[name] += 1;
      }
    }
    const shares = { ampereTurns: hits.ampereTurns / scans, lateralCentre: hits.lateralCentre / scans };
    console.log(`coverage, transverse scans: ${JSON.stringify(shares)}`);
    // nominal 95 %; 92–98 % is about ±2.7 binomial SD for 400 scans (see above)
    for (const share of Object.values(shares)) {
      expect(share).toBeGreaterThanOrEqual(0.92);
      expect(share).toBeLessThanOrEqual(0.98);
    }
  }, 240_000);
});
