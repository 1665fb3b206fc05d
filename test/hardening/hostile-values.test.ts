/**
 * Hostile inputs found by fuzzing (prototype names, guesses, escapes, set-aside rows): each case failed
 * before the fix (an internal error, "function Object() { [native code] }" in a report,
 * a silent guess, a raw ESC or line break in a message, set-aside rows only in prose).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parseThresholdLevel } from '../../src/core/analysis/thresholds/threshold-level';
import { renderTextReport } from '../../src/core/report/render-text';
import { summarizeSetAsideRows } from '../../src/core/report/set-aside-rows';
import { toJsonReport } from '../../src/core/report/to-json-report';
import { printable } from '../../src/core/text/printable';
import { readFitFlags } from '../../src/cli/fit-options';
import { fitFiles } from '../../src/cli/commands/fit';
import { importSurveys } from '../../src/io';
import { parseReadingType } from '../../src/io/import/parse-reading-type';
import { parseSpecs } from '../../src/io/spec';
import { thrownRingfallError } from '../support/thrown-ringfall-error';

const failure = thrownRingfallError;

const prototypeNames = ['constructor', '__proto__', 'toString', 'hasOwnProperty', 'valueOf', '__defineGetter__'];
const rows = 'distance (mm),B (mT)\n0,1.7\n10,1.2\n20,0.6\n30,0.3\n40,0.15\n';
const folder = mkdtempSync(join(tmpdir(), 'ringfall-hostile-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('Object.prototype names are unknown values, not table entries', () => {
  it('parseThresholdLevel() refuses "constructor", "__proto__" and friends with THRESHOLD_LEVEL listing the presets', () => {
    for (const name of prototypeNames) {
      const error = failure(() => parseThresholdLevel(name));
      expect(error.code, name).toBe('THRESHOLD_LEVEL');
      expect(error.message).toContain(`unknown preset "${name}"`);
      expect(error.message).toContain('implant-static');
    }
  });

  it('readFitFlags() refuses --threshold constructor before any file is read', () => {
    expect(failure(() => readFitFlags({ threshold: ['constructor'] })).code).toBe('THRESHOLD_LEVEL');
  });

  it('parseReadingType() gives null for Object.prototype names', () => {
    for (const name of prototypeNames) expect(parseReadingType(name), name).toBeNull();
  });

  it('importSurveys() refuses "# reading: constructor" with IMPORT_METADATA instead of a function as the reading type', () => {
    for (const name of prototypeNames) {
      const error = failure(() => importSurveys(`# reading: ${name}\n${rows}`, { source: 'proto.csv' }));
      expect(error.code, name).toBe('IMPORT_METADATA');
      expect(error.message).toContain('is not dc, rms or peak');
    }
  });

  it('importSurveys() sets aside a row whose reading cell is "constructor" as ROW_BAD_READING_TYPE', () => {
    const text = 'reading,distance (mm),B (mT)\ndc,0,1.7\ndc,10,1.2\nconstructor,15,1\ndc,20,0.6\n';
    const { surveys, unassigned } = importSurveys(text, { source: 'proto.csv' });
    expect(surveys.map((s) => s.readingType)).toEqual(['dc']);
    expect(unassigned).toEqual([expect.objectContaining({ line: 4, code: 'ROW_BAD_READING_TYPE', value: 'constructor' })]);
  });

  it('importSurveys() keeps "# constructor: x" and "# toString: y" as plain metadata', () => {
    const { surveys } = importSurveys(`# constructor: x\n# toString: y\n${rows}`, { source: 'proto.csv' });
    expect(Object.getOwnPropertyDescriptor(surveys[0]!.meta, 'constructor')?.value).toBe('x');
    expect(Object.getOwnPropertyDescriptor(surveys[0]!.meta, 'tostring')?.value).toBe('y');
  });

  it('parseSpecs() refuses a readingType or waveform of "constructor" naming the field', () => {
    const spec = (extra: string) => `{"model":"loop","params":{"radius":"45 mm"},"tolerance":"5%",${extra}}`;
    for (const name of prototypeNames) {
      expect(failure(() => parseSpecs(spec(`"readingType":"${name}"`), 's.json')).code, name).toBe('SPEC_READING_TYPE');
      const waveform = failure(() => parseSpecs(spec(`"readingType":"rms","waveform":"${name}"`), 's.json'));
      expect(waveform.code, name).toBe('SPEC_WAVEFORM');
      expect(waveform.message).toContain('Use "sine" or "square"');
    }
  });

  it('parseSpecs() refuses a parameter, model or tolerance named after an Object.prototype member', () => {
    expect(failure(() => parseSpecs('{"model":"constructor","params":{"radius":"45 mm"},"tolerance":"5%"}', 's.json')).code).toBe('SPEC_MODEL');
    expect(failure(() => parseSpecs('{"model":"loop","params":{"constructor":"45 mm"},"tolerance":"5%"}', 's.json')).code).toBe('SPEC_PARAM');
    expect(failure(() => parseSpecs('{"model":"loop","params":{"radius":"45 mm"},"tolerances":{"__proto__":"5%"}}', 's.json')).code).toBe('SPEC_TOLERANCE');
  });
});

describe('one line means one line', () => {
  it('printable() escapes C0, DEL, C1, line separators and bidi controls, and keeps backslashes and other text', () => {
    // ECMA-48 (ISO/IEC 6429): ESC = U+001B, CSI = U+009B; Unicode: U+2028 LINE SEPARATOR, U+202E RIGHT-TO-LEFT OVERRIDE
    expect(printable('a\r\nb\tc\u0000\u001b[31m\u007f\u009b\u2028\u202e C:\\data µT')).toBe('a\\r\\nb\\tc\\x00\\x1b[31m\\x7f\\x9b\\u2028\\u202e C:\\data µT');
    expect(printable('x'.repeat(50), 10)).toBe(`${'x'.repeat(10)}… (50 characters)`);
  });

  it('a header cell with a line break or an ESC sequence is shown escaped in the column notes and errors', () => {
    // a lone CR in a line would make CR the file's line break, so the header carries ESC, NEL (U+0085) and U+2028
    const error = failure(() => importSurveys('distance (mm),B (Oe\u001b[2J\u0085\u2028)\n0,1\n', { source: 'esc.csv' }));
    expect(error.code).toBe('IMPORT_UNIT_UNKNOWN');
    expect(error.message).not.toMatch(/[\u001b\u0085\u2028]/u);
    expect(error.message).toContain('column "B (Oe\\x1b[2J\\x85\\u2028)": "Oe\\x1b[2J\\x85"');
  });

  it('a rejected cell and a coil id with control characters stay one line in the text report', () => {
    const path = join(folder, 'control.csv');
    // the first line break (LF) sets the file's; the CR after it is then part of the coil id
    writeFileSync(path, `# probe: Hall\n# coil: A\u001b[31mRED\rX\ndistance (mm),B (mT)\n0,1.7\n10,1.2\n20,"0.6\u001b[2J\n"\n30,0.3\n40,0.15\n50,0.08\n`);
    const options = readFitFlags({ model: ['inverse-cube'] });
    const { reports, rejected } = fitFiles([path], options);
    const text = renderTextReport({ surveys: reports, rejected });
    expect(text).not.toMatch(/[\r\u001b]/u);
    expect(text).toContain('coil A\\x1b[31mRED\\rX');
    expect(text).toContain('"0.6\\x1b[2J" is not a number');
  });

  it('parseSpecs() shows JSON.parse\'s snippet of a multi-line file on one line', () => {
    const error = failure(() => parseSpecs('{\n  "model": "loop",\n  "params": {\n    "radius": \n  }\n}', 'multi.json'));
    expect(error.code).toBe('SPEC_JSON');
    expect(error.message).not.toMatch(/[\r\n]/u);
  });
});

describe('every set-aside row in one place', () => {
  it('fitFiles() lists rows outside any survey with file, line, code and reason, and the JSON report carries them as "rejected"', () => {
    const path = join(folder, 'set-aside.csv');
    writeFileSync(path, 'date,distance (mm),B (mT)\n2026-01-01,0,1.7\n2026-01-01,10,1.2\nbad,15,1\n#2026-01-01,17,0.9\nworse,18,0.8\n2026-01-01,20,0.6\n2026-01-01,30,0.3\n2026-01-01,"40,0.2\n');
    const { reports, rejected } = fitFiles([path], readFitFlags({ model: ['inverse-cube'] }));
    // counted by hand: lines 4 and 6 bad dates, line 5 commented out, line 9 opens a quote it never closes
    expect(rejected.map((row) => [row.line, row.code])).toEqual([[4, 'ROW_BAD_DATE'], [5, 'ROW_COMMENTED'], [6, 'ROW_BAD_DATE'], [9, 'ROW_UNCLOSED_QUOTE']]);
    const json = toJsonReport({ surveys: reports, rejected });
    expect(json.rejected?.[0]).toEqual({ source: path, line: 4, column: 'date', value: 'bad', code: 'ROW_BAD_DATE', reason: expect.stringContaining('is not a date') });
    // one warning per kind of problem, not one per row
    expect(reports[0]!.warnings.filter((w) => w.includes('belong'))).toHaveLength(3);
  });

  it('summarizeSetAsideRows() says each kind of problem once, with its lines and one example', () => {
    const row = (line: number) => ({ line, column: 'date', value: 'x', code: 'ROW_BAD_DATE' as const, reason: 'not a date' });
    const summary = summarizeSetAsideRows([row(3), row(4), ...Array.from({ length: 12 }, (_, i) => row(10 + i))]);
    expect(summary).toEqual(['14 rows belong to no survey and were not used (lines 3, 4, 10, 11, 12, 13, 14, 15, 16, 17 and 4 more; every one is listed in the JSON report\'s "rejected"). Line 3: not a date']);
  });
});
