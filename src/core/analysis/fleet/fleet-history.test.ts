import { describe, it, expect } from 'vitest';
import { linearRegression } from 'simple-statistics';
import { fleetHistory, type FleetSurvey } from './fleet-history';
import { syntheticFit } from '../testing/synthetic-fit';
import type { Spec } from '../spec/spec';
import type { Verdict } from '../../report/report';
import { expectClose } from '../../../../test/support/expect-close';

const msPerYear = 365.25 * 86_400_000;

function loopSurvey(coil: string | null, date: string | null, ampereTurns: number, radius: number, verdict: Verdict | null = null): FleetSurvey {
  const fit = syntheticFit('loop', [
    { name: 'ampereTurns', unit: 'A', value: ampereTurns, stderr: 1 },
    { name: 'radius', unit: 'm', value: radius, stderr: 0.0004 },
    { name: 'probeOffset', unit: 'm', value: 0.002, stderr: 0.0002 },
    { name: 'background', unit: 'T', value: 0, stderr: 1e-7 },
  ]);
  return { source: `${coil ?? 'anon'}-${date ?? 'undated'}.csv`, coil, date, fits: [fit], verdict };
}

const labelFL3: Spec = {
  source: 'specs.json',
  coils: ['FL-3'],
  model: 'loop',
  params: [
    { name: 'ampereTurns', value: 120, text: '120 A', tolerance: { relative: 0.05, absolute: 0 } },
    { name: 'radius', value: 0.045, text: '45 mm', tolerance: { relative: 0.05, absolute: 0 } },
  ],
  claims: [],
  readingType: null,
  crestFactor: null,
};

// A coil losing about 4 A of its 120 ampere-turns a year (truth stated here), surveyed
// yearly, listed out of order, plus one undated survey.
const dates = ['2022-03-01', '2023-03-01', '2024-03-01', '2025-03-01'];
const turns = [120.0, 116.0, 111.5, 108.0];
const fl3 = [3, 0, 2, 1].map((i) => loopSurvey('FL-3', dates[i]!, turns[i]!, 0.045));

