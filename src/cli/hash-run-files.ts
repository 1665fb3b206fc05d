import { isRingfallError } from '../core/errors';
import type { RunInput } from '../core/report/run-record';
import { readProblemNote } from './fit-file';
import { readSurveyBytes } from './read-survey-bytes';
import { describeBytes, unreadableInput } from './run-record';
import { yieldToEvents, type StopSignals } from './stop-signals';

/** A file of a `fit --json` run after the first pass (hashRunFiles). */
export interface HashedFile {
  /** Its entry in the run record's inputs: name, SHA-256 and size, or the note why it could not be read. */
  readonly input: RunInput;
  /** Its bytes while kept for the second pass (null when past the budget, unreadable, or already fitted). */
  bytes: Buffer | null;
  /** The message of the read error when it could not be read (its problem line), else null. */
  readonly problem: string | null;
}

/**
 * Bytes of survey files `fit --json` keeps from the first pass for the second, in all: 8 MB
 * holds ~15,000 thirty-reading files; the files after it are read again (and their hash
 * compared) when they are fitted. Measured at 50,000 such files (2 cores): keeping all
 * 27 MB raised peak RSS by ~50 MB (the bytes, and V8 letting the heap grow in proportion
 * to what stays alive), where reading a file again costs ~6 µs.
 */
export const keptBytesBudget = 8 * 1024 * 1024;

/** Milliseconds of synchronous work between two pauses for events (a stop signal among them). */
export const pauseEveryMs = 5;

/**
 * The first pass of `fit --json`: read and hash every file for the run record's inputs
 * (which the report prints before the surveys), keeping the bytes for fitting while their
 * total stays within `keepBytes`. A file that cannot be read is listed as fitFile lists it
 * (no hash, the note why) with its problem line, in the same order. Pauses for events
 * every few milliseconds and stops at once on a stop signal: then `stopped` is true and
 * `files` holds the files read so far.
 */
export async function hashRunFiles(
  paths: readonly string[], stop: Pick<StopSignals, 'signal'>, keepBytes: number = keptBytesBudget,
): Promise<{ files: HashedFile[]; stopped: boolean }> {
  const files: HashedFile[] = [];
  let kept = 0;
  let paused = performance.now();
  for (const path of paths) {
    if (performance.now() - paused >= pauseEveryMs) {
      await yieldToEvents();
      paused = performance.now();
    }
    if (stop.signal !== null) return { files, stopped: true };
    let bytes: Buffer;
    try {
      bytes = readSurveyBytes(path);
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      files.push({ input: unreadableInput(path, readProblemNote(error)), bytes: null, problem: error.message });
      continue;
    }
    const keep = kept + bytes.byteLength <= keepBytes;
    if (keep) kept += bytes.byteLength;
    files.push({ input: describeBytes(path, bytes), bytes: keep ? bytes : null, problem: null });
  }
  return { files, stopped: stop.signal !== null };
}

/**
 * A file's bytes for the second pass: those kept by the first, or read again and checked
 * against the hash the run record holds. A file that cannot be read again, or whose bytes
 * changed, gives a problem line saying so (it is then not fitted) instead of a report that
 * would not match its recorded hash.
 */
export function secondPassBytes(file: HashedFile): { bytes: Buffer } | { problem: string } {
  if (file.problem !== null) return { problem: file.problem };
  if (file.bytes !== null) {
    const { bytes } = file;
    file.bytes = null;
    return { bytes };
  }
  const { name } = file.input;
  let bytes: Buffer;
  try {
    bytes = readSurveyBytes(name);
  } catch (error) {
    if (!isRingfallError(error)) throw error;
    return { problem: `${error.message} It was read and hashed earlier in this run (the run record lists it) but could not be read again to be fitted, so it was not fitted. Run again.` };
  }
  const now = describeBytes(name, bytes);
  return sameInput(now, file.input) ? { bytes } : { problem: changedProblem(name) };
}

/** True when two inputs entries say the same of a file (hash, size, note). */
export function sameInput(a: RunInput, b: RunInput): boolean {
  return a.sha256 === b.sha256 && a.bytes === b.bytes && a.note === b.note;
}

/** The problem line of a file that changed between the pass that hashed it and the one that fitted it. */
export function changedProblem(name: string): string {
  return `"${name}" changed while ringfall ran: its bytes when it was fitted differ from those hashed for the run record, so it was not fitted. Run again once nothing is writing to it.`;
}
