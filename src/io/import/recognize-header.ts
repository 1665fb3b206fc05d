import { lookupUnit } from '../../core/units';
import { isValueName, normalizeColumnName, roleForName, unitKindOf } from './header-names';
import type { ColumnRole } from './import-types';
import { printable } from '../../core/text/printable';

/** What one header cell says: a role (or none), the unit text written in it, and why. */
export interface HeaderReading {
  readonly role: ColumnRole | null;
  /** Unit text as written ("mm", "µT", "Oe"), not yet validated; null when none is written. */
  readonly unitText: string | null;
  readonly reason: string;
}

/** A header split into the name before a unit and the unit text, or null when the form does not apply. */
type Split = { readonly name: string; readonly unitText: string } | null;

/**
 * Unit forms tried in order; each splits a trimmed header into name and unit text.
 * Hand-written scans from the end of the cell, each linear in its length: the regular
 * expressions these replace (`^(.*?)\s*\(…\)$` and the like) backtracked quadratically
 * on a long run of spaces (a 30,000-character cell took seconds).
 */
const unitForms: readonly { readonly form: string; readonly split: (text: string) => Split; readonly knownUnitOnly: boolean }[] = [
  { form: 'in parentheses', split: (text) => enclosed(text, '(', ')'), knownUnitOnly: false },
  { form: 'in brackets', split: (text) => enclosed(text, '[', ']'), knownUnitOnly: false },
  { form: 'in braces', split: (text) => enclosed(text, '{', '}'), knownUnitOnly: false },
  { form: 'after a slash', split: afterSlash, knownUnitOnly: false },
  { form: 'after "in"', split: afterIn, knownUnitOnly: true },
  { form: 'as a suffix', split: asSuffix, knownUnitOnly: true },
];

/** `name (unit)`: the cell ends with the closing mark and the unit holds neither mark. */
function enclosed(text: string, open: string, close: string): Split {
  if (!text.endsWith(close)) return null;
  const at = text.lastIndexOf(open, text.length - 2);
  if (at === -1 || text.indexOf(close, at + 1) !== text.length - 1) return null;
  return { name: text.slice(0, at).trimEnd(), unitText: text.slice(at + 1, -1).trim() };
}

/** `name / unit`: the unit is what follows the last slash. */
function afterSlash(text: string): Split {
  const at = text.lastIndexOf('/');
  if (at === -1) return null;
  return { name: text.slice(0, at).trimEnd(), unitText: text.slice(at + 1).trim() };
}

/** `name in unit`: the last word, after the word "in" (any case) with white space around it. */
function afterIn(text: string): Split {
  let at = text.length;
  while (at > 0 && !isSpace(text.charCodeAt(at - 1))) at -= 1;
  if (at === 0 || at === text.length) return null;
  const before = text.slice(0, at).trimEnd();
  const word = before.slice(-2).toLowerCase();
  if (word !== 'in' || before.length < 3 || !isSpace(before.charCodeAt(before.length - 3))) return null;
  return { name: before.slice(0, -2).trimEnd(), unitText: text.slice(at) };
}

/** `name_unit`, `name-unit`, `name unit`: the last run of other characters after a separator. */
function asSuffix(text: string): Split {
  let at = text.length;
  while (at > 0 && !isSeparator(text.charCodeAt(at - 1))) at -= 1;
  if (at === 0 || at === text.length) return null;
  let end = at;
  while (end > 0 && isSeparator(text.charCodeAt(end - 1))) end -= 1;
  return { name: text.slice(0, end), unitText: text.slice(at) };
}

function isSpace(code: number): boolean {
  return code === 32 || (code >= 9 && code <= 13) || code === 0xa0 || code === 0x1680 || (code >= 0x2000 && code <= 0x200a) ||
    code === 0x2028 || code === 0x2029 || code === 0x202f || code === 0x205f || code === 0x3000 || code === 0xfeff;
}

function isSeparator(code: number): boolean {
  return code === 95 || code === 45 || isSpace(code);
}

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
  if (bareRole) return { role: bareRole, unitText: null, reason: `name "${printable(header, 40)}" with no unit written` };
  const trimmed = header.trim();
  for (const { form, split, knownUnitOnly } of unitForms) {
    const match = split(trimmed);
    if (!match) continue;
    const name = normalizeColumnName(match.name);
    const unitText = match.unitText;
    if (name === '' || unitText === '') continue;
    const unit = lookupUnit(unitText);
    if (knownUnitOnly && !unit) continue;
    const role = roleForName(name);
    // "Reading (mT)" or "value [G]": a field unit makes a value name a field column.
    if ((role === 'reading' || (!role && isValueName(name))) && unit?.kind === 'field') {
      return { role: 'field', unitText, reason: `name "${printable(match.name, 40)}" with field unit "${printable(unitText, 40)}" ${form}: field values` };
    }
    if (role) {
      const numeric = unitKindOf(role) !== null;
      return {
        role,
        unitText: numeric ? unitText : null,
        reason: `name "${printable(match.name, 40)}"${numeric ? ` with unit "${printable(unitText, 40)}" ${form}` : ` ("${printable(unitText, 40)}" ${form} is not used)`}`,
      };
    }
  }
  return { role: null, unitText: null, reason: `"${printable(header, 40)}" is not a column name ringfall knows; ignored` };
}
