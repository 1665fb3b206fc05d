import type { RingfallError } from '../../core/errors';
import type { FieldKind, SurveyUnits } from '../../core/survey/survey';
import { displaySymbol } from '../../core/units';
import { applyMapping } from './apply-mapping';
import { distanceColumnAxis, exampleNames, lateralColumnAxis } from './header-names';
import { importError, place } from './import-errors';
import type { ColumnDetection, ColumnRole, ImportOptions } from './import-types';
import { shorten } from './read-number';
import { recognizeHeader } from './recognize-header';
import { resolveUnits } from './resolve-units';

/** A numeric column ready for the row reader: where it is and its factor to SI. */
export interface NumericColumn {
  readonly index: number;
  readonly header: string;
  /** Multiply a cell value by this to get SI (m or T). */
  readonly factor: number;
  /**
   * 1/factor when that is a whole number (mm → 1000, G → 10000), else 0. Dividing by an
   * exact integer rounds correctly, so "1.7 mT" and "17 G" give the same double.
   */
  readonly divisor: number;
}

/** Everything the row reader needs to know about the columns. */
export interface ColumnLayout {
  readonly width: number;
  readonly fieldKind: FieldKind;
  readonly distance: NumericColumn;
  /**
   * What the distance column's name says (distanceColumnAxis): 'distance' outward from the
   * datum (negative values rejected), 'position' a ruler position, a scan when any value is
   * negative, 'scan' always a scan. Positions may be negative.
   */
  readonly distanceAxis: 'distance' | 'position' | 'scan';
  /** The radial-offset column, or the lateral column (signed positions across the coil; a 3-D map's x). */
  readonly radial: NumericColumn | null;
  /**
   * What the radial column holds: 'offset' radial offsets from the axis (a negative value
   * is read as its absolute value), 'position' a lateral position ("x"), a transverse scan
   * when any value is negative, 'scan' always a transverse scan (lateralColumnAxis), 'map'
   * the x of a 3-D map (a y column is present).
   */
  readonly radialAxis: 'offset' | 'position' | 'scan' | 'map';
  /** A 3-D map's y column; null otherwise. */
  readonly y: NumericColumn | null;
  /** The field column (plain B, |B| or a lone Bz); null when components are used. */
  readonly field: NumericColumn | null;
  readonly components: readonly [NumericColumn, NumericColumn, NumericColumn] | null;
  readonly uncertainty: NumericColumn | null;
  readonly coil: number | null;
  readonly date: number | null;
  readonly reading: number | null;
  /** The units the distance and field columns were written in, as people write them (µ for micro). */
  readonly units: SurveyUnits;
}

export interface ColumnDetectionResult {
  readonly columns: ColumnDetection[];
  readonly fieldKind: FieldKind;
  readonly notes: string[];
  /** File-level problems, most basic first; empty when `layout` is set. */
  readonly problems: RingfallError[];
  readonly layout: ColumnLayout | null;
}

/**
 * Decide what every column holds: recognise each header (recognizeHeader), apply the
 * hand-made mapping, resolve units (header, then mapping, then --field-unit /
 * --distance-unit; never a guess), check that distance and exactly one kind of field
 * reading are present, and build the layout. Never throws for the file's content: the
 * problems are returned so a page can show the detection next to them.
 *
 * @param headers header cells as written
 * @param headerLine 1-based line of the header, for messages
 */
export function detectColumns(headers: readonly string[], headerLine: number, options: ImportOptions): ColumnDetectionResult {
  const problems: RingfallError[] = [];
  const notes: string[] = [];
  const detected = headers.map((header, index): ColumnDetection => {
    const text = header.replace(/^\uFEFF/, '').trim();
    if (text === '') return { index, header: text, role: null, unit: null, unitSource: null, reason: 'empty header; ignored' };
    const reading = recognizeHeader(text);
    return { index, header: text, role: reading.role, unit: reading.unitText, unitSource: reading.unitText === null ? null : 'header', reason: reading.reason };
  });
  const columns = applyMapping(detected, options, headerLine, problems);
  const fieldKind = chooseFieldKind(columns, notes, problems, options.source, headerLine);
  for (const role of ['distance', 'radial', 'lateral', 'y', 'uncertainty', 'coil', 'date', 'reading'] as const) {
    const claimed = columns.filter((c) => c.role === role);
    if (claimed.length > 1) problems.push(conflict(role, claimed, options.source, headerLine));
  }
  const across = columns.filter((c) => c.role === 'radial' || c.role === 'lateral');
  if (across.length === 2 && across[0]!.role !== across[1]!.role) problems.push(conflict('radial or lateral', across, options.source, headerLine));
  if (columns.some((c) => c.role === 'y') && !columns.some((c) => c.role === 'lateral')) {
    problems.push(importError(
      'IMPORT_MAP_INCOMPLETE',
      `A y column without an x column (${place(options.source, headerLine)}): a 3-D map needs x, y and z. Add the x column (named "x"), or remove the y column.`,
      place(options.source, headerLine),
    ));
  }
  if (!columns.some((c) => c.role === 'distance')) {
    problems.unshift(importError(
      'IMPORT_NO_DISTANCE',
      `No distance column: the header has ${describeHeaders(columns)} (${place(options.source, headerLine)}). ` +
        `Name the distance column ${exampleNames('distance')} with its unit, e.g. "distance (mm)", or map the columns by hand.`,
      place(options.source, headerLine), headers,
    ));
  }
  const { columns: resolved, factors } = resolveUnits(columns, options, headerLine, problems, notes);
  const unused = resolved.filter((column) => column.role === null && column.reason !== 'empty header; ignored');
  for (const column of unused.slice(0, listedColumns)) notes.push(`column ${column.index + 1} "${shorten(column.header)}" is not used: ${column.reason}`);
  if (unused.length > listedColumns) notes.push(`${unused.length - listedColumns} more columns, the last column ${(unused.at(-1)?.index ?? 0) + 1}, are not used either (the column detection lists each)`);
  const layout = problems.length === 0 ? buildLayout(resolved, factors, fieldKind) : null;
  return { columns: resolved, fieldKind, notes, problems, layout };
}

