import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { parseQuantity, parseRelativePlusAbsolute, formatQuantity, lookupUnit } from './index';
import { RingfallError } from '../errors';
import { expectClose } from '../../../test/support/expect-close';

/** The code of the RingfallError an action throws (the test fails if it throws anything else or nothing). */
function codeOf(action: () => unknown): string {
  try {
    action();
  } catch (error) {
    expect(error).toBeInstanceOf(RingfallError);
    return (error as RingfallError).code;
  }
  throw new Error('expected a RingfallError');
}

describe('parseQuantity()', () => {
  it('parseQuantity() reads a number and a unit with or without a space', () => {
    // CONTRACT.md examples; 1 mm = 1e-3 m exactly (SI Brochure 9th ed., prefixes)
    expect(parseQuantity('45mm', 'length').value).toBe(0.045);
    expect(parseQuantity('45 mm', 'length').value).toBe(0.045);
    expectClose(parseQuantity('0.5mT', 'field').value, 5e-4, { rel: 1e-15 });
    expect(parseQuantity('120A', 'current').value).toBe(120);
  });

  it('parseQuantity() converts gauss and inches with the exact NIST SP 811 factors', () => {
    // NIST SP 811 (2008) App. B.9: 1 G = 1e-4 T exactly; B.8: 1 in = 2.54e-2 m exactly
    expectClose(parseQuantity('5 G', 'field').value, 5e-4, { rel: 1e-15 });
    expectClose(parseQuantity('1 kG').value, 0.1, { rel: 1e-15 });
    expectClose(parseQuantity('10 mG').value, 1e-6, { rel: 1e-15 });
    expect(parseQuantity('1in', 'length').value).toBe(0.0254);
  });

  it('parseQuantity() accepts µT, μT (Greek mu) and uT alike', () => {
    // SI Brochure: µ = 1e-6; the micro sign U+00B5 and Greek mu U+03BC are both written
    for (const text of ['2 µT', '2μT', '2uT', '2 UT']) expectClose(parseQuantity(text, 'field').value, 2e-6, { rel: 1e-15 });
  });

  it('parseQuantity() rejects a unit of the wrong kind with code QUANTITY_KIND', () => {
    // --fix radius=5mT is a field where a length is needed (issue text)
    const thrown = (() => { try { parseQuantity('5mT', 'length', '--fix radius'); } catch (e) { return e; } })();
    expect(thrown).toBeInstanceOf(RingfallError);
    expect((thrown as RingfallError).code).toBe('QUANTITY_KIND');
    expect((thrown as RingfallError).message).toContain('--fix radius');
    expect((thrown as RingfallError).message).toContain('length');
  });

  it('parseQuantity() rejects unknown and missing units with code QUANTITY_UNIT', () => {
    expect(() => parseQuantity('5 furlongs', 'length')).toThrow(/unknown unit "furlongs"/);
    expect(() => parseQuantity('5', 'field')).toThrow(/has no unit/);
    expect(() => parseQuantity('abc', 'field')).toThrow(RingfallError);
    expect(codeOf(() => parseQuantity('5 furlongs', 'length'))).toBe('QUANTITY_UNIT');
    expect(codeOf(() => parseQuantity('5', 'field'))).toBe('QUANTITY_UNIT');
    expect(codeOf(() => parseQuantity('abc', 'field'))).toBe('QUANTITY_SYNTAX');
  });

  it('parseQuantity() rejects a number too large for a double with QUANTITY_SYNTAX and an example', () => {
    expect(codeOf(() => parseQuantity('1e999 mT', 'field'))).toBe('QUANTITY_SYNTAX');
    expect(() => parseQuantity('1e999 mT', 'field')).toThrow(/"1e999 mT" is not a finite number\. Write it like "0\.5mT"/);
  });

  it('parseQuantity() round-trips any finite value through format and parse (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 10, noNaN: true }), (tesla) => {
        const text = formatQuantity(tesla, 'field', { significant: 15 });
        expectClose(parseQuantity(text, 'field').value, tesla, { rel: 1e-12 });
      }),
    );
  });
});

describe('parseRelativePlusAbsolute()', () => {
  it('parseRelativePlusAbsolute() splits "1.5%+2uT" into relative and absolute parts', () => {
    // CONTRACT.md --uncertainty example
    const parsed = parseRelativePlusAbsolute('1.5%+2uT', 'field');
    expectClose(parsed.relative, 0.015, { rel: 1e-15 });
    expectClose(parsed.absolute, 2e-6, { rel: 1e-15 });
    expect(parseRelativePlusAbsolute('10%', 'field')).toEqual({ relative: 0.1, absolute: 0 });
  });

  it('parseRelativePlusAbsolute() rejects text that is neither with code TOLERANCE_SYNTAX', () => {
    expect(() => parseRelativePlusAbsolute('ten percent', 'field')).toThrow(/neither a percentage/);
    expect(codeOf(() => parseRelativePlusAbsolute('ten percent', 'field'))).toBe('TOLERANCE_SYNTAX');
    expect(codeOf(() => parseRelativePlusAbsolute('-2%', 'field'))).toBe('TOLERANCE_SYNTAX');
    // an infinite percentage would pass every check silently
    expect(codeOf(() => parseRelativePlusAbsolute('1e999%', 'field'))).toBe('TOLERANCE_SYNTAX');
    expect(() => parseRelativePlusAbsolute('1e999%', 'field', '--uncertainty')).toThrow(/--uncertainty: "1e999%" is not a finite percentage/);
  });
});

describe('formatQuantity()', () => {
  it('formatQuantity() picks mT, µT, mm as a reader expects', () => {
    // SI prefixes (SI Brochure 9th ed. §3); 4 significant digits is our default (regression pin, not truth)
    expect(formatQuantity(0.0012346, 'field')).toBe('1.235 mT');
    expect(formatQuantity(2.5e-5, 'field')).toBe('25.00 µT');
    expect(formatQuantity(0.045, 'length')).toBe('45.00 mm');
  });

  it('lookupUnit() returns undefined for an unknown unit', () => {
    expect(lookupUnit('parsec')).toBeUndefined();
  });

  it('lookupUnit() refuses spellings where a capital M reads as mega (MT, MG, Mm) and keeps the unambiguous all-caps ones (MM, UT, GAUSS)', () => {
    // SI Brochure 9th ed., Table 7: M = mega (1e6), m = milli (1e-3); "MM" and "UT" are no SI symbol of anything else
    for (const spelling of ['MT', 'Mt', 'MG', 'Mg', 'Mm']) expect(lookupUnit(spelling), spelling).toBeUndefined();
    expect(lookupUnit('MM')?.symbol).toBe('mm');
    expect(lookupUnit('UT')?.symbol).toBe('uT');
    expect(lookupUnit('GAUSS')?.symbol).toBe('G');
    expect(codeOf(() => parseQuantity('0.5 MT', 'field'))).toBe('QUANTITY_UNIT');
    expect(() => parseQuantity('0.5 MT', 'field')).toThrow(/megatesla.*write "mT"/u);
  });

  it('lookupUnit() and parseQuantity() treat Object.prototype names as unknown units', () => {
    for (const spelling of ['constructor', '__proto__', 'toString', 'hasOwnProperty']) {
      expect(lookupUnit(spelling), spelling).toBeUndefined();
      expect(codeOf(() => parseQuantity(`1 ${spelling}`)), spelling).toBe('QUANTITY_UNIT');
    }
  });
});
