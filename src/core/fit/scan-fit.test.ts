import { describe, expect, it } from 'vitest';
import { integrate, loopByBiotSavart } from '../../../test/support/biot-savart';
import { mulberry32 } from '../random/mulberry32';
import { normalRandom } from '../random/normal-random';
import type { Reading, Survey } from '../survey/survey';
import type { ModelId } from '../models/field-model';
import { fitSurvey } from './fit-survey';
import { evenlySpaced } from './testing/simulated-survey';

/** On-axis |B| of a coil described by a field function of z from its centre, read at ruler positions. */
function scanSurvey(field: (z: number) => number, centre: number, positions: readonly number[], noise: number, seed: number): Survey {
  const gaussian = normalRandom(mulberry32(seed));
  const readings: Reading[] = positions.map((p, i) => {
    const truth = field(p - centre);
    const sigma = noise * Math.abs(truth) + 1e-9;
    return { line: i + 2, distance: p, radial: 0, field: truth + sigma * gaussian(), standardUncertainty: sigma };
  });
  return {
    source: 'simulated scan', coil: null, date: null, readingType: 'dc', fieldKind: 'magnitude',
    readings, rejected: [], totalRows: readings.length, meta: {}, notes: [], axis: 'position',
  };
}

// Independent fields: direct Biot–Savart integration around each filament
// (test/support/biot-savart.ts), sharing nothing with src/core/physics but μ0.
const loop = (ampereTurns: number, radius: number) => (z: number) => loopByBiotSavart(ampereTurns, radius, z, 0)[0];
const pair = (ampereTurns: number, radius: number, separation: number) => (z: number) =>
  loopByBiotSavart(ampereTurns, radius, z - separation / 2, 0)[0] + loopByBiotSavart(ampereTurns, radius, z + separation / 2, 0)[0];
// A single-layer solenoid as a current sheet: the loop field integrated over the length
// (Gauss–Kronrod), N·I/L ampere-turns per metre.
const solenoid = (ampereTurns: number, radius: number, length: number) => (z: number) =>
  integrate((s) => loopByBiotSavart(ampereTurns / length, radius, z - s, 0)[0], -length / 2, length / 2, 1e-12);

interface Case {
  readonly model: ModelId;
  readonly truth: Readonly<Record<string, number>>;
  readonly field: (z: number) => number;
  readonly positions: readonly number[];
}

const cases: readonly Case[] = [
  { model: 'loop', truth: { ampereTurns: 200, radius: 0.04, centre: 0.0123 }, field: loop(200, 0.04), positions: evenlySpaced(-0.3, 0.3, 61) },
  // a 70 mm coil pair at Helmholtz spacing, ruler zero 23.1 mm from its midpoint
  { model: 'coil-pair', truth: { ampereTurns: 100, radius: 0.035, separation: 0.035, centre: 0.0231 }, field: pair(100, 0.035, 0.035), positions: evenlySpaced(-0.304, 0.256, 50) },
  { model: 'solenoid', truth: { ampereTurns: 500, radius: 0.02, length: 0.1, centre: -0.0171 }, field: solenoid(500, 0.02, 0.1), positions: evenlySpaced(-0.2, 0.15, 36) },
];

describe('fitting a two-sided scan (signed positions, centre fitted)', () => {
  for (const c of cases) {
    it(`${c.model}: noise-free Biot–Savart readings give back the coil and its centre`, () => {
      const survey = scanSurvey(c.field, c.truth['centre']!, c.positions, 0, 1);
      const [fit] = fitSurvey(survey, { models: [c.model] });
      expect(fit!.converged).toBe(true);
      expect(fit!.stats.n).toBe(c.positions.length);
      for (const [name, value] of Object.entries(c.truth)) {
        // independent method (Biot–Savart integration) vs the closed forms: agreement to 1e-6 of the size
        expect(Math.abs(fit!.params[name]!.value - value)).toBeLessThan(1e-6 * Math.max(Math.abs(value), 0.01));
      }
    });

    it(`${c.model}: noisy readings (1 %) bracket ampere-turns, geometry and centre in their 95 % intervals`, () => {
      const survey = scanSurvey(c.field, c.truth['centre']!, c.positions, 0.01, 7);
      const [fit] = fitSurvey(survey, { models: [c.model] });
      expect(fit!.converged).toBe(true);
      // every reading is used: both sides, inside the coil and between the coils of the pair
      expect(fit!.stats.n).toBe(survey.totalRows);
      expect(fit!.params['probeOffset']).toBeUndefined();
      for (const [name, value] of Object.entries(c.truth)) {
        const estimate = fit!.params[name]!;
        expect(estimate.determined).toBe(true);
        // truth from the generator; a 95 % interval (one seed, regression pin of the seed)
        expect(estimate.ci95![0]).toBeLessThanOrEqual(value);
        expect(estimate.ci95![1]).toBeGreaterThanOrEqual(value);
      }
    });
  }
});
