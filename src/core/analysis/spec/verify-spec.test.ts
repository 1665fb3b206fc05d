import { describe, it, expect } from 'vitest';
import { verifySpec } from './verify-spec';
import type { Spec } from './spec';
import { syntheticFit } from '../testing/synthetic-fit';
import { expectClose } from '../../../../test/support/expect-close';

// CODATA 2018 μ0 (DOMAIN.md §9); loop centre field μ0NI/(2R) (DOMAIN.md §1.1)
const mu0 = 1.25663706212e-6;
const surveyed = Array.from({ length: 16 }, (_, i) => 0.005 + 0.01 * i);

function loopFit(ampereTurns: number, ampereTurnsStderr: number | null, radius: number, radiusStderr: number | null, extra: { determined?: boolean } = {}) {
  const fit = syntheticFit('loop', [
    { name: 'ampereTurns', unit: 'A', value: ampereTurns, stderr: ampereTurnsStderr },
    { name: 'radius', unit: 'm', value: radius, stderr: radiusStderr },
    { name: 'probeOffset', unit: 'm', value: 0.002, stderr: 0.0002 },
    { name: 'background', unit: 'T', value: 1e-5, stderr: 1e-7 },
  ], { distances: surveyed, aicc: -200 });
  if (extra.determined === false) {
    for (const name of ['ampereTurns', 'radius']) (fit.params as Record<string, unknown>)[name] = { ...fit.params[name]!, determined: false, ci95: null };
  }
  return fit;
}

const label = (overrides: Partial<Spec> = {}): Spec => ({
  source: 'specs.json',
  coils: null,
  model: 'loop',
  params: [
    { name: 'ampereTurns', value: 120, text: '120 A', tolerance: { relative: 0.1, absolute: 0 } },
    { name: 'radius', value: 0.045, text: '45 mm', tolerance: { relative: 0.05, absolute: 0 } },
  ],
  claims: [],
  readingType: 'dc',
  crestFactor: null,
  ...overrides,
});

