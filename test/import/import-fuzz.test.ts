import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { RingfallError } from '../../src/core/errors';
import { importSurveys, SurveyImporter, type ImportResult } from '../../src/io/index';

const source = 'fuzz.csv';
/** A hang check, not a speed target (those live in bench/import.bench.ts). */
const timeBoundMs = 2000;

/** Import, timing it; a RingfallError is an accepted outcome, anything else fails the property. */
function importOrError(text: string): ImportResult | RingfallError {
  const started = performance.now();
  let outcome: ImportResult | RingfallError;
  try {
    outcome = importSurveys(text, { source });
  } catch (error) {
    if (!(error instanceof RingfallError)) throw error;
    expect(error.code).toMatch(/^IMPORT_[A-Z_]+$/u);
    outcome = error;
  }
  expect(performance.now() - started).toBeLessThan(timeBoundMs);
  return outcome;
}

/** Every line that holds a data row, as reported back: used, rejected, skipped or unassigned. */
function accountedLines(result: ImportResult): number[] {
  const surveys = [...result.surveys, ...result.skipped.map((s) => s.survey)];
  return [
    ...surveys.flatMap((s) => [...s.readings.map((r) => r.line), ...s.rejected.map((r) => r.line)]),
    ...result.unassigned.map((r) => r.line),
  ].sort((a, b) => a - b);
}

const header = 'coil,distance (mm),B (mT),uncertainty (uT)';
const validRow = fc.record({
  coil: fc.constantFrom('A', 'B'),
  mm: fc.integer({ min: 0, max: 500 }),
  field: fc.double({ min: -2, max: 20, noNaN: true }),
  uncertainty: fc.integer({ min: 1, max: 50 }),
}).map((r) => `${r.coil},${r.mm},${r.field},${r.uncertainty}`);

/** Cell contents that break rows in every way the issue lists, plus delimiters and quotes. */
const badCell = fc.oneof(
  fc.constantFrom('', 'NaN', 'Infinity', '-inf', '1e308', '-1e308', '1e999', 'OL', '12,5', '1.2.3', '0x10', '"', '""', ',', ',,,', '\t', ';', '#', '\u0000', '\uFFFD', 'µ'),
  fc.string({ maxLength: 12 }),
  fc.string({ unit: 'binary', maxLength: 12 }),
  fc.integer({ min: 1000, max: 100_000 }).map((n) => '9'.repeat(n)),
);

