import { describe, expect, it } from 'vitest';
import { studentTQuantile } from '../../stats';
import { historyHeadline, readTrend } from './trend-reading';
import { weightedLine } from './weighted-line';

describe('readTrend(): what a coil\'s ampere-turn trend says', () => {
  // the same guarded reading as a spec check (ISO 14253-1:2017, JCGM 106:2012): a whole interval on one side decides
  it('reads declining or rising only when the whole 95 % interval is on one side of zero', () => {
    expect(readTrend(-30, [-50, -10], 20, 5).status).toBe('declining');
    expect(readTrend(30, [10, 50], 20, 5).status).toBe('rising');
    // a significant change inside the band is still a change: the sign is settled first
    expect(readTrend(-5, [-8, -2], 20, 5).status).toBe('declining');
  });

  // ringfall's stated steady band, the tolerance per year (docs/CONTRACT.md fleet section; common practice
  // for periodic checks, not from a standard), read with the same whole-interval rule
  it('reads steady when the whole interval lies inside ±band, and undetermined when it crosses zero and reaches past the band', () => {
    expect(readTrend(-1, [-15, 13], 20, 5).status).toBe('steady');
    expect(readTrend(-1, [-20, 20], 20, 5).status).toBe('steady');
    const open = readTrend(8.9, [-49.7, 67.6], 40, 5);
    expect(open.status).toBe('undetermined');
    expect(open.moreSurveys).toBeGreaterThan(0);
  });

  // slope variance of n equally spaced, equally precise points ∝ 1/(n(n² − 1)) (Bevington & Robinson §6.3,
  // from memory); checked here against weightedLine on simulated surveys, an independent computation
  it('projects more surveys as weightedLine would find them: same spacing, same precision', () => {
    const sigma = 10;
    const spacing = 0.25;
    const slopeSe = (n: number) => weightedLine(Array.from({ length: n }, (_, i) => i * spacing), Array.from({ length: n }, () => 400), Array.from({ length: n }, () => sigma)).slopeStandardError;
    const n = 5;
    const slope = 3;
    const half = studentTQuantile(0.975, n - 2) * slopeSe(n);
    const band = 40;
    const reading = readTrend(slope, [slope - half, slope + half], band, n);
    expect(reading.status).toBe('undetermined');
    const k = reading.moreSurveys!;
    // with k more surveys the interval decides (here: steady, inside ±band); with k − 1 it does not
    const decides = (m: number) => slope + studentTQuantile(0.975, m - 2) * slopeSe(m) <= band;
    expect(decides(n + k)).toBe(true);
    expect(decides(n + k - 1)).toBe(false);
  });

  // the cap of fifty is ringfall's own (trend-reading.ts moreSurveysShown); a zero-width interval at zero is steady by the rule above
  it('says "many more" rather than a number past fifty surveys, and nothing to project without an interval', () => {
    expect(readTrend(0.1, [-1000, 1000], 1, 3).moreSurveys).toBeNull();
    expect(readTrend(0, [0, 0], 0, 3).status).toBe('steady');
  });
});

describe('historyHeadline()', () => {
  const coil = (status: 'declining' | 'steady' | 'undetermined', moreSurveys: number | null, flags: string[] = [], surveys = 5) => ({
    flags,
    surveys,
    trend: { ampereTurnsPerYear: surveys > 1 ? { value: 1 } : null, status, steadyBand: { value: 40 }, moreSurveys },
  });
  const rate = (value: number) => `${value} A/yr`;

  it('never reads "no flag" for a trend that is not known', () => {
    expect(historyHeadline(coil('undetermined', 2), rate)).toBe('trend undetermined — about 2 more surveys at the same interval and precision would decide');
    expect(historyHeadline(coil('undetermined', null, [], 1), rate)).toBe('trend undetermined — one survey; a second dated survey would start a trend');
    expect(historyHeadline(coil('steady', null), rate)).toBe('trend steady (within ±40 A/yr)');
    expect(historyHeadline(coil('declining', null, ['degrading']), rate)).toBe('degrading; trend declining');
  });
});
