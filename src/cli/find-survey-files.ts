import { readdirSync, statSync } from 'node:fs';
import { join, extname } from 'node:path';
import { RingfallError } from '../core/errors';

/** File endings taken as survey logs when a folder is given. */
const surveyEndings = new Set(['.csv', '.tsv', '.txt']);

/**
 * Expand the command line's DIR|FILE arguments into survey files: a file is taken as
 * given (whatever its ending); a folder is searched recursively for .csv, .tsv and .txt
 * files. The result is sorted so that runs are deterministic.
 * @throws RingfallError `INPUT_NOT_FOUND` when an argument does not exist,
 *   `INPUT_EMPTY_FOLDER` when no survey file is found at all.
 */
export function findSurveyFiles(paths: readonly string[]): string[] {
  const found = new Set<string>();
  for (const path of paths) {
    let stats;
    try {
      stats = statSync(path);
    } catch (cause) {
      throw new RingfallError(
        'INPUT_NOT_FOUND',
        `Cannot read "${path}": no such file or folder. Check the path, or run from the folder that holds it.`,
        { value: path, cause },
      );
    }
    if (stats.isDirectory()) walk(path, found);
    else found.add(path);
  }
  if (found.size === 0) {
    throw new RingfallError(
      'INPUT_EMPTY_FOLDER',
      `No survey files found: ${paths.join(', ')} holds no .csv, .tsv or .txt file. Name the files directly or point to the folder that holds them.`,
      { value: paths },
    );
  }
  return [...found].sort();
}

function walk(folder: string, found: Set<string>): void {
  const entries = readdirSync(folder, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const entry of entries) {
    if (entry.name.startsWith('.') || entry.name === 'node_modules') continue;
    const path = join(folder, entry.name);
    if (entry.isDirectory()) walk(path, found);
    else if (entry.isFile() && surveyEndings.has(extname(entry.name).toLowerCase())) found.add(path);
  }
}
