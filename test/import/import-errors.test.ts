import { describe, expect, it } from 'vitest';
import { RingfallError } from '../../src/core/errors';
import { detectSurveyLayout, importSurveys } from '../../src/io/index';

const source = 'bad.csv';

/** Run an import that must fail and return the error. */
function failure(text: string, options: Partial<Parameters<typeof importSurveys>[1]> = {}): RingfallError {
  try {
    importSurveys(text, { source, ...options });
  } catch (error) {
    expect(error).toBeInstanceOf(RingfallError);
    return error as RingfallError;
  }
  throw new Error('importSurveys() did not throw');
}

/** "what failed: what was found (where). What to do." */
function expectMessageForm(error: RingfallError): void {
  expect(error.message).toMatch(/^[^:]+: .+\(.*bad\.csv.*\)\. [A-Z].+$/su);
}

describe('importSurveys() file-level errors carry a stable code and say what to do', () => {
  const cases: [name: string, text: string, code: string, fragment: string, options?: Record<string, unknown>][] = [
    ['a 0-byte file', '', 'IMPORT_EMPTY', 'no characters at all'],
    ['only blank lines', '\n \r\n\t\n', 'IMPORT_EMPTY', 'only blank lines'],
    ['a NUL byte', 'distance (mm),B (mT)\n0,\u00001\n', 'IMPORT_BINARY', 'NUL'],
    ['an .xlsx workbook', 'PK\u0003\u0004\u0014\u0000\u0006\u0000', 'IMPORT_BINARY', 'spreadsheet workbook'],
    ['only # lines', '# coil: A\n# note: nothing\n', 'IMPORT_NO_HEADER', 'only # lines'],
    ['a header and no rows', 'distance (mm),B (mT)\n\n', 'IMPORT_HEADER_ONLY', 'no data rows'],
    ['no distance column', 'time (s),B (mT)\n0,1\n', 'IMPORT_NO_DISTANCE', '"time (s)"'],
    ['space-separated columns', 'distance_mm B_mT\n0 1\n', 'IMPORT_NO_DISTANCE', 'delimiters read: comma, semicolon, tab'],
    ['no field column', 'distance (mm),temp (C)\n0,20\n', 'IMPORT_NO_FIELD', 'No field column'],
    ['a field column with no unit', 'distance (mm),B\n0,1\n', 'IMPORT_FIELD_UNIT_MISSING', '--field-unit mT'],
    ['a distance column with no unit', 'z,B (mT)\n0,1\n', 'IMPORT_DISTANCE_UNIT_MISSING', '--distance-unit mm'],
    ['an unknown unit', 'distance (mm),B (Oe)\n0,1\n', 'IMPORT_UNIT_UNKNOWN', '"Oe"'],
    // "MT" is megatesla and "MG" megagauss in SI (SI Brochure 9th ed., Table 7: M = mega); never read as milli
    ['an all-caps MT', 'distance (mm),B (MT)\n0,1\n', 'IMPORT_UNIT_AMBIGUOUS', 'write "mT" for millitesla'],
    ['an all-caps MG', 'distance (mm),B (MG)\n0,1\n', 'IMPORT_UNIT_AMBIGUOUS', 'write "mG" for milligauss'],
    ['a distance in Mm', 'distance (Mm),B (mT)\n0,1\n', 'IMPORT_UNIT_AMBIGUOUS', 'megametre'],
    ['a unit of the wrong kind', 'distance (mT),B (mT)\n0,1\n', 'IMPORT_UNIT_KIND', 'is a field unit but the column holds a length'],
    ['two distance columns', 'z (mm),distance (cm),B (mT)\n0,0,1\n', 'IMPORT_COLUMN_CONFLICT', '"z (mm)" (column 1) and "distance (cm)" (column 2)'],
    ['B and |B| together', 'z (mm),B (mT),|B| (mT)\n0,1,1\n', 'IMPORT_COLUMN_CONFLICT', 'More than one field column'],
    ['Bx and By without Bz', 'z (mm),Bx (mT),By (mT)\n0,1,1\n', 'IMPORT_COMPONENTS_INCOMPLETE', 'not all of Bx, By, Bz'],
    ['a metadata date in an ambiguous form', '# date: 03/04/2026\nz (mm),B (mT)\n0,1\n', 'IMPORT_METADATA', 'YYYY-MM-DD'],
    ['a metadata reading type that is not dc, rms or peak', '# reading: ac\nz (mm),B (mT)\n0,1\n', 'IMPORT_METADATA', 'not dc, rms or peak'],
    ['two usable rows', 'z (mm),B (mT)\n0,1\n1,0.5\n2,x\n', 'IMPORT_TOO_FEW_ROWS', 'line 4: column "B (mT)": "x" is not a number'],
    ['a --field-unit that is a length', 'z (mm),B\n0,1\n', 'IMPORT_OPTION_UNIT', '--field-unit not usable', { fieldUnit: 'mm' }],
    ['a mapping to a column that is not there', 'z (mm),B (mT)\n0,1\n', 'IMPORT_MAPPING', 'no column "Bq"', { mapping: [{ column: 'Bq', role: 'field' }] }],
  ];
  for (const [name, text, code, fragment, options] of cases) {
    it(`importSurveys() on ${name} throws ${code}`, () => {
      const error = failure(text, options);
      expect(error.code).toBe(code);
      expect(error.message).toContain(fragment);
      expectMessageForm(error);
    });
  }

  it('importSurveys() IMPORT_TOO_FEW_ROWS carries the full result so every rejected row can be listed', () => {
    const error = failure('z (mm),B (mT)\n0,1\n1,NaN\n2,OL\n');
    const value = error.value as { counts: { dataRows: number }; skipped: { survey: { rejected: unknown[] } }[] };
    // three data rows, NaN and OL rejected (counted by hand)
    expect(value.counts.dataRows).toBe(3);
    expect(value.skipped[0]?.survey.rejected).toHaveLength(2);
  });

  it('importSurveys() keeps messages and notes short for a huge header cell or thousands of columns', () => {
    const long = failure(`${'x'.repeat(1_000_000)}\n0,1\n`);
    expect(long.code).toBe('IMPORT_NO_DISTANCE');
    expect(long.message).toContain('(1000000 characters)');
    expect(long.message.length).toBeLessThan(500);
    const unknown = Array.from({ length: 5000 }, (_, i) => `c${i}`);
    const wide = failure(`${unknown.join(',')}\n${unknown.map(() => '1').join(',')}\n`);
    // 10 columns named (listedColumns in detect-columns.ts), the other 4990 counted
    expect(wide.message).toContain('5000 columns "c0", "c1"');
    expect(wide.message).toContain('"c9" and 4990 more');
    expect(wide.message).not.toContain('"c10"');
    const { surveys, detection } = importSurveys(`distance (mm),B (mT),${unknown.join(',')}\n${['0,1', '1,1', '2,1'].map((r) => `${r},${unknown.map(() => '').join(',')}`).join('\n')}\n`, { source });
    expect(detection.columns).toHaveLength(5002);
    expect(detection.notes).toHaveLength(11);
    expect(detection.notes[0]).toBe('column 3 "c0" is not used: "c0" is not a column name ringfall knows; ignored');
    expect(detection.notes[10]).toBe('4990 more columns, the last column 5002, are not used either (the column detection lists each)');
    expect(surveys[0]?.readings).toHaveLength(3);
  });

  it('detectSurveyLayout() returns the column problems with the detection instead of throwing', () => {
    const { detection, problems } = detectSurveyLayout('z;B\n0;1,7\n', { source });
    expect(problems.map((p) => p.code)).toEqual(['IMPORT_DISTANCE_UNIT_MISSING', 'IMPORT_FIELD_UNIT_MISSING']);
    expect(detection.columns.map((c) => c.role)).toEqual(['distance', 'field']);
    expect(detection.delimiter).toBe(';');
  });
});

