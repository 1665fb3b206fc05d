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

/**
 * A thread's own spool file in a batch's scratch folder: a batch worker appends the texts
 * of each survey it fits (the finished JSON text, the summary row, the history part, the
 * page's line) and sends the main thread only their places, so the texts cross no thread
 * boundary and the main thread neither copies nor keeps them (WorkerSpools reads them back).
 * Each thread writes only its own file (named by its threadId, unique in the process; a
 * recycled worker gets a new one), so no two writers meet. The file is opened on the first
 * append.
 */
export class WorkerSpoolWriter {
  private fd: number | null = null;
  private size = 0;

  constructor(private readonly folder: string, private readonly id: number) {}

  /** Append `text` (UTF-8) and give its place. */
  append(text: string): WorkerSpoolPlace {
    return this.appendBytes(Buffer.from(text, 'utf8'));
  }

  /** Append bytes and give their place. */
  appendBytes(bytes: Uint8Array): WorkerSpoolPlace {
    if (this.fd === null) this.fd = openSync(spoolPath(this.folder, this.id), 'wx');
    for (let written = 0; written < bytes.length;) written += writeSync(this.fd, bytes, written, bytes.length - written, this.size + written);
    const place = { spool: this.id, offset: this.size, length: bytes.length };
    this.size += bytes.length;
    return place;
  }

  close(): void {
    if (this.fd !== null) closeSync(this.fd);
    this.fd = null;
  }
}

/** Each folder's spool writer of this thread. */
const threadWriters = new Map<string, WorkerSpoolWriter>();

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
    return readSpoolLine<T>(this.lineBuffer.toString('utf8', 0, place.length));
  }

  /** Fill `into` from byte 0 with `length` bytes of spool `spool` from `offset`. */
  read(spool: number, into: Uint8Array, offset: number, length: number): void {
    const got = this.readUpTo(spool, into.subarray(0, length), offset);
    if (got < length) throw new Error(`batch spool ${spoolPath(this.folder, spool)}: ended at byte ${offset + got}, expected ${offset + length}`);
  }

  /** Fill `into` from byte 0 with the bytes of spool `spool` from `offset`, as many as it holds up to into's length; the number read. */
  readUpTo(spool: number, into: Uint8Array, offset: number): number {
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
