import { closeSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/**
 * Bytes the process may still write through writeFileAtomic before it fails as a full
 * disk would (ENOSPC), or null for no limit. Set by the environment variable
 * RINGFALL_TEST_WRITE_LIMIT (bytes), for the fault tests only: it lets a test run the real
 * CLI into a "disk" that fills up part-way without needing a small filesystem.
 */
let writeBudget: number | null = readBudget(process.env['RINGFALL_TEST_WRITE_LIMIT']);

function readBudget(text: string | undefined): number | null {
  const bytes = Number(text);
  return text === undefined || text === '' || !Number.isFinite(bytes) || bytes < 0 ? null : bytes;
}

let counter = 0;

/** The temporary name `path` is written under before the rename: hidden, in the same folder, unique to this process. */
export function temporaryName(path: string): string {
  counter += 1;
  return join(dirname(path), `.${basename(path)}.${process.pid}-${counter}.part`);
}

/**
 * Write `text` (UTF-8) to `path` whole or not at all: it goes to a temporary name in the
 * same folder, then is renamed over `path` (rename within one filesystem is atomic,
 * POSIX rename(2)). No fsync: this guards against a full disk and an interrupted run,
 * not a power cut, and a page per coil would cost one disk flush each. A reader sees the old file or the new one,
 * never a truncated one; when the write fails (a full disk, a signal ending the process)
 * the temporary file is removed and `path` is untouched.
 * @throws the system error of the write or rename (ENOSPC, EACCES, …)
 */
export function writeFileAtomic(path: string, text: string | Uint8Array): void {
  const bytes = typeof text === 'string' ? Buffer.from(text, 'utf8') : text;
  const partial = temporaryName(path);
  const fd = openSync(partial, 'wx');
  try {
    try {
      writeAll(fd, bytes);
    } finally {
      closeSync(fd);
    }
    renameSync(partial, path);
  } catch (error) {
    rmSync(partial, { force: true });
    throw error;
  }
}

function writeAll(fd: number, bytes: Uint8Array): void {
  let allowed = bytes.length;
  if (writeBudget !== null) {
    allowed = Math.min(allowed, writeBudget);
    writeBudget -= allowed;
  }
  for (let offset = 0; offset < allowed;) offset += writeSync(fd, bytes, offset, allowed - offset);
  if (allowed < bytes.length) {
    throw Object.assign(new Error('ENOSPC: no space left on device (RINGFALL_TEST_WRITE_LIMIT reached)'), { code: 'ENOSPC' });
  }
}
