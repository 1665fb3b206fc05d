import { statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { dirname, resolve } from 'node:path';
import type { Command } from 'commander';
import type { Spec } from '../../core/analysis/spec/spec';
import { isRingfallError, RingfallError } from '../../core/errors';
import type { SurveyAnalysisSettings } from '../../core/report/analyse-survey';
import { renderTextReport } from '../../core/report/render-text';
import type { Report, SurveyReport } from '../../core/report/report';
import type { SetAsideRow } from '../../core/report/set-aside-rows';
import { printable } from '../../core/text/printable';
import { reportCsv } from '../../core/report/report-csv';
import { toJsonReport } from '../../core/report/to-json-report';
import { readSpecFile } from '../../io/spec';
import { renderReportDocument } from '../../render';
import { chartLibrarySource } from '../chart-library';
import { addFitOptions, readFitFlags, type FitCommandOptions, type FitFlags } from '../fit-options';
import { skippedLines, surveyFilesFrom, type UnusablePath } from '../find-survey-files';
import { skipListName, type SkippedFiles } from '../skip-list';
import { stoppedStatus, watchStopSignals, yieldToEvents, type StopSignals } from '../stop-signals';
import { writeFileAtomic } from '../write-file-atomic';
import type { CommandContext } from './command-context';
import { checksStatus } from '../checks-status';
import type { ByteSink } from '../json-report-stream';
import { cliRunRecord, describeSpecFile, runTime } from '../run-record';
import { fitFile } from '../fit-file';
import { fitRunSettings, type RunInput, type RunRecord } from '../../core/report/run-record';
import { hashRunFiles, keptBytesBudget } from '../hash-run-files';
import { fitJsonOnThread, fitJsonOnWorkers, FitJsonOutput } from '../fit-json-run';

/**
 * `ringfall fit FILE... [options]` (CONTRACT.md): import every survey in the files (folders
 * are searched), fit each requested model, compare them, check the spec and find the
 * threshold distances when asked, and print the report — text for people, or the JSON
 * report with --json; --html and --csv also write those files. A file that cannot be read
 * or imported is named on stderr in one line and the exit status becomes 2; the other
 * files are still reported. Exit status by checksStatus: 1 when a check failed (spec,
 * threshold not reached), 3 when none failed but one is inconclusive, 2 when a spec was
 * given that applies to no survey's coil (also said on stderr).
 */
export function registerFit(program: Command, context: CommandContext): void {
  addFitOptions(
    program
      .command('fit')
      .description('fit coil models to survey files and print the report')
      .argument('[files...]', 'survey CSV files, or folders to search for them')
      .option('--files-from <list>', 'also fit the paths listed in this file, one per line (- reads standard input); for runs too long for a command line')
      .option('--no-skip', `also fit what a folder's ${skipListName} list names as not surveys`),
  ).action(async (files: string[], flags: FitFlags & { readonly filesFrom?: string; readonly skip?: boolean }) => {
    const options = readFitFlags(flags);
    const time = runTime();
    // a side file's folder is checked before any fitting, so a typo costs nothing
    for (const [path, option] of [[options.html, '--html'], [options.csv, '--csv']] as const) if (path !== null) checkOutputFolder(path, option);
    const specs = options.spec === null ? [] : await readSpecFile(options.spec);
    const skipped: SkippedFiles[] = [];
    const unusable: UnusablePath[] = [];
    const paths = surveyFilesFrom(files, flags.filesFrom, { skipLists: flags.skip !== false, skipped, unusable });
    for (const line of skippedLines(skipped)) process.stderr.write(`ringfall: ${printable(line)}\n`);
    // a folder that cannot be listed, a pipe, a broken link: named with the reason, exit 2
    for (const path of unusable) process.stderr.write(`ringfall: "${printable(path.source)}": ${printable(path.reason)}\n`);
    if (unusable.length > 0) context.setExitCode(2);
    // Ctrl-C or SIGTERM between files: the files done are reported, marked partial
    const stop = watchStopSignals();
    try {
      const settings = fitRunSettings({ fit: options.fit, thresholds: options.thresholds, spec: describeSpecFile(options.spec), import: options.import, extra: { skipLists: flags.skip !== false } });
      // --json alone is written survey by survey as the files are fitted, so memory stays flat in the number of files
      if (options.json && options.html === null && options.csv === null) {
        await printJsonReport(paths, options, specs, { stop, context, runFor: (inputs) => cliRunRecord('fit', time, inputs, settings), skipped });
        return;
      }
      const { reports, problems, rejected, inputs, filesDone } = await fitFilesUntilStopped(paths, options, specs, stop);
      for (const problem of problems) process.stderr.write(`ringfall: ${printable(problem)}\n`);
      if (problems.length > 0) context.setExitCode(2);
      const signal = stop.signal;
      if (signal !== null) {
        process.stderr.write(`ringfall: ${signal}: stopped after ${filesDone} of ${paths.length} files; the report covers those only.\n`);
        context.setExitCode(stoppedStatus(signal));
      }
      if (reports.length === 0) return;
      const run = cliRunRecord('fit', time, inputs, settings);
      const report: Report = { surveys: reports, rejected, run, ...(skipped.length > 0 ? { skipped } : {}) };
      writeSideFiles(report, options);
      if (options.json) {
        const json = toJsonReport(report);
        if (signal !== null) json['partial'] = { filesDone, filesTotal: paths.length, signal };
        process.stdout.write(`${JSON.stringify(json, null, 2)}\n`);
      } else {
        process.stdout.write(`${signal !== null ? `PARTIAL REPORT: stopped by ${signal} after ${filesDone} of ${paths.length} files; it covers those files only.\n\n` : ''}${renderTextReport(report)}`);
      }
      reportUnappliedSpecs(report);
      context.setExitCode(checksStatus(report));
    } finally {
      stop.dispose();
    }
  });
}

/**
 * `fit --json` without --html/--csv, in two passes so that neither the report nor its
 * surveys are ever held whole: first every file is read and hashed (hashRunFiles; the run
 * record, with every file's hash, comes before the surveys in the report), then the head
 * of the report is written and each file is fitted and its surveys written at once (on
 * this thread, or on workers: fitWorkers). Problem lines, the stop line and the unapplied
 * specs go to stderr as fit always wrote them, once the report is closed; a run that gave
 * no survey prints no report.
 * A stopped run's `inputs` lists every file hashed in the first pass, fitted or not
 * (`partial.filesDone` says how many were fitted); a stop during the first pass fits none.
 */
export async function printJsonReport(paths: readonly string[], options: FitCommandOptions, specs: readonly Spec[], run: JsonRunOptions): Promise<FitJsonOutput> {
  const { stop, context } = run;
  const stderr = run.stderr ?? process.stderr;
  const workers = run.workers ?? fitWorkers(paths.length);
  // workers read the files again themselves: keep no bytes for them
  const first = await hashRunFiles(paths, stop, workers > 1 ? 0 : run.keepBytes ?? keptBytesBudget);
  const out = new FitJsonOutput(run.runFor(first.files.inputs()), run.skipped, run.sink);
  if (!first.stopped) {
    if (workers > 1) await fitJsonOnWorkers(paths, first.files, options, specs, stop, out, workers);
    else await fitJsonOnThread(paths, first.files, options, specs, stop, out);
  }
  const signal = stop.signal;
  // the report is closed first, so stderr lines never land inside it when both streams go to one place
  if (out.surveyCount > 0) await out.finish(signal === null ? {} : { partial: { filesDone: out.filesDone, filesTotal: paths.length, signal } });
  for (const problem of out.problems) stderr.write(`ringfall: ${printable(problem)}\n`);
  if (out.problems.length > 0) context.setExitCode(2);
  if (signal !== null) {
    stderr.write(`ringfall: ${signal}: stopped after ${out.filesDone} of ${paths.length} files; the report covers those only.\n`);
    context.setExitCode(stoppedStatus(signal));
  }
  if (out.surveyCount === 0) return out;
  reportUnappliedSpecs({ surveys: out.unapplied }, stderr);
  context.setExitCode(out.status);
  return out;
}

/** How printJsonReport runs: stop signals, where the exit status goes, the run record for the inputs hashed, the skipped files; for tests, where the report and the stderr lines go, the workers and the bytes kept. */
export interface JsonRunOptions {
  readonly stop: Pick<StopSignals, 'signal' | 'onStop'>;
  readonly context: Pick<CommandContext, 'setExitCode'>;
  readonly runFor: (inputs: readonly RunInput[]) => RunRecord;
  readonly skipped: readonly SkippedFiles[];
  readonly sink?: ByteSink;
  readonly workers?: number;
  readonly keepBytes?: number;
  readonly stderr?: { write(text: string): unknown };
}

/** Files from which `fit --json` may fit on worker threads: below it, starting the workers (0.1–0.4 s each) costs more than it saves. */
export const fitWorkersFrom = 200;

/**
 * Worker threads for `fit --json` on `files` files on a machine with `cores` cores: all of
 * them (as batch) from fitWorkersFrom files on when there are more than two, else 1 (fit on
 * the main thread). Measured on 2 cores, 10,000 thirty-reading files, `--model loop`, dist
 * (DEVELOPERS.md). With the spool: two workers took 0.7–1.3× the main thread's wall time for
 * 1.5–1.9× its CPU. Without it (the main thread only hashes and writes; load 4.9–5.5 from
 * other work): one thread 2.4–4.2 s wall, 2.7–2.8 s CPU, 143–149 MB peak RSS; two workers
 * 4.1–10.5 s wall, 6.8–7.7 s CPU, 228–248 MB (each worker loads and warms up the code again,
 * and again when recycled every 2,000 files; not recycled: 4.5–5.5 s wall, 4.7–4.8 s CPU,
 * 265–274 MB), past the 200 MB target too. Again with main's faster engine (load 2–3): one
 * thread 2.1–2.3 s wall, 2.3 s CPU, 119 MB; two workers 2.9–3.8 s, 3.8 s CPU, 235–237 MB.
 * So two cores fit on one thread. --html, --csv
 * and the text report need the whole report in hand and are always made on the main thread.
 */
export function fitWorkers(files: number, cores: number = availableParallelism()): number {
  return files >= fitWorkersFrom && cores > 2 ? cores : 1;
}

/** One line on stderr per survey that no given spec applies to (the report says it too; exit 2). */
export function reportUnappliedSpecs(report: { readonly surveys: readonly Pick<SurveyReport, 'source' | 'coil' | 'spec'>[] }, stderr: { write(text: string): unknown } = process.stderr): void {
  for (const survey of report.surveys) {
    if (survey.spec?.applied === false) stderr.write(`ringfall: ${survey.source}${survey.coil ? ` (${survey.coil})` : ''}: ${survey.spec.reason ?? 'no spec applies'}\n`);
  }
}

/** --html and --csv: write the self-contained HTML report and the per-reading CSV. */
export function writeSideFiles(report: Report, options: Pick<FitCommandOptions, 'html' | 'csv'>): void {
  if (options.html !== null) {
    const first = report.surveys[0];
    const title = report.surveys.length === 1 ? `ringfall report — ${first?.coil ?? first?.source ?? ''}` : `ringfall report — ${report.surveys.length} surveys`;
    writeOutput(options.html, '--html', renderReportDocument(report, { chartLibrary: chartLibrarySource(), title }));
  }
  if (options.csv !== null) writeOutput(options.csv, '--csv', reportCsv(report));
}

function checkOutputFolder(path: string, option: string): void {
  const folder = dirname(resolve(path));
  let isFolder = false;
  try {
    isFolder = statSync(folder).isDirectory();
  } catch {
    isFolder = false;
  }
  if (!isFolder) {
    throw new RingfallError('OUTPUT_UNWRITABLE', `${option}: the folder "${folder}" for "${path}" does not exist. Create it first or choose another path.`, { value: path, where: option });
  }
}

/** Write a side file whole or not at all (writeFileAtomic: a temporary name renamed into place). */
function writeOutput(path: string, option: string, text: string): void {
  try {
    writeFileAtomic(path, text);
  } catch (cause) {
    throw new RingfallError('OUTPUT_UNWRITABLE', `${option}: cannot write "${path}": ${(cause as NodeJS.ErrnoException).code ?? (cause as Error).message}. Choose a folder that exists and can be written.`, { value: path, cause });
  }
}

/**
 * Import and analyse every survey of the given files: one SurveyReport per survey (surveys
 * with too few readings get a report with no fits and a warning saying why), every row
 * that belongs to no survey with its file (`rejected`, summed up one sentence per kind of
 * problem in the file's first report's warnings), one message per file that could not
 * be read or imported, and every file with its SHA-256 for the run record.
 */
export function fitFiles(
  paths: readonly string[], options: FitCommandOptions, specs: readonly Spec[] = [],
): { reports: SurveyReport[]; problems: string[]; rejected: SetAsideRow[]; inputs: RunInput[] } {
  const settings: SurveyAnalysisSettings = { fit: options.fit, specs, thresholds: options.thresholds };
  const reports: SurveyReport[] = [];
  const problems: string[] = [];
  const rejected: SetAsideRow[] = [];
  const inputs: RunInput[] = [];
  for (const path of paths) {
    try {
      reports.push(...fitFile(path, options.import, settings, rejected, inputs));
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      problems.push(error.message);
    }
  }
  return { reports, problems, rejected, inputs };
}

/**
 * fitFiles, one file at a time with a pause for events between files, so a stop signal
 * (SIGINT, SIGTERM) ends the run after the file in hand; `filesDone` says how far it came.
 * With `onReports`, each file's reports go there as they come and are not kept.
 */
export async function fitFilesUntilStopped(
  paths: readonly string[], options: FitCommandOptions, specs: readonly Spec[], stop: Pick<StopSignals, 'signal'>,
  onReports?: (reports: readonly SurveyReport[]) => void,
): Promise<ReturnType<typeof fitFiles> & { filesDone: number }> {
  const all: ReturnType<typeof fitFiles> = { reports: [], problems: [], rejected: [], inputs: [] };
  let filesDone = 0;
  for (const path of paths) {
    await yieldToEvents();
    if (stop.signal !== null) break;
    const one = fitFiles([path], options, specs);
    if (onReports === undefined) all.reports.push(...one.reports);
    else onReports(one.reports);
    all.problems.push(...one.problems);
    all.rejected.push(...one.rejected);
    all.inputs.push(...one.inputs);
    filesDone += 1;
  }
  return { ...all, filesDone };
}
