import { readSurveyBytes } from '../read-survey-bytes';
import { describeBytes } from '../run-record';
import type { RunInput } from '../../core/report/run-record';
import { digestSurvey } from './survey-digest';
import { threadSpool } from './worker-spool';
import { isRingfallError } from '../../core/errors';
import { analyseSurvey } from '../../core/report/analyse-survey';
import type { SurveyReport } from '../../core/report/report';
import type { Survey } from '../../core/survey/survey';
import { importSurveys } from '../../io';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome, FileTask, UnreadableEntry } from './batch-types';

/**
 * Read one survey file and report every survey in it: import (CONTRACT.md CSV forms),
 * then per survey the pipeline `ringfall fit` uses (analyseSurvey: spec, fits, verdict,
 * threshold distances, SurveyReport). Never throws for a problem in
 * the file: a file that cannot be read or imported, a coil/date group with too few
 * readings, or a survey the fit refuses is listed in `unreadable` with the reason, and
 * the other surveys go on. Rows that belong to no survey are named in the first report's
 * warnings. Errors that are not RingfallErrors (bugs) are thrown.
 */
export function fitSurveyFile(task: FileTask, settings: BatchSettings): FileOutcome {
  const source = task.path;
  const unreadable: UnreadableEntry[] = [];
  let imported;
  // batch's run record: the hash of the bytes read here, so the main thread need not read the file again
  let input: { input: RunInput } | Record<string, never> = {};
  try {
    const bytes = readSurveyBytes(source);
    if (settings.digest !== undefined) input = { input: describeBytes(source, bytes) };
    imported = importSurveys(bytes.toString('utf8'), { source, ...settings.import });
  } catch (error) {
    const entry = isRingfallError(error) ? { source, reason: error.message, code: error.code } : readFailure(source, error);
    if (entry === null) throw error;
    return { index: task.index, source, reports: [], unreadable: [entry], ...input };
  }
  const reports: SurveyReport[] = [];
  for (const survey of imported.surveys) {
    try {
      const report = analyseSurvey(survey, settings);
      reports.push(settings.keepPoints ? report : { ...report, fits: report.fits.map((fit) => ({ ...fit, points: [] })) });
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      unreadable.push({ source: `${source} (${groupLabel(survey)})`, reason: error.message, code: error.code });
    }
  }
  for (const skipped of imported.skipped) {
    unreadable.push({ source: `${source} (${groupLabel(skipped.survey)})`, reason: `Not fitted: ${skipped.reason}`, code: 'SURVEY_TOO_FEW_READINGS' });
  }
  const unassigned = imported.unassigned.map((row) => ({ text: `Line ${row.line} belongs to no survey and was not used: ${row.reason}`, code: row.code ?? 'ROW_UNASSIGNED' }));
  if (unassigned.length > 0 && reports[0] !== undefined) {
    reports[0] = { ...reports[0], warnings: [...unassigned.map((row) => row.text), ...reports[0].warnings] };
  } else {
    unreadable.push(...unassigned.map((row) => ({ source, reason: row.text, code: row.code })));
  }
  if (settings.digest !== undefined) {
    const specModels = new Set<string>(settings.specs.map((spec) => spec.model));
    const parts = settings.digest;
    const spool = threadSpool(parts.folder);
    return { index: task.index, source, reports: [], digests: reports.map((report) => digestSurvey(report, specModels, parts, spool)), unreadable, ...input };
  }
  return { index: task.index, source, reports, unreadable };
}

/** "coil QA-107, 2026-03-10" for a group inside a file. */
function groupLabel(survey: Survey): string {
  return [survey.coil === null ? 'no coil id' : `coil ${survey.coil}`, survey.date ?? 'undated'].join(', ');
}

/** The entry for a file the system could not read (gone, a folder, no permission), or null for any other error. */
function readFailure(source: string, error: unknown): UnreadableEntry | null {
  const code = (error as NodeJS.ErrnoException | null)?.code;
  if (typeof code !== 'string' || !/^E[A-Z]+$/.test(code)) return null;
  return { source, code: 'INPUT_UNREADABLE', reason: `Cannot read the file: ${code} (${(error as Error).message}). Check that it exists and can be read.` };
}
