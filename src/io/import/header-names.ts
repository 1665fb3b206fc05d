import type { ColumnRole } from './import-types';

/**
 * Column names the importer knows, after normalisation (lower case; runs of spaces,
 * underscores, hyphens and dots made one space). Our own list of the names gaussmeter
 * logs and hand-made spreadsheets use; a name not here is reported, never guessed at.
 */
const namesByRole: Readonly<Record<ColumnRole, readonly string[]>> = {
  distance: [
    'distance', 'dist', 'z', 'd', 'axial distance', 'axial position', 'axial', 'depth',
    'height', 'position', 'pos', 'gap', 'distance from coil', 'distance to coil', 'probe distance',
    'scan position', 'ruler position', 'signed position',
  ],
  radial: [
    'radial offset', 'radial', 'rho', 'ρ', 'r offset', 'radial distance', 'radial position',
    'lateral offset', 'lateral', 'off axis', 'off axis distance', 'offset radial',
  ],
  lateral: [
    'x', 'lateral position', 'transverse position', 'across', 'cross position', 'x position', 'transverse',
  ],
  y: ['y', 'y position'],
  field: [
    'b', 'field', 'b field', 'bfield', 'flux density', 'magnetic field', 'magnetic flux density',
    'field strength', 'axial field', 'b axial',
  ],
  magnitude: [
    '|b|', '|field|', '| b |', 'b magnitude', 'b mag', 'bmag', 'field magnitude', 'magnitude',
    'b total', 'btotal', 'b tot', 'total field', 'b abs', 'abs b', 'abs(b)', 'b resultant', 'resultant',
  ],
  bx: ['bx', 'b x'],
  by: ['by', 'b y'],
  bz: ['bz', 'b z'],
  uncertainty: [
    'uncertainty', 'u', 'u(b)', 'ub', 'u b', 'standard uncertainty', 'std uncertainty',
    'b uncertainty', 'field uncertainty', 'sigma', 'sigma b', 'sd', 'std', 'std dev',
  ],
  coil: [
    'coil', 'coil id', 'coil name', 'coil no', 'coil number', 'id', 'device', 'device id',
    'applicator', 'serial', 'serial no', 'serial number', 'sn', 'asset', 'asset id',
  ],
  date: ['date', 'survey date', 'measurement date', 'date time', 'datetime', 'timestamp', 'day'],
  reading: [
    'reading', 'reading type', 'detector', 'detector type', 'mode', 'meter mode', 'type',
    'measurement type', 'dc/rms/peak',
  ],
};

const roleByName = new Map<string, ColumnRole>();
for (const [role, names] of Object.entries(namesByRole) as [ColumnRole, readonly string[]][]) {
  for (const name of names) roleByName.set(name, role);
}

/** Names that hold a field value when a field unit follows them ("Reading (mT)", "value [G]"). */
const valueNames = new Set(['reading', 'value', 'measurement', 'meas', 'result']);

/** Distance-column names that mean a position on a ruler along the axis (signed when any value is negative). */
const positionNames: ReadonlySet<string> = new Set(['position', 'pos', 'axial position', 'z']);
/** Distance-column names that always mean a signed position on a ruler along the axis (a scan). */
const scanNames: ReadonlySet<string> = new Set(['scan position', 'ruler position', 'signed position']);

/** Lateral-column names that mean a signed position across the coil only when a value is negative (else a radial offset). */
const lateralIfNegativeNames: ReadonlySet<string> = new Set(['x']);

/**
 * What a lateral column's header says: 'position' for "x" (a transverse scan when any
 * value is negative, else radial offsets from the axis), 'scan' for the names that always
 * mean a signed position across the coil ("lateral position (mm)", "transverse position",
 * "across", "cross position", "x position", "transverse"). The unit part is dropped as
 * for distanceColumnAxis.
 *
 * @example lateralColumnAxis('x (mm)') // 'position'
 */
export function lateralColumnAxis(header: string): 'position' | 'scan' {
  return nameCandidates(header).some((name) => lateralIfNegativeNames.has(name)) ? 'position' : 'scan';
}

/** A header's name with the unit part dropped in each way it may be written. */
function nameCandidates(header: string): string[] {
  const normalized = normalizeColumnName(header);
  const words = normalized.split(' ');
  return [
    normalized,
    normalizeColumnName(header.replace(/\s*[([].*$/u, '')),
    normalizeColumnName(header.replace(/\s*\/.*$/u, '')),
    words.slice(0, -1).join(' '),
  ];
}

/**
 * What a distance column's header says about its zero: 'scan' for a name that always
 * means a signed ruler position ("scan position (mm)"), 'position' for a name that means
 * one when the survey has a negative value ("z (mm)", "position", "pos_mm", "axial
 * position"), else 'distance' (outward from the datum). The unit part is dropped first:
 * a bracket, "/unit", or a last word after a separator.
 *
 * @example distanceColumnAxis('pos_mm') // 'position'
 */
export function distanceColumnAxis(header: string): 'distance' | 'position' | 'scan' {
  const candidates = nameCandidates(header);
  if (candidates.some((name) => scanNames.has(name))) return 'scan';
  if (candidates.some((name) => positionNames.has(name))) return 'position';
  return 'distance';
}

/** Lower-case a column name and make runs of spaces, underscores, hyphens and dots one space. */
export function normalizeColumnName(name: string): string {
  return name.toLowerCase().replace(/[\s_\-.]+/g, ' ').trim();
}

/** The role a (normalised) column name stands for, or undefined when it is not known. */
export function roleForName(normalizedName: string): ColumnRole | undefined {
  return roleByName.get(normalizedName);
}

/** True for names like "reading" or "value" that mean the field when a field unit is given. */
export function isValueName(normalizedName: string): boolean {
  return valueNames.has(normalizedName);
}

/** A short list of accepted names for messages: `"distance", "z", "dist"`. */
export function exampleNames(role: ColumnRole, count = 4): string {
  return namesByRole[role].slice(0, count).map((n) => `"${n}"`).join(', ');
}

/** Numeric roles and the kind of unit they take. */
export function unitKindOf(role: ColumnRole): 'length' | 'field' | null {
  switch (role) {
    case 'distance':
    case 'radial':
    case 'lateral':
    case 'y':
      return 'length';
    case 'field':
    case 'magnitude':
    case 'bx':
    case 'by':
    case 'bz':
    case 'uncertainty':
      return 'field';
    default:
      return null;
  }
}
