import { readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { isRingfallError, RingfallError } from '../../core/errors';
import { fitSurvey, fitSurveyNotes } from '../../core/fit/fit-survey';
import { buildSurveyReport } from '../../core/report/build-survey-report';
import { renderTextReport } from '../../core/report/render-text';
import type { SurveyReport } from '../../core/report/report';
import { toJsonReport } from '../../core/report/to-json-report';
import { importSurveys } from '../../io';
import { addFitOptions, readFitFlags, type FitCommandOptions, type FitFlags } from '../fit-options';
import { findSurveyFiles } from '../find-survey-files';
import type { CommandContext } from '../main';

/**
 * `ringfall fit FILE... [options]` (CONTRACT.md): import every survey in the files (folders
 * are searched), fit each requested model, compare them and print the report — text for
 * people, or the JSON report with --json. A file that cannot be read or imported is named
 * on stderr in one line and the exit status becomes 2; the other files are still reported.
 */
export function registerFit(program: Command, context: CommandContext): void {
  addFitOptions(
    program
      .command('fit')
      .description('fit coil models to survey files and print the report')
      .argument('<files...>', 'survey CSV files, or folders to search for them'),
  ).action((files: string[], flags: FitFlags) => {
    const options = readFitFlags(flags);
    refuseUnwired(options);
    const { reports, problems } = fitFiles(findSurveyFiles(files), options);
    for (const problem of problems) process.stderr.write(`ringfall: ${problem}\n`);
    if (problems.length > 0) context.setExitCode(2);
    if (reports.length === 0) return;
    const report = { surveys: reports };
    process.stdout.write(options.json ? `${JSON.stringify(toJsonReport(report), null, 2)}\n` : renderTextReport(report));
  });
}

/**
 * Import and fit every survey of the given files: one SurveyReport per survey (surveys
 * with too few readings get a report with no fits and a warning saying why; rows that
 * belong to no survey are named in the first report's warnings), and one message per file
 * that could not be read or imported.
 */
export function fitFiles(paths: readonly string[], options: FitCommandOptions): { reports: SurveyReport[]; problems: string[] } {
  const reports: SurveyReport[] = [];
  const problems: string[] = [];
  for (const path of paths) {
    try {
      reports.push(...fitFile(path, options));
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      problems.push(error.message);
    }
  }
  return { reports, problems };
}

function fitFile(path: string, options: FitCommandOptions): SurveyReport[] {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (cause) {
    throw new RingfallError('INPUT_UNREADABLE', `Cannot read "${path}": ${(cause as Error).message}. Check the path and its permissions.`, { value: path, cause });
  }
  const imported = importSurveys(text, { source: path, ...options.import });
  const unassigned = imported.unassigned.map((row) => `Line ${row.line} belongs to no survey and was not used: ${row.reason}`);
  const reports = imported.surveys.map((survey) =>
    buildSurveyReport(survey, fitSurvey(survey, options.fit), { notes: [...imported.detection.notes, ...fitSurveyNotes(survey, options.fit)] }),
  );
  for (const skipped of imported.skipped) {
    reports.push(buildSurveyReport(skipped.survey, [], { warnings: [`Not fitted: ${skipped.reason}`], notes: imported.detection.notes }));
  }
  if (unassigned.length > 0 && reports[0] !== undefined) {
    reports[0] = { ...reports[0], warnings: [...unassigned, ...reports[0].warnings] };
  }
  return reports;
}

/** --spec, --threshold, --html and --csv are parsed but not yet acted on: say so rather than ignore them. */
function refuseUnwired(options: FitCommandOptions): void {
  const given = [
    options.spec !== null ? '--spec' : null,
    options.thresholds.length > 0 ? '--threshold' : null,
    options.html !== null ? '--html' : null,
    options.csv !== null ? '--csv' : null,
  ].filter((flag) => flag !== null);
  if (given.length > 0) {
    throw new RingfallError('OPTION_NOT_READY', `${given.join(', ')}: not available in this version of ringfall fit yet. Run without ${given.length === 1 ? 'it' : 'them'}.`, { value: given });
  }
}
