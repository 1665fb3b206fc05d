import { closeSync, mkdtempSync, openSync, readSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { RingfallError } from '../../core/errors';
import type { SurveyReport } from '../../core/report/report';

/** Where a line of a spool is: its first byte and its length in bytes. */
export interface SpoolPlace {
  readonly offset: number;
  readonly length: number;
}

/**
 * Surveys of a batch kept on disk instead of in memory: each survey (or what the fleet
 * history, a summary row or the JSON report needs of it) is appended to one file, and
 * only its place in the file is remembered — by page key for `batch --out` (the coil id,
 * or a survey of its own when it has none), or by whoever appended it. Numbers JSON cannot
 * hold (NaN, ±Infinity) are kept as tagged strings and restored on reading (spoolLine), so
 * a page is drawn from exactly the report the worker made.
 */
export class SurveySpool {
  private readonly fd: number;
  private size = 0;
  private readonly places = new Map<string, SpoolPlace[]>();

  constructor(private readonly path: string) {
    this.fd = openSync(path, 'wx+');
  }

  /** Append a survey already made into a line (spoolLine, e.g. by a worker) under `key` (read back in the order added). */
  addLine(key: string, line: string): void {
    const place = this.append(line);
    const list = this.places.get(key) ?? [];
    list.push(place);
    this.places.set(key, list);
  }

  /** Append text under no key: the caller keeps its place and reads it back with `at` (a spoolLine) or `text`. */
  append(text: string): SpoolPlace {
    const bytes = Buffer.from(text, 'utf8');
    for (let written = 0; written < bytes.length;) written += writeSync(this.fd, bytes, written, bytes.length - written, this.size + written);
    const place = { offset: this.size, length: bytes.length };
    this.size += bytes.length;
    return place;
  }

  /** The surveys added under `key`, in the order added. */
  read(key: string): SurveyReport[] {
    return (this.places.get(key) ?? []).map((place) => this.at(place));
  }

  /** The value of the spool line at `place`, as it was before spoolLine. */
  at<T = SurveyReport>(place: SpoolPlace): T {
    return readSpoolLine<T>(this.text(place));
  }

  /** One buffer for reading back, grown as needed: reading 50,000 surveys allocates no buffer per survey. */
  private readBuffer = Buffer.alloc(1 << 16);

  /** The text appended at `place`. */
  text({ offset, length }: SpoolPlace): string {
    if (this.readBuffer.length < length) this.readBuffer = Buffer.alloc(Math.max(length, 2 * this.readBuffer.length));
    const bytes = this.readBuffer;
    for (let done = 0; done < length;) {
      const got = readSync(this.fd, bytes, done, length - done, offset + done);
      if (got === 0) throw new Error(`survey spool ${this.path}: ended at byte ${offset + done}, expected ${offset + length}`);
      done += got;
    }
    return bytes.toString('utf8', 0, length);
  }

  /** Close and delete the spool file. */
  dispose(): void {
    try {
      closeSync(this.fd);
    } catch {
      // already closed
    }
    rmSync(this.path, { force: true });
  }
}

/** A survey (or any plain data) as one line of a spool: JSON that keeps non-finite numbers, and a newline. */
export function spoolLine(value: unknown): string {
  return `${JSON.stringify(value, keepNumbers)}\n`;
}

/** The value of a spool line (spoolLine), non-finite numbers and all. */
export function readSpoolLine<T>(line: string): T {
  return JSON.parse(line, restoreNumbers) as T;
}

/**
 * Non-finite numbers are written as strings tagged with a leading NUL ("\u0000n:Infinity");
 * a string that itself starts with NUL (text from a hostile file) gets "\u0000s:" in front,
 * so every value reads back as it was.
 */
function keepNumbers(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && !Number.isFinite(value)) return `\u0000n:${value}`;
  if (typeof value === 'string' && value.startsWith('\u0000')) return `\u0000s:${value}`;
  return value;
}

function restoreNumbers(_key: string, value: unknown): unknown {
  if (typeof value !== 'string' || !value.startsWith('\u0000')) return value;
  return value.startsWith('\u0000n:') ? Number(value.slice(3)) : value.slice(3);
}

/**
 * A scratch folder for a run's spool in the system's temporary folder (TMPDIR), or a
 * usage error that names it when it cannot be made there (a read-only or missing TMPDIR);
 * `what` says who keeps surveys there and `remedy` what to do (both end the message); the
 * folder's name starts with `prefix`.
 */
export function scratchFolder(what: string, remedy: string, prefix = 'ringfall-batch-'): string {
  const base = tmpdir();
  try {
    return mkdtempSync(join(base, prefix));
  } catch (cause) {
    const code = (cause as NodeJS.ErrnoException).code ?? (cause as Error).message;
    throw new RingfallError('OUTPUT_UNWRITABLE', `Cannot make a scratch folder in the temporary folder "${base}" (${code}); ${what} keeps its surveys there while it runs. ${remedy}`, { value: base, where: 'TMPDIR', cause });
  }
}