describe('verifySpec()', () => {
  it('verifySpec() finds "degraded" when ampere-turns are low and the radius is as labeled (issue 5 example)', () => {
    // truth: the label's 45 mm coil carrying 96 of its 120 ampere-turns (amplitude-only change)
    const verdict = verifySpec(label(), [loopFit(96, 2, 0.0448, 0.00046)], 'dc');
    expect(verdict.status).toBe('fail');
    expect(verdict.findings).toEqual(['degraded']);
    expect(verdict.checks.map((c) => [c.what, c.status])).toEqual([['ampereTurns', 'fail'], ['radius', 'pass']]);
    expect(verdict.explanations[0]).toBe(
      'ampere-turns 96.0 A (92.1–99.9) vs 120 A on the label; radius 44.8 mm (43.9–45.7) as labeled → amplitude loss: shorted turns or lower drive current (a wrong turn count or current on the label looks the same; measure the coil current to tell).',
    );
  });

  it('verifySpec() finds "mislabeled" when the radius is outside the label\'s tolerance, whatever the amplitude does', () => {
    // truth: a 60 mm coil sold as 45 mm (geometry change)
    const verdict = verifySpec(label(), [loopFit(150, 3, 0.06, 0.0006)], 'dc');
    expect(verdict.status).toBe('fail');
    expect(verdict.findings).toEqual(['mislabeled']);
    expect(verdict.explanations[0]).toContain('radius 60.0 mm (58.8–61.2) vs 45.0 mm on the label');
    expect(verdict.explanations[0]).toContain('may follow from the different geometry');
  });

  it('verifySpec() passes when every interval lies within tolerance', () => {
    const verdict = verifySpec(label(), [loopFit(121, 1.5, 0.0451, 0.0003)], 'dc');
    expect(verdict.status).toBe('pass');
    expect(verdict.findings).toEqual([]);
  });

  it('verifySpec() is inconclusive when an interval straddles a limit and says what would decide it', () => {
    // 110 ± 7.8 A straddles the 108 A limit
    const verdict = verifySpec(label(), [loopFit(110, 4, 0.045, 0.0003)], 'dc');
    expect(verdict.status).toBe('inconclusive');
    const check = verdict.checks[0]!;
    expect(check.status).toBe('inconclusive');
    expect(check.toDecide).toMatch(/more on-axis readings? .* would shrink the ampere-turns interval|Even \d+ more readings/);
    expect(verdict.explanations.join(' ')).toContain('To decide ampereTurns');
  });

  it('verifySpec() reports a peak label against rms readings instead of converting, and converts with a stated sine', () => {
    const mismatch = verifySpec(label({ readingType: 'peak' }), [loopFit(85, 1, 0.045, 0.0003)], 'rms');
    expect(mismatch.findings).toContain('reading-type-mismatch');
    expect(mismatch.checks[0]!.status).toBe('inconclusive');
    expect(mismatch.checks[0]!.toDecide).toContain('"waveform": "sine"');
    // geometry does not depend on the detector type
    expect(mismatch.checks[1]!.status).toBe('pass');
    // DOMAIN.md §3.6: sine peak = √2 × rms, so 85 A rms is 120.2 A peak
    const converted = verifySpec(label({ readingType: 'peak', crestFactor: Math.SQRT2 }), [loopFit(85, 1, 0.045, 0.0003)], 'rms');
    expectClose(converted.checks[0]!.measured.value, 85 * Math.SQRT2, { rel: 1e-12 });
    expect(converted.status).toBe('pass');
    expect(converted.explanations.join(' ')).toContain('crest factor 1.414');
  });

  it('verifySpec() checks a claimed centre field with the coil\'s own field μ0NI/(2R)', () => {
    const centre = (mu0 * 120) / (2 * 0.045);
    const claims = [{ distance: 0, datum: 'winding' as const, radial: 0, field: centre, tolerance: { relative: 0.05, absolute: 0 }, text: 'centre' }];
    const verdict = verifySpec(label({ params: [], claims }), [loopFit(120, 0.5, 0.045, 0.0001)], 'dc');
    // probe offset and background are not the coil's field: the claim is met exactly
    expectClose(verdict.checks[0]!.measured.value, centre, { rel: 1e-6 });
    expect(verdict.checks[0]!.status).toBe('pass');
    expect(verdict.checks[0]!.kind).toBe('claim');
  });

  it('verifySpec() reads a claim\'s distance from the device surface by default: the coil is evaluated a probe offset further out', () => {
    // on-axis loop field B(z) = μ0NI·R²/(2(R²+z²)^1.5) (Jackson, Classical Electrodynamics, 3rd ed., §5.5);
    // a label's "field at 50 mm" is from the device surface (common practice), i.e. 50 mm plus the fitted offset of 2 mm from the winding
    const onAxis = (z: number) => (mu0 * 120 * 0.045 ** 2) / (2 * (0.045 ** 2 + z ** 2) ** 1.5);
    const claim = { distance: 0.05, radial: 0, field: onAxis(0.052), tolerance: { relative: 0.02, absolute: 0 } };
    const surface = verifySpec(label({ params: [], claims: [{ ...claim, datum: 'surface', text: 'surface' }] }), [loopFit(120, 0.5, 0.045, 0.0001)], 'dc');
    expectClose(surface.checks[0]!.measured.value, onAxis(0.052), { rel: 1e-6 });
    expect(surface.checks[0]!.status).toBe('pass');
    expect(surface.checks[0]!.datum).toBe('surface');
    expect(surface.checks[0]!.what).toBe('field at 50.0 mm from the surface');
    // the same figure claimed from the winding plane is 2 mm nearer the coil, 6.8 % higher (same formula): outside 2 %
    const winding = verifySpec(label({ params: [], claims: [{ ...claim, datum: 'winding', text: 'winding' }] }), [loopFit(120, 0.5, 0.045, 0.0001)], 'dc');
    expectClose(winding.checks[0]!.measured.value, onAxis(0.05), { rel: 1e-6 });
    expect(winding.checks[0]!.status).toBe('fail');
  });

  it('verifySpec() flags a claim that only an inverse-square extrapolation reproduces', () => {
    // the datasheet took 2.0 mT at 10 mm and scaled by (10/60)² → 55.6 µT at 60 mm
    const inverseSquare = syntheticFit('inverse-square', [
      { name: 'amplitude', unit: 'T·m^n', value: 2e-3 * 0.012 ** 2, stderr: 1e-9 },
      { name: 'probeOffset', unit: 'm', value: 0, stderr: 1e-4 },
      { name: 'background', unit: 'T', value: 0, stderr: 1e-7 },
    ], { aicc: 50 });
    const claimed = (2e-3 * 0.012 ** 2) / (0.06 - 0.002) ** 2;
    const claims = [{ distance: 0.06, datum: 'winding' as const, radial: 0, field: claimed, tolerance: { relative: 0.1, absolute: 0 }, text: 'far' }];
    const verdict = verifySpec(label({ params: [], claims }), [loopFit(120, 0.5, 0.045, 0.0001), inverseSquare], 'dc');
    expect(verdict.checks[0]!.alternatives![0]!.model).toBe('inverse-square');
    expectClose(verdict.checks[0]!.alternatives![0]!.value, claimed, { rel: 1e-9 });
    expect(verdict.findings).toContain('power-law-extrapolation');
  });

  it('verifySpec() says a fixed parameter is not tested', () => {
    const verdict = verifySpec(label(), [loopFit(120, 1, 0.045, null)], 'dc');
    expect(verdict.checks[1]!.status).toBe('inconclusive');
    expect(verdict.checks[1]!.evidence).toContain('held fixed');
  });

  it('verifySpec() checks the far-field moment when the survey cannot separate ampere-turns and radius', () => {
    // label moment 120 A·π·(45 mm)² = 0.7634 A·m²; fitted pair gives 96·π·0.045² (20 % low)
    const fit = loopFit(96, 30, 0.045, 0.007, { determined: false });
    const verdict = verifySpec(label(), [fit], 'dc');
    const moment = verdict.checks.find((c) => c.what === 'moment')!;
    // the catalog's moment is a Richardson limit of the field (fit/far-field-moment.ts), good to ~1e-6
    expectClose(moment.expected.value, 120 * Math.PI * 0.045 ** 2, { rel: 1e-5 });
    expectClose(moment.measured.value, 96 * Math.PI * 0.045 ** 2, { rel: 1e-5 });
    // stacked tolerance |∂m/∂NI|·12 A + |∂m/∂R|·2.25 mm = m·(0.1 + 2·0.05)
    expectClose(moment.tolerance.absolute, 0.2 * 120 * Math.PI * 0.045 ** 2, { rel: 1e-5 });
  });

  it('verifySpec() is inconclusive with "not-fitted" when the spec\'s model did not converge', () => {
    const verdict = verifySpec(label(), [{ ...loopFit(120, 1, 0.045, 0.0003), converged: false }], 'dc');
    expect(verdict.findings).toEqual(['not-fitted']);
    expect(verdict.explanations[0]).toContain('did not converge');
  });
});
