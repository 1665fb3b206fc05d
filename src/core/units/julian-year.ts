/**
 * The one year of ringfall: the Julian year, exactly 365.25 days of 86 400 s (the IAU's
 * year, symbol "a", and the unit of Julian epochs; IAU 1976 System of Astronomical
 * Constants). Every per-year figure uses it: the ampere-turn trend (A/yr) divides time by
 * it, and the fleet history chart places a survey at its Julian epoch, so the chart's
 * slope and the printed trend share one year.
 */
export const julianYearMs = 365.25 * 86_400_000;

/** 2000-01-01 12:00 UTC, the epoch J2000.0 (JD 2451545.0; UTC for TT, ~1 min apart). */
const j2000Ms = Date.UTC(2000, 0, 1, 12);

/**
 * Julian years from one date to another, as `Date.parse` reads them (ISO dates: UTC midnight).
 * @example yearsBetween('2025-01-01', '2026-01-01') // 0.9993155373032 (365 days)
 */
export function yearsBetween(from: string, to: string): number {
  return (Date.parse(to) - Date.parse(from)) / julianYearMs;
}

/**
 * The Julian epoch of an ISO date (YYYY-MM-DD…) taken at noon UTC: 2000 + Julian years since
 * J2000.0 (Meeus, Astronomical Algorithms, 2nd ed., ch. 21: J = 2000 + (JD − 2451545)/365.25);
 * null when the text does not start with a date.
 * @example julianEpoch('2000-01-01') // 2000; julianEpoch('2026-07-02') // 2026.4996577687
 */
export function julianEpoch(date: string | null): number | null {
  const match = date ? /^(\d{4})-(\d{2})-(\d{2})/.exec(date) : null;
  if (!match) return null;
  const noon = Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]), 12);
  return Number.isFinite(noon) ? 2000 + (noon - j2000Ms) / julianYearMs : null;
}
