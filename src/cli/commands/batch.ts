import { mkdirSync, rmSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import type { Command } from 'commander';
import { RingfallError } from '../../core/errors';
import { renderRunText } from '../../core/report/render-text';
import type { Report, SurveyReport } from '../../core/report/report';
import type { RunInput } from '../../core/report/run-record';
import { fitRunSettings } from '../../core/report/run-record';
import { toJsonReport } from '../../core/report/to-json-report';
import { readSpecFile } from '../../io/spec';
import type { BatchSettings } from '../batch/batch-settings';
import { renderFleetSummary } from '../batch/render-fleet-summary';
import { runBatchInOrder } from '../batch/run-batch';
import { FleetCollector } from '../batch/fleet-collector';
import { scratchFolder } from '../batch/survey-spool';
import { writeSpooledSurveys, type SurveyJsonPlace } from '../batch/survey-json';
import { WorkerSpools, type WorkerSpoolPlace } from '../batch/worker-spool';
import { JsonReportStream, stdoutBackpressure } from '../json-report-stream';
import { writeHtmlReports } from '../batch/write-html-reports';
import { claimOutFolder } from '../batch/out-folder-lock';
import { stoppedStatus, watchStopSignals } from '../stop-signals';
import { addFitOptions, readFitFlags, type FitFlags } from '../fit-options';
import { checksStatus } from '../checks-status';
import { printable } from '../../core/text/printable';
import { skippedLines, surveyFilesFrom, type UnusablePath } from '../find-survey-files';
import { skipListName, type SkippedFiles } from '../skip-list';
import { exitStatus, worseStatus } from '../exit-codes';
import { reportUnappliedSpecs } from './fit';
import type { CommandContext } from './command-context';
import { cliRunRecord, describeFiles, describeSpecFile, runTime } from '../run-record';

/** Flags of `batch` besides the fitting options it shares with `fit`. */
interface BatchFlags extends FitFlags {
  readonly out?: string;
  readonly workers?: string;
  readonly filesFrom?: string;
  readonly progressEvery?: string;
  readonly skip?: boolean;
  readonly fileTimeLimit?: string;
}

/** Seconds one file may fit before batch leaves it out (BATCH_FILE_TIMEOUT): far past any real survey, short of a stalled worker. */
const defaultFileTimeLimit = 300;

/**
 * `ringfall batch DIR|FILE... [options]` (CONTRACT.md): fit every survey of every file in
 * parallel on worker threads and print the fleet summary (or the JSON report with its
 * fleet section, --json); --out DIR also writes one HTML report per coil and an index.
 * Exit status (CONTRACT.md): 0 all fitted and every check passed; 1 a check failed as for
 * `fit` (spec failed, threshold not reached, history flag); 3 none failed but a spec
 * check is inconclusive; 2 a usage or input error (also a file or part that could not be
 * used, or a spec that applies to no survey's coil); 130 stopped by Ctrl-C.
 */
export function registerBatch(program: Command, context: CommandContext): void {
  const command = addFitOptions(
    program
      .command('batch')
      .description('fit many survey files in parallel: fleet summary, histories and what needs attention')
      .argument('[paths...]', 'folders to search for survey files, or the files')
      .option('--files-from <list>', 'also fit the paths listed in this file, one per line (- reads standard input); for runs too long for a command line'),
  );
  // fit's single-report files; batch writes one report per coil with --out instead (refused below if given).
  for (const option of command.options) if (option.long === '--html' || option.long === '--csv') option.hideHelp();
  command
    .option('--out <dir>', 'also write one HTML report per coil and an index.html into this folder')
    .option('--workers <n>', `worker threads (default: all cores, ${availableParallelism()} here)`)
    .option('--progress-every <seconds>', 'seconds between progress lines when stderr is not a terminal (default 2)')
    .option('--no-skip', `also fit what a folder's ${skipListName} list names as not surveys`)
    .option('--file-time-limit <seconds>', `seconds one file may take before it is left out and listed, so no file stalls the run (default ${defaultFileTimeLimit})`)
    .action(async (paths: string[], flags: BatchFlags) => {
      const time = runTime();
      const settings = await readBatchSettings(flags);
      const workers = readWorkers(flags.workers);
      const progressInterval = readProgressEvery(flags.progressEvery);
      const fileTimeLimit = readSeconds(flags.fileTimeLimit, '--file-time-limit', 0.01, 86_400, 600) ?? defaultFileTimeLimit;
      const skipped: SkippedFiles[] = [];
      const unusable: UnusablePath[] = [];
      const files = surveyFilesFrom(paths, flags.filesFrom, { skipLists: flags.skip !== false, skipped, unusable });
      // the --out folder is claimed before any fitting: a bad folder or a second run into it is refused at once
      const claim = flags.out === undefined ? null : claimOutFolder(flags.out);
      const stop = watchStopSignals();
      try {
        for (const line of skippedLines(skipped)) process.stderr.write(`ringfall batch: ${printable(line)}\n`);
        // surveys go to spools on disk as they are fitted, each worker writing its own (for the
        // JSON report and the pages), as does what the summary and the fleet history need (the
        // collector keeps their places): memory stays flat in the number of files
        const spoolFolder = claim === null ? scratchFolder('batch', 'Set TMPDIR to a folder you can write, or give --out DIR (the scratch then goes there).') : claim.scratchPath('spools');
        if (claim !== null) mkdirSync(spoolFolder);
        const spools = new WorkerSpools(spoolFolder);
        try {
          // workers send digests: each survey's texts in the worker's spool (the JSON text and the
          // page's line only when they are written), their places in the message
          const run: BatchSettings = { ...settings, digest: { pages: flags.out !== undefined, json: flags.json === true, folder: spoolFolder } };
          const collector = new FleetCollector(run, spools);
          let uncoiled = 0;
          // each survey's JSON text in the spools, in report order
          const jsonPlaces: SurveyJsonPlace[] = [];
          // the files' SHA-256 for the run record, from the bytes each worker read
          const inputs: (RunInput | undefined)[] = new Array(files.length);
          // each page's surveys (pageKey) in the spools, in report order
          const pagePlaces = new Map<string, WorkerSpoolPlace[]>();
          const result = await runBatchInOrder(files, run, { workers, progress: process.stderr, stop, fileTimeLimit, ...(progressInterval === null ? {} : { progressInterval }) }, (outcome) => {
            if (outcome.input !== undefined) inputs[outcome.index] = outcome.input;
            const digests = collector.add(outcome);
            reportUnappliedSpecs({ surveys: digests.map((digest) => digest.head) });
            for (const digest of digests) {
              if (digest.line !== undefined) {
                const key = pageKey(digest.head, () => uncoiled++);
                const list = pagePlaces.get(key);
                if (list === undefined) pagePlaces.set(key, [digest.line]);
                else list.push(digest.line);
              }
              if (digest.json !== undefined) jsonPlaces.push(digest.json);
            }
          });
          const runSettings = fitRunSettings({ fit: settings.fit, thresholds: settings.thresholds, spec: describeSpecFile(flags.spec ?? null), import: settings.import, extra: { skipLists: flags.skip !== false } });
          const summary = collector.report();
          // paths the search could not use (a folder that cannot be listed, a pipe, a broken link) join the files that failed
          const fleet = summary.fleet === undefined ? undefined : { ...summary.fleet, unreadable: [...unusable, ...summary.fleet.unreadable] };
          const extra = { run: cliRunRecord('batch', time, await withInputs(files, inputs), runSettings), ...(skipped.length > 0 ? { skipped } : {}) };
          const report: Report = { ...summary, ...(fleet ? { fleet } : {}), ...extra };
          const signal = result.interrupted ? stop.signal ?? 'SIGINT' : null;
          const coverage = { filesDone: result.filesDone, filesTotal: result.filesTotal, interrupted: result.interrupted, surveys: collector.surveyCount };
          if (flags.json === true) {
            // written survey by survey from the spools, each as the worker made its bytes with the
            // fleet's summaryModel filled in: the same bytes as one JSON.stringify of the whole
            // report, waiting for a slow pipe rather than buffering the report
            const stream = new JsonReportStream(process.stdout, (part: Report) => toJsonReport({ ...part, ...extra, ...(fleet ? { fleet } : {}) }), stdoutBackpressure);
            await writeSpooledSurveys(stream, jsonPlaces, spools, fleet ? { fleet } : {});
            await stream.finish({}, signal === null ? {} : { partial: { filesDone: result.filesDone, filesTotal: result.filesTotal, signal } });
          } else {
            process.stdout.write(`${renderFleetSummary(report, coverage)}\n${renderRunText(report.run!)}`);
          }
          if (flags.out !== undefined) {
            let pageUncoiled = 0;
            const written = await writeHtmlReports(flags.out, report, coverage, stop, (row) => (pagePlaces.get(row.coil === null ? `survey ${pageUncoiled++}` : `coil ${row.coil}`) ?? []).map((place) => spools.at<SurveyReport>(place)));
            process.stderr.write(`ringfall batch: wrote ${written.filter((path) => path.endsWith('.html')).length} HTML pages and one copy of Chart.js to ${flags.out} (open ${written[0]})\n`);
          }
          const stoppedBy = signal ?? stop.signal;
          if (stoppedBy !== null) context.setExitCode(stoppedStatus(stoppedBy));
          context.setExitCode(worseStatus(collector.checksStatus, batchStatus(report)));
        } finally {
          spools.close();
          rmSync(spoolFolder, { recursive: true, force: true });
        }
      } finally {
        stop.dispose();
        claim?.release();
      }
    });
}

/** The options of `fit` that `batch` shares, read and checked, plus the parsed spec file. */
async function readBatchSettings(flags: BatchFlags): Promise<BatchSettings> {
  const options = readFitFlags(flags);
  const refused = [options.html !== null ? '--html' : null, options.csv !== null ? '--csv' : null].filter((flag) => flag !== null);
  if (refused.length > 0) {
    throw new RingfallError('OPTION_VALUE', `${refused.join(', ')}: not an option of batch. Use --out DIR for one HTML report per coil, or --json.`, { value: refused, where: refused[0] ?? null });
  }
  return {
    fit: options.fit,
    import: options.import,
    specs: options.spec === null ? [] : await readSpecFile(options.spec),
    thresholds: options.thresholds,
    keepPoints: flags.out !== undefined,
  };
}

function readWorkers(text: string | undefined): number {
  if (text === undefined) return availableParallelism();
  const workers = Number(text);
  if (!Number.isInteger(workers) || workers < 1 || workers > 256) {
    throw new RingfallError('OPTION_VALUE', `--workers: "${text}" is not usable. Give a whole number from 1 to 256.`, { value: text, where: '--workers' });
  }
  return workers;
}

function readProgressEvery(text: string | undefined): number | null {
  return readSeconds(text, '--progress-every', 0.1, 3600, 10);
}

/** A number of seconds from an option, within [least, most], or null when not given. */
function readSeconds(text: string | undefined, option: string, least: number, most: number, example: number): number | null {
  if (text === undefined) return null;
  const seconds = Number(text);
  if (text.trim() === '' || !Number.isFinite(seconds) || seconds < least || seconds > most) {
    throw new RingfallError('OPTION_VALUE', `${option}: "${text}" is not usable. Give seconds from ${least} to ${most}, e.g. ${example}.`, { value: text, where: option });
  }
  return seconds;
}

/** Every file's run-record entry: the workers' (`inputs`, by file), and for a file a worker did not read (a stopped run, a file that could not be read) read here. */
async function withInputs(files: readonly string[], inputs: readonly (RunInput | undefined)[]): Promise<RunInput[]> {
  const missing = files.filter((_, i) => inputs[i] === undefined);
  const read = (await describeFiles(missing)).values();
  return files.map((_, i) => inputs[i] ?? read.next().value!);
}

/** The spool key of a survey's page: its coil, or a page of its own when it has no coil id (numbered in report order). */
function pageKey(survey: { readonly coil: string | null }, nextUncoiled: () => number): string {
  return survey.coil === null || survey.coil.trim() === '' ? `survey ${nextUncoiled()}` : `coil ${survey.coil}`;
}

/** 2 when a file or part could not be used (an input error), combined with the checks as `fit` counts them (checksStatus) (CONTRACT.md). */
export function batchStatus(report: Report): number {
  return worseStatus(checksStatus(report), (report.fleet?.unreadable.length ?? 0) > 0 ? exitStatus.input : exitStatus.passed);
}
