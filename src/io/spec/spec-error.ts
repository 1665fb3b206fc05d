import { RingfallError } from '../../core/errors';
import type { ProblemCode } from '../../core/error-codes';

/** Stable codes of spec-file problems (CLI exit status 2). */
export type SpecErrorCode = Extract<ProblemCode, `SPEC_${string}`>;

/** Where a value sits in a spec file, for messages: source, 1-based line, and JSON path. */
export interface SpecPlace {
  readonly source: string;
  readonly line: number | null;
  /** 1-based column, for syntax errors. */
  readonly column?: number;
  /** Field path as a reader writes it: "params.radius", "claims[1].field", "spec 2". */
  readonly field: string;
}

/** "specs.json line 7, field params.radius". */
export function describePlace(place: SpecPlace): string {
  return `${place.source}${place.line === null ? '' : ` line ${place.line}`}${place.column === undefined ? '' : `, column ${place.column}`}${place.field === '' ? '' : `, field ${place.field}`}`;
}

/**
 * Build a spec error: "what failed: what was found (where). What to do."
 * `found` and `todo` are sentences without the place; the place is inserted.
 */
export function specError(code: SpecErrorCode, what: string, found: string, place: SpecPlace, todo: string, value?: unknown, cause?: unknown): RingfallError {
  return new RingfallError(code, `${what}: ${found} (${describePlace(place)}). ${todo}`, {
    value,
    where: describePlace(place),
    cause,
  });
}