describe('fleetHistory()', () => {
  it('fleetHistory() orders a coil\'s surveys by date and trends ampere-turns per year like an independent regression', () => {
    const fleet = fleetHistory([...fl3, loopSurvey('FL-3', null, 110, 0.045)], { specs: [labelFL3] });
    const coil = fleet.coils[0]!;
    expect(coil.coil).toBe('FL-3');
    expect(coil.surveys).toBe(5);
    expect(coil.latest).toBe('2025-03-01');
    expect(coil.history.map((h) => h.date)).toEqual([...dates, null]);
    expect(coil.explanations.join(' ')).toContain('without a date');
    const years = dates.map((d) => (Date.parse(d) - Date.parse(dates[0]!)) / msPerYear);
    // equal σ: the weighted slope equals the ordinary one; simple-statistics 7.12 linearRegression is independent code
    const reference = linearRegression(years.map((t, i) => [t, turns[i]!]));
    const trend = coil.trend.ampereTurnsPerYear!;
    expectClose(trend.value, reference.m, { rel: 1e-10 });
    expect(trend.unit).toBe('A/yr');
    // σ_b = σ/√Σ(t − t̄)² with σ = 1 A (scatter below 1 A keeps the Birge ratio at 1); t_{0.975,2} = 4.302653 (A&S Table 26.10)
    const meanT = years.reduce((s, t) => s + t, 0) / years.length;
    const se = 1 / Math.sqrt(years.reduce((s, t) => s + (t - meanT) ** 2, 0));
    expectClose(trend.ci95[1] - trend.value, 4.302653 * se, { rel: 1e-6 });
  });

  it('fleetHistory() flags "degrading" when the latest survey\'s decline is significant and beyond the label tolerance', () => {
    const coil = fleetHistory(fl3, { specs: [labelFL3] }).coils[0]!;
    // latest 108 ± 1.96 A lies wholly below 120 A − 5 % = 114 A, slope ≈ −4 A/yr significant
    expect(coil.flags).toContain('degrading');
    expect(coil.reference).toEqual({ kind: 'spec', ampereTurns: 120, unit: 'A' });
    expectClose(coil.history[3]!.ratioToReference!.value, 108 / 120, { rel: 1e-12 });
    expect(coil.explanations.join(' ')).toMatch(/^degrading: the latest \(2025-03-01\) 108 A \(106–110\) lies, with its whole interval, below the label's 120 A less the tolerance \(114 A\); ampere-turns change -4\.\d+ A .* declining \(the whole 95 % interval is below zero\)\.$/);
    expect(coil.trend.status).toBe('declining');
  });

  it('fleetHistory() does not flag a significant decline that is still within tolerance', () => {
    // −1.5 A a year over six yearly surveys (σ = 1 A): slope SE ≈ 0.24 A/yr, significant; latest 112.5 A is above 120 A − 10 % = 108 A
    const gentle = ['2020-01-01', '2021-01-01', '2022-01-01', '2023-01-01', '2024-01-01', '2025-01-01']
      .map((date, i) => loopSurvey('FL-4', date, 120 - 1.5 * i, 0.045));
    const coil = fleetHistory(gentle, { specs: [{ ...labelFL3, coils: ['FL-4'], params: [{ ...labelFL3.params[0]!, tolerance: { relative: 0.1, absolute: 0 } }] }] }).coils[0]!;
    expect(coil.trend.ampereTurnsPerYear!.ci95[1]).toBeLessThan(0);
    expect(coil.flags).not.toContain('degrading');
    expect(coil.explanations.join(' ')).toContain('declining (the whole 95 % interval is below zero); the latest (2025-01-01) 113 A (111–114) is not below');
  });

  it('fleetHistory() flags "geometry-changed" when the fitted radius jumps between surveys (swapped unit)', () => {
    const swapped = [loopSurvey('FL-7', '2023-01-10', 100, 0.045), loopSurvey('FL-7', '2024-01-10', 100.5, 0.0451), loopSurvey('FL-7', '2025-01-10', 99.5, 0.038)];
    const coil = fleetHistory(swapped).coils[0]!;
    expect(coil.flags).toContain('geometry-changed');
    expect(coil.flags).not.toContain('degrading');
    // default tolerance 5 % with no spec; the first-survey reference is used
    expect(coil.reference?.kind).toBe('first-survey');
    const sentence = coil.explanations.find((e) => e.startsWith('geometry-changed'))!;
    expect(sentence).toContain('2024-01-10');
    expect(sentence).toContain('2025-01-10');
    // a 0.1 mm wobble within the intervals is not a change
    expect(fleetHistory(swapped.slice(0, 2)).coils[0]!.flags).not.toContain('geometry-changed');
  });

  it('fleetHistory() writes a geometry change in inches when both surveys were logged in inches, in mm when they differ', () => {
    const inches = { field: 'G', distance: 'in' } as const;
    const swapped = [{ ...loopSurvey('FL-8', '2024-01-10', 100, 0.0508), units: inches }, { ...loopSurvey('FL-8', '2025-01-10', 100, 0.0381), units: inches }];
    // 1 in = 25.4 mm exactly (international yard and pound agreement, 1959): 50.8 mm = 2.00 in, 38.1 mm = 1.50 in
    const sentence = fleetHistory(swapped).coils[0]!.explanations.find((e) => e.startsWith('geometry-changed'))!;
    expect(sentence).toMatch(/^geometry-changed: radius 2\.00 in \([0-9.]+–[0-9.]+\) on 2024-01-10 but 1\.50 in \([0-9.]+–[0-9.]+\) on 2025-01-10 \(difference -0\.500 in,/);
    const mixed = [swapped[0]!, { ...swapped[1]!, units: { field: 'mT', distance: 'mm' } }];
    expect(fleetHistory(mixed).coils[0]!.explanations.find((e) => e.startsWith('geometry-changed'))).toMatch(/radius 50\.8 mm .* but 38\.1 mm/);
  });

  it('fleetHistory() flags "failed-spec" from the latest survey\'s verdict', () => {
    const failed: Verdict = { status: 'fail', findings: ['degraded'], checks: [], explanations: [] };
    const coil = fleetHistory([loopSurvey('FL-9', '2024-05-01', 100, 0.045), loopSurvey('FL-9', '2025-05-01', 99, 0.045, failed)]).coils[0]!;
    expect(coil.flags).toEqual(['failed-spec']);
    expect(coil.explanations.join(' ')).toContain('(degraded)');
  });

  it('fleetHistory() lists surveys without a coil id and passes unreadable files through', () => {
    const fleet = fleetHistory([loopSurvey(null, '2025-01-01', 100, 0.045)], { unreadable: [{ source: 'broken.csv', reason: 'not a CSV' }] });
    expect(fleet.coils).toHaveLength(0);
    expect(fleet.ungrouped![0]!.reason).toContain('# coil: ID');
    expect(fleet.unreadable).toEqual([{ source: 'broken.csv', reason: 'not a CSV' }]);
  });

  it('fleetHistory() flags a sudden drop against the first survey even when the trend line is not significant', () => {
    // truth: 100 A for three quarterly surveys, then a shorted section: 80 A (no spec; default 5 %)
    const drop = [['2025-01-01', 100], ['2025-04-01', 100.4], ['2025-07-01', 99.7], ['2025-10-01', 80]] as const;
    const coil = fleetHistory(drop.map(([date, turns]) => loopSurvey('FL-5', date, turns, 0.045))).coils[0]!;
    expect(coil.flags).toContain('degrading');
    expect(coil.explanations[0]).toContain("the first survey's 100 A");
  });

  it('fleetHistory() gives no trend for a single dated survey and says why', () => {
    const coil = fleetHistory([loopSurvey('FL-1', '2025-01-01', 100, 0.045)]).coils[0]!;
    expect(coil.trend.ampereTurnsPerYear).toBeNull();
    expect(coil.explanations.join(' ')).toContain('trend undetermined: only one dated survey has determined ampere-turns');
    expect(coil.trend.status).toBe('undetermined');
  });

  it('fleetHistory() makes the first date\'s surveys one baseline, whatever their file names, and orders same-date surveys by file name', () => {
    // two surveys on the first day, 100 A (σ 1 A) and 104 A (σ 2 A): inverse-variance mean 100.8 A,
    // σ = 1/√(1 + 1/4) (Bevington & Robinson §4.1, weighted mean, from memory)
    const precise = { ...loopSurvey('FL-6', '2025-01-01', 100, 0.045), source: 'z-precise.csv' };
    const rough = loopSurvey('FL-6', '2025-01-01', 104, 0.045);
    const roughFit = rough.fits[0]!;
    const widened = { ...rough, source: 'a-rough.csv', fits: [{ ...roughFit, params: { ...roughFit.params, ampereTurns: { ...roughFit.params['ampereTurns']!, stderr: 2, ci95: [100, 108] as const } } }] };
    const later = loopSurvey('FL-6', '2025-07-01', 101, 0.045);
    const one = fleetHistory([precise, widened, later]).coils[0]!;
    const other = fleetHistory([later, widened, precise]).coils[0]!;
    expectClose(one.reference!.ampereTurns, (100 * 1 + 104 / 4) / (1 + 1 / 4), { rel: 1e-12 });
    expect(other.reference).toEqual(one.reference);
    expect(one.history.map((h) => h.source)).toEqual(['a-rough.csv', 'z-precise.csv', later.source]);
    expect(other.history.map((h) => h.source)).toEqual(one.history.map((h) => h.source));
    expect(one.explanations.join(' ')).toContain('baseline: the 2 surveys of 2025-01-01, the earliest date, combined by inverse-variance weight');
  });
});
