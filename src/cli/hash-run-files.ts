import { isRingfallError } from '../core/errors';
import type { RunInput } from '../core/report/run-record';
import { readProblemNote } from './fit-file';
import { readSurveyBytes } from './read-survey-bytes';
import { sha256, unreadableInput } from './run-record';
import { yieldToEvents, type StopSignals } from './stop-signals';

/**
 * Bytes of survey files `fit --json` keeps from the first pass for the second, in all: 8 MB
 * holds ~15,000 thirty-reading files; the files after it are read again (and their hash
 * compared) when they are fitted. Measured at 50,000 such files (2 cores), when each kept
 * file was a Buffer object of its own: keeping all 27 MB peaked at 304 MB RSS, 8 MB at
 * 209 MB; reading a file again costs ~6 µs.
 */
export const keptBytesBudget = 8 * 1024 * 1024;

/** Milliseconds of synchronous work between two pauses for events (a stop signal among them). */
export const pauseEveryMs = 5;

/** Bytes of one SHA-256 digest. */
const digestBytes = 32;

/** Size of the buffers kept bytes are copied into (a larger file gets a buffer of its own). */
const slabBytes = 1 << 20;

/**
 * What the first pass of `fit --json` learnt of each file, in the order given, kept
 * outside the JavaScript heap: every digest in one buffer, sizes and the places of kept
 * bytes in typed arrays, the kept bytes in 1 MB buffers, and a map of the files that could
 * not be read. No object per file stays alive: measured at 100,000 thirty-reading files
 * (2 cores), an object per file (its inputs entry, hex digest and bytes) held from the
 * first pass raised peak RSS from ~170 to ~260 MB, V8 letting the old generation grow in
 * proportion to what is alive. The inputs entries are made when the report's head is
 * written (`inputs`) and one at a time after it (`input`).
 */
export class FirstPass {
  private readonly digests: Buffer;
  private readonly sizes: Float64Array;
  /** Per file: 1 + the index of the slab holding its bytes (0: not kept), the offset there, the length. */
  private readonly places: Uint32Array;
  private readonly slabs: (Buffer | null)[] = [];
  private slabUsed = slabBytes;
  private keptTotal = 0;
  private readonly unreadable = new Map<number, { readonly note: string; readonly problem: string }>();
  /** Files read so far (all of them unless a stop came first). */
  count = 0;

  constructor(private readonly paths: readonly string[], private readonly keepBytes: number) {
    this.digests = Buffer.alloc(paths.length * digestBytes);
    this.sizes = new Float64Array(paths.length);
    this.places = new Uint32Array(paths.length * 3);
  }

  /** Read and record the next file. */
  readNext(): void {
    const index = this.count;
    const path = this.paths[index]!;
    this.count += 1;
    let bytes: Buffer;
    try {
      bytes = readSurveyBytes(path);
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      this.unreadable.set(index, { note: readProblemNote(error), problem: error.message });
      return;
    }
    sha256(bytes).copy(this.digests, index * digestBytes);
    this.sizes[index] = bytes.byteLength;
    if (this.keptTotal + bytes.byteLength <= this.keepBytes) this.keep(index, bytes);
  }

  private keep(index: number, bytes: Buffer): void {
    this.keptTotal += bytes.byteLength;
    if (bytes.byteLength > slabBytes - this.slabUsed) {
      this.slabs.push(Buffer.allocUnsafeSlow(Math.max(slabBytes, bytes.byteLength)));
      this.slabUsed = 0;
    }
    const slab = this.slabs.length - 1;
    bytes.copy(this.slabs[slab]!, this.slabUsed);
    this.places[index * 3] = slab + 1;
    this.places[index * 3 + 1] = this.slabUsed;
    this.places[index * 3 + 2] = bytes.byteLength;
    this.slabUsed += bytes.byteLength;
  }

  /** The file's entry in the run record's inputs: name, SHA-256 and size, or the note why it could not be read (as fitFile lists it). */
  input(index: number): RunInput {
    const path = this.paths[index]!;
    const unreadable = this.unreadable.get(index);
    if (unreadable !== undefined) return unreadableInput(path, unreadable.note);
    return { name: path, sha256: this.digests.toString('hex', index * digestBytes, (index + 1) * digestBytes), bytes: this.sizes[index]! };
  }

  /** The inputs entries of every file read, for the run record. */
  inputs(): RunInput[] {
    return Array.from({ length: this.count }, (_, index) => this.input(index));
  }

  /** The problem line of a file that could not be read, else null. */
  problem(index: number): string | null {
    return this.unreadable.get(index)?.problem ?? null;
  }

  /**
   * A file's bytes for the second pass: those kept (released after this; a slab once its
   * last file is taken, as files are taken in order), or the file read again and checked
   * against its hash. A file that could not be read, cannot be read again, or whose bytes
   * changed gives its problem line instead (it is then not fitted), never a report beside
   * a hash of other bytes.
   */
  take(index: number): { bytes: Buffer } | { problem: string } {
    const problem = this.problem(index);
    if (problem !== null) return { problem };
    const slab = this.places[index * 3]!;
    if (slab > 0) {
      const offset = this.places[index * 3 + 1]!;
      // the slabs before this one hold files already taken
      for (let before = 0; before < slab - 1; before++) this.slabs[before] = null;
      return { bytes: this.slabs[slab - 1]!.subarray(offset, offset + this.places[index * 3 + 2]!) };
    }
    const path = this.paths[index]!;
    let bytes: Buffer;
    try {
      bytes = readSurveyBytes(path);
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      return { problem: `${error.message} It was read and hashed earlier in this run (the run record lists it) but could not be read again to be fitted, so it was not fitted. Run again.` };
    }
    const digest = sha256(bytes);
    const same = bytes.byteLength === this.sizes[index] && digest.equals(this.digests.subarray(index * digestBytes, (index + 1) * digestBytes));
    return same ? { bytes } : { problem: changedProblem(path) };
  }
}

/**
 * The first pass of `fit --json`: read and hash every file for the run record's inputs
 * (which the report prints before the surveys), keeping the bytes for fitting while their
 * total stays within `keepBytes`. A file that cannot be read is listed as fitFile lists it
 * (no hash, the note why) with its problem line, in the same order. Pauses for events
 * every few milliseconds and stops at once on a stop signal: then `stopped` is true and
 * the files read so far are recorded.
 */
export async function hashRunFiles(
  paths: readonly string[], stop: Pick<StopSignals, 'signal'>, keepBytes: number = keptBytesBudget,
): Promise<{ files: FirstPass; stopped: boolean }> {
  const files = new FirstPass(paths, keepBytes);
  let paused = performance.now();
  while (files.count < paths.length) {
    if (performance.now() - paused >= pauseEveryMs) {
      await yieldToEvents();
      paused = performance.now();
    }
    if (stop.signal !== null) return { files, stopped: true };
    files.readNext();
  }
  return { files, stopped: stop.signal !== null };
}

/** True when two inputs entries say the same of a file (hash, size, note). */
export function sameInput(a: RunInput, b: RunInput): boolean {
  return a.sha256 === b.sha256 && a.bytes === b.bytes && a.note === b.note;
}

/** The problem line of a file that changed between the pass that hashed it and the one that fitted it. */
export function changedProblem(name: string): string {
  return `"${name}" changed while ringfall ran: its bytes when it was fitted differ from those hashed for the run record, so it was not fitted. Run again once nothing is writing to it.`;
}
