import Papa from 'papaparse';
import type { ReadingType } from '../../core/survey/survey';
import { detectColumns, type ColumnDetectionResult } from './detect-columns';
import { detectDelimiter, type Delimiter } from './detect-delimiter';
import { roleForName } from './header-names';
import { importError, place } from './import-errors';
import type { Detection, ImportOptions, MetadataLine } from './import-types';
import { looksBinary } from './looks-binary';
import { parseDate } from './parse-date';
import { parseReadingType } from './parse-reading-type';
import { shorten } from './read-number';
import { readPreamble, type Preamble } from './read-preamble';

/** Everything decided before the first data row. */
export interface FileLayout {
  readonly preamble: Preamble;
  readonly delimiter: Delimiter;
  readonly decimalComma: boolean;
  readonly columns: ColumnDetectionResult;
  readonly detection: Detection;
  /** Metadata as a record (later keys win), keys as in MetadataLine. */
  readonly meta: Readonly<Record<string, string>>;
  /** Coil, date and reading type from metadata, used where the row has no such cell. */
  readonly defaults: { readonly coil: string | null; readonly date: string | null; readonly readingType: ReadingType | null };
}

const sampleLineCount = 10;
const sampleCharacterLimit = 1 << 16;

/**
 * Decide how to read a survey file from its beginning: binary check, metadata, header,
 * delimiter (from the header and up to ten following lines), columns and units.
 * Column problems are returned in `columns.problems`, not thrown, so a page can show the
 * detection and let the user map columns by hand.
 *
 * @param text the text so far, byte-order mark removed
 * @param final true when no more text will come
 * @returns the layout, or null when more text is needed
 * @throws RingfallError IMPORT_BINARY, IMPORT_EMPTY, IMPORT_NO_HEADER, IMPORT_METADATA
 */
export function readLayout(text: string, byteOrderMark: boolean, final: boolean, options: ImportOptions): FileLayout | null {
  const binary = looksBinary(text.slice(0, 8192));
  if (binary) {
    throw importError(
      'IMPORT_BINARY',
      `Survey file is not text: found ${binary} (${options.source}). Save or export the readings as CSV text (UTF-8), e.g. "distance (mm),B (mT)" then one row per reading.`,
      options.source,
    );
  }
  const preamble = readPreamble(text, final, options.source);
  if (!preamble) return null;
  const sample: string[] = [];
  let offset = preamble.dataOffset;
  while (sample.length < sampleLineCount && offset < text.length) {
    const end = text.indexOf(preamble.newline, offset);
    if (end === -1 && !final) break;
    sample.push(text.slice(offset, end === -1 ? text.length : end));
    offset = end === -1 ? text.length : end + 1;
  }
  if (!final && sample.length < sampleLineCount && text.length - preamble.dataOffset < sampleCharacterLimit) return null;
  const delimiter = detectDelimiter(preamble.headerText, sample);
  const parsedHeader = headerCells(preamble.headerText, delimiter, preamble.newline);
  const headers = parsedHeader.map((h) => h.replace(/\r$/u, ''));
  const columns = learnedColumns(headers, preamble.headerLine, options);
  // keys are the file's own words ("# constructor: …"): a null-prototype object holds them as plain data
  const meta: Record<string, string> = Object.create(null) as Record<string, string>;
  for (const { key, value } of preamble.metadata) meta[key] = value;
  const detection: Detection = {
    delimiter,
    decimalComma: delimiter === ';',
    lineBreak: preamble.lineBreak,
    byteOrderMark,
    headerLine: preamble.headerLine,
    metadata: preamble.metadata,
    comments: preamble.comments,
    columns: columns.columns,
    fieldKind: columns.fieldKind,
    notes: columns.notes,
  };
  // CONTRACT.md: a decimal comma only in semicolon files. In a tab file "1,700" could be
  // 1.7 or 1700 (thousands separator); a guess would be silent, so such cells are refused.
  return { preamble, delimiter, decimalComma: delimiter === ';', columns, detection, meta, defaults: readDefaults(preamble.metadata, options.source) };
}

/**
 * The header's cells as papaparse reads the line. Without a quote (or a line break) in it
 * that is its fast mode, a split on the delimiter (papaparse.js, Parser.parse), done here
 * directly: building a papaparse run for each of 10,000 one-line headers cost more than
 * reading the file's rows.
 */
function headerCells(headerText: string, delimiter: Delimiter, newline: Preamble['newline']): string[] {
  if (!headerText.includes('"') && !headerText.includes(newline)) return headerText === '' ? [] : headerText.split(delimiter);
  return Papa.parse<string[]>(headerText, { delimiter, newline }).data[0] ?? [];
}

/**
 * Column layouts learnt from headers already read, so a fleet of files with one header is
 * detected once: keyed by the header cells, the header's line and the unit options, and
 * kept only when detection found no problem (a problem's message names its file) and no
 * hand-made mapping was given. The result is the same as detectColumns' for the file:
 * nothing in it depends on the file's name or its other lines, and it is read-only data
 * (the column and note lists are copied for each file all the same).
 */
const learnt = new Map<string, ColumnDetectionResult>();
/** Headers remembered at most: a fleet has a handful; a folder of unrelated files cannot grow it without bound. */
const learntLimit = 64;

function learnedColumns(headers: readonly string[], headerLine: number, options: ImportOptions): ColumnDetectionResult {
  if (options.mapping !== undefined) return detectColumns(headers, headerLine, options);
  const key = JSON.stringify([headers, headerLine, options.fieldUnit ?? null, options.distanceUnit ?? null]);
  const known = learnt.get(key);
  if (known !== undefined) return { ...known, columns: [...known.columns], notes: [...known.notes], problems: [] };
  const columns = detectColumns(headers, headerLine, options);
  if (columns.problems.length === 0 && columns.layout !== null) {
    if (learnt.size >= learntLimit) learnt.delete(learnt.keys().next().value!);
    learnt.set(key, { ...columns, columns: [...columns.columns], notes: [...columns.notes] });
  }
  return columns;
}

function readDefaults(metadata: readonly MetadataLine[], source: string): FileLayout['defaults'] {
  let coil: string | null = null;
  let date: string | null = null;
  let readingType: ReadingType | null = null;
  for (const { key, value, line } of metadata) {
    const role = roleForName(key);
    if (role === 'coil' && value !== '') coil = value;
    if (role === 'date' && value !== '') {
      date = parseDate(value);
      if (date === null) {
        throw importError(
          'IMPORT_METADATA',
          `Metadata date not read: "${shorten(value, 60)}" is not a date ringfall reads (${place(source, line)}). Write it as YYYY-MM-DD, e.g. 2026-03-14.`,
          place(source, line), value,
        );
      }
    }
    if (role === 'reading' && value !== '') {
      readingType = parseReadingType(value);
      if (readingType === null) {
        throw importError(
          'IMPORT_METADATA',
          `Metadata reading type not read: "${shorten(value, 60)}" is not dc, rms or peak (${place(source, line)}). Write "# reading: dc", "rms" or "peak".`,
          place(source, line), value,
        );
      }
    }
  }
  return { coil, date, readingType };
}
