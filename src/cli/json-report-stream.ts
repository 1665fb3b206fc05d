import { once } from 'node:events';
import type { Report } from '../core/report/report';
import { toJsonReport } from '../core/report/to-json-report';
import { jsonPieces } from './json-pieces';

/** Where the report goes: stdout in the CLI, a buffer in tests. */
export interface TextSink {
  write(text: string): unknown;
}

/** A promise to wait for before writing more (a stream's 'drain'), or null to go on. */
export type SinkBackpressure = () => Promise<unknown> | null;

/** Backpressure of standard output: a pipe takes the report as fast as its reader does, so wait for it rather than buffer the report. */
export const stdoutBackpressure: SinkBackpressure = () => (process.stdout.writableNeedDrain ? once(process.stdout, 'drain') : null);

/** Text gathered before it goes to the sink: few writes, none large. */
const writeSize = 1 << 16;

/**
 * The JSON report written one survey at a time, so a run over 50,000 files never holds
 * the whole report (or one giant string) in memory. The bytes are exactly those of
 * `JSON.stringify(toJsonReport(report), null, 2) + "\n"` for the same report: the keys
 * before "surveys" (schema, run, …) are written with the first survey, each survey as it
 * comes, and the keys after it (fleet, …) by `finish`, from toJsonReport itself, so a
 * key added there appears here too. `finish` may add keys of its own at the end, such
 * as the partial marker of a stopped run. Large values (the run record's inputs, the fleet
 * section) are written part by part (jsonPieces), and text goes to the sink in pieces of
 * about 64 kB, each write waiting first for `backpressure` when it gives a promise.
 */
export class JsonReportStream {
  private started = false;
  private surveys = 0;
  private pending = '';
  /** Bytes waiting to be written before `pending` (surveyBytes). */
  private bytes: Uint8Array[] = [];
  private byteCount = 0;
  private readonly toJson: (report: Report) => Record<string, unknown>;

  constructor(private readonly sink: TextSink, toJson: (report: Report) => object = toJsonReport, private readonly backpressure: SinkBackpressure = () => null) {
    this.toJson = (report) => toJson(report) as Record<string, unknown>;
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
    await this.start();
    await this.put(`${this.surveys === 0 ? '\n' : ',\n'}    ${indent(text, '    ')}`);
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
    this.bytes.push(Buffer.from(this.pending, 'utf8'), ...pieces);
    this.pending = '';
    this.surveys += 1;
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
    this.pending += text;
    if (this.pending.length >= writeSize) await this.flush();
  }

  private async flush(): Promise<void> {
    if (this.bytes.length > 0) {
      // bytes from surveyBytes, then the text after them, in one write
      const bytes = Buffer.concat([...this.bytes, Buffer.from(this.pending, 'utf8')]);
      this.bytes = [];
      this.byteCount = 0;
      this.pending = '';
      (this.sink as unknown as { write(bytes: Uint8Array): unknown }).write(bytes);
      const wait = this.backpressure();
      if (wait !== null) await wait;
      return;
    }
    if (this.pending === '') return;
    const text = this.pending;
    this.pending = '';
    this.sink.write(text);
    const wait = this.backpressure();
    if (wait !== null) await wait;
  }
}

function indent(text: string, by: string): string {
  return text.replace(/\n/g, `\n${by}`);
}
