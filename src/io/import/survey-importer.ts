import Papa from 'papaparse';
import { checkResult } from './check-result';
import type { ImportOptions, ImportResult } from './import-types';
import { readLayout, type FileLayout } from './read-layout';
import { readRow } from './read-row';
import type { RowContext } from './row-context';
import { SurveyCollector } from './survey-collector';

/** What papaparse's low-level Parser gives the step callback: one row in `data[0]`. */
interface StepResults {
  readonly data: string[][];
  readonly errors: readonly { readonly code: string }[];
  readonly meta: { readonly cursor: number };
}

/** A quoted field still open after this many characters stops re-parsing until a quote arrives. */
const stalledQuoteLength = 1 << 16;

/**
 * Chunk-fed survey importer: push text as it arrives (a file stream, an upload), then
 * finish() for the result. Memory holds the readings and at most one partial row, so a
 * 1,000,000-row file streams through in bounded extra space.
 *
 * Algorithm: the beginning is buffered until readLayout can see the metadata, header and
 * ten sample lines; then rows go through papaparse's Parser with `ignoreLastRow` (the
 * partial last row waits for the next chunk, as papaparse's own chunk streamers do).
 * Rows are one per physical line when the text has no quotes (papaparse's fast mode) or
 * when the rows parsed equal the line breaks they span; otherwise (a quoted field holds
 * a line break) the text is parsed again row by row (step mode) and line numbers come
 * from counting the line breaks between row cursors, so later numbers stay right.
 *
 * @example const importer = new SurveyImporter({ source: 'a.csv' }); importer.push(text); importer.finish().surveys
 */
export class SurveyImporter {
  private pending = '';
  private started = false;
  private byteOrderMark = false;
  private nextAttempt = 0;
  private finished = false;
  private layout: FileLayout | null = null;
  private context: RowContext | null = null;
  /** Parser for text with quotes: rows one by one with their end cursor (step mode). */
  private stepParser: Papa.Parser | null = null;
  /** Parser for quote-free text: all rows at once (papaparse's fast mode). */
  private bulkParser: Papa.Parser | null = null;
  private remainder = '';
  private stalled = false;
  private line = 0;
  private chunkText = '';
  private chunkCursor = 0;

  constructor(private readonly options: ImportOptions) {}

  /** Add the next piece of text (any split, even inside a row or a CRLF). */
  push(chunk: string): void {
    if (this.finished) throw new TypeError('SurveyImporter.push() after finish(): create a new importer for a new file');
    if (chunk === '') return;
    if (!this.started) {
      this.started = true;
      if (chunk.charCodeAt(0) === 0xfeff) {
        this.byteOrderMark = true;
        chunk = chunk.slice(1);
      }
    }
    if (this.context) {
      this.feed(chunk, false);
      return;
    }
    this.pending += chunk;
    if (this.pending.length >= this.nextAttempt) this.start(false);
  }

  /**
   * Read what is left and build the result.
   * @throws RingfallError with an IMPORT_* code for file-level problems (see import-errors.ts)
   */
  finish(): ImportResult {
    if (this.finished) throw new TypeError('SurveyImporter.finish() called twice');
    this.finished = true;
    if (!this.context) this.start(true);
    this.feed('', true);
    const layout = this.layout as FileLayout;
    const collector = (this.context as RowContext).collector;
    const { surveys, skipped, counts } = collector.finish();
    return checkResult({ surveys, skipped, unassigned: collector.unassigned, detection: layout.detection, counts }, this.options.source, layout.preamble.headerLine);
  }

  private start(final: boolean): void {
    const layout = readLayout(this.pending, this.byteOrderMark, final, this.options);
    if (!layout) {
      this.nextAttempt = Math.max(2 * this.pending.length, 4096);
      return;
    }
    const problem = layout.columns.problems[0];
    if (problem) throw problem;
    const columnLayout = layout.columns.layout;
    if (!columnLayout) throw new TypeError('readLayout() gave no column layout and no problem');
    this.layout = layout;
    this.context = {
      layout: columnLayout,
      decimalComma: layout.decimalComma,
      headers: layout.detection.columns.map((c) => c.header),
      used: layout.detection.columns.map((c) => c.role !== null),
      defaults: layout.defaults,
      collector: new SurveyCollector({ source: this.options.source, fieldKind: columnLayout.fieldKind, distanceAxis: columnLayout.distanceAxis, radialAxis: columnLayout.radialAxis, meta: layout.meta, fileNotes: layout.detection.notes, units: columnLayout.units }),
    };
    this.line = layout.preamble.headerLine + 1;
    const rest = this.pending.slice(layout.preamble.dataOffset);
    this.pending = '';
    this.feed(rest, final);
  }

  private feed(chunk: string, final: boolean): void {
    const text = this.remainder + chunk;
    if (this.stalled && !final && !chunk.includes('"')) {
      this.remainder = text;
      return;
    }
    this.remainder = text.slice(this.parse(text, true));
    if (final && this.remainder !== '') {
      this.parse(this.remainder, false);
      this.remainder = '';
    }
    this.stalled = this.remainder.length > stalledQuoteLength && this.remainder.includes('"');
  }

