import type { ProblemCode } from '../../core/error-codes';
import type { ReadingType } from '../../core/survey/survey';
import { parseDate } from './parse-date';
import { parseReadingType } from './parse-reading-type';
import { shorten } from './read-number';
import type { RowContext } from './row-context';

/** The survey a row belongs to: its coil, date and reading type. */
export interface RowKey {
  readonly coil: string | null;
  readonly date: string | null;
  readonly readingType: ReadingType | null;
}

type WidthProblem = { readonly column: string | null; readonly value: string | null; readonly code: ProblemCode; readonly reason: string } | null;

/**
 * Read which survey a row belongs to: its coil, date and reading-type cells, each
 * falling back to the `# coil:`, `# date:`, `# reading:` metadata when the file has no
 * such column or the cell is empty. A row whose key cell is missing or unreadable
 * belongs to no survey: it is put in `collector.unassigned` and null is returned.
 */
export function readRowKey(cells: readonly string[], line: number, context: RowContext, widthProblem: WidthProblem): RowKey | null {
  const { layout, defaults, collector, headers } = context;
  if (widthProblem && Math.max(layout.coil ?? -1, layout.date ?? -1, layout.reading ?? -1) >= cells.length) {
    collector.unassigned.push({ line, column: widthProblem.column, value: widthProblem.value, reason: widthProblem.reason, code: widthProblem.code });
    return null;
  }
  if (layout.coil === null && layout.date === null && layout.reading === null) return defaults;
  const coilText = keyCell(cells, layout.coil);
  const dateText = keyCell(cells, layout.date);
  const readingText = keyCell(cells, layout.reading);
  const date = dateText === '' ? defaults.date : parseDate(dateText);
  if (date === null && dateText !== '') {
    const column = headers[layout.date ?? 0] ?? 'date';
    collector.unassigned.push({
      line, column, value: shorten(dateText), code: 'ROW_BAD_DATE',
      reason: `column "${shorten(column, 60)}": "${shorten(dateText)}" is not a date ringfall reads, so the row belongs to no survey. Write dates as YYYY-MM-DD, e.g. 2026-03-14.`,
    });
    return null;
  }
  const readingType: ReadingType | null = readingText === '' ? defaults.readingType : parseReadingType(readingText);
  if (readingType === null && readingText !== '') {
    const column = headers[layout.reading ?? 0] ?? 'reading';
    collector.unassigned.push({
      line, column, value: shorten(readingText), code: 'ROW_BAD_READING_TYPE',
      reason: `column "${shorten(column, 60)}": "${shorten(readingText)}" is not dc, rms or peak, so the row belongs to no survey. ` +
        'Write the detector type, or if the column holds field values write its unit in the header, e.g. "reading (mT)".',
    });
    return null;
  }
  return { coil: coilText === '' ? defaults.coil : coilText, date, readingType };
}

function keyCell(cells: readonly string[], index: number | null): string {
  return index === null ? '' : (cells[index] ?? '').trim();
}
