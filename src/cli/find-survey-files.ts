import { existsSync, readdirSync, readFileSync, realpathSync, statSync, type Dirent, type Stats } from 'node:fs';
import { join, extname } from 'node:path';
import { RingfallError } from '../core/errors';
import { isSkipped, readSkipList, type SkipList, type SkippedFiles } from './skip-list';
import type { ProblemCode } from '../core/error-codes';

/** File endings taken as survey logs when a folder is given. */
const surveyEndings = new Set(['.csv', '.tsv', '.txt']);

/** A path found while searching that will not be read, and why (batch lists it in fleet.unreadable, fit on stderr). */
export interface UnusablePath {
  readonly source: string;
  readonly reason: string;
  /** INPUT_FOLDER_UNREADABLE, INPUT_NOT_REGULAR, INPUT_SYMLINK_LOOP, INPUT_LINK_BROKEN, INPUT_UNREADABLE or INPUT_SKIP_LIST_UNREADABLE. */
  readonly code: Extract<ProblemCode, `INPUT_${string}`>;
}

/** Options of findSurveyFiles and surveyFilesFrom. */
export interface SurveySearchOptions {
  /** Honour `.ringfall-skip` lists in the folders searched (default true; `--no-skip` turns it off). */
  readonly skipLists?: boolean;
  /** Filled with what each skip list left out, one entry per list that left out anything. */
  readonly skipped?: SkippedFiles[];
  /** Filled with every path found that cannot be read (a folder that cannot be listed, a pipe, a broken link), with the reason. */
  readonly unusable?: UnusablePath[];
}

/** What one search has seen: files by real path, folders searched, skip-list results, unusable paths. */
interface Search {
  readonly found: Map<string, string>;
  readonly searched: Set<string>;
  readonly skipped: Map<string, { list: SkipList; files: string[] }>;
  readonly unusable: UnusablePath[];
}

const loopWords = 'it is a symbolic link that leads into a loop of links (ELOOP)';

/**
 * Expand the command line's DIR|FILE arguments into survey files: a file is taken as
 * given (whatever its ending); a folder is searched recursively for .csv, .tsv and .txt
 * files (names starting with "." and node_modules are left out), leaving out what a
 * `.ringfall-skip` list in a searched folder names (skip-list.ts; what was left out goes to
 * `options.skipped`). Files named directly are never left out. Only regular files are read:
 * a pipe, socket or device would block or never end, so it goes to `options.unusable` with
 * the reason, as does a folder that cannot be listed (the rest is still searched) and a
 * link that points to nothing or into a loop of links. Symbolic links are followed once: a
 * file reached by several paths is read once, under the first path in sorted order, and a
 * link back into a folder already searched is not followed again. Nothing is left out
 * silently. The result is sorted so that runs are deterministic.
 * @throws RingfallError `INPUT_NOT_FOUND` when an argument does not exist,
 *   `INPUT_SYMLINK_LOOP` when an argument is a loop of links, `INPUT_UNREADABLE` when the
 *   system refuses to look at it, `INPUT_EMPTY_FOLDER` when nothing at all is found.
 */
export function findSurveyFiles(paths: readonly string[], options: SurveySearchOptions = {}): string[] {
  const search: Search = { found: new Map(), searched: new Set(), skipped: new Map(), unusable: [] };
  for (const path of paths) {
    let stats: Stats;
    try {
      stats = statSync(path);
    } catch (cause) {
      const code = (cause as NodeJS.ErrnoException).code;
      if (code === 'ELOOP') throw new RingfallError('INPUT_SYMLINK_LOOP', `Cannot read "${path}": ${loopWords}. Point to the file itself, or fix the link.`, { value: path, cause });
      if (code !== 'ENOENT' && code !== 'ENOTDIR') {
        throw new RingfallError('INPUT_UNREADABLE', `Cannot read "${path}": ${code ?? (cause as Error).message}. Check the path and its permissions.`, { value: path, cause });
      }
      throw new RingfallError(
        'INPUT_NOT_FOUND',
        `Cannot read "${path}": no such file or folder. Check the path, or run from the folder that holds it.`,
        { value: path, cause },
      );
    }
    if (stats.isDirectory()) walk(path, search, options.skipLists === false ? null : []);
    else if (stats.isFile()) addFile(path, search.found);
    else search.unusable.push(notRegular(path, stats));
  }
  const files = new Set(search.found.values());
  const leftOut = [...search.skipped.values()].map(({ list, files: listed }) => ({ list: list.path, patterns: list.patterns, files: listed.filter((file) => !files.has(file)).sort() }))
    .filter((entry) => entry.files.length > 0);
  options.skipped?.push(...leftOut);
  options.unusable?.push(...search.unusable);
  if (files.size === 0 && search.unusable.length === 0) {
    const because = leftOut.length > 0 ? ` (${leftOut.map((entry) => `${entry.files.length} left out by ${entry.list}`).join(', ')}; --no-skip fits them)` : '';
    throw new RingfallError(
      'INPUT_EMPTY_FOLDER',
      `No survey files found: ${paths.join(', ')} holds no .csv, .tsv or .txt file${because}. Name the files directly or point to the folder that holds them.`,
      { value: paths },
    );
  }
  return [...files].sort();
}

