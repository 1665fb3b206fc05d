import { once } from 'node:events';
import type { Report } from '../core/report/report';
import { toJsonReport } from '../core/report/to-json-report';
import { jsonPieces } from './json-pieces';

/** Where the report goes: stdout in the CLI, a buffer in tests. */
export interface TextSink {
  write(text: string): unknown;
}

/**
 * A sink that takes bytes (stdout): JsonReportStream then encodes the text itself, once, into
 * large buffers. A sink that calls `done` once it holds the bytes no longer (as a Writable
 * calls its write callback) may be given the option `reuse`.
 */
export interface ByteSink {
  write(bytes: Uint8Array, done?: (error?: Error | null) => void): unknown;
}

/** A promise to wait for before writing more (a stream's 'drain'), or null to go on. */
export type SinkBackpressure = () => Promise<unknown> | null;

/** Backpressure of standard output: a pipe takes the report as fast as its reader does, so wait for it rather than buffer the report. */
export const stdoutBackpressure: SinkBackpressure = () => (process.stdout.writableNeedDrain ? once(process.stdout, 'drain') : null);

/** Text gathered before it goes to the sink: few writes, none large. */
const writeSize = 1 << 16;

/**
 * Bytes gathered before they go to a ByteSink. Measured (2 cores, 10,000 loop surveys,
 * 105 MB): each survey's text encoded into 1 MB buffers took 70–90 ms beyond the
 * JSON.stringify, against 250–400 ms for 64 kB strings handed to stdout (a string made of
 * many pieces is flattened, then converted to UTF-8 by the stream) and 3× that into a pipe.
 */
const byteWriteSize = 1 << 20;

/**
 * Written buffers kept to be written into again (option `reuse`). A fresh 1 MB buffer is
 * new memory the system maps page by page on first touch: measured at 10,000 loop surveys
 * (105 MB, 2 cores), encoding into fresh buffers took 175–240 ms, and the same text
 * encoded again into a buffer already touched about a third of that.
 */
const spareBuffers = 4;

/**
 * The JSON report written one survey at a time, so a run over 50,000 files never holds
 * the whole report (or one giant string) in memory. The bytes are exactly those of
 * `JSON.stringify(toJsonReport(report), null, 2) + "\n"` for the same report: the keys
 * before "surveys" (schema, run, …) are written with the first survey, each survey as it
 * comes, and the keys after it (fleet, …) by `finish`, from toJsonReport itself, so a
 * key added there appears here too. `finish` may add keys of its own at the end, such
 * as the partial marker of a stopped run. Large values (the run record's inputs, the fleet
 * section) are written part by part (jsonPieces), and text goes to the sink in pieces of
 * about 64 kB, each write waiting first for `backpressure` when it gives a promise. Given
 * a ByteSink (`{ bytes: true }`), the text is encoded as UTF-8 straight into buffers of
 * about 1 MB, each handed over once: a fresh buffer follows (the sink may keep it), or
 * with `{ reuse: true }` one the sink has said it is done with (its `done` callback).
 */
export class JsonReportStream {
  private started = false;
  private surveys = 0;
  private pending = '';
  /** Bytes waiting to be written before `pending` (surveyBytes). */
  private bytes: Uint8Array[] = [];
  private byteCount = 0;
  private readonly toJson: (report: Report) => Record<string, unknown>;
  /** True for a ByteSink: text is encoded here into `buffer` (see the class comment). */
  private readonly encodes: boolean;
  private buffer: Buffer | null = null;
  private used = 0;
  /** Buffers the sink is done with, to encode into again (option `reuse`); null: never reused. */
  private readonly spare: Buffer[] | null;

  constructor(sink: TextSink, toJson?: (report: Report) => object, backpressure?: SinkBackpressure);
  constructor(sink: ByteSink, toJson: ((report: Report) => object) | undefined, backpressure: SinkBackpressure | undefined, options: { readonly bytes: true; readonly reuse?: boolean });
  constructor(private readonly sink: TextSink | ByteSink, toJson: (report: Report) => object = toJsonReport, private readonly backpressure: SinkBackpressure = () => null, options: { readonly bytes?: boolean; readonly reuse?: boolean } = {}) {
    this.toJson = (report) => toJson(report) as Record<string, unknown>;
    this.encodes = options.bytes === true;
    this.spare = this.encodes && options.reuse === true ? [] : null;
  }

  /** Surveys written so far. */
  get surveyCount(): number {
    return this.surveys;
  }

  /**
   * Write one survey (in report order) given as its JSON text: the text of
   * `JSON.stringify(survey, null, 2)` for the survey as toJsonReport maps it in this report
   * (surveyJsonText in batch/survey-json.ts makes it from a worker's record).
   */
  async surveyText(text: string): Promise<void> {
    await this.surveyJson(`    ${indent(text, '    ')}`);
  }

  /**
   * Write one survey (in report order) given as its text at the report's indentation: the
   * lines of `JSON.stringify(survey, null, 2)` each indented by four spaces, as
   * reportSurveyText makes it, so nothing is indented again here.
   */
  async surveyJson(text: string): Promise<void> {
    await this.start();
    await this.put(this.surveys === 0 ? '\n' : ',\n');
    await this.put(text);
    this.surveys += 1;
  }

