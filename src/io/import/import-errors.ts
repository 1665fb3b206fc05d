import type { ProblemCode } from '../../core/error-codes';
import { RingfallError } from '../../core/errors';
import { printable } from '../../core/text/printable';

/**
 * Stable codes of file-level import problems (CLI exit status 2; the web page shows the
 * message next to the file name): the IMPORT_… codes of core/error-codes.ts. Row-level
 * problems are RejectedRow codes instead.
 */
export type ImportErrorCode = Extract<ProblemCode, `IMPORT_${string}`>;

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