  /** Parse complete rows (all rows when `ignoreLastRow` is false); returns the cursor after the last one. */
  private parse(text: string, ignoreLastRow: boolean): number {
    const quoted = text.indexOf('"') !== -1;
    if (!quoted) return this.parseUnquoted(text, ignoreLastRow);
    if (ignoreLastRow) {
      const result = this.parser('bulk').parse(text, 0, ignoreLastRow) as { data: string[][]; meta: { cursor: number } };
      // Without quotes papaparse's fast mode splits on line breaks; with quotes, rows are still
      // one per line when the rows and the line breaks they span are equal in number.
      if (countBreaks(text, (this.layout as FileLayout).preamble.newline, result.meta.cursor) === result.data.length) {
        for (const cells of result.data) {
          this.take(cells, this.line, false, this.line);
          this.line += 1;
        }
        return result.meta.cursor;
      }
    }
    this.chunkText = text;
    this.chunkCursor = 0;
    const cursor = this.parser('step').parse(text, 0, ignoreLastRow).meta.cursor as number;
    this.chunkText = '';
    return cursor;
  }

  /**
   * Rows of text without a quote: one per line, cells split on the delimiter. This is
   * papaparse's fast mode (papaparse.js, Parser.parse: split on the newline, then each row
   * on the delimiter; with `ignoreLastRow` the text after the last newline waits), done
   * here without building papaparse's row list; the cursor is the end of the last row taken.
   */
  private parseUnquoted(text: string, ignoreLastRow: boolean): number {
    if (text === '') return 0;
    const { delimiter, preamble: { newline } } = this.layout as FileLayout;
    let start = 0;
    for (;;) {
      const end = text.indexOf(newline, start);
      if (end === -1) {
        if (ignoreLastRow) return start;
        this.take(text.slice(start).split(delimiter), this.line, false, this.line);
        this.line += 1;
        return text.length;
      }
      this.take(text.slice(start, end).split(delimiter), this.line, false, this.line);
      this.line += 1;
      start = end + newline.length;
    }
  }

  /** papaparse's Parser for quoted text, made when first needed: 'bulk' gives all rows at once, 'step' one by one with their cursor. */
  private parser(kind: 'bulk' | 'step'): Papa.Parser {
    const config = { delimiter: (this.layout as FileLayout).delimiter, newline: (this.layout as FileLayout).preamble.newline };
    if (kind === 'bulk') return (this.bulkParser ??= new Papa.Parser(config));
    return (this.stepParser ??= new Papa.Parser({ ...config, step: (results: StepResults) => this.stepRow(results) } as Papa.ParseConfig));
  }

  /** A row from the step parser: count the line breaks it spans to keep physical line numbers. */
  private stepRow(results: StepResults): void {
    const cells = results.data[0] ?? [];
    const cursor = results.meta.cursor;
    const text = this.chunkText;
    const newline = (this.layout as FileLayout).preamble.newline;
    const first = this.line;
    let breaks = 0;
    for (let at = text.indexOf(newline, this.chunkCursor); at !== -1 && at < cursor; at = text.indexOf(newline, at + 1)) breaks += 1;
    const empty = cursor === this.chunkCursor;
    this.chunkCursor = cursor;
    this.line += breaks;
    if (empty) return;
    const unclosed = results.errors.length > 0 && hasUnclosedQuote(results.errors);
    this.take(cells, first, unclosed, first + breaks - (text[cursor - 1] === newline ? 1 : 0));
  }

  private take(cells: readonly string[], line: number, unclosedQuote: boolean, lastLine: number): void {
    const context = this.context as RowContext;
    if (isBlank(cells)) {
      context.collector.blankLines += 1;
      return;
    }
    if (unclosedQuote) {
      context.collector.unassigned.push({
        line, column: null, value: null, code: 'ROW_UNCLOSED_QUOTE',
        reason: `a quoted field opened on line ${line} is never closed, so ${lastLine > line ? `lines ${line}–${lastLine} read as one row and are` : 'the row is'} not used. Remove the stray " or close the quote.`,
      });
      return;
    }
    if (isCommented(cells[0] ?? '')) {
      context.collector.unassigned.push({ line, column: null, value: null, code: 'ROW_COMMENTED', reason: 'the row is commented out with "#"; not used. Remove the "#" to use it.' });
      return;
    }
    readRow(cells, line, context);
  }
}

/** True when every cell is empty or white space (a blank line, or one of only delimiters). */
function isBlank(cells: readonly string[]): boolean {
  for (const cell of cells) if (cell.length > 0 && (cell.charCodeAt(0) > 32 || cell.trim() !== '')) return false;
  return true;
}

function isCommented(firstCell: string): boolean {
  const code = firstCell.charCodeAt(0);
  return code === 35 || (code <= 32 && firstCell.trimStart().startsWith('#'));
}

/** Number of line breaks in text[0, end). */
function countBreaks(text: string, newline: string, end: number): number {
  let breaks = 0;
  for (let at = text.indexOf(newline); at !== -1 && at < end; at = text.indexOf(newline, at + 1)) breaks += 1;
  return breaks;
}

function hasUnclosedQuote(errors: StepResults['errors']): boolean {
  for (const error of errors) if (error.code === 'MissingQuotes') return true;
  return false;
}
