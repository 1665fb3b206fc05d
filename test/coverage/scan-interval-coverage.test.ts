import { describe, expect, it } from 'vitest';
import { fitSurvey } from '../../src/core/fit/strategy/fit-survey';
import { evenlySpaced } from '../../src/core/fit/testing/simulated-survey';
import { mulberry32, normalRandom } from '../../src/core/random';
import type { Reading, Survey } from '../../src/core/survey/survey';
import { loopByBiotSavart } from '../support/biot-savart';

/**
 * Honest intervals on scans: 400 two-sided scans through a Helmholtz pair whose midpoint is
 * 23.1 mm from the ruler's zero (and through a loop 12.3 mm on the other side), the true
 * field by direct Biot–Savart integration of the loops (test/support/biot-savart.ts, independent of src/core/physics), plus seeded
 * Gaussian noise of 1 % + 1 µT stated per reading. The share of 95 % intervals containing
 * the true ampere-turns and centre must lie in 92–98 % (binomial SD at 95 % for 400 is
 * 1.1 %, so the band is about ±2.7 SD).
 */
const truth: Readonly<Record<string, number>> = { ampereTurns: 100, radius: 0.035, separation: 0.035, centre: 0.0231, background: 2e-5 };
const positions = evenlySpaced(-0.15, 0.12, 28);
const clean = positions.map((p) => {
  const z = p - truth['centre']!;
  const half = truth['separation']! / 2;
  return loopByBiotSavart(truth['ampereTurns']!, truth['radius']!, z - half, 0)[0] + loopByBiotSavart(truth['ampereTurns']!, truth['radius']!, z + half, 0)[0] + truth['background']!;
});
const surveys = 400;

describe('95 % intervals of a scan fit cover the truth', () => {
  it('coil-pair scans: the intervals of ampereTurns and centre contain the truth in 92–98 % of 400 scans', () => {
    const shares = coverage('coil-pair', truth, clean);
    // nominal 95 %; 92–98 % is about ±2.7 binomial SD for 400 scans (see above)
    for (const name of ['ampereTurns', 'centre']) {
      expect(shares[name]!, name).toBeGreaterThanOrEqual(0.92);
      expect(shares[name]!, name).toBeLessThanOrEqual(0.98);
    }
  });

  it('loop scans: the intervals of ampereTurns and centre contain the truth in 92–98 % of 400 scans', () => {
    const loopTruth = { ampereTurns: 200, radius: 0.04, centre: -0.0123, background: 2e-5 };
    const shares = coverage('loop', loopTruth, positions.map((p) => loopByBiotSavart(200, 0.04, p - loopTruth.centre, 0)[0] + loopTruth.background));
    // nominal 95 %; 92–98 % is about ±2.7 binomial SD for 400 scans (see above)
    for (const name of ['ampereTurns', 'centre']) {
      expect(shares[name]!, name).toBeGreaterThanOrEqual(0.92);
      expect(shares[name]!, name).toBeLessThanOrEqual(0.98);
    }
  });
});

function coverage(model: 'loop' | 'coil-pair', truth: Readonly<Record<string, number>>, clean: readonly number[]): Record<string, number> {
  const hits: Record<string, number> = Object.fromEntries(Object.keys(truth).filter((name) => name !== 'background').map((name) => [name, 0]));
  for (let s = 0; s < surveys; s++) {
    const gaussian = normalRandom(mulberry32(9000 + s));
    const readings: Reading[] = clean.map((b, i) => {
      const sigma = 0.01 * Math.abs(b) + 1e-6;
      return { line: i + 2, distance: positions[i]!, radial: 0, field: b + sigma * gaussian(), standardUncertainty: sigma };
    });
    const survey: Survey = {
      source: `scan ${s}`, coil: null, date: null, readingType: 'dc', fieldKind: 'axial', readings, rejected: [],
      totalRows: readings.length, meta: {}, notes: [], axis: 'position',
    };
    const [fit] = fitSurvey(survey, { models: [model], starts: 1, seed: s });
    expect(fit!.converged).toBe(true);
    for (const name of Object.keys(hits)) {
      const interval = fit!.params[name]!.ci95;
      if (interval !== null && interval[0] <= truth[name]! && truth[name]! <= interval[1]) hits[name]! += 1;
    }
  }
  const shares = Object.fromEntries(Object.entries(hits).map(([name, count]) => [name, count / surveys]));
  console.log(`coverage, ${model} scans: ${JSON.stringify(shares)}`);
  return shares;
}
