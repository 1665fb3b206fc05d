import type { ProblemCode } from './error-codes';
import { printable } from './text/printable';

/**
 * Project error: a problem the user can fix. Carries a stable `code` (error-codes.ts), the offending
 * value and where it was found, so callers (CLI, web page) can map it to an exit status
 * or show it next to the input. Message form: "what failed: what was found (where).
 * What to do." The message is one line: control characters that reach it from files and
 * arguments (a header cell with a carriage return, an ESC sequence, JSON.parse's multi-line
 * snippet) are shown escaped (printable), wherever the message is built.
 *
 * Programmer errors use TypeError / RangeError instead.
 */
export class RingfallError extends Error {
  override readonly name = 'RingfallError';
  readonly code: ProblemCode;
  readonly value: unknown;
  readonly where: string | null;

  constructor(
    code: ProblemCode,
    message: string,
    details: { value?: unknown; where?: string | null; cause?: unknown } = {},
  ) {
    super(printable(message), details.cause === undefined ? undefined : { cause: details.cause });
    this.code = code;
    this.value = details.value;
    this.where = details.where ?? null;
  }
}

/** True when `error` is a RingfallError, optionally with the given code. */
export function isRingfallError(error: unknown, code?: ProblemCode): error is RingfallError {
  return error instanceof RingfallError && (code === undefined || error.code === code);
}
