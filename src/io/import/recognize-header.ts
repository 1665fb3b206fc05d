import { lookupUnit } from '../../core/units';
import { isValueName, normalizeColumnName, roleForName, unitKindOf } from './header-names';
import type { ColumnRole } from './import-types';
import { shorten } from './read-number';

/** What one header cell says: a role (or none), the unit text written in it, and why. */
export interface HeaderReading {
  readonly role: ColumnRole | null;
  /** Unit text as written ("mm", "µT", "Oe"), not yet validated; null when none is written. */
  readonly unitText: string | null;
  readonly reason: string;
}

/** Unit forms tried in order; each splits a header into name and unit text. */
const unitForms: readonly { readonly form: string; readonly pattern: RegExp; readonly knownUnitOnly: boolean }[] = [
  { form: 'in parentheses', pattern: /^(.*?)\s*\(\s*([^()]*?)\s*\)$/u, knownUnitOnly: false },
  { form: 'in brackets', pattern: /^(.*?)\s*\[\s*([^[\]]*?)\s*\]$/u, knownUnitOnly: false },
  { form: 'in braces', pattern: /^(.*?)\s*\{\s*([^{}]*?)\s*\}$/u, knownUnitOnly: false },
  { form: 'after a slash', pattern: /^(.*?)\s*\/\s*([^/]+?)$/u, knownUnitOnly: false },
  { form: 'after "in"', pattern: /^(.*?)\s+in\s+(\S+)$/iu, knownUnitOnly: true },
  { form: 'as a suffix', pattern: /^(.*?)[\s_-]+([^\s_-]+)$/u, knownUnitOnly: true },
];

/**
 * Recognise one header cell: `distance (mm)`, `distance_mm`, `z [cm]`, `Distance/in`,
 * `B (mT)`, `field_G`, `|B| (uT)`, `Bx (mT)`, `rho (mm)`, `coil`, `date`, `reading`.
 * The whole cell is first matched as a bare name; then the unit forms above are tried,
 * and a form counts only when the part before the unit is a known name. A suffix or
 * "in" unit must also be a known unit ("radial offset" is not "radial" in "offset").
 * Names are matched case-insensitively with spaces, underscores, hyphens and dots alike.
 *
 * @param header the header cell as written
 * @example recognizeHeader('distance_mm') // { role: 'distance', unitText: 'mm', reason: … }
 */
export function recognizeHeader(header: string): HeaderReading {
  const bare = normalizeColumnName(header);
  const bareRole = roleForName(bare);
  if (bareRole) return { role: bareRole, unitText: null, reason: `name "${header}" with no unit written` };
  for (const { form, pattern, knownUnitOnly } of unitForms) {
    const match = pattern.exec(header.trim());
    if (!match) continue;
    const name = normalizeColumnName(match[1] ?? '');
    const unitText = (match[2] ?? '').trim();
    if (name === '' || unitText === '') continue;
    const unit = lookupUnit(unitText);
    if (knownUnitOnly && !unit) continue;
    const role = roleForName(name);
    // "Reading (mT)" or "value [G]": a field unit makes a value name a field column.
    if ((role === 'reading' || (!role && isValueName(name))) && unit?.kind === 'field') {
      return { role: 'field', unitText, reason: `name "${match[1]}" with field unit "${unitText}" ${form}: field values` };
    }
    if (role) {
      const numeric = unitKindOf(role) !== null;
      return {
        role,
        unitText: numeric ? unitText : null,
        reason: `name "${match[1]}"${numeric ? ` with unit "${unitText}" ${form}` : ` ("${unitText}" ${form} is not used)`}`,
      };
    }
  }
  return { role: null, unitText: null, reason: `"${shorten(header)}" is not a column name ringfall knows; ignored` };
}