  /**
   * surveyText for a survey given as bytes: the UTF-8 of its text with every line after the
   * first indented by 4 spaces (`indent(text, '    ')`), in pieces (batch's workers make
   * them, batch/survey-json.ts). The pieces are kept, not copied, until they are written:
   * they must not change after the call. Only for a sink that takes bytes too (stdout does).
   */
  async surveyBytes(pieces: readonly Uint8Array[]): Promise<void> {
    await this.start();
    await this.put(`${this.surveys === 0 ? '\n' : ',\n'}    `);
    this.surveys += 1;
    if (this.encodes) {
      // what is encoded so far, then the pieces as they are
      await this.flush();
      for (const piece of pieces) await this.hand(piece);
      return;
    }
    this.bytes.push(Buffer.from(this.pending, 'utf8'), ...pieces);
    this.pending = '';
    for (const piece of pieces) this.byteCount += piece.byteLength;
    if (this.byteCount >= writeSize) await this.flush();
  }

  /** Close the survey list and write the keys after it (`rest` is the report without its surveys), then `extra`; every byte is handed to the sink. */
  async finish(rest: Omit<Report, 'surveys'> = {}, extra: Record<string, unknown> = {}): Promise<void> {
    await this.start();
    await this.put(this.surveys === 0 ? ']' : '\n  ]');
    const whole = this.toJson({ ...rest, surveys: [] });
    const keys = Object.keys(whole);
    const after = keys.slice(keys.indexOf('surveys') + 1);
    await this.keys([...after.map((k) => [k, whole[k]] as const), ...Object.entries(extra)], ',\n');
    await this.put('\n}\n');
    await this.flush();
  }

  private async start(): Promise<void> {
    if (this.started) return;
    this.started = true;
    const head = this.toJson({ surveys: [] });
    const keys = Object.keys(head);
    await this.put('{\n');
    const written = await this.keys(keys.slice(0, keys.indexOf('surveys')).map((key) => [key, head[key]] as const), '');
    await this.put(`${written > 0 ? ',\n' : ''}  "surveys": [`);
  }

  /** Write `"key": value` entries, each preceded by `separator` (the first one too) or ",\n"; values JSON leaves out are skipped. */
  private async keys(entries: readonly (readonly [string, unknown])[], separator: string): Promise<number> {
    let written = 0;
    for (const [key, value] of entries) {
      if (value === undefined || typeof value === 'function' || typeof value === 'symbol') continue;
      await this.put(`${written === 0 ? separator : ',\n'}  ${JSON.stringify(key)}: `);
      for (const piece of jsonPieces(value, '  ')) await this.put(piece);
      written += 1;
    }
    return written;
  }

  private async put(text: string): Promise<void> {
    if (this.encodes) return this.putBytes(text);
    this.pending += text;
    if (this.pending.length >= writeSize) await this.flush();
  }

  /** Encode `text` into the current buffer (a UTF-16 unit takes at most 3 bytes in UTF-8), handing the buffer over when it would not fit. */
  private async putBytes(text: string): Promise<void> {
    if (this.buffer !== null && this.used + 3 * text.length > this.buffer.length) await this.flush();
    if (3 * text.length > byteWriteSize) {
      await this.hand(Buffer.from(text, 'utf8'));
      return;
    }
    this.buffer ??= this.spare?.pop() ?? Buffer.allocUnsafe(byteWriteSize);
    this.used += this.buffer.write(text, this.used, 'utf8');
  }

  private async flush(): Promise<void> {
    if (this.encodes) {
      const full = this.buffer;
      if (full === null || this.used === 0) return;
      const used = this.used;
      this.buffer = null;
      this.used = 0;
      await this.hand(full.subarray(0, used), full);
      return;
    }
    if (this.bytes.length > 0) {
      // bytes from surveyBytes, then the text after them, in one write
      const bytes = Buffer.concat([...this.bytes, Buffer.from(this.pending, 'utf8')]);
      this.bytes = [];
      this.byteCount = 0;
      this.pending = '';
      await this.hand(bytes);
      return;
    }
    if (this.pending === '') return;
    const text = this.pending;
    this.pending = '';
    (this.sink as TextSink).write(text);
    const wait = this.backpressure();
    if (wait !== null) await wait;
  }

  /** Hand `bytes` to the sink; `own` is the stream's buffer under them, written into again once the sink is done with it (option `reuse`). */
  private async hand(bytes: Uint8Array, own?: Buffer): Promise<void> {
    const spare = this.spare;
    if (spare !== null && own !== undefined) {
      (this.sink as ByteSink).write(bytes, (error) => {
        if (error == null && spare.length < spareBuffers) spare.push(own);
      });
    } else {
      (this.sink as ByteSink).write(bytes);
    }
    const wait = this.backpressure();
    if (wait !== null) await wait;
  }
}

/**
 * A survey's text at the report's indentation (JsonReportStream.surveyJson): the text of
 * `JSON.stringify(survey, null, 2)` with every line indented by four spaces, made in one
 * JSON.stringify — the survey as the only item of an array in an array is written at that
 * depth, and the brackets around it are cut off ("[\n  [\n" before, "\n  ]\n]" after).
 */
export function reportSurveyText(survey: object): string {
  return JSON.stringify([[survey]], null, 2).slice(6, -6);
}

function indent(text: string, by: string): string {
  return text.replace(/\n/g, `\n${by}`);
}
