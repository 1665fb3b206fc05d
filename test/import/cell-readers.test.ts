import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { detectDelimiter } from '../../src/io/import/detect-delimiter';
import { looksBinary } from '../../src/io/import/looks-binary';
import { parseDate } from '../../src/io/import/parse-date';
import { parseReadingType } from '../../src/io/import/parse-reading-type';
import { readNumber } from '../../src/io/import/read-number';

describe('readNumber()', () => {
  it('readNumber(" 12,5 ", true) reads a decimal comma as 12.5 (doc example)', () => {
    expect(readNumber(' 12,5 ', true)).toBe(12.5);
  });

  it('readNumber() reads plain decimals, signs, exponents and a U+2212 minus', () => {
    // the decimal value of each string as written; U+2212 is the minus sign (Unicode)
    expect([readNumber('12', false), readNumber('-0.5', false), readNumber('.25', false), readNumber('1e-3', false), readNumber('+5.', false), readNumber('\u22122', false)])
      .toEqual([12, -0.5, 0.25, 0.001, 5, -2]);
  });

  it('readNumber() refuses what Number() would accept but a meter never writes', () => {
    // JavaScript Number('') is 0, Number('0x10') is 16, Number('Infinity') is Infinity (ECMA-262 StringToNumber)
    for (const text of ['', '  ', '0x10', '0b1', 'Infinity', '1_000', '1,2', '1.2.3', '1e', '--1']) expect(readNumber(text, false), text).toBeNaN();
  });

  it('readNumber() with a decimal comma refuses a cell with both marks rather than guess thousands', () => {
    expect(readNumber('1.234,5', true)).toBeNaN();
    expect(readNumber('1,2,3', true)).toBeNaN();
  });
});

describe('parseDate()', () => {
  it('parseDate("2026/3/14 09:30") is "2026-03-14" (doc example)', () => {
    expect(parseDate('2026/3/14 09:30')).toBe('2026-03-14');
  });

  it('parseDate() reads ISO dates, date-times and day-first dotted dates', () => {
    // ISO 8601 calendar date; 14.03.2026 is day-first dotted (DIN 5008)
    expect([parseDate('2026-03-14'), parseDate('2026-03-14T10:00:00Z'), parseDate('14.03.2026')]).toEqual(['2026-03-14', '2026-03-14', '2026-03-14']);
  });

  it('parseDate() refuses slashed year-last dates and impossible days', () => {
    // Gregorian calendar: 2024 is a leap year, 2025 and 1900 are not
    expect(parseDate('2024-02-29')).toBe('2024-02-29');
    for (const text of ['03/04/2026', '2025-02-29', '1900-02-29', '2026-04-31', '2026-13-01', 'yesterday']) expect(parseDate(text), text).toBeNull();
  });
});

describe('parseReadingType()', () => {
  it('parseReadingType("True RMS") is "rms" (doc example) and a bare AC is refused', () => {
    expect(parseReadingType('True RMS')).toBe('rms');
    expect([parseReadingType('DC'), parseReadingType('pk')]).toEqual(['dc', 'peak']);
    expect(parseReadingType('AC')).toBeNull();
  });
});

describe('detectDelimiter()', () => {
  it('detectDelimiter("distance (mm);B (mT)", ["10;1,25"]) is ";" (doc example)', () => {
    expect(detectDelimiter('distance (mm);B (mT)', ['10;1,25'])).toBe(';');
  });

  it('detectDelimiter() prefers the delimiter that gives every sample line the header width', () => {
    expect(detectDelimiter('a,b,c', ['1,2,3', '4,5,6'])).toBe(',');
    expect(detectDelimiter('a\tb', ['1,5\t2'])).toBe('\t');
    expect(detectDelimiter('"x, y";z', ['1;2'])).toBe(';');
  });
});

describe('looksBinary()', () => {
  it('looksBinary() passes text and names NUL bytes, workbooks and unreadable characters', () => {
    expect(looksBinary('distance (mm),B (mT)\n0,1\n')).toBeNull();
    expect(looksBinary('a\u0000b')).toContain('NUL');
    expect(looksBinary('PK\u0003\u0004rest')).toContain('workbook');
    expect(looksBinary('\uFFFD'.repeat(10) + 'abc')).toContain('unreadable characters');
  });
});

describe('readNumber() against the decimal grammar', () => {
  it('readNumber() accepts exactly the strings of /^[+-]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][+-]?\\d+)?$/ (property)', () => {
    // the plain decimal grammar written as a regular expression, an independent statement of what a meter writes
    const grammar = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/u;
    const alphabet = fc.constantFrom(...'0123456789+-.eExXbBoOInfity,'.split(''));
    fc.assert(
      fc.property(fc.array(alphabet, { maxLength: 10 }).map((chars) => chars.join('')), (text) => {
        const value = readNumber(text, false);
        if (grammar.test(text)) expect(value).toBe(Number(text));
        else expect(value).toBeNaN();
      }),
      { numRuns: 3000 },
    );
  });
});
