import type { ProblemCode } from '../../core/error-codes';
import type { Reading, ReadingType } from '../../core/survey/survey';
import type { ColumnLayout, NumericColumn } from './detect-columns';
import { explainNumberCell, readNumber, shorten } from './read-number';
import { readRowKey } from './read-row-key';
import type { RowContext } from './row-context';

/** Largest |value| taken for a reading: beyond any gaussmeter (the strongest DC magnets reach about 45 T). */
const maximumField = 100;
/** Largest distance taken, m: far beyond any coil survey. */
const maximumDistance = 100;

type Problem = { readonly column: string | null; readonly value: string | null; readonly code: ProblemCode; readonly reason: string };

/**
 * Read one data row into a Reading of its survey, or a RejectedRow with line, column,
 * value and reason. Rows whose coil, date or reading cell cannot be read belong to no
 * survey and go to `collector.unassigned`. Rows short of cells only in unused trailing
 * columns, and rows with extra empty trailing cells (a trailing delimiter), are read.
 */
export function readRow(cells: readonly string[], line: number, context: RowContext): void {
  const { layout, collector } = context;
  const widthProblem = checkWidth(cells, context);
  const key = readRowKey(cells, line, context, widthProblem);
  if (key === null) return;
  const group = collector.group(key.coil, key.date, key.readingType);
  const outcome = widthProblem ?? readNumbers(cells, line, layout, context.decimalComma);
  if ('reason' in outcome) {
    group.rejected.push({ line, column: outcome.column, value: outcome.value, reason: outcome.reason, code: outcome.code });
    return;
  }
  if (outcome.radial < 0) {
    group.negativeRadial += 1;
    group.readings.push({ ...outcome, radial: -outcome.radial });
    return;
  }
  group.readings.push(outcome);
}

/** A row's key cells: coil, date, reading type. */
function checkWidth(cells: readonly string[], context: RowContext): Problem | null {
  const width = context.layout.width;
  if (cells.length === width) return null;
  if (cells.length > width) {
    const extra = cells.slice(width).find((cell) => cell.trim() !== '');
    if (extra === undefined) return null;
    return {
      column: null, value: shorten(extra.trim()), code: 'ROW_EXTRA_CELLS',
      reason: `the row has ${cells.length} cells but the header has ${width}; "${shorten(extra.trim())}" has no column. Fix the row or add a header for that column.` +
        decimalCommaHint(cells, width, context.decimalComma),
    };
  }
  const missing = context.headers.filter((_, index) => index >= cells.length && context.used[index]);
  if (missing.length === 0) return null;
  return {
    column: missing[0] ?? null, value: null, code: 'ROW_MISSING_CELLS',
    reason: `the row has ${cells.length} cell${cells.length === 1 ? '' : 's'} but the header has ${width}; no ${missing.map((m) => `"${shorten(m, 60)}"`).join(', ')}. Fill in the missing cells or delete the row.`,
  };
}

/** A hint when one extra cell could come from a decimal comma in a comma-delimited file ("3,412" read as 3 and 412). */
function decimalCommaHint(cells: readonly string[], width: number, decimalComma: boolean): string {
  if (decimalComma || cells.length !== width + 1) return '';
  for (let i = 0; i + 1 < cells.length; i += 1) {
    if (/^\s*[+-]?\d+\s*$/u.test(cells[i] ?? '') && /^\s*\d+\s*$/u.test(cells[i + 1] ?? '')) {
      return ' If a number in it has a decimal comma, write a decimal point instead (this comma-delimited file splits "1,5" into two cells), or save the file delimited by semicolons.';
    }
  }
  return '';
}

