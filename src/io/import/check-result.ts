import { importError, place } from './import-errors';
import { MIN_USABLE_READINGS, type ImportResult } from './import-types';

/**
 * File-level checks once every row is read: a header with no data rows is
 * IMPORT_HEADER_ONLY; a file with no survey of at least MIN_USABLE_READINGS usable
 * readings is IMPORT_TOO_FEW_ROWS, whose message quotes the first rejections and whose
 * `value` holds the full result so every rejected row can still be listed.
 *
 * @throws RingfallError IMPORT_HEADER_ONLY, IMPORT_TOO_FEW_ROWS
 */
export function checkResult(result: ImportResult, source: string, headerLine: number): ImportResult {
  const { counts } = result;
  if (counts.dataRows === 0) {
    throw importError(
      'IMPORT_HEADER_ONLY',
      `No readings: the file has a header but no data rows (${place(source, headerLine)}). Add one row per reading below the header.`,
      place(source, headerLine),
    );
  }
  if (result.surveys.length === 0) {
    const rejected = [...result.unassigned, ...result.skipped.flatMap((s) => s.survey.rejected)].sort((a, b) => a.line - b.line);
    const examples = rejected.slice(0, 3).map((row) => `line ${row.line}: ${row.reason}`).join(' ');
    throw importError(
      'IMPORT_TOO_FEW_ROWS',
      `Too few usable readings: ${counts.used + result.skipped.reduce((n, s) => n + s.survey.readings.length, 0)} of ${counts.dataRows} data rows are usable ` +
        `and no survey has ${MIN_USABLE_READINGS} (${source}). ` +
        `At least ${MIN_USABLE_READINGS} readings per coil and date are needed to fit the smallest model; fix the rejected rows.` +
        (examples === '' ? '' : ` ${examples}`),
      source, result,
    );
  }
  return result;
}
