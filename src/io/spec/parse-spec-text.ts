import type { Spec } from '../../core/analysis/spec/spec';
import { jsonLineIndex } from './json-line-index';
import { readSpecEntry, type ParameterCatalog } from './read-spec-entry';
import { specError } from './spec-error';

/**
 * Parse a spec file (CONTRACT.md "Spec file"): JSON holding one spec or an array of them,
 * each giving a model, label parameters and/or field claims with tolerances, the reading
 * type and the coil ids it applies to. Quantities are read with their units into SI.
 * Two specs may not name the same coil, and at most one may name no coil.
 *
 * @param text the file's text (a UTF-8 byte-order mark is ignored)
 * @param source the file name, for messages
 * @param catalog parameters of each model id (the fit-model catalog)
 * @param modelIds the known ids, listed in messages
 * @throws RingfallError SPEC_JSON (syntax, with line and column), SPEC_EMPTY (also an empty
 *   file), SPEC_SHAPE, SPEC_KEY (also a key given twice in one object), SPEC_MODEL,
 *   SPEC_PARAM, SPEC_QUANTITY, SPEC_TOLERANCE, SPEC_READING_TYPE, SPEC_WAVEFORM, SPEC_DATUM,
 *   SPEC_DUPLICATE; each message names the line and field
 * @example parseSpecText('{"model":"loop","params":{"radius":"45 mm"},"tolerance":"5%"}', 'a.json', catalog, ids)[0].params[0].value // 0.045
 */
export function parseSpecText(text: string, source: string, catalog: ParameterCatalog, modelIds: readonly string[]): Spec[] {
  const clean = text.replace(/^\uFEFF/, '');
  if (clean.trim() === '') {
    throw specError('SPEC_EMPTY', 'Spec file', clean === '' ? 'the file is empty' : 'the file holds only white space', { source, line: null, field: '' },
      'Write one spec object, or a list of them, e.g. {"model": "loop", "params": {"radius": "45 mm"}, "tolerance": "10%"}.');
  }
  let parsed: unknown;
  try {
    parsed = JSON.parse(clean);
  } catch (cause) {
    const { line, column } = syntaxPlace(clean, (cause as Error).message);
    throw specError('SPEC_JSON', 'Spec file', `not valid JSON: ${(cause as Error).message}`, { source, line, field: '', ...(column === null ? {} : { column }) },
      'Fix the JSON syntax (quotes around keys and strings, commas between entries, no trailing comma).', undefined, cause);
  }
  const duplicateKeys: { path: string; line: number }[] = [];
  const lines = jsonLineIndex(clean, duplicateKeys);
  const duplicate = duplicateKeys[0];
  if (duplicate) {
    const [first = '', ...rest] = duplicate.path.split('.');
    const field = Array.isArray(parsed) ? [`spec ${Number(first) + 1}`, rest.join('.')].filter((p) => p !== '').join(' ') : duplicate.path;
    throw specError('SPEC_KEY', 'Spec file', `the key "${duplicate.path.split('.').pop() ?? ''}" appears twice in one object, and JSON keeps only the last`, { source, line: duplicate.line, field },
      'Give each key once; remove or rename the other.', duplicate.path);
  }
  const entries = Array.isArray(parsed) ? parsed : [parsed];
  if (entries.length === 0) {
    throw specError('SPEC_EMPTY', 'Spec file', 'the list of specs is empty', { source, line: 1, field: '' }, 'Give at least one spec object.');
  }
  const specs = entries.map((entry, index) =>
    readSpecEntry(entry, {
      source,
      name: Array.isArray(parsed) ? `spec ${index + 1}` : '',
      prefix: Array.isArray(parsed) ? String(index) : '',
      lines,
      catalog,
      modelIds,
    }),
  );
  checkDuplicates(specs, source, lines, Array.isArray(parsed));
  return specs;
}

function checkDuplicates(specs: readonly Spec[], source: string, lines: ReadonlyMap<string, number>, isArray: boolean): void {
  const seen = new Map<string, number>();
  specs.forEach((spec, index) => {
    for (const coil of spec.coils ?? ['']) {
      const earlier = seen.get(coil);
      if (earlier !== undefined) {
        const found = coil === '' ? `specs ${earlier + 1} and ${index + 1} both name no coil` : `specs ${earlier + 1} and ${index + 1} both apply to coil "${coil}"`;
        throw specError('SPEC_DUPLICATE', 'Spec file', found, { source, line: lines.get(isArray ? `${index}.coil` : 'coil') ?? lines.get(String(index)) ?? null, field: `spec ${index + 1} coil` },
          'Give each coil id one spec, and at most one spec without "coil" (it applies to every other coil).', coil);
      }
      seen.set(coil, index);
    }
  });
}

/** Line and column of a JSON.parse error from its message ("position N" or "line L column C"). */
function syntaxPlace(text: string, message: string): { line: number | null; column: number | null } {
  const lineColumn = /line (\d+) column (\d+)/.exec(message);
  if (lineColumn) return { line: Number(lineColumn[1]), column: Number(lineColumn[2]) };
  const position = /position (\d+)/.exec(message);
  if (!position) return { line: null, column: null };
  const before = text.slice(0, Number(position[1]));
  const line = before.split('\n').length;
  return { line, column: before.length - before.lastIndexOf('\n') };
}
