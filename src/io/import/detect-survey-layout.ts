import type { RingfallError } from '../../core/errors';
import type { Detection, ImportOptions } from './import-types';
import { readLayout } from './read-layout';

/**
 * Show how a survey file would be read, without reading its rows: delimiter, decimal
 * mark, line breaks, metadata, and which column became what and why. Column problems
 * (no field unit, two distance columns …) are returned rather than thrown, so a page can
 * show the detection beside them and let the user map the columns by hand; pass the
 * mapping back to importSurveys() in `options.mapping`.
 *
 * @param text the file's text, or its first ~64 kB
 * @returns the detection and the file-level problems importSurveys() would throw (first first)
 * @throws RingfallError IMPORT_BINARY, IMPORT_EMPTY, IMPORT_NO_HEADER, IMPORT_METADATA (nothing to show)
 * @example detectSurveyLayout('z;B\n0;1,7\n', { source: 'a.csv' }).problems[0].code // 'IMPORT_DISTANCE_UNIT_MISSING'
 */
export function detectSurveyLayout(text: string, options: ImportOptions): { detection: Detection; problems: RingfallError[] } {
  const byteOrderMark = text.charCodeAt(0) === 0xfeff;
  const layout = readLayout(byteOrderMark ? text.slice(1) : text, byteOrderMark, true, options);
  if (!layout) throw new TypeError('readLayout() returned null for final text');
  return { detection: layout.detection, problems: layout.columns.problems };
}
