import { RingfallError } from '../../core/errors';
import { printable } from '../../core/text/printable';

/**
 * Stable codes of file-level import problems (CLI exit status 2; the web page shows the
 * message next to the file name). Row-level problems are RejectedRow codes instead.
 */
export type ImportErrorCode =
  | 'IMPORT_EMPTY'
  | 'IMPORT_BINARY'
  | 'IMPORT_NO_HEADER'
  | 'IMPORT_HEADER_ONLY'
  | 'IMPORT_NO_DISTANCE'
  | 'IMPORT_NO_FIELD'
  | 'IMPORT_FIELD_UNIT_MISSING'
  | 'IMPORT_DISTANCE_UNIT_MISSING'
  | 'IMPORT_UNIT_UNKNOWN'
  | 'IMPORT_UNIT_KIND'
  | 'IMPORT_UNIT_AMBIGUOUS'
  | 'IMPORT_COLUMN_CONFLICT'
  | 'IMPORT_COMPONENTS_INCOMPLETE'
  | 'IMPORT_MAP_INCOMPLETE'
  | 'IMPORT_METADATA'
  | 'IMPORT_MAPPING'
  | 'IMPORT_OPTION_UNIT'
  | 'IMPORT_TOO_FEW_ROWS';

/**
 * Build a file-level import error. `message` must already have the form
 * "what failed: what was found (where). What to do."; `where` is "source line N[, column M]".
 */
export function importError(code: ImportErrorCode, message: string, where: string, value?: unknown): RingfallError {
  return new RingfallError(code, message, { where, value });
}

/** "survey.csv line 3, column 2" for messages (control characters in the name shown escaped). */
export function place(source: string, line: number, column?: number): string {
  const name = printable(source);
  return column === undefined ? `${name} line ${line}` : `${name} line ${line}, column ${column}`;
}
