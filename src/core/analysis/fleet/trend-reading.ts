import { studentTQuantile } from '../../stats';

/** What a coil's ampere-turn trend says, in one word (FleetCoil.trend.status). */
export type TrendStatus = 'declining' | 'rising' | 'steady' | 'undetermined';

/** A trend's reading: its word, the band "steady" is judged against, and what would decide it. */
export interface TrendReading {
  readonly status: TrendStatus;
  /** Half-width of the steady band, A/yr: the tolerance of the reference per year. */
  readonly band: number;
  /**
   * For 'undetermined': how many more surveys, at the same interval and precision, would
   * make the interval decide (null when decided, or when more than `moreSurveysShown`
   * would be needed or there is no interval to project).
   */
  readonly moreSurveys: number | null;
}

/** Beyond this many more surveys the reading says "many more" instead of a number. */
export const moreSurveysShown = 50;

const normal975 = 1.959963984540054;

/**
 * Read a trend of ampere-turns per year with its 95 % interval [low, high]:
 * - **declining** when the whole interval lies below zero, **rising** when above;
 * - **steady** when the whole interval lies inside ±band, where band is the reference's
 *   tolerance per year (a coil that takes at least a year to drift across its tolerance:
 *   ringfall's stated rule, common practice for periodic checks, not from a standard);
 * - **undetermined** otherwise (the interval crosses zero and reaches past the band).
 *
 * For an undetermined trend, `moreSurveys` is the least k for which k more surveys, spaced
 * and as precise as these, would shrink the interval enough to decide, the slope held at its
 * estimate: for n equally spaced points the slope's variance goes as 1/(n(n² − 1))
 * (Bevington & Robinson 3rd ed. §6.3, from memory), so the half-width scales by
 * √(n(n² − 1) / (m(m² − 1))) for m = n + k, with t_{0.975, m−2} for the new interval.
 *
 * @param slope fitted slope, A/yr
 * @param ci95 its 95 % interval
 * @param band half-width of the steady band, A/yr (> 0)
 * @param surveys the dated surveys the slope was fitted to (n ≥ 2)
 * @example readTrend(-1, [-3, 1], 20, 5).status // 'steady'
 */
export function readTrend(slope: number, ci95: readonly [number, number], band: number, surveys: number): TrendReading {
  const [low, high] = ci95;
  if (high < 0) return { status: 'declining', band, moreSurveys: null };
  if (low > 0) return { status: 'rising', band, moreSurveys: null };
  if (low >= -band && high <= band) return { status: 'steady', band, moreSurveys: null };
  const halfWidth = (high - low) / 2;
  // the half-width that decides: below |slope| (sign settled) or below band − |slope| (steady)
  const needed = Math.max(Math.abs(slope), band - Math.abs(slope));
  if (!(halfWidth > 0) || !(needed > 0) || surveys < 2) return { status: 'undetermined', band, moreSurveys: null };
  const spread = (n: number) => n * (n * n - 1);
  const standardError = halfWidth / quantileFor(surveys);
  for (let k = 1; k <= moreSurveysShown; k += 1) {
    const m = surveys + k;
    if (quantileFor(m) * standardError * Math.sqrt(spread(surveys) / spread(m)) < needed) return { status: 'undetermined', band, moreSurveys: k };
  }
  return { status: 'undetermined', band, moreSurveys: null };
}

/** The quantile the interval was made with: t_{0.975, n−2} for n > 2 (as coilHistory uses), else normal. */
function quantileFor(surveys: number): number {
  return surveys > 2 ? studentTQuantile(0.975, surveys - 2) : normal975;
}

/**
 * The trend's word with its reason, for people: "declining", "steady (within ±18 A/yr, the
 * tolerance per year)", "undetermined — about 3 more surveys at the same interval and
 * precision would decide".
 */
export function trendWords(reading: TrendReading, describeRate: (value: number) => string): string {
  switch (reading.status) {
    case 'declining':
    case 'rising':
      return `${reading.status} (the whole 95 % interval is ${reading.status === 'declining' ? 'below' : 'above'} zero)`;
    case 'steady':
      return `steady (the whole 95 % interval lies within ±${describeRate(reading.band)}, the tolerance per year)`;
    case 'undetermined':
      return reading.moreSurveys === null
        ? `undetermined — the interval spans both a change and ±${describeRate(reading.band)}; many more surveys, or more precise ones, would decide`
        : `undetermined — about ${reading.moreSurveys} more survey${reading.moreSurveys === 1 ? '' : 's'} at the same interval and precision would decide`;
  }
}

/**
 * A coil history's flags and trend in one line for summaries: "degrading, failed-spec;
 * trend declining" or "trend undetermined — about 3 more surveys at the same interval and
 * precision would decide"; never "no flag" for a trend that is simply not known.
 */
export function historyHeadline(history: {
  readonly flags: readonly string[];
  readonly surveys: number;
  readonly trend: { readonly ampereTurnsPerYear: unknown; readonly status: TrendStatus; readonly steadyBand: { readonly value: number } | null; readonly moreSurveys: number | null };
}, describeRate: (value: number) => string): string {
  const flags = history.flags.length > 0 ? `${history.flags.join(', ')}; ` : '';
  const { trend } = history;
  if (trend.ampereTurnsPerYear === null) {
    return `${flags}trend undetermined — ${history.surveys === 1 ? 'one survey; a second dated survey would start a trend' : 'fewer than two dates with determined ampere-turns'}`;
  }
  if (trend.status === 'steady' && trend.steadyBand !== null) return `${flags}trend steady (within ±${describeRate(trend.steadyBand.value)})`;
  if (trend.status === 'undetermined') {
    return `${flags}trend undetermined — ${trend.moreSurveys === null ? 'many more surveys, or more precise ones, would decide' : `about ${trend.moreSurveys} more survey${trend.moreSurveys === 1 ? '' : 's'} at the same interval and precision would decide`}`;
  }
  return `${flags}trend ${trend.status}`;
}
