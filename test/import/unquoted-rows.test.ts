import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { importSurveys, importSurveysStreaming } from '../../src/io/index';

/**
 * Rows of a file without quotes are split by the importer itself (one row per line, cells
 * on the delimiter). The reference is papaparse (npm papaparse 5.7.1) reading the same file
 * with every data cell quoted, which takes its full quote-aware parser: quoting a cell that
 * holds no quote or line break does not change it (RFC 4180, section 2), so both must give
 * the same surveys, rejected rows, line numbers and blank-line counts.
 */
function quoteEveryCell(line: string): string {
  return line === '' ? '' : line.split(',').map((value) => `"${value}"`).join(',');
}

/** Everything the import says, without the detection record (which names the header cell as written). */
function outcome(text: string) {
  const { surveys, skipped, unassigned } = importSurveys(text, { source: 'rows.csv' });
  return { surveys, skipped, unassigned };
}

const cell = fc.oneof(
  fc.integer({ min: -50, max: 3000 }).map((n) => String(n / 10)),
  fc.constantFrom('', ' ', 'OL', '1e-3', '#12', '  4.5 ', '−2', 'abc', '1,5'),
);
const line = fc.oneof(
  fc.tuple(cell, cell).map(([a, b]) => `${a},${b}`),
  fc.tuple(cell, cell, cell).map(([a, b, c]) => `${a},${b},${c}`),
  cell,
  fc.constantFrom('', ',', '# a comment row', ',,'),
);

describe('unquoted rows read as papaparse reads them', () => {
  it('gives the same result as papaparse for generated quote-free files (LF and CR line ends, with and without a final line break)', () => {
    fc.assert(
      fc.property(fc.array(line, { minLength: 1, maxLength: 30 }), fc.constantFrom('\n', '\r', '\r\n'), fc.boolean(), (lines, newline, finalBreak) => {
        const text = `# coil: RQ-1${newline}distance (mm),B (mT)${newline}${lines.join(newline)}${finalBreak ? newline : ''}`;
        let direct: unknown;
        let reference: unknown;
        try {
          direct = outcome(text);
        } catch (error) {
          direct = (error as Error).message;
        }
        try {
          reference = outcome(`# coil: RQ-1${newline}distance (mm),B (mT)${newline}${lines.map(quoteEveryCell).join(newline)}${finalBreak ? newline : ''}`);
        } catch (error) {
          reference = (error as Error).message;
        }
        expect(direct).toEqual(reference);
      }),
      { numRuns: 300 },
    );
  });

  it('reads a quote-free file the same whole and streamed in small chunks', async () => {
    const text = `distance (mm);B (mT)\n${Array.from({ length: 200 }, (_, i) => `${i};${(1000 / (1 + i)).toFixed(3).replace('.', ',')}`).join('\n')}\n\n`;
    const whole = importSurveys(text, { source: 'semi.csv' });
    async function* chunks() {
      for (let i = 0; i < text.length; i += 7) yield text.slice(i, i + 7);
    }
    const streamed = await importSurveysStreaming(chunks(), { source: 'semi.csv' });
    expect(streamed.surveys).toEqual(whole.surveys);
    expect(whole.surveys[0]?.readings).toHaveLength(200);
  });
});
