import type { RingfallError } from '../../core/errors';
import { importError, place } from './import-errors';
import type { ColumnDetection, ColumnRole, ImportOptions } from './import-types';

const roles: readonly string[] = ['distance', 'radial', 'lateral', 'y', 'field', 'magnitude', 'bx', 'by', 'bz', 'uncertainty', 'coil', 'date', 'reading'];

/**
 * Apply hand-made column assignments (the web page's column mapping) over detection.
 * A mapped column takes the given role and unit ("set by hand"); a detected column that
 * held the same role gives it up (a field or |B| column set by hand replaces every
 * detected field, |B| and component column). A mapping that names no column, or an unknown role,
 * is an IMPORT_MAPPING problem.
 *
 * @returns new column detections; `problems` receives mapping errors
 */
export function applyMapping(
  detected: readonly ColumnDetection[],
  options: ImportOptions,
  headerLine: number,
  problems: RingfallError[],
): ColumnDetection[] {
  const columns = detected.map((c) => ({ ...c }));
  const mapped = new Set<number>();
  for (const mapping of options.mapping ?? []) {
    const index = typeof mapping.column === 'number'
      ? (Number.isInteger(mapping.column) && mapping.column >= 0 && mapping.column < columns.length ? mapping.column : -1)
      : columns.findIndex((c) => c.header === String(mapping.column).trim());
    if (index < 0 || (mapping.role !== 'ignore' && mapping.role !== 'position' && !roles.includes(mapping.role))) {
      problems.push(importError(
        'IMPORT_MAPPING',
        `Column mapping not applied: ${index < 0 ? `no column ${JSON.stringify(mapping.column)}` : `unknown role "${mapping.role}"`} ` +
          `(${place(options.source, headerLine)}; columns: ${columns.map((c) => `"${c.header}"`).join(', ')}). ` +
          `Name a column by its 0-based index or exact header, with a role of ${roles.join(', ')}, position or ignore.`,
        place(options.source, headerLine), mapping,
      ));
      continue;
    }
    // 'position': the distance column, read as signed ruler positions (a scan)
    const role: ColumnRole | null = mapping.role === 'ignore' ? null : mapping.role === 'position' ? 'distance' : mapping.role;
    if (role !== null) {
      for (const other of columns) {
        if (other.role !== null && clashes(role, other.role) && other.index !== index && !mapped.has(other.index)) {
          Object.assign(other, { role: null, unit: null, unitSource: null, reason: `replaced by column ${index + 1} set by hand` });
        }
      }
    }
    const column = columns[index] as ColumnDetection;
    const unit = mapping.unit ?? (role === column.role ? column.unit : null);
    const { axis: _axis, ...rest } = column;
    columns[index] = {
      ...rest,
      ...(mapping.role === 'position' ? { axis: 'scan' as const } : {}),
      role,
      unit: role === null ? null : unit,
      unitSource: role === null || unit === null ? null : mapping.unit !== undefined ? 'mapping' : column.unitSource,
      reason: role === null ? 'ignored (set by hand)' : `set by hand as ${mapping.role === 'position' ? 'ruler position (a scan)' : role}`,
    };
    mapped.add(index);
  }
  return columns;
}

/** A single field column set by hand replaces every detected field reading column. */
function clashes(mappedRole: ColumnRole, otherRole: ColumnRole): boolean {
  if (mappedRole === otherRole) return true;
  const singleField = mappedRole === 'field' || mappedRole === 'magnitude';
  return singleField && ['field', 'magnitude', 'bx', 'by', 'bz'].includes(otherRole);
}
