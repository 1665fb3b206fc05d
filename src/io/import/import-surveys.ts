import type { ImportOptions, ImportResult } from './import-types';
import { SurveyImporter } from './survey-importer';

/** Characters handed to the parser at a time by importSurveys(). */
const sliceLength = 1 << 20;

/**
 * Import survey CSV text (CONTRACT.md "CSV survey files") into Surveys, SI inside, with
 * every row either used or reported. Runs in the browser and in Node.
 *
 * @param text the whole file as text (a byte-order mark is allowed)
 * @param options `source` for messages; `fieldUnit`, `distanceUnit` for headers without
 *   units; `mapping` to override column detection
 * @returns surveys (one per coil, date and reading type), skipped groups, unassigned rows,
 *   the detection and row counts
 * @throws RingfallError IMPORT_* (see import-errors.ts) for file-level problems
 * @example importSurveys('distance (mm),B (mT)\n0,1.7\n10,1.6\n20,1.3\n', { source: 'a.csv' }).surveys[0].readings[1].field // 0.0016
 */
export function importSurveys(text: string, options: ImportOptions): ImportResult {
  const importer = new SurveyImporter(options);
  for (let start = 0; start < text.length; start += sliceLength) importer.push(text.slice(start, start + sliceLength));
  return importer.finish();
}

/**
 * Import a survey from text chunks as they arrive (a decoded file stream in the CLI, a
 * File's text stream in the browser). Same result as importSurveys() on the joined text.
 *
 * @throws RingfallError IMPORT_* for file-level problems
 */
export async function importSurveysStreaming(
  chunks: AsyncIterable<string> | Iterable<string>,
  options: ImportOptions,
): Promise<ImportResult> {
  const importer = new SurveyImporter(options);
  for await (const chunk of chunks) importer.push(chunk);
  return importer.finish();
}
