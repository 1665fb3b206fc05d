import { importError, place } from './import-errors';
import type { MetadataLine } from './import-types';

/** The part of a survey file before the data rows. */
export interface Preamble {
  readonly lineBreak: 'LF' | 'CRLF' | 'CR';
  /** The character rows are split on ("\n" for LF and CRLF; a trailing "\r" is trimmed). */
  readonly newline: '\n' | '\r';
  readonly metadata: MetadataLine[];
  readonly comments: { line: number; text: string }[];
  readonly headerLine: number;
  readonly headerText: string;
  /** Offset just past the header line's line break. */
  readonly dataOffset: number;
}

/**
 * A trimmed `#` line as metadata `# key: value` (or `# key = value`): the key is what
 * comes before the first ":" or "=", the value what follows, both trimmed; null when there
 * is no separator or no key. A scan, linear in the line: the regular expression it
 * replaces backtracked quadratically on a long run of spaces.
 */
function readMetadataLine(trimmed: string): { key: string; value: string } | null {
  let start = 0;
  while (trimmed.charCodeAt(start) === 35) start += 1;
  let separator = -1;
  for (let i = start; i < trimmed.length; i += 1) {
    const code = trimmed.charCodeAt(i);
    if (code === 58 || code === 61) {
      separator = i;
      break;
    }
  }
  if (separator === -1) return null;
  const key = trimmed.slice(start, separator).trim();
  if (key === '') return null;
  return { key, value: trimmed.slice(separator + 1).trim() };
}

/**
 * Read metadata lines (`# key: value`), comment lines and blank lines up to the header
 * row, the first other line. Lines are physical lines, 1-based. The line break is the
 * first one in the text (CRLF, LF or a lone CR).
 *
 * @param text the file text so far, byte-order mark removed
 * @param final true when no more text will come
 * @returns the preamble, or null when more text is needed to see the header line whole
 * @throws RingfallError IMPORT_EMPTY (nothing but blank lines), IMPORT_NO_HEADER (only `#` lines)
 */
export function readPreamble(text: string, final: boolean, source: string): Preamble | null {
  const breakAt = text.search(/[\r\n]/);
  if (breakAt === -1 && !final) return null;
  if (breakAt !== -1 && text[breakAt] === '\r' && breakAt === text.length - 1 && !final) return null;
  const lineBreak = breakAt === -1 || text[breakAt] === '\n' ? 'LF' : text[breakAt + 1] === '\n' ? 'CRLF' : 'CR';
  const newline = lineBreak === 'CR' ? '\r' : '\n';
  const metadata: MetadataLine[] = [];
  const comments: { line: number; text: string }[] = [];
  let offset = 0;
  for (let line = 1; offset < text.length; line += 1) {
    const end = text.indexOf(newline, offset);
    if (end === -1 && !final) return null;
    const raw = text.slice(offset, end === -1 ? text.length : end);
    const nextOffset = end === -1 ? text.length : end + 1;
    const trimmed = raw.trim();
    if (/^[\s,;]*$/u.test(trimmed)) {
      offset = nextOffset;
      continue;
    }
    if (trimmed.startsWith('#')) {
      const match = readMetadataLine(trimmed);
      if (match) {
        metadata.push({ line, key: match.key.toLowerCase().replace(/[\s_-]+/g, ' '), value: match.value });
      } else {
        comments.push({ line, text: trimmed });
      }
      offset = nextOffset;
      continue;
    }
    return { lineBreak, newline, metadata, comments, headerLine: line, headerText: raw.replace(/\r$/u, ''), dataOffset: nextOffset };
  }
  if (!final) return null;
  if (metadata.length === 0 && comments.length === 0) {
    throw importError(
      'IMPORT_EMPTY',
      `Survey file is empty: ${text.length === 0 ? 'no characters at all' : 'only blank lines'} (${source}). ` +
        'Export the readings again as CSV with a header row such as "distance (mm),B (mT)".',
      source,
    );
  }
  const last = metadata.at(-1)?.line ?? 0;
  throw importError(
    'IMPORT_NO_HEADER',
    `No header row: the file has only # lines (${place(source, Math.max(last, comments.at(-1)?.line ?? 0))}). ` +
      'Add a header row after the # lines, e.g. "distance (mm),B (mT)", then the readings.',
    source,
  );
}