function chooseFieldKind(columns: ColumnDetection[], notes: string[], problems: RingfallError[], source: string, headerLine: number): FieldKind {
  const has = (role: ColumnRole) => columns.some((c) => c.role === role);
  const components = ['bx', 'by', 'bz'].filter((r) => has(r as ColumnRole));
  if (components.length === 3) {
    for (const column of columns) {
      if (column.role === 'field' || column.role === 'magnitude') {
        notes.push(`column ${column.index + 1} "${shorten(column.header, 60)}" is not used: the magnitude is computed from Bx, By and Bz (map it by hand to use it instead)`);
        Object.assign(column, { role: null, unit: null, unitSource: null, reason: 'field computed from Bx, By, Bz instead' });
      }
    }
    return 'components';
  }
  if (has('bx') || has('by')) {
    problems.push(importError(
      'IMPORT_COMPONENTS_INCOMPLETE',
      `Field components incomplete: found ${components.map((c) => `"${c.replace('b', 'B')}"`).join(' and ')} but not all of Bx, By, Bz (${place(source, headerLine)}). ` +
        'Give all three components, or one field column such as "B (mT)" or "|B| (mT)".',
      place(source, headerLine),
    ));
    return 'components';
  }
  const fieldColumns = columns.filter((c) => c.role === 'field' || c.role === 'magnitude' || c.role === 'bz');
  if (fieldColumns.length > 1) problems.push(conflict('field', fieldColumns, source, headerLine));
  if (fieldColumns.length === 0) {
    problems.push(importError(
      'IMPORT_NO_FIELD',
      `No field column: the header has ${describeHeaders(columns)} (${place(source, headerLine)}). ` +
        `Name the field column ${exampleNames('field')} or "|B|" with its unit, e.g. "B (mT)", or map the columns by hand.`,
      place(source, headerLine),
    ));
  }
  return fieldColumns[0]?.role === 'magnitude' ? 'magnitude' : 'axial';
}

function conflict(role: string, claimed: readonly ColumnDetection[], source: string, headerLine: number): RingfallError {
  return importError(
    'IMPORT_COLUMN_CONFLICT',
    `More than one ${role} column: ${claimed.map((c) => `"${shorten(c.header, 60)}" (column ${c.index + 1})`).join(' and ')} (${place(source, headerLine)}). ` +
      'Remove or rename all but one, or map the columns by hand.',
    place(source, headerLine), claimed.map((c) => c.header),
  );
}

/** Columns named one by one in a message or in the notes; the rest are counted. */
const listedColumns = 10;

function describeHeaders(columns: readonly ColumnDetection[]): string {
  if (columns.length === 1) {
    return `one column "${shorten(columns[0]?.header ?? '')}" (delimiters read: comma, semicolon, tab)`;
  }
  const more = columns.length > listedColumns ? ` and ${columns.length - listedColumns} more` : '';
  return `${columns.length} columns ${columns.slice(0, listedColumns).map((c) => `"${shorten(c.header)}"`).join(', ')}${more}`;
}

function buildLayout(columns: readonly ColumnDetection[], factors: readonly number[], fieldKind: FieldKind): ColumnLayout {
  const numeric = (role: ColumnRole): NumericColumn | null => {
    const column = columns.find((c) => c.role === role);
    if (!column) return null;
    const factor = factors[column.index] ?? Number.NaN;
    const inverse = Math.round(1 / factor);
    const divisor = factor < 1 && Math.abs(1 / factor - inverse) <= 1e-9 * inverse ? inverse : 0;
    return { index: column.index, header: column.header, factor, divisor };
  };
  const index = (role: ColumnRole): number | null => columns.find((c) => c.role === role)?.index ?? null;
  const [x, y, z] = [numeric('bx'), numeric('by'), numeric('bz')];
  const components = fieldKind === 'components' && x && y && z ? ([x, y, z] as const) : null;
  const field = components ? null : numeric('field') ?? numeric('magnitude') ?? numeric('bz');
  const unitOf = (column: NumericColumn | null | undefined) => displaySymbol(columns[column?.index ?? -1]?.unit ?? '');
  return {
    width: columns.length,
    fieldKind,
    distance: numeric('distance') as NumericColumn,
    distanceAxis: columns.find((c) => c.role === 'distance')?.axis ?? distanceColumnAxis(columns.find((c) => c.role === 'distance')?.header ?? ''),
    radial: numeric('radial') ?? numeric('lateral'),
    radialAxis: numeric('lateral') === null ? 'offset' : numeric('y') !== null ? 'map' : lateralColumnAxis(columns.find((c) => c.role === 'lateral')?.header ?? ''),
    y: numeric('lateral') === null ? null : numeric('y'),
    field,
    components,
    uncertainty: numeric('uncertainty'),
    coil: index('coil'),
    date: index('date'),
    reading: index('reading'),
    units: { field: unitOf(field ?? components?.[0]), distance: unitOf(numeric('distance')) },
  };
}
