import { describe, expect, it } from 'vitest';
import { fitSurvey } from '../../fit/strategy/fit-survey';
import { getModel, type ModelId } from '../../models';
import { mulberry32, normalRandom } from '../../random';
import type { Survey } from '../../survey/survey';
import { expectClose } from '../../../../test/support/expect-close';
import { describeValue } from '../describe-value';
import { modelPoint } from '../model-point';
import { atLabelGeometry } from './check-at-label-geometry';
import type { Spec } from './spec';
import { verifySpec } from './verify-spec';

// A generated on-axis survey of a thick coil (truth: 1500 ampere-turns, inner radius 20 mm,
// outer 40 mm, length 30 mm, probe offset 1.5 mm, 25 µT background; the model's own datum), read
// from 2 mm to 150 mm from its face with 0.25 % + 0.2 µT noise (seeded). On-axis readings of
// a thick coil do not separate its three dimensions (DOMAIN.md §7.6), so the free fit leaves
// ampere-turns undetermined and only the check at the label's geometry can decide them.
const truth = { ampereTurns: 1500, innerRadius: 0.02, outerRadius: 0.04, length: 0.03, probeOffset: 0.0015, background: 2.5e-5 };
const uncertainty = { relative: 0.0025, absolute: 2e-7 };

function generatedSurvey(seed: number): Survey {
  const coil = modelPoint(getModel('thick-coil'));
  const values = Float64Array.of(truth.ampereTurns, truth.innerRadius, truth.outerRadius, truth.length, truth.probeOffset, truth.background);
  const gaussian = normalRandom(mulberry32(seed));
  const distances = Array.from({ length: 17 }, (_, i) => 0.002 * 1.31 ** i);
  const readings = distances.map((distance, i) => {
    const field = coil.field(values, distance, 0);
    return { line: i + 2, distance, radial: 0, field: field + Math.hypot(uncertainty.relative * field, uncertainty.absolute) * gaussian() };
  });
  return {
    source: `thick-${seed}.csv`, coil: 'GEN-T', date: '2026-02-03', readingType: 'dc', fieldKind: 'magnitude',
    readings, rejected: [], totalRows: readings.length, meta: {}, notes: [],
  };
}

function label(ampereTurns: number, geometryTolerance: number): Spec {
  const tolerance = { relative: geometryTolerance, absolute: 0 };
  return {
    source: 'label', coils: null, model: 'thick-coil',
    params: [
      { name: 'ampereTurns', value: ampereTurns, text: `${ampereTurns} A`, tolerance: { relative: 0.05, absolute: 0 } },
      { name: 'innerRadius', value: 0.02, text: '20 mm', tolerance },
      { name: 'outerRadius', value: 0.04, text: '40 mm', tolerance },
      { name: 'length', value: 0.03, text: '30 mm', tolerance },
    ],
    claims: [], readingType: 'dc', crestFactor: null,
  };
}

const options = { models: ['thick-coil', 'dipole'] as ModelId[], instrumentUncertainty: uncertainty };
const survey = generatedSurvey(1105);
const fits = fitSurvey(survey, options);
const refits: Record<string, number>[] = [];
const refit = (held: Readonly<Record<string, number>>) => {
  refits.push({ ...held });
  return fitSurvey(survey, { ...options, models: ['thick-coil'], fixed: held })[0] ?? null;
};