/** One line per skip list that left files out, for stderr and the text summary. */
export function skippedLines(skipped: readonly SkippedFiles[]): string[] {
  return skipped.map((entry) => `left out ${entry.files.length} file${entry.files.length === 1 ? '' : 's'} that ${entry.list} lists as not surveys (${entry.patterns.join(', ')}); --no-skip fits them too`);
}

/**
 * Search `folder`; `lists` are the skip lists in force (the folders above, within this
 * search), or null when skip lists are off (or inside a folder a list left out).
 */
function walk(folder: string, search: Search, lists: readonly SkipList[] | null): void {
  let real: string;
  try {
    real = realpathSync(folder);
  } catch {
    real = folder;
  }
  // a folder reached again (a link back to a parent, or two links to one folder) is searched once
  if (search.searched.has(real)) return;
  search.searched.add(real);
  let entries: Dirent[];
  try {
    entries = readdirSync(folder, { withFileTypes: true });
  } catch (cause) {
    const code = (cause as NodeJS.ErrnoException).code ?? (cause as Error).message;
    search.unusable.push({ source: folder, code: 'INPUT_FOLDER_UNREADABLE', reason: `Cannot list the folder (${code}), so the survey files in it were not read. Give read and search permission on it, or leave it out.` });
    return;
  }
  const own = lists === null ? null : readSkipList(folder, (path, code) => search.unusable.push({
    source: path, code: 'INPUT_SKIP_LIST_UNREADABLE',
    reason: `Cannot read this skip list (${code}), so nothing in its folder was left out by it. Make it readable, or remove it.`,
  }));
  const active = lists === null ? null : own === null ? lists : [...lists, own];
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const entry of entries) {
    if (entry.name.startsWith('.') || entry.name === 'node_modules') continue;
    const path = join(folder, entry.name);
    const survey = surveyEndings.has(extname(entry.name).toLowerCase());
    let kind: 'folder' | 'file' | 'other';
    if (entry.isSymbolicLink()) {
      const target = followLink(path, survey, search);
      if (target === null) continue;
      kind = target;
    } else {
      kind = entry.isDirectory() ? 'folder' : entry.isFile() ? 'file' : 'other';
    }
    if (kind !== 'folder' && !survey) continue;
    const by = active?.find((list) => isSkipped(list, path, kind === 'folder'));
    if (by !== undefined) {
      const record = search.skipped.get(by.path) ?? { list: by, files: [] };
      search.skipped.set(by.path, record);
      if (kind === 'folder') {
        // what the list left out is counted by its files, found by a search of its own
        const inside: Search = { found: new Map(), searched: search.searched, skipped: search.skipped, unusable: [] };
        walk(path, inside, null);
        record.files.push(...inside.found.values());
      } else {
        record.files.push(path);
      }
      continue;
    }
    if (kind === 'folder') walk(path, search, active);
    // a file that is not a link is where its folder really is: its real path needs no system call
    else if (kind === 'file') addFile(path, search.found, entry.isSymbolicLink() ? undefined : join(real, entry.name));
    else search.unusable.push(notRegular(path, statOrNull(path)));
  }
}

/** What a link inside a folder leads to; a broken or looping link to a survey name is listed as unusable (null). */
function followLink(path: string, survey: boolean, search: Search): 'folder' | 'file' | 'other' | null {
  try {
    const stats = statSync(path);
    return stats.isDirectory() ? 'folder' : stats.isFile() ? 'file' : 'other';
  } catch (cause) {
    if (!survey) return null;
    const code = (cause as NodeJS.ErrnoException).code;
    if (code === 'ELOOP') search.unusable.push({ source: path, code: 'INPUT_SYMLINK_LOOP', reason: `Not read: ${loopWords}. Fix or remove the link.` });
    else if (code === 'ENOENT') search.unusable.push({ source: path, code: 'INPUT_LINK_BROKEN', reason: 'Not read: it is a symbolic link to a file that does not exist. Fix or remove the link.' });
    else search.unusable.push({ source: path, code: 'INPUT_UNREADABLE', reason: `Not read: the symbolic link cannot be followed (${code ?? (cause as Error).message}). Check its target and permissions.` });
    return null;
  }
}

function statOrNull(path: string): Stats | null {
  try {
    return statSync(path);
  } catch {
    return null;
  }
}

/** Keep the first path (in sorted walk order) of each real file; `known` is its real path when the caller knows it. */
function addFile(path: string, found: Map<string, string>, known?: string): void {
  let real = known;
  if (real === undefined) {
    try {
      real = realpathSync(path);
    } catch {
      real = path;
    }
  }
  if (!found.has(real)) found.set(real, path);
}

function notRegular(path: string, stats: Stats | null): UnusablePath {
  return { source: path, code: 'INPUT_NOT_REGULAR', reason: `Not read: it is ${kindOf(stats)}, not a regular file; only regular files are read (a pipe or device could block or never end). Copy the survey into a file and name that.` };
}

/** "a named pipe (FIFO)", "a socket", … for a message. */
export function kindOf(stats: Stats | null): string {
  if (stats === null) return 'a special file';
  if (stats.isFIFO()) return 'a named pipe (FIFO)';
  if (stats.isSocket()) return 'a socket';
  if (stats.isCharacterDevice()) return 'a character device';
  if (stats.isBlockDevice()) return 'a block device';
  if (stats.isDirectory()) return 'a folder';
  return 'a special file';
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
