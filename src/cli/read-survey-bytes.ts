import { closeSync, constants, fstatSync, openSync, readFileSync } from 'node:fs';
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
    return readFileSync(fd);
  } catch (cause) {
    if (cause instanceof RingfallError) throw cause;
    throw readError(path, cause);
  } finally {
    closeSync(fd);
  }
}

function readError(path: string, cause: unknown): RingfallError {
  const code = (cause as NodeJS.ErrnoException | null)?.code;
  if (code === 'ELOOP') {
    return new RingfallError('INPUT_SYMLINK_LOOP', `Cannot read "${path}": it is a symbolic link that leads into a loop of links (ELOOP). Point to the file itself, or fix the link.`, { value: path, cause });
  }
  const what = code === 'ENOENT' ? 'no such file (ENOENT)' : code === 'EACCES' ? 'permission denied (EACCES)' : code ?? (cause as Error).message;
  return new RingfallError('INPUT_UNREADABLE', `Cannot read "${path}": ${what}. Check that it exists and can be read.`, { value: path, cause });
}
