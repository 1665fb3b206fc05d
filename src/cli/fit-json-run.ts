import type { Spec } from '../core/analysis/spec/spec';
import { isRingfallError } from '../core/errors';
import type { SurveyAnalysisSettings } from '../core/report/analyse-survey';
import type { Report, SurveyReport } from '../core/report/report';
import type { RunRecord } from '../core/report/run-record';
import type { SetAsideRow } from '../core/report/set-aside-rows';
import { toJsonReport } from '../core/report/to-json-report';
import type { BatchSettings } from './batch/batch-settings';
import { runBatchInOrder } from './batch/run-batch';
import { exitStatus, worseStatus } from './exit-codes';
import { fitSurveyText, surveyTexts, type FitFileTexts } from './fit-file';
import type { FitCommandOptions } from './fit-options';
import { changedProblem, pauseEveryMs, sameInput, type FirstPass } from './hash-run-files';
import { JsonReportStream, stdoutBackpressure, type ByteSink, type SinkBackpressure } from './json-report-stream';
import type { SkippedFiles } from './skip-list';
import { yieldToEvents, type StopSignals } from './stop-signals';

/**
 * The JSON report of `fit --json` as it is made, after the first pass (hashRunFiles) gave
 * the run record: the schema and run record go out with the first survey, each survey's
 * text straight after it is fitted (JsonReportStream, UTF-8 into large buffers), and
 * `finish` writes the rows outside any survey, the skipped files and the partial marker.
 * Kept in memory: only those rows, the problem lines, the exit status from the checks and
 * the surveys no given spec applies to. The bytes are those of one
 * `JSON.stringify(toJsonReport(report), null, 2)` of the whole report.
 */
export class FitJsonOutput {
  /** One line per file that could not be read, imported or fitted, in file order. */
  readonly problems: string[] = [];
  readonly rejected: SetAsideRow[] = [];
  /** The exit status from the checks so far (checksStatus of the surveys written). */
  status: number = exitStatus.passed;
  /** Surveys no given spec applies to, with what their stderr line reads. */
  readonly unapplied: Pick<SurveyReport, 'source' | 'coil' | 'spec'>[] = [];
  /** Files fitted (or found unusable) so far, in file order but for a stopped worker run's gaps. */
  filesDone = 0;
  private readonly stream: JsonReportStream;
  /** The report without its surveys; the run record goes once the head is written (only the keys after the surveys are needed then). */
  private rest: Omit<Report, 'surveys'>;

  constructor(run: RunRecord, skipped: readonly SkippedFiles[], sink: ByteSink = process.stdout, backpressure: SinkBackpressure | undefined = sink === process.stdout ? stdoutBackpressure : undefined) {
    this.rest = { rejected: this.rejected, run, ...(skipped.length > 0 ? { skipped: [...skipped] } : {}) };
    // stdout calls a write's callback once it holds the bytes no longer (Node's Writable), so its buffers are reused
    this.stream = new JsonReportStream(sink, (part: Report) => toJsonReport({ ...part, ...this.rest }), backpressure, { bytes: true, reuse: sink === process.stdout });
  }

  /** Surveys written so far: none means no report is printed (as when no file gave a survey). */
  get surveyCount(): number {
    return this.stream.surveyCount;
  }

  /** A file's surveys as text (fitFileTexts or surveyTexts), written now in file order. */
  async add(texts: Pick<FitFileTexts, 'json' | 'status' | 'unapplied'>): Promise<void> {
    for (const text of texts.json) await this.stream.surveyJson(text);
    // the head is out: let the run record (an entry per file) go
    if (this.rest.run !== undefined && this.stream.surveyCount > 0) this.rest = { rejected: this.rejected, ...(this.rest.skipped === undefined ? {} : { skipped: this.rest.skipped }) };
    this.status = worseStatus(this.status, texts.status);
    this.unapplied.push(...texts.unapplied);
  }

  /** Close the report: the keys after the surveys, then `extra` (the partial marker of a stopped run). */
  finish(extra: Record<string, unknown>): Promise<void> {
    return this.stream.finish({}, extra);
  }
}

/**
 * The second pass of `fit --json` on this thread: each file's kept bytes (or the file read
 * again and checked against its hash: FirstPass.take) imported, fitted and written to
 * `out` at once, in file order. Pauses for events every few milliseconds; a stop signal
 * ends the run after the file in hand (`out.filesDone` says how far it came).
 */
export async function fitJsonOnThread(paths: readonly string[], files: FirstPass, options: FitCommandOptions, specs: readonly Spec[], stop: Pick<StopSignals, 'signal'>, out: FitJsonOutput): Promise<void> {
  const settings: SurveyAnalysisSettings = { fit: options.fit, specs, thresholds: options.thresholds };
  let paused = performance.now();
  for (const [index, path] of paths.entries()) {
    if (performance.now() - paused >= pauseEveryMs) {
      await yieldToEvents();
      paused = performance.now();
    }
    if (stop.signal !== null) return;
    const read = files.take(index);
    if ('problem' in read) {
      out.problems.push(read.problem);
    } else {
      try {
        await out.add(surveyTexts(fitSurveyText(path, read.bytes.toString('utf8'), options.import, settings, out.rejected)));
      } catch (error) {
        if (!isRingfallError(error)) throw error;
        out.problems.push(error.message);
      }
    }
    out.filesDone += 1;
  }
}

/**
 * The second pass of `fit --json` on batch's worker pool (runBatchInOrder with
 * BatchSettings.fitTexts): each worker reads, hashes, imports and fits its files and
 * returns them as text (fitFileTexts), handed over in file order, so the report is the same
 * byte for byte as on one thread. A file whose bytes in the worker differ from those of
 * the first pass gives the problem line of a changed file. A stop signal ends the workers;
 * the files finished are reported. A file that breaks a worker (a bug, not a
 * RingfallError) ends the run as an internal error, as it would on one thread.
 */
export async function fitJsonOnWorkers(
  paths: readonly string[], files: FirstPass, options: FitCommandOptions, specs: readonly Spec[], stop: Pick<StopSignals, 'onStop'>, out: FitJsonOutput, workers: number,
): Promise<void> {
  const settings: BatchSettings = { fit: options.fit, specs, thresholds: options.thresholds, import: options.import, keepPoints: true, fitTexts: true };
  let broken: string | null = null;
  // writing waits for stdout; outcomes come in order, so each write starts after the one before
  let writing: Promise<void> = Promise.resolve();
  const silent = { write: () => true };
  // workers get more files only once what they gave is written: a slow reader of stdout holds the run back, not memory
  const holdBack = () => writing;
  const result = await runBatchInOrder(paths, settings, { workers, progress: silent, stop, holdBack }, (outcome) => {
    const fit = outcome.fit;
    if (fit === undefined) {
      broken ??= outcome.unreadable.map((entry) => entry.reason).join(' ') || `${outcome.source}: not fitted`;
      return;
    }
    const input = fit.inputs[0];
    if (input === undefined || !sameInput(input, files.input(outcome.index))) {
      out.problems.push(changedProblem(outcome.source));
      return;
    }
    if (fit.problem !== null) out.problems.push(files.problem(outcome.index) ?? fit.problem);
    out.rejected.push(...fit.rejected);
    writing = writing.then(() => out.add(fit));
    // a failed write is thrown by the await below, not reported first as an unhandled rejection
    writing.catch(() => undefined);
  });
  await writing;
  if (broken !== null) throw new Error(broken);
  out.filesDone = result.filesDone;
}
