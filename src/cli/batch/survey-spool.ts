import { closeSync, openSync, readSync, rmSync, writeSync } from 'node:fs';
import type { SurveyReport } from '../../core/report/report';

/** Where a line of a spool is: its first byte and its length in bytes. */
export interface SpoolPlace {
  readonly offset: number;
  readonly length: number;
}

/**
 * Surveys of a batch kept on disk instead of in memory until `batch --out` writes the
 * page of each coil: each survey is appended to one file as a line of JSON, and only its
 * place in the file is remembered, by page key (the coil id, or a survey of its own when
 * it has none). Numbers JSON cannot hold (NaN, ±Infinity) are kept as tagged strings and
 * restored on reading, so a page is drawn from exactly the report the worker made.
 */
export class SurveySpool {
  private readonly fd: number;
  private size = 0;
  private readonly places = new Map<string, SpoolPlace[]>();
  /** Every survey's place, in the order added (the report's order). */
  private readonly order: SpoolPlace[] = [];

  constructor(private readonly path: string) {
    this.fd = openSync(path, 'wx+');
  }

  /** Append `survey` under `key` (surveys under one key are read back in the order added). */
  add(key: string, survey: SurveyReport): void {
    this.addLine(key, spoolLine(survey));
  }

  /** Append a survey already made into a line (spoolLine, e.g. by a worker) under `key`. */
  addLine(key: string, line: string): void {
    const place = this.append(line);
    const list = this.places.get(key) ?? [];
    list.push(place);
    this.places.set(key, list);
    this.order.push(place);
  }

  /** Append a line (e.g. spoolLine of any value) under no key: the caller keeps its place and reads it back with `at`. */
  append(line: string): SpoolPlace {
    const bytes = Buffer.from(line, 'utf8');
    for (let written = 0; written < bytes.length;) written += writeSync(this.fd, bytes, written, bytes.length - written, this.size + written);
    const place = { offset: this.size, length: bytes.length };
    this.size += bytes.length;
    return place;
  }

  /** The surveys added under `key`, in the order added. */
  read(key: string): SurveyReport[] {
    return (this.places.get(key) ?? []).map((place) => this.at(place));
  }

  /** Every survey, one at a time in the order added (memory holds one survey, not all). */
  *all(): Generator<SurveyReport> {
    for (const place of this.order) yield this.at(place);
  }

  /** Surveys added. */
  get count(): number {
    return this.order.length;
  }

  /** One buffer for reading surveys back, grown as needed: reading 50,000 surveys allocates no buffer per survey. */
  private readBuffer = Buffer.alloc(1 << 16);

  /** The value of the spool line at `place`, as it was before spoolLine. */
  at<T = SurveyReport>({ offset, length }: SpoolPlace): T {
    if (this.readBuffer.length < length) this.readBuffer = Buffer.alloc(Math.max(length, 2 * this.readBuffer.length));
    const bytes = this.readBuffer;
    for (let done = 0; done < length;) {
      const got = readSync(this.fd, bytes, done, length - done, offset + done);
      if (got === 0) throw new Error(`survey spool ${this.path}: ended at byte ${offset + done}, expected ${offset + length}`);
      done += got;
    }
    return JSON.parse(bytes.toString('utf8', 0, length), restoreNumbers) as T;
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
