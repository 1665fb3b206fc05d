/**
 * Every parser that reads user text, called with inputs of 10⁵ characters shaped to make
 * a backtracking regular expression work quadratically (long runs of spaces, separators
 * or letters ending in a character that makes the match fail). A fuzz run measured 11 s
 * for a 30,000-character header cell and 26 s for a --fix with 100,000 spaces; linear
 * parsers finish each case in milliseconds. Run by long-input-runner.ts in a child
 * process under a watchdog (long-inputs.test.ts): a hang fails the test, naming the case.
 */
import { parseThresholdLevel } from '../../src/core/analysis/thresholds/threshold-level';
import { getModel, parseParameterAssignment } from '../../src/core/models';
import { lookupUnit, parseQuantity, parseRelativePlusAbsolute } from '../../src/core/units';
import { printable } from '../../src/core/text/printable';
import { readFitFlags } from '../../src/cli/fit-options';
import { usageErrorLine } from '../../src/cli/main';
import { importSurveys } from '../../src/io';
import { recognizeHeader } from '../../src/io/import/recognize-header';
import { readPreamble } from '../../src/io/import/read-preamble';
import { parseDate } from '../../src/io/import/parse-date';
import { parseReadingType } from '../../src/io/import/parse-reading-type';
import { explainNumberCell, readNumber } from '../../src/io/import/read-number';
import { parseSpecs } from '../../src/io/spec';

/** Length of each long input. */
export const longLength = 100_000;

const spaces = ' '.repeat(longLength);
const letters = 'a'.repeat(longLength);
const underscores = '_'.repeat(longLength);
const rows = '0,1\n10,0.5\n20,0.25\n30,0.1\n';

/** One call; returning or throwing a RingfallError are both fine, only a hang is not. */
export interface LongInputCase {
  readonly name: string;
  readonly run: () => unknown;
}

export const longInputCases: readonly LongInputCase[] = [
  { name: 'recognizeHeader: spaces then a letter', run: () => recognizeHeader(`B${spaces}x`) },
  { name: 'recognizeHeader: spaces before "("', run: () => recognizeHeader(`B${spaces}(mT`) },
  { name: 'recognizeHeader: spaces inside ( )', run: () => recognizeHeader(`B (${spaces}x${spaces})`) },
  { name: 'recognizeHeader: "(" repeated', run: () => recognizeHeader(`${'('.repeat(longLength)}x)`) },
  { name: 'recognizeHeader: slashes', run: () => recognizeHeader(`B${' /'.repeat(longLength / 2)}x`) },
  { name: 'recognizeHeader: " in " repeated', run: () => recognizeHeader(`d${' in'.repeat(longLength / 3)}x`) },
  { name: 'recognizeHeader: underscores', run: () => recognizeHeader(`distance${underscores}`) },
  { name: 'recognizeHeader: letters', run: () => recognizeHeader(letters) },
  { name: 'readPreamble: metadata value with spaces inside', run: () => readPreamble(`# note: a${spaces}b\ndistance (mm),B (mT)\n`, true, 'long.csv') },
  { name: 'readPreamble: metadata value of spaces', run: () => readPreamble(`# note:${spaces}x\ndistance (mm),B (mT)\n`, true, 'long.csv') },
  { name: 'readPreamble: # line of spaces, no separator', run: () => readPreamble(`#${spaces}x\ndistance (mm),B (mT)\n`, true, 'long.csv') },
  { name: 'readPreamble: # line of spaces, then ":"', run: () => readPreamble(`#${spaces}x${spaces}:${spaces}y\ndistance (mm),B (mT)\n`, true, 'long.csv') },
  { name: 'importSurveys: long header cell', run: () => importSurveys(`distance (mm),B (mT),x${spaces}y\n${rows}`, { source: 'long.csv' }) },
  { name: 'importSurveys: long note', run: () => importSurveys(`# note: a${spaces}b\ndistance (mm),B (mT)\n${rows}`, { source: 'long.csv' }) },
  { name: 'importSurveys: long cell', run: () => importSurveys(`distance (mm),B (mT)\n0,1${spaces}x\n${rows}`, { source: 'long.csv' }) },
  { name: 'importSurveys: long date cell', run: () => importSurveys(`date,distance (mm),B (mT)\n2026-01-01${spaces}x,0,1\n2026-01-01,${rows.replace(/\n/g, '\n2026-01-01,')}`, { source: 'long.csv' }) },
  { name: 'importSurveys: one line of spaces', run: () => importSurveys(`${spaces}x`, { source: 'long.csv' }) },
  { name: 'parseQuantity: spaces between unit and junk', run: () => parseQuantity(`1 mm${spaces}x`, 'length') },
  { name: 'parseQuantity: leading spaces', run: () => parseQuantity(`${spaces}1${spaces}x`) },
  { name: 'parseQuantity: digits', run: () => parseQuantity(`${'1'.repeat(longLength)}x`) },
  { name: 'lookupUnit: spaces', run: () => lookupUnit(`m${spaces}m`) },
  { name: 'parseParameterAssignment: --fix with spaces', run: () => parseParameterAssignment(getModel('loop'), `radius=1 mm${spaces}x`, '--fix') },
  { name: 'parseParameterAssignment: name of spaces', run: () => parseParameterAssignment(getModel('loop'), `r${spaces}x=1mm`, '--fix') },
  { name: 'readFitFlags: --fix, --threshold, --uncertainty', run: () => readFitFlags({ fix: [`radius=1 mm${spaces}x`] }) },
  { name: 'readFitFlags: --uncertainty', run: () => readFitFlags({ uncertainty: `1%${spaces}+${spaces}x` }) },
  { name: 'parseThresholdLevel: spaces', run: () => parseThresholdLevel(`0.5${spaces}x`) },
  { name: 'parseThresholdLevel: icnirp frequency', run: () => parseThresholdLevel(`icnirp-public@1${spaces}x`) },
  { name: 'parseRelativePlusAbsolute: spaces', run: () => parseRelativePlusAbsolute(`1${spaces}%x`, 'field') },
  { name: 'parseDate: spaces', run: () => parseDate(`2026-01-01${spaces}x`) },
  { name: 'parseReadingType: spaces', run: () => parseReadingType(`true${spaces}rms x`) },
  { name: 'readNumber and explainNumberCell: spaces', run: () => explainNumberCell(`1${spaces}x`, 'B', readNumber(`1${spaces}x`, true)) },
  { name: 'explainNumberCell: digits and commas', run: () => explainNumberCell('1,'.repeat(longLength / 2), 'B', Number.NaN) },
  { name: 'usageErrorLine: spaces in an argument', run: () => usageErrorLine(`error: unknown option '--x${spaces}y'\n`, ['node', 'ringfall', 'fit'], ['fit']) },
  { name: 'parseSpecs: long string value', run: () => parseSpecs(`{"model":"loop","params":{"radius":"1 mm${spaces}x"},"tolerance":"5%"}`, 'long.json') },
  { name: 'parseSpecs: long tolerance', run: () => parseSpecs(`{"model":"loop","params":{"radius":"1 mm"},"tolerance":"5${spaces}%x"}`, 'long.json') },
  { name: 'parseSpecs: white space then junk', run: () => parseSpecs(`${spaces}x`, 'long.json') },
  { name: 'printable: control characters', run: () => printable('\u001b'.repeat(longLength)) },
];
