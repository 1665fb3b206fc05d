import { closeSync, constants, fstatSync, openSync, readFileSync, readSync } from 'node:fs';
import { RingfallError } from '../core/errors';
import { kindOf } from './find-survey-files';

/**
 * The bytes of a survey file, read only when it is a regular file. The file is opened
 * without blocking (O_NONBLOCK) and checked with fstat on the open descriptor, so a named
 * pipe, socket or device — given directly, or swapped in after the folder was listed — is
 * refused at once instead of blocking the run forever.
 * @throws RingfallError `INPUT_NOT_REGULAR` for anything but a regular file,
 *   `INPUT_SYMLINK_LOOP` for a loop of symbolic links (ELOOP),
 *   `INPUT_UNREADABLE` when the system refuses the read (missing, no permission, …)
 */
export function readSurveyBytes(path: string): Buffer {
  let fd: number;
  try {
    fd = openSync(path, constants.O_RDONLY | constants.O_NONBLOCK);
  } catch (cause) {
    throw readError(path, cause);
  }
  try {
    const stats = fstatSync(fd);
    if (!stats.isFile()) {
      throw new RingfallError('INPUT_NOT_REGULAR', `Cannot read "${path}": it is ${kindOf(stats)}, not a regular file; only regular files are read. Copy the survey into a file and name that.`, { value: path });
    }
    return readOpenFile(fd, stats.size);
  } catch (cause) {
    if (cause instanceof RingfallError) throw cause;
    throw readError(path, cause);
  } finally {
    closeSync(fd);
  }
}

/**
 * The `size` bytes of an open regular file, as readFileSync(fd) reads them but without its
 * second fstat (one system call less per file), fewer when the file ended sooner. A size of
 * 0 (a file the system cannot size, as under /proc) or past one read (2 GiB) is left to
 * readFileSync, with its errors.
 */
function readOpenFile(fd: number, size: number): Buffer {
  if (size === 0 || size > largestRead) return readFileSync(fd);
  const bytes = Buffer.allocUnsafe(size);
  let got = 0;
  while (got < size) {
    const read = readSync(fd, bytes, got, size - got, null);
    if (read === 0) break;
    got += read;
  }
  return got === size ? bytes : bytes.subarray(0, got);
}

/** Bytes one readSync may read (Node's kIoMaxLength, 2^31 - 1). */
const largestRead = 2 ** 31 - 1;

function readError(path: string, cause: unknown): RingfallError {
  const code = (cause as NodeJS.ErrnoException | null)?.code;
  if (code === 'ELOOP') {
    return new RingfallError('INPUT_SYMLINK_LOOP', `Cannot read "${path}": it is a symbolic link that leads into a loop of links (ELOOP). Point to the file itself, or fix the link.`, { value: path, cause });
  }
  const what = code === 'ENOENT' ? 'no such file (ENOENT)' : code === 'EACCES' ? 'permission denied (EACCES)' : code ?? (cause as Error).message;
  return new RingfallError('INPUT_UNREADABLE', `Cannot read "${path}": ${what}. Check that it exists and can be read.`, { value: path, cause });
}
