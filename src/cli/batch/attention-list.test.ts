import { describe, expect, it } from 'vitest';
import type { FleetCoil, SurveyReport, Verdict } from '../../core/report/report';
import { attentionList } from './attention-list';
import type { FleetRow } from './fleet-rows';

function survey(coil: string | null, verdict: Verdict | null = null, best: 'loop' | null = 'loop'): SurveyReport {
  return {
    source: `${coil ?? 'anonymous'}.csv`, coil, date: '2026-01-01', readingType: 'dc',
    readings: { total: 30, used: 30, rejected: [] }, fits: [], best, comparison: [], verdict,
    thresholds: [], warnings: best === null ? ['No model converged.'] : [], cautions: [], notes: [],
  };
}

function history(coil: string, flags: string[], slope: number | null = null, reference = 400): FleetCoil {
  return {
    coil, surveys: 3, latest: '2026-01-01', flags,
    trend: {
      ampereTurnsPerYear: slope === null ? null : { value: slope, unit: 'A/yr', ci95: [slope - 5, slope + 5] },
      status: slope === null ? 'undetermined' : slope + 5 < 0 ? 'declining' : 'undetermined',
      steadyBand: { value: 0.05 * reference, unit: 'A/yr' },
      moreSurveys: null,
    },
    model: 'loop', reference: { kind: 'first-survey', ampereTurns: reference, unit: 'A' }, history: [],
    explanations: flags.map((flag) => `${flag}: evidence for ${coil}.`),
  };
}

const row = (coil: string, flags: string[], verdict: Verdict | null = null, slope: number | null = null, reference = 400): FleetRow =>
  ({ coil, history: history(coil, flags, slope, reference), latest: survey(coil, verdict), surveys: 3 });

const failed: Verdict = { status: 'fail', findings: ['degraded'], checks: [], explanations: ['ampere-turns 96 A vs 120 A on the label.'] };
const undecided: Verdict = { status: 'inconclusive', findings: [], checks: [], explanations: ['To decide radius: add near readings.'] };

describe('attentionList()', () => {
  it('attentionList() orders failed spec > geometry change > degrading > unreadable files > inconclusive > not fitted, and leaves healthy coils out', () => {
    const rows: FleetRow[] = [
      { coil: null, history: null, latest: survey(null, null, null), surveys: 1 },
      row('IN-1', [], undecided),
      row('OK-1', [], null, 1),
      row('DG-1', ['degrading'], null, -30),
      row('GC-1', ['geometry-changed']),
      row('FS-1', ['failed-spec'], failed),
    ];
    const items = attentionList(rows, [{ source: 'broken.csv', reason: 'not text' }]);
    expect(items.map((item) => item.subject)).toEqual(['FS-1', 'GC-1', 'DG-1', 'files not used', 'IN-1', 'anonymous.csv']);
    expect(items[0]!.reasons).toEqual(['failed its spec (degraded)']);
    expect(items[0]!.evidence).toEqual(['ampere-turns 96 A vs 120 A on the label.']);
    expect(items[3]).toMatchObject({ kind: 'unreadable', evidence: ['broken.csv: not text'] });
  });

  it('attentionList() puts a coil with more reasons first, then the faster relative decline, and gives the first sentence of every reason before the rest', () => {
    const items = attentionList([
      row('SLOW', ['degrading'], null, -10, 400),
      row('FAST', ['degrading'], null, -10, 100),
      row('BOTH', ['degrading', 'failed-spec'], { ...failed, explanations: ['first verdict sentence.', 'second verdict sentence.'] }, -10),
      row('SPEC', ['failed-spec'], failed),
    ], []);
    expect(items.map((item) => item.subject)).toEqual(['BOTH', 'SPEC', 'FAST', 'SLOW']);
    expect(items[0]!.reasons).toEqual(['failed its spec (degraded)', 'degrading -10 A/yr']);
    expect(items[0]!.evidence).toEqual(['first verdict sentence.', 'degrading: evidence for BOTH.', 'second verdict sentence.']);
  });

  it('attentionList() names a threshold level the fitted curve never reaches (a reason `fit` exits 1 for), with the analysis\'s sentence', () => {
    const base = row('TH-1', []);
    const threshold = { level: { value: 100, unit: 'T' as const }, model: 'loop' as const, distance: null, extrapolated: false, naive: null, notes: ['The fitted loop field stays below 100 T everywhere.', 'On the coil axis.'] };
    const items = attentionList([{ ...base, latest: { ...base.latest, thresholds: [threshold] } }], []);
    expect(items).toMatchObject([{ subject: 'TH-1', reasons: ['a threshold level was not found on the fitted curve'], evidence: ['The fitted loop field stays below 100 T everywhere.'] }]);
  });

  it('attentionList() of a healthy fleet with no unreadable file is empty', () => {
    expect(attentionList([row('OK-1', []), row('OK-2', [], null, 3)], [])).toEqual([]);
  });
});
