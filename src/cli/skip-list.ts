import { readFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import type { SkippedFiles } from '../core/report/report';

export type { SkippedFiles };

/** Name of the file, in any folder searched, that lists what is not a survey there. */
export const skipListName = '.ringfall-skip';

/** One folder's skip list, as read: where it is and its patterns. */
export interface SkipList {
  /** The list file's path, as the search reached it (e.g. "sample-data/.ringfall-skip"). */
  readonly path: string;
  /** The folder its patterns are relative to. */
  readonly folder: string;
  readonly patterns: readonly string[];
  readonly matchers: readonly ((relativePath: string, isFolder: boolean) => boolean)[];
}

/**
 * Read the skip list of `folder`, or null when it has none. One pattern per line, relative
 * to the folder; blank lines and lines starting with `#` are ignored. `*` matches any run
 * of characters within one name and `?` one character; a trailing `/` matches folders
 * only; a pattern without any other `/` matches that name at any depth below the folder,
 * one with a `/` the path from the folder (the rules of .gitignore patterns, simplified).
 * A list that exists but cannot be read is reported through `onUnreadable`.
 * @example readSkipList('sample-data')?.patterns // ['flawed/']
 */
export function readSkipList(folder: string, onUnreadable: (path: string, code: string) => void = () => undefined): SkipList | null {
  const path = join(folder, skipListName);
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (cause) {
    const code = (cause as NodeJS.ErrnoException).code ?? (cause as Error).message;
    // no list is the usual case; a list that is there but cannot be read is said, not passed over
    if (code !== 'ENOENT' && code !== 'ENOTDIR') onUnreadable(path, code);
    return null;
  }
  const patterns = text.replace(/^\uFEFF/, '').split(/\r?\n/).map((line) => line.trim()).filter((line) => line !== '' && !line.startsWith('#'));
  return { path, folder, patterns, matchers: patterns.map(compilePattern) };
}

/** Whether a skip list leaves out the entry at `path` (a file or a folder inside list.folder). */
export function isSkipped(list: SkipList, path: string, isFolder: boolean): boolean {
  const inner = relative(list.folder, path).split(sep).join('/');
  return list.matchers.some((matches) => matches(inner, isFolder));
}

function compilePattern(pattern: string): (relativePath: string, isFolder: boolean) => boolean {
  const foldersOnly = pattern.endsWith('/');
  const body = pattern.replace(/^\/+/, '').replace(/\/+$/, '');
  const anchored = body.includes('/') || pattern.startsWith('/');
  const expression = new RegExp(`^${body.split('').map(globCharacter).join('')}$`);
  return (relativePath, isFolder) => {
    if (foldersOnly && !isFolder) return false;
    if (anchored) return expression.test(relativePath);
    const name = relativePath.slice(relativePath.lastIndexOf('/') + 1);
    return expression.test(name);
  };
}

function globCharacter(character: string): string {
  if (character === '*') return '[^/]*';
  if (character === '?') return '[^/]';
  return character.replace(/[.+^${}()|[\]\\]/g, '\\$&');
}
