import { describe, it, expect } from 'vitest';
import { fitSurvey } from '../../fit/strategy/fit-survey';
import { getModel } from '../../models';
import { mulberry32, normalRandom } from '../../random';
import type { Survey } from '../../survey/survey';
import { modelPoint } from '../model-point';
import { thresholdDistances } from '../thresholds/threshold-distances';
import { parseThresholdLevel } from '../thresholds/threshold-level';
import type { Spec } from './spec';
import { verifySpec } from './verify-spec';

// Generated surveys from known coils (truth stated per test): a loop of N·I ampere-turns and
// radius R, sensing point 3 mm behind the probe tip, 20 µT background, read on axis with 1 %
// + 0.5 µT noise (seeded).
function generatedSurvey(truth: { ampereTurns: number; radius: number }, distances: readonly number[], seed: number): Survey {
  const loop = modelPoint(getModel('loop'));
  const values = Float64Array.of(truth.ampereTurns, truth.radius, 0.003, 2e-5);
  const gaussian = normalRandom(mulberry32(seed));
  const readings = distances.map((distance, i) => {
    const field = loop.field(values, distance, 0);
    return { line: i + 2, distance, radial: 0, field: field + Math.hypot(0.01 * field, 5e-7) * gaussian() };
  });
  return {
    source: `generated-${seed}.csv`, coil: 'GEN-1', date: '2026-01-01', readingType: 'dc', fieldKind: 'magnitude',
    readings, rejected: [], totalRows: readings.length, meta: {}, notes: [],
  };
}

const nearAndFar = Array.from({ length: 18 }, (_, i) => 0.004 * 1.22 ** i); // 4 mm … 118 mm
const label: Spec = {
  source: 'label', coils: null, model: 'loop',
  params: [
    { name: 'ampereTurns', value: 120, text: '120 A', tolerance: { relative: 0.1, absolute: 0 } },
    { name: 'radius', value: 0.045, text: '45 mm', tolerance: { relative: 0.1, absolute: 0 } },
  ],
  claims: [{ distance: 0, datum: 'winding', radial: 0, field: 1.7e-3, tolerance: { relative: 0.15, absolute: 0 }, text: '1.7 mT at 0 mm' }],
  readingType: 'dc', crestFactor: null,
};
const fitOptions = { models: ['loop', 'dipole', 'power-law', 'inverse-square'] as const, instrumentUncertainty: { relative: 0.01, absolute: 5e-7 } };

describe('verifySpec() on generated surveys', () => {
  it('verifySpec() passes the coil the label describes (truth: 120 A, 45 mm)', () => {
    const fits = fitSurvey(generatedSurvey({ ampereTurns: 120, radius: 0.045 }, nearAndFar, 11), fitOptions);
    const verdict = verifySpec(label, fits, 'dc');
    expect(verdict.checks.map((c) => c.status)).toEqual(['pass', 'pass', 'pass']);
    expect(verdict.findings).toEqual([]);
  });

  it('verifySpec() finds "degraded" for an amplitude-only loss (truth: 96 A, 45 mm: 20 % of the turns shorted)', () => {
    const fits = fitSurvey(generatedSurvey({ ampereTurns: 96, radius: 0.045 }, nearAndFar, 12), fitOptions);
    const verdict = verifySpec(label, fits, 'dc');
    expect(verdict.status).toBe('fail');
    expect(verdict.findings).toEqual(['degraded', 'claim-not-met']);
    expect(verdict.explanations[0]).toMatch(/^ampere-turns 9\d\.\d A \(\d+(\.\d)?–\d+(\.\d)?\) vs 120 A on the label; radius 4\d\.\d mm \(4\d\.\d–4\d\.\d\) as labeled → amplitude loss/);
  });

  it('verifySpec() finds "mislabeled" for a geometry change (truth: 120 A, 60 mm sold as 45 mm)', () => {
    const fits = fitSurvey(generatedSurvey({ ampereTurns: 120, radius: 0.06 }, nearAndFar, 13), fitOptions);
    const verdict = verifySpec(label, fits, 'dc');
    expect(verdict.status).toBe('fail');
    expect(verdict.findings[0]).toBe('mislabeled');
    expect(verdict.checks[1]!.status).toBe('fail');
  });

  it('verifySpec() falls back on the moment when only far-field readings exist (truth: 60 A, 45 mm; 5R–10R)', () => {
    // DOMAIN.md §7.6: 5R–10R determines only the moment; the probe offset is fixed from the probe's drawing
    const far = Array.from({ length: 12 }, (_, i) => 0.225 + (0.225 * i) / 11);
    const fits = fitSurvey(generatedSurvey({ ampereTurns: 60, radius: 0.045 }, far, 14), { ...fitOptions, fixed: { probeOffset: 0.003 } });
    const verdict = verifySpec({ ...label, claims: [] }, fits, 'dc');
    const moment = verdict.checks.find((c) => c.what === 'moment')!;
    // truth m = 60·π·(45 mm)² = 0.382 A·m², below the label's 0.763 A·m² less its stacked ±30 %
    expect(moment.status).toBe('fail');
    expect(moment.measured.ci95![0]).toBeLessThan(60 * Math.PI * 0.045 ** 2);
    expect(moment.measured.ci95![1]).toBeGreaterThan(60 * Math.PI * 0.045 ** 2);
    expect(verdict.findings).toContain('moment-low');
    // the radius is not decided, so neither "degraded" nor "mislabeled" may be claimed
    expect(verdict.findings).not.toContain('degraded');
    expect(verdict.findings).not.toContain('mislabeled');
  });

  it('thresholdDistances() on a fitted generated survey brackets the true 0.5 mT distance', () => {
    const fits = fitSurvey(generatedSurvey({ ampereTurns: 400, radius: 0.05 }, Array.from({ length: 18 }, (_, i) => 0.004 * 1.25 ** i), 15), fitOptions);
    const result = thresholdDistances(fits, [parseThresholdLevel('0.5mT')], { readingType: 'dc' })[0]!;
    // DOMAIN.md §9 row 36: 95.630 mm for NI = 400 A, R = 50 mm
    expect(result.model).toBe('loop');
    const [low, high] = result.distance!.ci95!;
    expect(low).toBeLessThan(0.09563);
    expect(high).toBeGreaterThan(0.09563);
    expect(result.naive!.ratio!).toBeGreaterThan(1);
  });
});
