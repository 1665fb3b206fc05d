import { accessSync, closeSync, constants, mkdirSync, openSync, readdirSync, readFileSync, rmSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { RingfallError } from '../../core/errors';

/** Name of the lock file a `batch --out` run holds in its folder while it runs. */
export const lockFileName = '.ringfall-batch.lock';

/** A claimed `--out` folder: this process alone writes into it until `release`. */
export interface OutFolderClaim {
  /** A path in this run's scratch folder inside the out folder (same filesystem; deleted on release). */
  scratchPath(name: string): string;
  /** Delete the scratch folder and the lock (also done when the process exits). */
  release(): void;
}

/**
 * Claim `folder` for one `batch --out` run: make it (prepareOutFolder), then create the
 * lock file `.ringfall-batch.lock` holding this process id, exclusively (O_EXCL), so two
 * runs into one folder cannot interleave their pages and indexes: the second is refused
 * with the first one's process id. A lock left by a process that no longer runs (killed
 * with SIGKILL, a power cut) is taken over, and that run's leftovers (temporary files,
 * scratch folder) removed. The lock and the scratch folder are removed on release or
 * when the process exits.
 * @throws RingfallError `OUTPUT_BUSY` while another live run holds the folder,
 *   `OUTPUT_UNWRITABLE` when it cannot be made or written
 */
export function claimOutFolder(folder: string): OutFolderClaim {
  prepareOutFolder(folder);
  const lock = join(folder, lockFileName);
  takeLock(lock, folder);
  const scratch = join(folder, `.ringfall-scratch-${process.pid}`);
  let released = false;
  const release = () => {
    if (released) return;
    released = true;
    process.off('exit', release);
    rmSync(scratch, { recursive: true, force: true });
    try {
      if (readFileSync(lock, 'utf8').trim() === String(process.pid)) rmSync(lock, { force: true });
    } catch {
      // gone already
    }
  };
  process.on('exit', release);
  try {
    removeLeftovers(folder, new Set([lockFileName]));
    mkdirSync(scratch);
  } catch (cause) {
    release();
    throw unwritable(scratch, cause);
  }
  return { scratchPath: (name) => join(scratch, name), release };
}

function takeLock(lock: string, folder: string): void {
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      const fd = openSync(lock, 'wx');
      writeSync(fd, `${process.pid}\n`);
      closeSync(fd);
      return;
    } catch (cause) {
      if ((cause as NodeJS.ErrnoException).code !== 'EEXIST') throw unwritable(lock, cause);
    }
    const holder = Number.parseInt(readLock(lock), 10);
    if (Number.isInteger(holder) && holder > 0 && holder !== process.pid && isRunning(holder)) {
      throw new RingfallError(
        'OUTPUT_BUSY',
        `--out: another ringfall batch (process ${holder}) is writing into "${folder}". Wait for it to finish, or choose another folder. If no such run is going on, delete "${lock}".`,
        { value: folder, where: '--out' },
      );
    }
    // left by a run that ended without removing it: take it over
    rmSync(lock, { force: true });
  }
  throw unwritable(lock, new Error('the lock file keeps reappearing'));
}

function readLock(lock: string): string {
  try {
    return readFileSync(lock, 'utf8');
  } catch {
    return '';
  }
}

/** True when process `pid` exists (signal 0 checks without sending anything; EPERM means it exists under another user). */
function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Make the `--out` folder (and its parents) and check it can be written: `batch` calls
 * this before fitting, so a bad folder is refused at once rather than after the whole run.
 * @throws RingfallError `OUTPUT_UNWRITABLE`
 */
export function prepareOutFolder(folder: string): void {
  try {
    mkdirSync(folder, { recursive: true });
    accessSync(folder, constants.W_OK);
  } catch (cause) {
    throw unwritable(folder, cause);
  }
}

/** Remove this folder's leftovers of runs that ended without cleaning up (temporary files, spools); call only while holding its lock. */
function removeLeftovers(folder: string, keep: ReadonlySet<string>): void {
  for (const name of readdirSync(folder)) {
    if (keep.has(name)) continue;
    if ((name.startsWith('.') && name.endsWith('.part')) || name.startsWith('.ringfall-scratch-')) rmSync(join(folder, name), { recursive: true, force: true });
  }
}

/** The OUTPUT_UNWRITABLE error of `--out` for `path`, with the system's code. */
export function unwritable(path: string, cause: unknown): RingfallError {
  const code = (cause as NodeJS.ErrnoException | null)?.code ?? (cause as Error).message;
  return new RingfallError('OUTPUT_UNWRITABLE', `--out: cannot write "${path}" (${code}). Choose a folder you can write to.`, { value: path, where: '--out', cause });
}
