import { RingfallError } from '../errors';
import { printable } from '../text/printable';
import { ambiguousUnit, lookupUnit, unitsOfKind, type QuantityKind, type UnitDefinition } from './unit-table';

/** A parsed quantity: the value in SI (T, m, A, A·m²) and the unit it was written in. */
export interface Quantity {
  readonly value: number;
  readonly kind: QuantityKind;
  readonly unit: UnitDefinition;
}

/** The number at the start of a trimmed quantity; sticky and free of nested repeats, so linear. */
const numberPattern = /[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?/y;
/** Quantities longer than this are shown cut in messages. */
const shownLength = 60;

/**
 * Parse "45mm", "45 mm", "0.5mT", "5 G", "120A", "2 µT", "-1.5e-3 T" into SI.
 *
 * @param text the quantity as the user wrote it
 * @param expected the kind of quantity the caller needs ("field", "length", …); a unit
 *   of another kind is an error naming what was expected
 * @param what a name for messages, e.g. `--fix radius` or `column "B"`
 * @throws RingfallError code `QUANTITY_SYNTAX` (no number), `QUANTITY_UNIT` (unknown
 *   unit or missing unit), `QUANTITY_KIND` (unit of the wrong kind)
 * @example parseQuantity('45 mm', 'length').value // 0.045
 */
export function parseQuantity(text: string, expected?: QuantityKind, what = 'quantity'): Quantity {
  // trim, then match the number at the start and take the rest as the unit: no pattern
  // with two adjacent repeats over the same characters (`(.*?)\s*$` is quadratic on spaces)
  const trimmed = text.trim();
  const shown = printable(text, shownLength);
  numberPattern.lastIndex = 0;
  const match = numberPattern.exec(trimmed);
  if (!match) {
    throw new RingfallError(
      'QUANTITY_SYNTAX',
      `${what}: "${shown}" is not a number with a unit. Write it like ${example(expected)}.`,
      { value: text },
    );
  }
  const number = Number(match[0]);
  const unitText = trimmed.slice(numberPattern.lastIndex).trimStart();
  if (unitText === '') {
    throw new RingfallError(
      'QUANTITY_UNIT',
      `${what}: "${shown}" has no unit. Add one, e.g. ${example(expected)}` +
        (expected ? ` (units: ${unitsOfKind(expected).join(', ')}).` : '.'),
      { value: text },
    );
  }
  const unit = lookupUnit(unitText);
  const ambiguous = ambiguousUnit(unitText);
  if (ambiguous !== null) {
    throw new RingfallError('QUANTITY_UNIT', `${what}: the unit in "${shown}" is ambiguous: ${ambiguous}.`, { value: text });
  }
  if (!unit) {
    throw new RingfallError(
      'QUANTITY_UNIT',
      `${what}: unknown unit "${printable(unitText, shownLength)}" in "${shown}". Use one of: ` +
        `${(expected ? unitsOfKind(expected) : ['T', 'mT', '\u00b5T', 'nT', 'G', 'kG', 'mG', 'm', 'cm', 'mm', 'in', 'A']).join(', ')}.`,
      { value: text },
    );
  }
  if (expected && unit.kind !== expected) {
    throw new RingfallError(
      'QUANTITY_KIND',
      `${what}: "${shown}" is a ${unit.kind} but a ${expected} is needed. Write it like ${example(expected)}.`,
      { value: text },
    );
  }
  if (!Number.isFinite(number)) {
    throw new RingfallError('QUANTITY_SYNTAX', `${what}: "${shown}" is not a finite number. Write it like ${example(expected)}.`, { value: text });
  }
  return { value: number * unit.factor, kind: unit.kind, unit };
}

function example(kind: QuantityKind | undefined): string {
  switch (kind) {
    case 'field': return '"0.5mT" or "5 G"';
    case 'length': return '"45mm" or "4.5 cm"';
    case 'current': return '"120A"';
    case 'moment': return '"0.5 A·m²"';
    default: return '"45mm", "0.5mT" or "120A"';
  }
}
