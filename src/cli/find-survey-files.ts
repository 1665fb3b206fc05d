import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join, extname } from 'node:path';
import { RingfallError } from '../core/errors';
import { isSkipped, readSkipList, type SkipList, type SkippedFiles } from './skip-list';

/** File endings taken as survey logs when a folder is given. */
const surveyEndings = new Set(['.csv', '.tsv', '.txt']);

/** Options of findSurveyFiles and surveyFilesFrom. */
export interface SurveySearchOptions {
  /** Honour `.ringfall-skip` lists in the folders searched (default true; `--no-skip` turns it off). */
  readonly skipLists?: boolean;
  /** Filled with what each skip list left out, one entry per list that left out anything. */
  readonly skipped?: SkippedFiles[];
}

/**
 * Expand the command line's DIR|FILE arguments into survey files: a file is taken as
 * given (whatever its ending); a folder is searched recursively for .csv, .tsv and .txt
 * files, leaving out what a `.ringfall-skip` list in a searched folder names (skip-list.ts;
 * what was left out goes to `options.skipped`, nothing silently). Files named directly are
 * never left out. The result is sorted so that runs are deterministic.
 * @throws RingfallError `INPUT_NOT_FOUND` when an argument does not exist,
 *   `INPUT_EMPTY_FOLDER` when no survey file is found at all.
 */
export function findSurveyFiles(paths: readonly string[], options: SurveySearchOptions = {}): string[] {
  const found = new Set<string>();
  const skipped = new Map<string, { list: SkipList; files: string[] }>();
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
    if (stats.isDirectory()) walk(path, found, options.skipLists === false ? null : [], skipped);
    else found.add(path);
  }
  const leftOut = [...skipped.values()].map(({ list, files }) => ({ list: list.path, patterns: list.patterns, files: files.filter((file) => !found.has(file)).sort() }))
    .filter((entry) => entry.files.length > 0);
  options.skipped?.push(...leftOut);
  if (found.size === 0) {
    const because = leftOut.length > 0 ? ` (${leftOut.map((entry) => `${entry.files.length} left out by ${entry.list}`).join(', ')}; --no-skip fits them)` : '';
    throw new RingfallError(
      'INPUT_EMPTY_FOLDER',
      `No survey files found: ${paths.join(', ')} holds no .csv, .tsv or .txt file${because}. Name the files directly or point to the folder that holds them.`,
      { value: paths },
    );
  }
  return [...found].sort();
}

/** One line per skip list that left files out, for stderr and the text summary. */
export function skippedLines(skipped: readonly SkippedFiles[]): string[] {
  return skipped.map((entry) => `left out ${entry.files.length} file${entry.files.length === 1 ? '' : 's'} that ${entry.list} lists as not surveys (${entry.patterns.join(', ')}); --no-skip fits them too`);
}

/**
 * Search `folder`; `lists` are the skip lists in force (the folders above, within this
 * search), or null when skip lists are off.
 */
function walk(folder: string, found: Set<string>, lists: readonly SkipList[] | null, skipped: Map<string, { list: SkipList; files: string[] }>): void {
  const own = lists === null ? null : readSkipList(folder);
  const active = lists === null ? null : own === null ? lists : [...lists, own];
  const entries = readdirSync(folder, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const entry of entries) {
    if (entry.name.startsWith('.') || entry.name === 'node_modules') continue;
    const path = join(folder, entry.name);
    const isFolder = entry.isDirectory();
    if (!isFolder && !(entry.isFile() && surveyEndings.has(extname(entry.name).toLowerCase()))) continue;
    const by = active?.find((list) => isSkipped(list, path, isFolder));
    if (by !== undefined) {
      const record = skipped.get(by.path) ?? { list: by, files: [] };
      skipped.set(by.path, record);
      if (isFolder) {
        const inside = new Set<string>();
        walk(path, inside, null, skipped);
        record.files.push(...inside);
      } else {
        record.files.push(path);
      }
      continue;
    }
    if (isFolder) walk(path, found, active, skipped);
    else found.add(path);
  }
}

/** Missing paths named one by one in the --files-from message; the rest are counted. */
const missingShown = 5;

/**
 * The survey files of `fit` and `batch`: the command line's DIR|FILE arguments plus, with
 * `--files-from LIST`, the paths in LIST (`-`: standard input), one per line, relative to
 * the current folder as on the command line; blank lines are skipped, folders are searched.
 * A list has no length limit, where a command line does (the shell refuses one over
 * 128 KiB per argument string on Linux, and npx passes its whole command as one).
 * @throws RingfallError `USAGE_NO_INPUT` when nothing is named, `INPUT_UNREADABLE` when
 *   the list cannot be read, `INPUT_LIST_EMPTY` when it names nothing, `INPUT_NOT_FOUND`
 *   naming the lines whose paths do not exist, and findSurveyFiles's errors.
 */
export function surveyFilesFrom(paths: readonly string[], filesFrom: string | undefined, options: SurveySearchOptions = {}): string[] {
  if (filesFrom === undefined) {
    if (paths.length === 0) {
      throw new RingfallError('USAGE_NO_INPUT', 'No survey files given. Name the files or the folders that hold them, or give a list with --files-from FILE (one path per line).');
    }
    return findSurveyFiles(paths, options);
  }
  const listName = filesFrom === '-' ? 'standard input' : `"${filesFrom}"`;
  let text: string;
  try {
    text = readFileSync(filesFrom === '-' ? 0 : filesFrom, 'utf8');
  } catch (cause) {
    throw new RingfallError('INPUT_UNREADABLE', `--files-from: cannot read ${listName}: ${(cause as NodeJS.ErrnoException).code ?? (cause as Error).message}. Give a file that lists one survey path per line, or - to read the list from standard input.`, { value: filesFrom, where: '--files-from', cause });
  }
  const listed = text.replace(/^\uFEFF/, '').split(/\r?\n/).flatMap((line, index) => (line.trim() === '' ? [] : [{ path: line, line: index + 1 }]));
  if (listed.length === 0) {
    throw new RingfallError('INPUT_LIST_EMPTY', `--files-from: ${listName} names no file (blank lines are skipped). Put one survey path per line.`, { value: filesFrom, where: '--files-from' });
  }
  const missing = listed.filter((entry) => !existsSync(entry.path));
  if (missing.length > 0) {
    const named = missing.slice(0, missingShown).map((entry) => `line ${entry.line} "${entry.path}"`).join(', ');
    const more = missing.length > missingShown ? ` and ${missing.length - missingShown} more` : '';
    throw new RingfallError(
      'INPUT_NOT_FOUND',
      `--files-from ${listName}: ${missing.length} of ${listed.length} paths do not exist: ${named}${more}. Paths are read relative to the current folder (${process.cwd()}); fix the list or run from the folder it was written for.`,
      { value: missing.map((entry) => entry.path), where: '--files-from' },
    );
  }
  return findSurveyFiles([...paths, ...listed.map((entry) => entry.path)], options);
}
