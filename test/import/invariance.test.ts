import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { importSurveys } from '../../src/io/index';
import { expectClose } from '../support/expect-close';

/** Write an integer divided by 10^places as exact decimal text: shift(1234, 3) → "1.234". */
function shift(value: number, places: number, decimalMark = '.'): string {
  const digits = String(Math.abs(value)).padStart(places + 1, '0');
  const whole = digits.slice(0, digits.length - places);
  const fraction = digits.slice(digits.length - places).replace(/0+$/u, '');
  return `${value < 0 ? '-' : ''}${whole}${fraction === '' ? '' : decimalMark + fraction}`;
}

/** Pythagorean quadruples a² + b² + c² = d² with d dividing 63. */
const quadruples = [[1, 2, 2, 3], [2, 3, 6, 7], [1, 4, 8, 9], [4, 4, 7, 9]] as const;

/** One survey (distance in mm, field in multiples of 63 µT) written five ways. */
function spellings(rows: readonly { mm: number; units63: number; turn: number }[]): Record<string, string> {
  const microtesla = (row: { units63: number }) => 63 * row.units63;
  const lines = (make: (row: (typeof rows)[number]) => string) => rows.map(make).join('\n');
  return {
    'mT, mm, comma': `distance (mm),B (mT)\n${lines((r) => `${r.mm},${shift(microtesla(r), 3)}`)}\n`,
    'G, cm': `z [cm],field_G\n${lines((r) => `${shift(r.mm, 1)},${shift(microtesla(r), 2)}`)}\n`,
    'µT, m, tab': `Distance/m\tB [µT]\n${lines((r) => `${shift(r.mm, 3)}\t${microtesla(r)}`)}\n`,
    'semicolon, decimal comma, BOM': `\uFEFFdistance_mm;B_mT\r\n${rows.map((r) => `${r.mm};${shift(microtesla(r), 3, ',')}`).join('\r\n')}\r\n`,
    'Bx, By, Bz': `distance (mm),Bx (uT),By (uT),Bz (uT)\n${lines((r) => {
      const [a, b, c, d] = quadruples[r.turn % quadruples.length] as readonly [number, number, number, number];
      const scale = microtesla(r) / d;
      return `${r.mm},${a * scale},${b * scale},${c * scale}`;
    })}\n`,
  };
}

describe('importSurveys() invariance to spelling', () => {
  it('importSurveys() gives the same readings to rounding for mT/mm/comma, G/cm, µT/m/tab, semicolon+decimal comma+BOM and Bx/By/Bz', () => {
    const row = fc.record({ mm: fc.integer({ min: 0, max: 2000 }), units63: fc.integer({ min: 1, max: 40000 }), turn: fc.nat(3) });
    fc.assert(
      fc.property(fc.array(row, { minLength: 3, maxLength: 40 }), (rows) => {
        const imported = Object.entries(spellings(rows)).map(([name, text]) => [name, importSurveys(text, { source: name })] as const);
        for (const [name, result] of imported) {
          const readings = result.surveys[0]?.readings ?? [];
          expect(readings, name).toHaveLength(rows.length);
          rows.forEach((r, i) => {
            // exact by construction: mm/1000 m and 63·k µT; one rounding per conversion step
            expectClose(readings[i]?.distance ?? NaN, r.mm / 1000, { rel: 4e-16, abs: 0 }, `${name} distance, row ${i}`);
            expectClose(readings[i]?.field ?? NaN, (63 * r.units63) / 1e6, { rel: 4e-16 }, `${name} field, row ${i}`);
            expect(readings[i]?.line, name).toBe(i + 2);
          });
        }
      }),
      { numRuns: 60 },
    );
  });

  it('importSurveys() reads the five spellings with the detection each one calls for', () => {
    const result = Object.fromEntries(
      Object.entries(spellings([{ mm: 5, units63: 10, turn: 1 }, { mm: 10, units63: 5, turn: 2 }, { mm: 20, units63: 2, turn: 3 }]))
        .map(([name, text]) => [name, importSurveys(text, { source: name }).detection]),
    );
    expect(result['G, cm']?.columns.map((c) => c.unit)).toEqual(['cm', 'G']);
    expect(result['µT, m, tab']).toMatchObject({ delimiter: '\t' });
    expect(result['semicolon, decimal comma, BOM']).toMatchObject({ delimiter: ';', decimalComma: true, byteOrderMark: true, lineBreak: 'CRLF' });
    expect(result['Bx, By, Bz']?.fieldKind).toBe('components');
  });
});
