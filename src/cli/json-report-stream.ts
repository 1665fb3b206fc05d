import type { Report, SurveyReport } from '../core/report/report';
import { toJsonReport } from '../core/report/to-json-report';

/** Where the report goes: stdout in the CLI (synchronous on Linux for files and pipes), a buffer in tests. */
export interface TextSink {
  write(text: string): unknown;
}

/**
 * The JSON report written one survey at a time, so a run over 50,000 files never holds
 * the whole report (or one giant string) in memory. The bytes are exactly those of
 * `JSON.stringify(toJsonReport(report), null, 2) + "\n"` for the same report: the keys
 * before "surveys" (schema, …) are written with the first survey, each survey as it
 * comes, and the keys after it (fleet, …) by `finish`, from toJsonReport itself, so a
 * key added there appears here too. `finish` may add keys of its own at the end, such
 * as the partial marker of a stopped run.
 */
export class JsonReportStream {
  private started = false;
  private surveys = 0;
  private readonly sink: TextSink;
  private readonly toJson: (report: Report) => Record<string, unknown>;

  constructor(sink: TextSink, toJson: (report: Report) => object = toJsonReport) {
    this.sink = sink;
    this.toJson = (report) => toJson(report) as Record<string, unknown>;
  }

  /** Surveys written so far. */
  get surveyCount(): number {
    return this.surveys;
  }

  /** Write one survey (in report order). */
  survey(survey: SurveyReport): void {
    this.start();
    const json = (this.toJson({ surveys: [survey] })['surveys'] as unknown[])[0];
    this.sink.write(`${this.surveys === 0 ? '\n' : ',\n'}    ${indent(JSON.stringify(json, null, 2), '    ')}`);
    this.surveys += 1;
  }

  /** Close the survey list and write the keys after it (`rest` is the report without its surveys), then `extra`. */
  finish(rest: Omit<Report, 'surveys'> = {}, extra: Record<string, unknown> = {}): void {
    this.start();
    this.sink.write(this.surveys === 0 ? ']' : '\n  ]');
    const whole = this.toJson({ ...rest, surveys: [] });
    const keys = Object.keys(whole);
    const after = keys.slice(keys.indexOf('surveys') + 1);
    for (const [key, value] of [...after.map((k) => [k, whole[k]] as const), ...Object.entries(extra)]) {
      const text = JSON.stringify(value, null, 2);
      if (text !== undefined) this.sink.write(`,\n  ${JSON.stringify(key)}: ${indent(text, '  ')}`);
    }
    this.sink.write('\n}\n');
  }

  private start(): void {
    if (this.started) return;
    this.started = true;
    const head = this.toJson({ surveys: [] });
    const keys = Object.keys(head);
    const before = keys.slice(0, keys.indexOf('surveys'));
    const parts = before.flatMap((key) => {
      const text = JSON.stringify(head[key], null, 2);
      return text === undefined ? [] : [`  ${JSON.stringify(key)}: ${indent(text, '  ')}`];
    });
    this.sink.write(`{\n${[...parts, '  "surveys": ['].join(',\n')}`);
  }
}

function indent(text: string, by: string): string {
  return text.replace(/\n/g, `\n${by}`);
}