describe('importSurveys() row-level problems: the row is listed, the rest is used', () => {
  const header = 'coil,date,reading,distance (mm),|B| (mT),uncertainty (uT)\n';
  const good = 'A,2026-01-02,dc,0,1,10\nA,2026-01-02,dc,1,1,10\nA,2026-01-02,dc,2,1,10\n';
  const cases: [name: string, row: string, code: string, column: string | null, fragment: string][] = [
    ['a cell that is not a number', 'A,2026-01-02,dc,3,1.2.3,10', 'ROW_NOT_A_NUMBER', '|B| (mT)', '"1.2.3" is not a number'],
    ['NaN', 'A,2026-01-02,dc,3,NaN,10', 'ROW_NOT_FINITE', '|B| (mT)', 'not a finite number'],
    ['Infinity', 'A,2026-01-02,dc,Infinity,1,10', 'ROW_NOT_FINITE', 'distance (mm)', 'not a finite number'],
    ['1e999, which overflows', 'A,2026-01-02,dc,3,1e999,10', 'ROW_NOT_FINITE', '|B| (mT)', 'too large to be a number'],
    ['1e308 mT, beyond any meter', 'A,2026-01-02,dc,3,1e308,10', 'ROW_IMPLAUSIBLE', '|B| (mT)', 'more than 100 T'],
    ['the meter\'s OL display', 'A,2026-01-02,dc,3,OL,10', 'ROW_OVER_RANGE', '|B| (mT)', 'over-range'],
    ['an empty cell', 'A,2026-01-02,dc,3,,10', 'ROW_EMPTY_CELL', '|B| (mT)', 'is empty'],
    ['a missing cell', 'A,2026-01-02,dc,3', 'ROW_MISSING_CELLS', '|B| (mT)', 'has 4 cells but the header has 6'],
    ['an extra cell', 'A,2026-01-02,dc,3,1,10,99', 'ROW_EXTRA_CELLS', null, '"99" has no column'],
    ['a negative magnitude', 'A,2026-01-02,dc,3,-1,10', 'ROW_NEGATIVE_MAGNITUDE', '|B| (mT)', 'negative in a magnitude'],
    ['a negative distance', 'A,2026-01-02,dc,-3,1,10', 'ROW_NEGATIVE_DISTANCE', 'distance (mm)', 'is negative'],
    ['a zero uncertainty', 'A,2026-01-02,dc,3,1,0', 'ROW_NEGATIVE_UNCERTAINTY', 'uncertainty (uT)', 'not a positive uncertainty'],
  ];
  for (const [name, row, code, column, fragment] of cases) {
    it(`importSurveys() rejects a row with ${name} as ${code} and uses the others`, () => {
      const { surveys, counts } = importSurveys(`${header}${good}${row}\n`, { source });
      // header on line 1, three good rows, the bad row on line 5 (counted by hand)
      expect(surveys[0]?.readings).toHaveLength(3);
      expect(surveys[0]?.rejected).toHaveLength(1);
      const rejected = surveys[0]?.rejected[0];
      expect(rejected).toMatchObject({ line: 5, code, column });
      expect(rejected?.reason).toContain(fragment);
      expect(counts).toMatchObject({ dataRows: 4, used: 3, rejected: 1 });
    });
  }

  const unassignedCases: [name: string, row: string, code: string, fragment: string][] = [
    ['an unreadable date', 'A,14/03/2026,dc,3,1,10', 'ROW_BAD_DATE', 'not a date ringfall reads'],
    ['a reading type that is not dc, rms or peak', 'A,2026-01-02,avg,3,1,10', 'ROW_BAD_READING_TYPE', 'not dc, rms or peak'],
    ['a commented-out row', '# A,2026-01-02,dc,3,1,10', 'ROW_COMMENTED', 'commented out'],
    ['a quote never closed', 'A,"2026-01-02,dc,3,1,10\nA,2026-01-02,dc,4,1,10', 'ROW_UNCLOSED_QUOTE', 'lines 5–6'],
  ];
  for (const [name, row, code, fragment] of unassignedCases) {
    it(`importSurveys() puts a row with ${name} in unassigned as ${code}`, () => {
      const { surveys, unassigned, counts } = importSurveys(`${header}${good}${row}\n`, { source });
      expect(surveys[0]?.readings).toHaveLength(3);
      expect(unassigned).toHaveLength(1);
      expect(unassigned[0]).toMatchObject({ line: 5, code });
      expect(unassigned[0]?.reason).toContain(fragment);
      expect(counts.used + counts.rejected).toBe(counts.dataRows);
    });
  }

  it('importSurveys() names a quote left open on the last line as that one row, not a range', () => {
    const { unassigned } = importSurveys(`${header}${good}A,2026-01-02,dc,3,"1,10`, { source });
    // the open quote is on line 5, the file's last line (counted by hand)
    expect(unassigned[0]).toMatchObject({ line: 5, code: 'ROW_UNCLOSED_QUOTE' });
    expect(unassigned[0]?.reason).toContain('opened on line 5 is never closed, so the row is not used');
    expect(unassigned[0]?.reason).not.toContain('–');
  });

  it('importSurveys() skips a coil/date group with fewer than 3 usable readings and keeps its rows', () => {
    const { surveys, skipped, counts } = importSurveys(`${header}${good}B,2026-01-02,dc,0,1,10\nB,2026-01-02,dc,1,x,10\n`, { source });
    expect(surveys.map((s) => s.coil)).toEqual(['A']);
    expect(skipped[0]?.survey.coil).toBe('B');
    expect(skipped[0]?.reason).toContain('coil B on 2026-01-02 (dc) has 1 usable reading (1 rejected)');
    expect(counts).toMatchObject({ dataRows: 5, used: 3, rejected: 2 });
  });

  it('importSurveys() hints at a decimal comma when one extra cell splits a number in a comma file, and only then', () => {
    const { surveys } = importSurveys('distance (mm),B (mT)\n0,1.7\n10,1.6\n20,1.3\n30,1,2\n40,1.0,x\n', { source });
    const [comma, text] = surveys[0]?.rejected ?? [];
    expect(comma).toMatchObject({ line: 5, code: 'ROW_EXTRA_CELLS', value: '2' });
    expect(comma?.reason).toContain('has a decimal comma, write a decimal point instead');
    expect(text).toMatchObject({ line: 6, code: 'ROW_EXTRA_CELLS', value: 'x' });
    expect(text?.reason).not.toContain('decimal comma');
  });

  it('importSurveys() reads rows that lack only unused trailing cells, or carry a trailing delimiter', () => {
    const { surveys } = importSurveys('distance (mm),B (mT),note\n0,1\n1,0.5,x,\n2,0.2,,,\n', { source });
    expect(surveys[0]?.readings).toHaveLength(3);
  });
});