describe('importSurveys() never crashes, never hangs, never drops a row (fast-check)', () => {
  it('importSurveys() on random bytes returns a result or a RingfallError', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 2000 }), (bytes) => {
        const outcome = importOrError(new TextDecoder().decode(bytes));
        if (!(outcome instanceof RingfallError)) expect(outcome.counts.used + outcome.counts.rejected).toBe(outcome.counts.dataRows);
      }),
      { numRuns: 300 },
    );
  });

  it('importSurveys() on random text after a valid header accounts for every data row', () => {
    fc.assert(
      fc.property(fc.array(fc.string({ unit: 'grapheme', maxLength: 40 }), { maxLength: 30 }), (lines) => {
        const outcome = importOrError(`${header}\n${lines.join('\n')}`);
        if (outcome instanceof RingfallError) return;
        expect(outcome.counts.used + outcome.counts.rejected).toBe(outcome.counts.dataRows);
        expect(accountedLines(outcome)).toHaveLength(outcome.counts.dataRows);
      }),
      { numRuns: 200 },
    );
  });

  it('importSurveys() on shuffled valid rows gives the same readings, each on its own line', () => {
    fc.assert(
      fc.property(fc.array(validRow, { minLength: 6, maxLength: 40 }).chain((rows) => fc.tuple(fc.constant(rows), fc.shuffledSubarray(rows, { minLength: rows.length, maxLength: rows.length }))), ([rows, shuffled]) => {
        const readingsOf = (text: string) => {
          const outcome = importOrError(text);
          if (outcome instanceof RingfallError) return [outcome.code];
          return [...outcome.surveys, ...outcome.skipped.map((s) => s.survey)]
            .flatMap((s) => s.readings.map((r) => `${s.coil} ${r.distance} ${s.notes.some((n) => n.includes('reversed')) ? -r.field : r.field} ${r.standardUncertainty}`))
            .sort();
        };
        expect(readingsOf(`${header}\n${shuffled.join('\n')}\n`)).toEqual(readingsOf(`${header}\n${rows.join('\n')}\n`));
        const outcome = importOrError(`${header}\n${shuffled.join('\n')}\n`);
        if (!(outcome instanceof RingfallError)) expect(accountedLines(outcome)).toEqual(shuffled.map((_, i) => i + 2));
      }),
      { numRuns: 100 },
    );
  });

  it('importSurveys() with random cell corruptions uses or reports every data line exactly once', () => {
    const corruption = fc.record({ row: fc.nat(), cell: fc.nat(3), text: badCell });
    fc.assert(
      fc.property(fc.array(validRow, { minLength: 3, maxLength: 30 }), fc.array(corruption, { maxLength: 8 }), (rows, corruptions) => {
        const cells = rows.map((row) => row.split(','));
        for (const { row, cell, text } of corruptions) {
          const target = cells[row % cells.length] as string[];
          target[cell] = text;
        }
        const lines = cells.map((c) => c.join(','));
        const outcome = importOrError(`${header}\n${lines.join('\n')}\n`);
        if (outcome instanceof RingfallError) {
          expect(outcome.code).toMatch(/IMPORT_TOO_FEW_ROWS|IMPORT_BINARY/u);
          return;
        }
        expect(outcome.counts.used + outcome.counts.rejected).toBe(outcome.counts.dataRows);
        const simple = corruptions.every(({ text }) => !/["\r\n]/u.test(text));
        if (simple) {
          // no quotes or line breaks injected: one record per non-blank line, each accounted for once
          const dataLines = lines.map((line, i) => [line, i + 2] as const).filter(([line]) => !/^[\s,;]*$/u.test(line)).map(([, n]) => n);
          expect(accountedLines(outcome)).toEqual(dataLines);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('importSurveys() reads 1e308 cells, a 1,000,000-character line and a 0-byte file without crashing', () => {
    const huge = importOrError(`${header}\nA,1,1e308,5\nA,1e308,1,5\nA,1,1,1e308\nA,1,1,5\nA,2,1,5\nA,3,1,5\n`);
    expect(huge).not.toBeInstanceOf(RingfallError);
    expect((huge as ImportResult).surveys[0]?.rejected.map((r) => r.code)).toEqual(['ROW_IMPLAUSIBLE', 'ROW_IMPLAUSIBLE', 'ROW_IMPLAUSIBLE']);
    const long = importOrError(`${header}\nA,1,${'1'.repeat(1_000_000)},5\nA,1,1,5\nA,2,1,5\nA,3,1,5\n`);
    expect((long as ImportResult).surveys[0]?.rejected[0]?.value).toContain('(1000000 characters)');
    const empty = importOrError('');
    expect((empty as RingfallError).code).toBe('IMPORT_EMPTY');
  });

  it('SurveyImporter gives the same result however the text is cut into chunks', () => {
    const text = `# coil: Z\r\n${header}\r\n"A",1,"1,5",5\r\nA,2,1,5\r\nA,3,0.5,5\r\nB,x,1,5\r\n\r\nA,"4\r\n",1,5\r\n`;
    const whole = importSurveys(text, { source });
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: text.length - 1 }), { maxLength: 12 }), (cuts) => {
        const importer = new SurveyImporter({ source });
        let start = 0;
        for (const cut of [...cuts].sort((a, b) => a - b)) {
          importer.push(text.slice(start, cut));
          start = cut;
        }
        importer.push(text.slice(start));
        expect(importer.finish()).toEqual(whole);
      }),
      { numRuns: 200 },
    );
  });
});
