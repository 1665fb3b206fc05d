/**
 * The property-based fuzz suite (fast-check), one property per class of
 * hostile input: Object.prototype names, long inputs, control characters, decimal commas,
 * unit spellings, and malformed CSV through the library path `fit --json` uses (fitFiles →
 * importSurveys → analyseSurvey → toJsonReport). fuzz-runner.ts runs them in a child
 * process under a hang watchdog (fuzz.test.ts); each property is seeded, so a failure
 * reproduces with the seed and path fast-check prints.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { parseThresholdLevel } from '../../src/core/analysis/thresholds/threshold-level';
import { RingfallError } from '../../src/core/errors';
import { getModel } from '../../src/core/models';
import { renderTextReport } from '../../src/core/report/render-text';
import { toJsonReport } from '../../src/core/report/to-json-report';
import { hasControlCharacters } from '../../src/core/text/printable';
import { lookupUnit, parseQuantity } from '../../src/core/units';
import { fitFiles } from '../../src/cli/commands/fit';
import { readFitFlags } from '../../src/cli/fit-options';
import { importSurveys, type ImportResult } from '../../src/io';
import { parseReadingType } from '../../src/io/import/parse-reading-type';
import { recognizeHeader } from '../../src/io/import/recognize-header';
import { parseSpecs } from '../../src/io/spec';

/** A named property and how many runs it gets (CI time: each run may fit models). */
export interface FuzzProperty {
  readonly name: string;
  readonly numRuns: number;
  readonly property: () => fc.IRawProperty<unknown[]>;
}

/** Run an action: its result, or the RingfallError it threw; anything else thrown is a failure. */
function resultOrMessage<T>(action: () => T): T | RingfallError {
  try {
    return action();
  } catch (error) {
    if (error instanceof RingfallError) return error;
    throw error;
  }
}

function check(condition: boolean, what: string): void {
  if (!condition) throw new Error(what);
}

function oneLine(error: unknown): void {
  if (error instanceof RingfallError) check(!hasControlCharacters(error.message), `message not one line: ${JSON.stringify(error.message)}`);
}

/** Names of Object.prototype members (and the accessor), with case and white space around them. */
const prototypeName = fc.tuple(
  fc.constantFrom(...Object.getOwnPropertyNames(Object.prototype), 'prototype', '__proto__'),
  fc.constantFrom('', ' ', '\t'),
  fc.boolean(),
).map(([name, pad, upper]) => `${pad}${upper ? name.toUpperCase() : name}${pad}`);

/** Characters that break lines or drive a terminal: C0, DEL, C1, line separators, bidi controls. */
const controlCharacter = fc.oneof(
  fc.integer({ min: 0, max: 0x1f }),
  fc.integer({ min: 0x7f, max: 0x9f }),
  fc.constantFrom(0x2028, 0x2029, 0x202e, 0x2066, 0x200f),
).map((code) => String.fromCharCode(code));

