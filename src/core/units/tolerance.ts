import { RingfallError } from '../errors';
import { parseQuantity } from './parse-quantity';
import type { QuantityKind } from './unit-table';

/**
 * A tolerance or standard uncertainty written as "10%", "0.2 mT", or "1.5%+2µT":
 * relative part (a fraction, 0.015 for 1.5 %) plus an absolute part in SI.
 * The bound for a value x is relative·|x| + absolute (linear sum, as instrument
 * accuracy specs "±(p % of reading + c)" are written; common practice).
 */
export interface RelativePlusAbsolute {
  readonly relative: number;
  readonly absolute: number;
}

/**
 * Parse "1.5%+2µT", "2%", "5uT", "1.5 % + 2 µT".
 * @throws RingfallError code `TOLERANCE_SYNTAX`
 * @example parseRelativePlusAbsolute('1.5%+2µT', 'field') // { relative: 0.015, absolute: 2e-6 }
 */
export function parseRelativePlusAbsolute(text: string, kind: QuantityKind, what = 'tolerance'): RelativePlusAbsolute {
  const parts = text.split('+').map((p) => p.trim()).filter((p) => p !== '');
  if (parts.length === 0 || parts.length > 2) {
    throw new RingfallError(
      'TOLERANCE_SYNTAX',
      `${what}: "${text}" is not a percentage, a quantity, or both. Write it like "1.5%+2µT", "10%" or "0.2mT".`,
      { value: text },
    );
  }
  let relative = 0;
  let absolute = 0;
  for (const part of parts) {
    const percent = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*%$/.exec(part);
    if (percent) {
      relative += Number(percent[1]) / 100;
    } else {
      try {
        absolute += parseQuantity(part, kind, what).value;
      } catch (cause) {
        throw new RingfallError(
          'TOLERANCE_SYNTAX',
          `${what}: "${part}" in "${text}" is neither a percentage nor a ${kind}. Write it like "1.5%+2µT", "10%" or "0.2mT".`,
          { value: text, cause },
        );
      }
    }
  }
  if (!Number.isFinite(relative)) {
    throw new RingfallError('TOLERANCE_SYNTAX', `${what}: "${text}" is not a finite percentage. Write it like "1.5%+2µT", "10%" or "0.2mT".`, { value: text });
  }
  if (relative < 0 || absolute < 0) {
    throw new RingfallError('TOLERANCE_SYNTAX', `${what}: "${text}" is negative. Give a positive tolerance.`, { value: text });
  }
  return { relative, absolute };
}
