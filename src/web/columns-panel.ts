import { distanceColumnAxis, type ColumnDetection, type ColumnMapping, type ColumnRole } from '../io';
import { displaySymbol, unitsOfKind } from '../core/units';
import { pageText } from './page-words';
import { h, uniqueId, type Child } from './dom';
import type { FileOutcome } from './pipeline';

/** The roles a column can be given here; 'position' is the distance column read as signed ruler positions (a scan). */
type PageRole = ColumnRole | 'position';

const roles: readonly PageRole[] = ['distance', 'position', 'radial', 'lateral', 'y', 'field', 'magnitude', 'bx', 'by', 'bz', 'uncertainty', 'coil', 'date', 'reading'];

const roleWords: Readonly<Record<PageRole | 'ignore', string>> = {
  distance: 'distance along the axis (z of a 3-D map)', position: 'position on a ruler through the coil (a scan)', radial: 'radial offset', lateral: 'position across the coil (a transverse scan; x of a 3-D map)', y: 'y of a 3-D map', field: 'field, signed single axis', magnitude: 'field magnitude |B|',
  bx: 'component Bx', by: 'component By', bz: 'component Bz (axial)', uncertainty: 'reading uncertainty', coil: 'coil id', date: 'date',
  reading: 'detector type (dc/rms/peak)', ignore: 'not used',
};

/** Which units a role takes: lengths, fields, or none. */
function unitsFor(role: PageRole | 'ignore'): readonly string[] {
  if (role === 'distance' || role === 'position' || role === 'radial' || role === 'lateral' || role === 'y') return unitsOfKind('length');
  if (['field', 'magnitude', 'bx', 'by', 'bz', 'uncertainty'].includes(role)) return unitsOfKind('field');
  return [];
}

/**
 * "What the file said": per file, how it was read (delimiter, decimal mark, metadata),
 * a row per column with its role, unit and the importer's reason — editable by hand —
 * and the rows not used with line and reason. `onApply` gets the new mapping.
 */
export function columnsPanel(outcome: FileOutcome, current: readonly ColumnMapping[] | null, onApply: (mapping: ColumnMapping[] | null) => void): HTMLElement {
  const detection = outcome.detection;
  const summary = outcome.error
    ? 'not read'
    : `${outcome.surveys.reduce((sum, s) => sum + s.used, 0)} rows used, ${outcome.rowsNotUsedTotal} not used, ${outcome.surveys.length} survey(s)`;
  const body: Child[] = [];
  if (detection) {
    body.push(h('p', { class: 'muted' },
      `Delimiter ${detection.delimiter === '\t' ? 'tab' : `"${detection.delimiter}"`}, decimal mark ${detection.decimalComma ? 'comma' : 'point'}, header on line ${detection.headerLine}, readings: ${detection.fieldKind}.`));
    if (detection.metadata.length > 0) {
      body.push(h('p', { class: 'muted' }, 'Metadata: ', detection.metadata.map((m, i) => [i > 0 ? '; ' : '', `${m.key}: ${m.value}`])));
    }
    for (const note of detection.notes) body.push(h('p', { class: 'muted' }, note));
    const selects: { role: HTMLSelectElement; unit: HTMLSelectElement; column: ColumnDetection }[] = [];
    const rows = detection.columns.map((column) => {
      const roleId = uniqueId('role');
      const unitId = uniqueId('unit');
      // a distance column of ruler positions (set so, or named as always meaning a scan) shows as such
      const shown: PageRole | 'ignore' = column.role === 'distance' && (column.axis === 'scan' || distanceColumnAxis(column.header) === 'scan') ? 'position' : column.role ?? 'ignore';
      const role = h('select', { id: roleId, 'aria-label': `Role of column ${column.index + 1} "${column.header}"` },
        (['ignore', ...roles] as const).map((r) => h('option', { value: r, selected: shown === r }, roleWords[r])));
      const unit = h('select', { id: unitId, 'aria-label': `Unit of column ${column.index + 1} "${column.header}"` });
      const fillUnits = () => {
        const chosen = role.value as PageRole | 'ignore';
        const options = unitsFor(chosen);
        unit.replaceChildren(h('option', { value: '' }, options.length === 0 ? '—' : column.unit ? `as read (${displaySymbol(column.unit)})` : 'choose…'),
          ...options.map((u) => h('option', { value: u }, u)));
        unit.disabled = options.length === 0;
      };
      fillUnits();
      role.addEventListener('change', fillUnits);
      selects.push({ role, unit, column });
      return h('li', { class: 'column-card' },
        h('p', { class: 'column-head' }, h('span', { class: 'muted' }, `column ${column.index + 1}`), ' ', h('code', {}, column.header)),
        h('div', { class: 'row' }, role, unit),
        h('p', { class: 'muted small' }, pageText(column.reason)));
    });
    body.push(h('ul', { class: 'column-cards' }, rows));
    const apply = h('button', { type: 'button', class: 'primary' }, 'Use this reading and refit');
    apply.addEventListener('click', () => {
      onApply(selects.map(({ role, unit, column }) => {
        const mapping: ColumnMapping = { column: column.index, role: role.value as PageRole | 'ignore' };
        return unit.value ? { ...mapping, unit: unit.value } : mapping;
      }));
    });
    const reset = h('button', { type: 'button', disabled: current === null }, 'Back to what was detected');
    reset.addEventListener('click', () => onApply(null));
    body.push(h('div', { class: 'row' }, apply, reset));
  }
  if (outcome.skipped.length > 0) {
    body.push(h('ul', { class: 'warn-list' }, outcome.skipped.map((s) => h('li', {}, `${s.coil ?? 'no coil'} ${s.date ?? ''}: ${pageText(s.reason)}`))));
  }
  if (outcome.rowsNotUsedTotal > 0) {
    body.push(h('h4', {}, `Rows not used (${outcome.rowsNotUsedTotal})`));
    body.push(h('table', { class: 'grid' },
      h('thead', {}, h('tr', {}, ['line', 'column', 'cell', 'reason'].map((t) => h('th', { scope: 'col' }, t)))),
      h('tbody', {}, outcome.rowsNotUsed.map((row) => h('tr', {},
        h('td', { class: 'num' }, String(row.line)), h('td', {}, row.column ?? '—'), h('td', {}, h('code', {}, row.value ?? '')), h('td', {}, pageText(row.reason)))))));
    if (outcome.rowsNotUsedTotal > outcome.rowsNotUsed.length) {
      body.push(h('p', { class: 'muted' }, `The first ${outcome.rowsNotUsed.length} are listed, in line order; the JSON export also lists every row set aside inside a fitted survey.`));
    }
  }
  return h('details', { class: 'file-columns', open: outcome.error !== null || outcome.rowsNotUsedTotal > 0 || current !== null },
    h('summary', {}, h('span', { class: 'file-name' }, outcome.name), ` — ${summary}${current ? ' (columns set by hand)' : ''}`),
    body);
}
