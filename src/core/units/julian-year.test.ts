import { describe, expect, it } from 'vitest';
import { julianEpoch, julianYearMs, yearsBetween } from './julian-year';

/** Julian Day of a Gregorian calendar date at 0h UT (Meeus, Astronomical Algorithms, 2nd ed., eq. 7.1). */
function meeusJulianDay(year: number, month: number, day: number): number {
  const y = month > 2 ? year : year - 1;
  const m = month > 2 ? month : month + 12;
  const a = Math.floor(y / 100);
  const b = 2 - a + Math.floor(a / 4);
  return Math.floor(365.25 * (y + 4716)) + Math.floor(30.6001 * (m + 1)) + day + b - 1524.5;
}

describe('the Julian year', () => {
  it('is 365.25 days of 86 400 s', () => {
    // IAU 1976 System of Astronomical Constants: the Julian year, 365.25 d of 86 400 s
    expect(julianYearMs).toBe(31_557_600_000);
  });

  it('yearsBetween() counts Julian years between two dates', () => {
    // 2024 is a leap year (Gregorian rule): 366 days, 366 / 365.25 Julian years
    expect(yearsBetween('2024-01-01', '2025-01-01')).toBe(366 / 365.25);
    // four Gregorian years holding one leap day are exactly four Julian years (1461 days)
    expect(yearsBetween('2025-03-11', '2029-03-11')).toBe(4);
    expect(yearsBetween('2026-03-10', '2025-03-11')).toBe(-364 / 365.25);
  });

  it('julianEpoch() is J = 2000 + (JD − 2451545)/365.25 at noon of the date', () => {
    // J2000.0 is 2000 January 1, 12h (JD 2451545.0; Meeus, Astronomical Algorithms, ch. 21)
    expect(julianEpoch('2000-01-01')).toBe(2000);
    // independent method: the Julian Day by Meeus's eq. 7.1, plus half a day for noon
    for (const [text, y, m, d] of [['2026-07-02', 2026, 7, 2], ['2025-03-11', 2025, 3, 11], ['1999-12-31', 1999, 12, 31], ['2028-02-29', 2028, 2, 29]] as const) {
      const expected = 2000 + (meeusJulianDay(y, m, d) + 0.5 - 2451545) / 365.25;
      expect(julianEpoch(text)).toBeCloseTo(expected, 10);
    }
    // a date with a time after it is read by its date; text that is no date gives null
    expect(julianEpoch('2026-07-02T18:00:00Z')).toBe(julianEpoch('2026-07-02'));
    expect(julianEpoch('not a date')).toBeNull();
    expect(julianEpoch(null)).toBeNull();
  });
});
