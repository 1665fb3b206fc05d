import type { ProblemCode } from '../../core/error-codes';
import { printable } from '../../core/text/printable';

/**
 * Read a numeric cell: optional sign, digits with one decimal point, optional exponent
 * ("12", "-0.5", ".25", "1e-3"). With `decimalComma` a single comma is the decimal mark
 * ("12,5" → 12.5); a cell with both marks is not read, since "1.234,5" would need a
 * guess about thousands separators. A leading U+2212 minus sign is read as "-".
 * JavaScript's Number() does the conversion (correctly rounded, ECMA-262 StringToNumber);
 * the forms it accepts that a meter never writes (the empty cell, "Infinity", 0x/0b/0o
 * prefixes) are refused here.
 *
 * @returns the number (possibly ±Infinity for "1e999"), or NaN when the cell is not a number
 * @example readNumber(' 12,5 ', true) // 12.5
 */
export function readNumber(cell: string, decimalComma: boolean): number {
  let text = cell.length > 0 && cell.charCodeAt(0) > 32 && cell.charCodeAt(cell.length - 1) > 32 ? cell : cell.trim();
  if (text === '') return Number.NaN;
  let first = text.charCodeAt(0);
  if (first === 0x2212) {
    text = `-${text.slice(1)}`;
    first = 45;
  }
  if (decimalComma) {
    const comma = text.indexOf(',');
    if (comma !== -1) {
      if (text.includes('.') || text.indexOf(',', comma + 1) !== -1) return Number.NaN;
      text = `${text.slice(0, comma)}.${text.slice(comma + 1)}`;
    }
  }
  const value = Number(text);
  if (value !== value) return Number.NaN;
  if (first === 48 && text.length > 1) {
    const prefix = text.charCodeAt(1) | 32;
    if (prefix === 120 || prefix === 98 || prefix === 111) return Number.NaN;
  }
  if ((value === Infinity || value === -Infinity) && text.charCodeAt(first === 43 || first === 45 ? 1 : 0) === 73) return Number.NaN;
  return value;
}

/**
 * Why a cell gave no finite number: a stable code and a reason for people.
 * @param value what readNumber returned for the cell (NaN or ±Infinity)
 */
export function explainNumberCell(cell: string, header: string, value: number): { code: ProblemCode; reason: string } {
  const text = cell.trim();
  const column = shorten(header, 60);
  if (text === '') return { code: 'ROW_EMPTY_CELL', reason: `column "${column}" is empty. Fill in the value or delete the row.` };
  if (value === Infinity || value === -Infinity) {
    return { code: 'ROW_NOT_FINITE', reason: `column "${column}": "${shorten(text)}" is too large to be a number. Write the measured value.` };
  }
  if (/^[+-]?(?:nan|inf|infinity)$/iu.test(text)) {
    return { code: 'ROW_NOT_FINITE', reason: `column "${column}": "${shorten(text)}" is not a finite number. Write the measured value.` };
  }
  if (/^(?:o\.?l\.?|ovl|over|overload|over ?range|ofl)$/iu.test(text)) {
    return { code: 'ROW_OVER_RANGE', reason: `column "${column}": "${shorten(text)}" is the meter's over-range display, not a reading. Re-measure this point on a higher range.` };
  }
  const hint = /\d,\d/u.test(text)
    ? ' A comma in a number is read as a decimal comma only in files delimited by semicolons, and never together with a decimal point:' +
      ' elsewhere "1,700" could mean 1.7 or 1700. Write a decimal point, or save the file delimited by semicolons.'
    : '';
  return { code: 'ROW_NOT_A_NUMBER', reason: `column "${column}": "${shorten(text)}" is not a number.${hint} Correct the cell or delete the row.` };
}

/**
 * A cell or header as shown in a message: short when it is very long (fuzzed or corrupted
 * lines), with control characters escaped so the message stays one line (printable).
 */
export function shorten(text: string, limit = 40): string {
  return printable(text, limit);
}
