import { describe, expect, it } from 'vitest';
import { integrate, loopByBiotSavart } from '../../../../test/support/biot-savart';
import { mulberry32 } from '../../random/mulberry32';
import { normalRandom } from '../../random/normal-random';
import type { Reading, Survey } from '../../survey/survey';
import { centralDifference } from '../../../../test/support/central-difference';
import { coilPairModel, getModel, scanModel, solenoidModel } from '../../models';
import type { FieldModel, ModelId, SurveyPoints } from '../../models/field-model';
import { fitSurvey } from './fit-survey';
import { evenlySpaced } from '../testing/simulated-survey';

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

describe('scan form of the models against published values, read at ruler positions', () => {
  const mu0 = 1.25663706212e-6;
  const at = (model: FieldModel, params: number[], positions: number[]) => {
    const points: SurveyPoints = { n: positions.length, distance: Float64Array.from(positions), radial: new Float64Array(positions.length), field: new Float64Array(positions.length), kind: 'axial' };
    const out = new Float64Array(positions.length);
    scanModel(model).evaluate(Float64Array.from(params), points, out);
    return Array.from(out);
  };

  it('a Helmholtz pair: centre field (4/5)^{3/2} μ0NI/R, flat to fourth order about its midpoint on the ruler', () => {
    const [R, NI, centre] = [0.05, 120, -0.0372];
    const [middle, near] = at(coilPairModel, [NI, R, R, centre, 0], [centre, centre + 0.01 * R]);
    // Jackson, Classical Electrodynamics 3rd ed., Problem 5.5 (from memory): B = (4/5)^{3/2} μ0 N I / R at the midpoint
    expect(middle! / ((4 / 5) ** 1.5 * mu0 * NI / R) - 1).toBeCloseTo(0, 12);
    // B(z) ≈ B(0)(1 − (144/125)(z/R)⁴ + O((z/R)⁶)) on the axis of a Helmholtz pair (from memory, the standard
    // expansion): at z = R/100 the sixth-order term is ~1e-4 of the fourth-order one
    expect((1 - near! / middle!) / 0.01 ** 4).toBeCloseTo(144 / 125, 3);
  });

  it('a long solenoid: the field at either end is half the field at its middle', () => {
    const [R, L, NI, centre] = [0.002, 2, 1000, 0.4];
    const [middle, left, right] = at(solenoidModel, [NI, R, L, centre, 0], [centre, centre - L / 2, centre + L / 2]);
    // Griffiths, Introduction to Electrodynamics 4th ed., eq. 5.57 and Problem 5.11: B = μ0 n I inside, half of it at an end (long-solenoid limit)
    expect(middle! / (mu0 * NI / L) - 1).toBeCloseTo(0, 5);
    expect(left! / middle!).toBeCloseTo(0.5, 5);
    expect(right! / middle!).toBeCloseTo(0.5, 5);
  });
});

describe('scan form Jacobian', () => {
  const starts: Readonly<Record<string, number[]>> = {
    'loop': [150, 0.03, 0.011, 1e-6],
    'coil-pair': [100, 0.035, 0.03, -0.02, 0],
    'solenoid': [400, 0.02, 0.08, 0.013, 2e-6],
    'thick-coil': [900, 0.015, 0.03, 0.04, -0.007, 0],
    'rectangle': [60, 0.04, 0.025, 0.004, 0],
    'dipole': [0.5, 0.021, 0],
    'power-law': [1e-7, 2.6, -0.013, 0],
  };
  const positions = [-0.21, -0.08, -0.031, -0.004, 0.017, 0.026, 0.052, 0.13];
  for (const [id, values] of Object.entries(starts)) {
    it(`${id}: the analytic Jacobian matches central differences of the scan-form prediction`, () => {
      const model = scanModel(getModel(id));
      const n = positions.length;
      const k = values.length;
      for (const kind of ['magnitude', 'axial'] as const) {
        const points: SurveyPoints = { n, distance: Float64Array.from(positions), radial: new Float64Array(n).fill(0.004), field: new Float64Array(n), kind };
        const analytic = new Float64Array(n * k);
        model.jacobian!(Float64Array.from(values), points, analytic);
        for (let j = 0; j < k; j++) {
          const column = centralDifference((x) => {
            const trial = Float64Array.from(values);
            trial[j] = x;
            const out = new Float64Array(n);
            model.evaluate(trial, points, out);
            return Array.from(out);
          }, values[j]!, 1e-3);
          column.forEach((value, i) => {
            // common practice: central differences agree to ~1e-6 of the column's size
            const size = Math.max(...column.map(Math.abs), 1e-30);
            expect(Math.abs(analytic[i * k + j]! - value) / size).toBeLessThan(2e-5);
          });
        }
      }
    });
  }
});