describe('checkAtLabelGeometry() through verifySpec()', () => {
  it('the generated survey is the case it is for: the free thick-coil fit cannot determine ampere-turns', () => {
    // DOMAIN.md §7.6: on-axis readings fix the curve's shape, not three dimensions and N·I separately
    expect(getModel('thick-coil').parameters.map((p) => p.name)).toEqual(['ampereTurns', 'innerRadius', 'outerRadius', 'length', 'probeOffset', 'background']);
    const verdict = verifySpec(label(1500, 0.02), fits, 'dc');
    expect(verdict.checks.find((c) => c.what === 'ampereTurns')?.evidence).toMatch(/do not determine ampere-turns/);
    // without a refit there is no check at the label's geometry
    expect(verdict.checks.some((c) => c.what === atLabelGeometry)).toBe(false);
  });

  it('passes the coil the label describes, with the truth inside its interval', () => {
    refits.length = 0;
    const verdict = verifySpec(label(1500, 0.02), fits, 'dc', refit);
    const check = verdict.checks.find((c) => c.what === atLabelGeometry)!;
    expect(check.status).toBe('pass');
    // the undetermined check no longer suggests fixing the label's values: that was just done
    const undetermined = verdict.checks.find((c) => c.what === 'ampereTurns')!;
    expect(undetermined.toDecide).not.toContain('--fix');
    expect(undetermined.toDecide).toContain('at the label\'s geometry is the one that decides');
    // truth of the generated survey: 1500 A
    expect(check.measured.ci95![0]).toBeLessThan(1500);
    expect(check.measured.ci95![1]).toBeGreaterThan(1500);
    // one refit at the label's geometry, then each dimension at label ± tolerance (2 %)
    expect(refits).toHaveLength(7);
    expect(refits[0]).toEqual({ innerRadius: 0.02, outerRadius: 0.04, length: 0.03 });
    expect(refits.slice(1).map((r) => r['innerRadius'])).toEqual([0.0196, 0.0204, 0.02, 0.02, 0.02, 0.02]);
    expect(check.evidence).toMatch(/^with the label's geometry held \(inner radius 20\.0 mm, outer radius 40\.0 mm, length 30\.0 mm\), ampere-turns 1\.\d\d kA/);
  });

  it('widens the ampere-turns tolerance by the geometry tolerance (none when the geometry is exact)', () => {
    const exact = verifySpec(label(1500, 0), fits, 'dc', refit).checks.find((c) => c.what === atLabelGeometry)!;
    expect(exact.tolerance).toEqual({ relative: 0.05, absolute: 0 });
    const loose = verifySpec(label(1500, 0.05), fits, 'dc', refit).checks.find((c) => c.what === atLabelGeometry)!;
    expect(loose.tolerance.relative).toBe(0.05);
    // a 5 % change in a coil's size moves the ampere-turns that fit the same readings by several per cent
    expect(loose.tolerance.absolute).toBeGreaterThan(0.02 * 1500);
    // linear worst-case stack (common practice for tolerance stack-up), computed here from refits of our own:
    // T = T_NI + Σ_j max over g_j ± 5 % of |NI(g) − NI(label)|, the other dimensions held at the label
    const labelGeometry = { innerRadius: 0.02, outerRadius: 0.04, length: 0.03 };
    const turnsAt = (held: Record<string, number>) => fitSurvey(survey, { ...options, models: ['thick-coil'], fixed: held })[0]!.params['ampereTurns']!.value;
    const atLabel = turnsAt(labelGeometry);
    const stack = Object.entries(labelGeometry).reduce((sum, [name, value]) =>
      sum + Math.max(...[0.95, 1.05].map((f) => Math.abs(turnsAt({ ...labelGeometry, [name]: value * f }) - atLabel))), 0);
    expect(stack).toBeGreaterThan(0);
    expectClose(loose.tolerance.absolute, stack, { rel: 1e-9 });
    // the zone in the evidence is label ± (5 % + stack)
    expect(loose.evidence).toContain(`within ${describeValue(1500 - 75 - stack, 'current')} to ${describeValue(1500 + 75 + stack, 'current')}`);
    expect(loose.evidence).toContain(`widened by ±${describeValue(stack, 'current')} for the geometry's own tolerance`);
  });

  it('fails a label whose ampere-turns the readings contradict even with the geometry tolerance (label 1800 A, truth 1500 A)', () => {
    const verdict = verifySpec(label(1800, 0.02), fits, 'dc', refit);
    const check = verdict.checks.find((c) => c.what === atLabelGeometry)!;
    expect(check.status).toBe('fail');
    expect(verdict.status).toBe('fail');
    // geometry not confirmed, so the finding is the cautious one (DOMAIN.md §5)
    expect(verdict.findings).toContain('amplitude-low');
    expect(verdict.findings).not.toContain('degraded');
  });

  it('adds no check when a refit fails', () => {
    const verdict = verifySpec(label(1500, 0.02), fits, 'dc', () => null);
    expect(verdict.checks.some((c) => c.what === atLabelGeometry)).toBe(false);
    // but says so, naming what was held (nothing dropped silently)
    expect(verdict.explanations).toContain(
      'The check of ampere-turns at the label\'s geometry was not made: the thick-coil fit with inner radius 20.0 mm, outer radius 40.0 mm, length 30.0 mm held could not be fitted (a held value is outside the model\'s range). ' +
        'Add readings within about one radius so the geometry is fitted rather than assumed, or check the label\'s dimensions and their tolerances.',
    );
  });

  it('names the held values of the refit that failed, and a refit that did not converge', () => {
    // fails only when the inner radius is moved to 20 mm − 2 % = 19.6 mm
    const failsLow = (held: Readonly<Record<string, number>>) => (held['innerRadius']! < 0.02 ? null : refit(held));
    const low = verifySpec(label(1500, 0.02), fits, 'dc', failsLow);
    expect(low.checks.some((c) => c.what === atLabelGeometry)).toBe(false);
    expect(low.explanations.join(' ')).toContain('with inner radius 19.6 mm, outer radius 40.0 mm, length 30.0 mm held could not be fitted');
    const stuck = verifySpec(label(1500, 0.02), fits, 'dc', (held) => ({ ...refit(held)!, converged: false }));
    expect(stuck.explanations.join(' ')).toContain('held did not converge');
  });

  it('adds neither a check nor a note when the label does not give every dimension', () => {
    const spec = label(1500, 0.02);
    const verdict = verifySpec({ ...spec, params: spec.params.filter((p) => p.name !== 'length') }, fits, 'dc', refit);
    expect(verdict.checks.some((c) => c.what === atLabelGeometry)).toBe(false);
    expect(verdict.explanations.join(' ')).not.toContain('label\'s geometry was not made');
  });
});
