import { closeSync, openSync, readSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { threadId } from 'node:worker_threads';
import { readSpoolLine } from './survey-spool';

/** Where a text of a batch is: which thread's spool file (its threadId), its first byte and its length in bytes. */
export interface WorkerSpoolPlace {
  readonly spool: number;
  readonly offset: number;
  readonly length: number;
}

/** The spool file of thread `id` in `folder`. */
function spoolPath(folder: string, id: number): string {
  return join(folder, `thread-${id}.spool`);
}

/** Bytes a spool writer gathers before it writes them to its file. */
const writeBlock = 1 << 20;

/**
 * A thread's own spool file in a batch's scratch folder: a batch worker appends the texts
 * of each survey it fits (the finished JSON text, the summary row, the history part, the
 * page's line) and sends the main thread only their places, so the texts cross no thread
 * boundary and the main thread neither copies nor keeps them (WorkerSpools reads them back).
 * Each thread writes only its own file (named by its threadId, unique in the process; a
 * recycled worker gets a new one), so no two writers meet. Text is encoded straight into
 * one buffer and written when it is full or on `flush`, which must come before anyone reads
 * the places given (the worker flushes before it answers a chunk). The file is opened on
 * the first write.
 */
export class WorkerSpoolWriter {
  private fd: number | null = null;
  /** Bytes in the file. */
  private written = 0;
  private readonly buffer = Buffer.allocUnsafe(writeBlock);
  /** Bytes in `buffer`, to be written after `written`. */
  private pending = 0;

  constructor(private readonly folder: string, private readonly id: number) {}

  /** Append `text` (UTF-8) and give its place. */
  append(text: string): WorkerSpoolPlace {
    return this.appendParts([text]).place;
  }

  /** Append the texts one after another: their place as one, and the length in bytes of each. */
  appendParts(texts: readonly string[]): { place: WorkerSpoolPlace; lengths: number[] } {
    const offset = this.written + this.pending;
    const lengths = texts.map((text) => {
      // a UTF-16 code unit is at most 3 bytes of UTF-8
      if (this.pending + 3 * text.length > this.buffer.length) this.flush();
      if (3 * text.length > this.buffer.length) {
        const bytes = Buffer.from(text, 'utf8');
        this.write(bytes, bytes.length);
        return bytes.length;
      }
      const length = this.buffer.write(text, this.pending, 'utf8');
      this.pending += length;
      return length;
    });
    return { place: { spool: this.id, offset, length: lengths.reduce((sum, length) => sum + length, 0) }, lengths };
  }

  /** Write what is gathered to the file. */
  flush(): void {
    if (this.pending === 0) return;
    const length = this.pending;
    this.pending = 0;
    this.write(this.buffer, length);
  }

  private write(bytes: Uint8Array, length: number): void {
    if (this.fd === null) this.fd = openSync(spoolPath(this.folder, this.id), 'wx');
    for (let done = 0; done < length;) done += writeSync(this.fd, bytes, done, length - done, this.written + done);
    this.written += length;
  }

  close(): void {
    this.flush();
    if (this.fd !== null) closeSync(this.fd);
    this.fd = null;
  }
}

/** Each folder's spool writer of this thread. */
const threadWriters = new Map<string, WorkerSpoolWriter>();

/** Write what this thread's spools have gathered (a worker, before it answers a chunk). */
export function flushThreadSpools(): void {
  for (const writer of threadWriters.values()) writer.flush();
}

/** This thread's spool in `folder` (one writer per thread and folder, made on first use). */
export function threadSpool(folder: string): WorkerSpoolWriter {
  let writer = threadWriters.get(folder);
  if (writer === undefined) {
    writer = new WorkerSpoolWriter(folder, threadId);
    threadWriters.set(folder, writer);
  }
  return writer;
}

/**
 * The main thread's reader of every spool file in a batch's scratch folder (WorkerSpoolWriter),
 * and its writer of its own for surveys that came back as reports rather than places. Files are opened on first read and closed by `close`; the
 * folder itself belongs to the caller.
 */
export class WorkerSpools {
  private readonly files = new Map<number, number>();
  /** One buffer for reading lines back, grown as needed. */
  private lineBuffer = Buffer.alloc(1 << 16);

  constructor(readonly folder: string) {}

  /** This thread's own spool in the folder. */
  writer(): WorkerSpoolWriter {
    return threadSpool(this.folder);
  }

  /** The value of the spool line (spoolLine) at `place`. */
  at<T>(place: WorkerSpoolPlace): T {
    if (this.lineBuffer.length < place.length) this.lineBuffer = Buffer.alloc(Math.max(place.length, 2 * this.lineBuffer.length));
    this.read(place.spool, this.lineBuffer, place.offset, place.length);
    const text = this.lineBuffer.toString('utf8', 0, place.length);
    // spoolLine tags a non-finite number or a string that starts with NUL with a leading NUL,
    // which JSON writes as \u0000: a line without one parses faster without the reviver
    return text.includes('\\u0000') ? readSpoolLine<T>(text) : JSON.parse(text) as T;
  }

  /** Fill `into` from byte 0 with `length` bytes of spool `spool` from `offset`. */
  read(spool: number, into: Uint8Array, offset: number, length: number): void {
    const got = this.readUpTo(spool, into.subarray(0, length), offset);
    if (got < length) throw new Error(`batch spool ${spoolPath(this.folder, spool)}: ended at byte ${offset + got}, expected ${offset + length}`);
  }

  /** Fill `into` from byte 0 with the bytes of spool `spool` from `offset`, as many as it holds up to into's length; the number read. */
  readUpTo(spool: number, into: Uint8Array, offset: number): number {
    threadWriters.get(this.folder)?.flush();
    let fd = this.files.get(spool);
    if (fd === undefined) {
      fd = openSync(spoolPath(this.folder, spool), 'r');
      this.files.set(spool, fd);
    }
    let done = 0;
    for (let got = -1; done < into.length && got !== 0; done += got) got = readSync(fd, into, done, into.length - done, offset + done);
    return done;
  }

  /** Close every file (the folder and its files stay for the caller to delete). */
  close(): void {
    threadWriters.get(this.folder)?.close();
    threadWriters.delete(this.folder);
    for (const fd of this.files.values()) closeSync(fd);
    this.files.clear();
  }
}
