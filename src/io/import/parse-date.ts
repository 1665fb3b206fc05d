const yearFirst = /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})(?:[T\s].*)?$/u;
const dayFirstDotted = /^(\d{1,2})\.(\d{1,2})\.(\d{4})(?:\s.*)?$/u;

/**
 * Read a survey date as ISO 8601 `YYYY-MM-DD`. Accepts year-first dates with `-`, `/` or
 * `.` (ISO 8601; a time after "T" or a space is dropped) and the day-first dotted form
 * `14.03.2026` (DIN 5008). Slashed dates with the year last (03/04/2026) are refused:
 * month-first and day-first readings both exist and a guess could swap them.
 * Days are checked against the month, with Gregorian leap years.
 *
 * @returns the ISO date, or null when the text is not a date in these forms
 * @example parseDate('2026/3/14 09:30') // '2026-03-14'
 */
export function parseDate(text: string): string | null {
  const trimmed = text.trim();
  const match = yearFirst.exec(trimmed);
  const dotted = match ? null : dayFirstDotted.exec(trimmed);
  const [year, month, day] = match
    ? [Number(match[1]), Number(match[2]), Number(match[3])]
    : dotted ? [Number(dotted[3]), Number(dotted[2]), Number(dotted[1])] : [0, 0, 0];
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return null;
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}