function readNumbers(cells: readonly string[], line: number, layout: ColumnLayout, decimalComma: boolean): Reading | Problem {
  const distance = readColumn(cells, layout.distance, decimalComma);
  if (typeof distance !== 'number') return distance;
  if (distance < 0 && layout.distanceAxis === 'distance') {
    return problem(cells, layout.distance, 'ROW_NEGATIVE_DISTANCE',
      'is negative; distances are measured outward from the coil (winding plane or near face). Put readings from the other side in their own survey with positive distances, or, for a scan through the coil, name the column "position" so that signed positions along the axis are used.');
  }
  if (Math.abs(distance) > maximumDistance) return problem(cells, layout.distance, 'ROW_IMPLAUSIBLE', `is more than ${maximumDistance} m; check the cell and the column's unit.`);
  let radial = 0;
  if (layout.radial) {
    const value = readColumn(cells, layout.radial, decimalComma);
    if (typeof value !== 'number') return value;
    if (Math.abs(value) > maximumDistance) return problem(cells, layout.radial, 'ROW_IMPLAUSIBLE', `is more than ${maximumDistance} m; check the cell and the column's unit.`);
    radial = value;
  }
  let field = 0;
  let components: Reading['components'];
  if (layout.components) {
    const [columnX, columnY, columnZ] = layout.components;
    const x = readComponent(cells, columnX, decimalComma);
    if (typeof x !== 'number') return x;
    const y = readComponent(cells, columnY, decimalComma);
    if (typeof y !== 'number') return y;
    const z = readComponent(cells, columnZ, decimalComma);
    if (typeof z !== 'number') return z;
    components = { x, y, z };
    field = Math.hypot(x, y, z);
  } else if (layout.field) {
    const value = readColumn(cells, layout.field, decimalComma);
    if (typeof value !== 'number') return value;
    if (value < 0 && layout.fieldKind === 'magnitude') {
      return problem(cells, layout.field, 'ROW_NEGATIVE_MAGNITUDE', 'is negative in a magnitude (|B|) column. Correct the reading, or write the column as "B" if it is a signed single-axis reading.');
    }
    if (Math.abs(value) > maximumField) return problem(cells, layout.field, 'ROW_IMPLAUSIBLE', `is more than ${maximumField} T; check the cell and the column's unit.`);
    field = value;
  }
  let standardUncertainty: number | undefined;
  if (layout.uncertainty && hasContent(cells[layout.uncertainty.index] ?? '')) {
    const value = readColumn(cells, layout.uncertainty, decimalComma);
    if (typeof value !== 'number') return value;
    if (!(value > 0)) {
      return problem(cells, layout.uncertainty, 'ROW_NEGATIVE_UNCERTAINTY', 'is not a positive uncertainty. Give a standard uncertainty above zero, or leave the cell empty.');
    }
    if (value > maximumField) return problem(cells, layout.uncertainty, 'ROW_IMPLAUSIBLE', `is more than ${maximumField} T; check the cell and the column's unit.`);
    standardUncertainty = value;
  }
  // One object literal per shape, so readings are built without later property additions.
  if (components) return standardUncertainty === undefined ? { line, distance, radial, field, components } : { line, distance, radial, field, components, standardUncertainty };
  return standardUncertainty === undefined ? { line, distance, radial, field } : { line, distance, radial, field, standardUncertainty };
}

/** True unless the cell is empty or white space (an empty uncertainty cell means "not given"). */
function hasContent(cell: string): boolean {
  return cell.length > 0 && (cell.charCodeAt(0) > 32 || cell.trim() !== '');
}

function readComponent(cells: readonly string[], column: NumericColumn, decimalComma: boolean): number | Problem {
  const value = readColumn(cells, column, decimalComma);
  if (typeof value === 'number' && Math.abs(value) > maximumField) {
    return problem(cells, column, 'ROW_IMPLAUSIBLE', `is more than ${maximumField} T; check the cell and the column's unit.`);
  }
  return value;
}

/** A cell converted to SI, or the problem with it. */
function readColumn(cells: readonly string[], column: NumericColumn, decimalComma: boolean): number | Problem {
  const cell = cells[column.index] ?? '';
  const value = readNumber(cell, decimalComma);
  if (Number.isFinite(value)) return column.divisor === 0 ? value * column.factor : value / column.divisor;
  const { code, reason } = explainNumberCell(cell, column.header, value);
  return { column: column.header, value: shorten(cell.trim()), code, reason };
}

function problem(cells: readonly string[], column: NumericColumn, code: ProblemCode, what: string): Problem {
  const value = shorten((cells[column.index] ?? '').trim());
  return { column: column.header, value, code, reason: `column "${shorten(column.header, 60)}": "${value}" ${what}` };
}
