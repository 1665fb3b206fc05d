import type { RingfallError } from '../../core/errors';
import { ambiguousUnit, lookupUnit, unitsOfKind, type UnitDefinition } from '../../core/units';
import { printable } from '../../core/text/printable';
import { unitKindOf } from './header-names';
import { importError, place } from './import-errors';
import type { ColumnDetection, ImportOptions } from './import-types';

/**
 * Give every numeric column its unit: the one written in the header (or set by hand);
 * else `--field-unit` / `--distance-unit`; else a problem naming the column and the fix.
 * Never guesses: a wrong guess between gauss and millitesla is a factor of ten.
 *
 * @returns the columns with canonical unit symbols, and per column the factor to SI
 *   (NaN for columns without a numeric role)
 */
export function resolveUnits(
  columns: readonly ColumnDetection[],
  options: ImportOptions,
  headerLine: number,
  problems: RingfallError[],
  notes: string[],
): { columns: ColumnDetection[]; factors: number[] } {
  const factors: number[] = [];
  const optionUnits = {
    field: optionUnit(options.fieldUnit, 'field', '--field-unit', options.source, problems),
    length: optionUnit(options.distanceUnit, 'length', '--distance-unit', options.source, problems),
  };
  const resolved = columns.map((column): ColumnDetection => {
    factors[column.index] = Number.NaN;
    const kind = column.role === null ? null : unitKindOf(column.role);
    if (kind === null) return column;
    const where = place(options.source, headerLine, column.index + 1);
    if (column.unit !== null) {
      const unit = lookupUnit(column.unit);
      const ambiguous = ambiguousUnit(column.unit);
      if (ambiguous !== null) {
        problems.push(importError(
          'IMPORT_UNIT_AMBIGUOUS',
          `Ambiguous unit in column "${printable(column.header, 60)}": ${ambiguous} (${where}). Correct the header, or map the column by hand with its unit.`,
          where, column.unit,
        ));
        return column;
      }
      if (!unit) {
        problems.push(importError(
          'IMPORT_UNIT_UNKNOWN',
          `Unknown unit in column "${printable(column.header, 60)}": "${printable(column.unit, 40)}" (${where}). Use one of ${unitsOfKind(kind).join(', ')}` +
            (kind === 'field' ? ' (a meter that reads oersted in air reads gauss: write G).' : '.'),
          where, column.unit,
        ));
        return column;
      }
      if (unit.kind !== kind) {
        problems.push(importError(
          'IMPORT_UNIT_KIND',
          `Wrong kind of unit in column "${printable(column.header, 60)}": "${printable(column.unit, 40)}" is a ${unit.kind} unit but the column holds a ${kind} (${where}). ` +
            `Write a ${kind} unit (${unitsOfKind(kind).join(', ')}) or map the column by hand.`,
          where, column.unit,
        ));
        return column;
      }
      const optionForKind = optionUnits[kind];
      if (optionForKind && optionForKind.symbol !== unit.symbol) {
        notes.push(`column "${printable(column.header, 60)}" states its unit ${unit.symbol}; ${kind === 'field' ? '--field-unit' : '--distance-unit'} ${optionForKind.symbol} applies only to columns without a unit`);
      }
      factors[column.index] = unit.factor;
      return { ...column, unit: unit.symbol };
    }
    const fallback = optionUnits[kind];
    if (fallback) {
      factors[column.index] = fallback.factor;
      return { ...column, unit: fallback.symbol, unitSource: 'option' };
    }
    problems.push(kind === 'field'
      ? importError(
        'IMPORT_FIELD_UNIT_MISSING',
        `No unit for field column "${printable(column.header, 60)}": the header states none (${where}). ` +
          `Write the unit in the header, e.g. "${printable(column.header, 60)} (mT)", or pass --field-unit mT (or G, µT); ringfall does not guess between gauss and millitesla.`,
        where, column.header)
      : importError(
        'IMPORT_DISTANCE_UNIT_MISSING',
        `No unit for distance column "${printable(column.header, 60)}": the header states none (${where}). ` +
          `Write the unit in the header, e.g. "${printable(column.header, 60)} (mm)", or pass --distance-unit mm (or cm, m, in).`,
        where, column.header));
    return column;
  });
  return { columns: resolved, factors };
}

function optionUnit(
  text: string | undefined,
  kind: 'field' | 'length',
  flag: string,
  source: string,
  problems: RingfallError[],
): UnitDefinition | null {
  if (text === undefined) return null;
  const unit = lookupUnit(text);
  if (unit && unit.kind === kind) return unit;
  problems.push(importError(
    'IMPORT_OPTION_UNIT',
    `${flag} not usable: "${printable(text, 40)}" is ${ambiguousUnit(text) ?? (unit ? `a ${unit.kind} unit` : 'not a unit ringfall knows')} (importing ${printable(source)}). ` +
      `Give a ${kind} unit: ${unitsOfKind(kind).join(', ')}.`,
    source, text,
  ));
  return null;
}
