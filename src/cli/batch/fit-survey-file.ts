import { readFileSync } from 'node:fs';
import { selectSpec } from '../../core/analysis/spec/select-spec';
import { verifySpec } from '../../core/analysis/spec/verify-spec';
import { thresholdCautions } from '../../core/analysis/thresholds/threshold-cautions';
import { thresholdDistances } from '../../core/analysis/thresholds/threshold-distances';
import { isRingfallError } from '../../core/errors';
import { fitSurvey, fitSurveyNotes } from '../../core/fit/fit-survey';
import { buildSurveyReport } from '../../core/report/build-survey-report';
import type { SurveyReport } from '../../core/report/report';
import type { Survey } from '../../core/survey/survey';
import { importSurveys } from '../../io';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome, FileTask, UnreadableEntry } from './batch-types';

/**
 * Read one survey file and report every survey in it: import (CONTRACT.md CSV forms),
 * then per survey the spec that applies (its model fitted too), fitSurvey, the spec
 * verdict, the threshold distances and the SurveyReport. Never throws for a problem in
 * the file: a file that cannot be read or imported, a coil/date group with too few
 * readings, or a survey the fit refuses is listed in `unreadable` with the reason, and
 * the other surveys go on. Rows that belong to no survey are named in the first report's
 * warnings. Errors that are not RingfallErrors (bugs) are thrown.
 */
export function fitSurveyFile(task: FileTask, settings: BatchSettings): FileOutcome {
  const source = task.path;
  const unreadable: UnreadableEntry[] = [];
  let imported;
  try {
    imported = importSurveys(readFileSync(source, 'utf8'), { source, ...settings.import });
  } catch (error) {
    const entry = isRingfallError(error) ? { source, reason: error.message, code: error.code } : readFailure(source, error);
    if (entry === null) throw error;
    return { index: task.index, source, reports: [], unreadable: [entry] };
  }
  const reports: SurveyReport[] = [];
  for (const survey of imported.surveys) {
    try {
      reports.push(reportSurvey(survey, imported.detection.notes, settings));
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
  return { index: task.index, source, reports, unreadable };
}

function reportSurvey(survey: Survey, importNotes: readonly string[], settings: BatchSettings): SurveyReport {
  const spec = selectSpec(settings.specs, survey.coil);
  const models = spec && !settings.fit.models.includes(spec.model) ? [...settings.fit.models, spec.model] : settings.fit.models;
  const options = { ...settings.fit, models };
  const fits = fitSurvey(survey, options);
  const thresholds = settings.thresholds.length > 0 ? thresholdDistances(fits, settings.thresholds, { readingType: survey.readingType }) : [];
  const report = buildSurveyReport(survey, fits, {
    verdict: spec ? verifySpec(spec, fits, survey.readingType) : null,
    thresholds,
    cautions: thresholds.length > 0 ? thresholdCautions : [],
    notes: [...importNotes, ...fitSurveyNotes(survey, options)],
  });
  return settings.keepPoints ? report : { ...report, fits: report.fits.map((fit) => ({ ...fit, points: [] })) };
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