/** Text with control characters among ordinary ones, never a quote or a delimiter (they make other rows). */
const textWithControls = fc.array(fc.oneof(controlCharacter, fc.constantFrom('a', 'B', ' ', '1', '[', 'm', 'µ')), { minLength: 1, maxLength: 12 })
  .map((parts) => parts.join('').replace(/[\r\n",;\t#]/gu, '\u001b'));

/** A chunk repeated to a long input: the shapes that make backtracking patterns quadratic. */
const longText = fc.tuple(
  fc.constantFrom('', 'B', 'a', '1', '#', 'd in'),
  fc.constantFrom(' ', '_', '(', ' in', '/', ':', '1', 'a', ',', '#', '\t', '.', 'e'),
  fc.integer({ min: 20_000, max: 100_000 }),
  fc.constantFrom('x', ')', 'mm', '', '%', '='),
).map(([start, chunk, length, end]) => start + chunk.repeat(Math.ceil(length / chunk.length)) + end);

const rows = (values: readonly number[]) => values.map((field, i) => `${i * 10},${field}`).join('\n');
const folder = mkdtempSync(join(tmpdir(), 'ringfall-fuzz-'));
process.on('exit', () => rmSync(folder, { recursive: true, force: true }));
let fileCount = 0;

/** fitFiles on one file, as `ringfall fit FILE --json` runs it, with the JSON it prints. */
function fitJson(text: string, models: readonly string[] = ['inverse-cube', 'dipole']) {
  fileCount += 1;
  const path = join(folder, `survey-${fileCount}.csv`);
  writeFileSync(path, text);
  const { reports, problems, rejected } = fitFiles([path], readFitFlags({ model: [models.join(',')] }));
  const json = JSON.parse(JSON.stringify(toJsonReport({ surveys: reports, rejected }))) as {
    surveys: { readings: { total: number; used: number; rejected: unknown[] } }[];
    rejected: unknown[];
  };
  return { reports, problems, rejected, json, text: reports.length > 0 ? renderTextReport({ surveys: reports, rejected }) : '' };
}

export const fuzzProperties: readonly FuzzProperty[] = [
  {
    name: 'prototype names are unknown values everywhere',
    numRuns: 150,
    property: () => fc.property(prototypeName, (name) => {
      const actions: (() => unknown)[] = [
        () => parseThresholdLevel(name),
        () => readFitFlags({ threshold: [name] }),
        () => readFitFlags({ model: [name] }),
        () => readFitFlags({ fieldUnit: name }),
        () => readFitFlags({ fix: [`${name}=1mm`] }),
        () => getModel(name),
        () => parseQuantity(`1 ${name}`),
        () => parseSpecs(JSON.stringify({ model: 'loop', params: { radius: '45 mm' }, tolerance: '5%', readingType: name }), 's.json'),
        () => parseSpecs(JSON.stringify({ model: 'loop', params: { radius: '45 mm' }, tolerance: '5%', readingType: 'rms', waveform: name }), 's.json'),
        () => parseSpecs(JSON.stringify({ model: name, params: { radius: '45 mm' }, tolerance: '5%' }), 's.json'),
        () => importSurveys(`# reading: ${name}\ndistance (mm),B (mT)\n0,1\n10,0.5\n20,0.2\n`, { source: 'p.csv' }),
      ];
      for (const action of actions) {
        const outcome = resultOrMessage(action);
        check(outcome instanceof RingfallError, `accepted "${name}": ${String(outcome).slice(0, 80)}`);
        oneLine(outcome);
      }
      check(parseReadingType(name) === null, `reading type "${name}"`);
      check(lookupUnit(name) === undefined, `unit "${name}"`);
      const imported = importSurveys(`reading,distance (mm),B (mT)\ndc,0,1\ndc,10,0.5\n${name.replace(/[,\t]/gu, '')},15,0.3\ndc,20,0.2\n`, { source: 'p.csv' });
      check(imported.surveys.every((s) => s.readingType === 'dc'), 'a reading type from Object.prototype');
    }),
  },
  {
    name: 'long inputs finish with a result or a one-line message',
    numRuns: 40,
    property: () => fc.property(longText, fc.constantFrom('header', 'note', 'cell', 'quantity', 'fix', 'threshold', 'spec', 'file'), (text, where) => {
      const outcome = resultOrMessage((): unknown => {
        switch (where) {
          case 'header': return recognizeHeader(text);
          case 'note': return importSurveys(`# note: ${text}\ndistance (mm),B (mT)\n0,1\n10,0.5\n20,0.2\n`, { source: 'l.csv' });
          case 'cell': return importSurveys(`distance (mm),B (mT)\n0,${text}\n0,1\n10,0.5\n20,0.2\n`, { source: 'l.csv' });
          case 'quantity': return parseQuantity(`1 mm${text}`, 'length');
          case 'fix': return readFitFlags({ fix: [`radius=1 mm${text}`] });
          case 'threshold': return parseThresholdLevel(text);
          case 'spec': return parseSpecs(`{"model":"loop","params":{"radius":${JSON.stringify(text)}},"tolerance":"5%"}`, 'l.json');
          default: return importSurveys(text, { source: 'l.csv' });
        }
      });
      oneLine(outcome);
    }),
  },
  {
    name: 'control characters never reach a message or the text report raw',
    numRuns: 60,
    property: () => fc.property(textWithControls, fc.constantFrom('coil', 'header', 'cell', 'date', 'reading', 'unit'), (text, where) => {
      const header = where === 'header' ? `distance (mm),B (mT),${text}` : where === 'unit' ? `distance (mm),B (${text})` : 'distance (mm),B (mT),coil,date,reading';
      const row = (i: number, field: string) => (where === 'header' || where === 'unit' ? `${i * 10},${field}` : `${i * 10},${field},${where === 'coil' ? text : 'A'},${where === 'date' && i === 1 ? text : '2026-01-02'},${where === 'reading' && i === 1 ? text : 'dc'}`);
      const body = [row(0, '1.7'), row(1, where === 'cell' ? text : '1.2'), row(2, '0.6'), row(3, '0.3'), row(4, '0.15')].join('\n');
      const outcome = resultOrMessage(() => fitJson(`# probe: Hall\n${header}\n${body}\n`));
      if (outcome instanceof RingfallError) return oneLine(outcome);
      for (const problem of outcome.problems) check(!hasControlCharacters(problem), `problem not one line: ${JSON.stringify(problem)}`);
      check(!/[\u0000-\u0009\u000b-\u001f\u007f-\u009f\u2028\u2029\u202e\u2066\u200f]/u.test(outcome.text), `control character in the text report: ${JSON.stringify(outcome.text.slice(0, 200))}`);
    }),
  },
  {
    name: 'a decimal comma is read only in semicolon files',
    numRuns: 80,
    property: () => fc.property(
      fc.array(fc.integer({ min: 1, max: 99_999 }), { minLength: 4, maxLength: 12 }),
      fc.array(fc.boolean(), { minLength: 12, maxLength: 12 }),
      fc.constantFrom('\t', ';', ','),
      (values, withComma, delimiter) => {
        // a cell "1,700": decimal comma in a semicolon file (CONTRACT.md), refused elsewhere
        const cells = values.map((v, i) => (withComma[i] ? `${Math.floor(v / 1000)},${String(v % 1000).padStart(3, '0')}` : String(v)));
        const quoted = (cell: string) => (delimiter === ',' && cell.includes(',') ? `"${cell}"` : cell);
        const text = `distance (mm)${delimiter}B (uT)\n${cells.map((cell, i) => `${i}${delimiter}${quoted(cell)}`).join('\n')}\n`;
        const outcome = resultOrMessage(() => importSurveys(text, { source: 'd.csv' }));
        if (outcome instanceof RingfallError) return check(outcome.code === 'IMPORT_TOO_FEW_ROWS', outcome.code);
        const readings = [...outcome.surveys, ...outcome.skipped.map((s) => s.survey)].flatMap((s) => s.readings);
        for (const reading of readings) {
          const cell = cells[reading.line - 2]!;
          if (cell.includes(',')) check(delimiter === ';', `"${cell}" read in a file delimited by ${JSON.stringify(delimiter)}`);
          // 1 uT = 1e-6 T (SI Brochure 9th ed.); the comma as decimal mark in a semicolon file
          const expected = Number(cell.replace(',', '.')) / 1e6;
          check(Math.abs(reading.field - expected) <= 1e-15 * Math.abs(expected), `"${cell}" read as ${reading.field}`);
        }
        const rejected = [...outcome.surveys, ...outcome.skipped.map((s) => s.survey)].flatMap((s) => s.rejected);
        if (delimiter !== ';') check(rejected.length === cells.filter((c) => c.includes(',')).length, 'a comma cell not refused');
      },
    ),
  },
  {
    name: 'unit spellings are read exactly or refused, never as a case-changed prefix',
    numRuns: 300,
    property: () => fc.property(
      fc.constantFrom('T', 'mT', 'uT', 'nT', 'G', 'kG', 'mG', 'm', 'cm', 'mm', 'in', 'A', 'gauss', 'tesla', 'Gs', 'µT'),
      fc.array(fc.boolean(), { minLength: 6, maxLength: 6 }),
      (symbol, upper) => {
        const spelling = [...symbol].map((c, i) => (upper[i] ? c.toUpperCase() : c.toLowerCase())).join('');
        const unit = lookupUnit(spelling);
        if (unit === undefined) return;
        // SI Brochure 9th ed., Table 7: M is mega; a spelling that starts with M is never read as milli
        if (spelling.startsWith('M') && spelling.length > 1 && spelling !== 'MM') check(false, `"${spelling}" read as ${unit.symbol}`);
        const canonical = lookupUnit(symbol)!;
        if (spelling.toLowerCase() === symbol.toLowerCase()) check(unit.factor === canonical.factor || unit.symbol.toLowerCase() === spelling.toLowerCase(), `"${spelling}" read as ${unit.symbol}`);
      },
    ),
  },
  {
    name: 'malformed CSV through fitFiles and toJsonReport: no crash, every row accounted',
    numRuns: 60,
    property: () => fc.property(
      fc.array(fc.oneof(
        fc.constantFrom('', '#', '"', ',,,', '1,2,3,4', 'NaN', 'bad', '2026-13-45', 'OL', '1,700', '\t'),
        fc.string({ maxLength: 16 }),
        fc.tuple(fc.integer({ min: 0, max: 200 }), fc.double({ min: 0.01, max: 5, noNaN: true })).map(([d, b]) => `2026-01-02,${d},${b}`),
      ), { minLength: 3, maxLength: 25 }),
      (lines) => {
        const text = `date,distance (mm),B (mT)\n2026-01-02,0,2\n2026-01-02,10,1\n2026-01-02,20,0.5\n${lines.join('\n')}\n`;
        const imported = resultOrMessage(() => importSurveys(text, { source: 'm.csv' }));
        const outcome = resultOrMessage(() => fitJson(text));
        if (imported instanceof RingfallError || outcome instanceof RingfallError) return;
        const counts = (imported as ImportResult).counts;
        const listed = outcome.json.surveys.reduce((sum, s) => sum + s.readings.total, 0) + outcome.json.rejected.length;
        check(listed === counts.dataRows, `${listed} rows in the JSON report, ${counts.dataRows} data rows`);
        check(outcome.problems.length === 0, outcome.problems.join(' '));
      },
    ),
  },
];
