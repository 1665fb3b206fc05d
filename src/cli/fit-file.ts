import { isRingfallError } from '../core/errors';
import { analyseSurvey, unfittedSurveyReport, type SurveyAnalysisSettings } from '../core/report/analyse-survey';
import type { SurveyReport } from '../core/report/report';
import type { RunInput } from '../core/report/run-record';
import { summarizeSetAsideRows, type SetAsideRow } from '../core/report/set-aside-rows';
import { toJsonReport } from '../core/report/to-json-report';
import { importSurveys, type ImportOptions } from '../io';
import { checksStatus } from './checks-status';
import { exitStatus, worseStatus } from './exit-codes';
import { reportSurveyText } from './json-report-stream';
import { readSurveyBytes } from './read-survey-bytes';
import { describeBytes, unreadableInput } from './run-record';

/**
 * One survey file as `ringfall fit` reports it (CONTRACT.md): the file's bytes hashed for
 * the run record (`inputs`), every survey imported and analysed (surveys with too few
 * readings get a report with no fits and a warning saying why), and every row that belongs
 * to no survey added to `rejected` (summed up one sentence per kind of problem in the
 * file's first report's warnings). Used on the main thread and in a worker (fitFileTexts).
 * @throws RingfallError when the file cannot be read or imported (its input is listed first)
 */
export function fitFile(path: string, importOptions: Omit<ImportOptions, 'source'>, settings: SurveyAnalysisSettings, rejected: SetAsideRow[], inputs: RunInput[]): SurveyReport[] {
  let text: string;
  try {
    const bytes = readSurveyBytes(path);
    inputs.push(describeBytes(path, bytes));
    text = bytes.toString('utf8');
  } catch (error) {
    inputs.push(unreadableInput(path, readProblemNote(error)));
    throw error;
  }
  return fitSurveyText(path, text, importOptions, settings, rejected);
}

/** The note of a file's `inputs` entry when it could not be read (readSurveyBytes threw `error`). */
export function readProblemNote(error: unknown): string {
  return `could not be read: ${isRingfallError(error) ? error.code : (error as Error).message}`;
}

/**
 * fitFile for a file already read: its text (`path` names it in the reports) imported,
 * every survey analysed, rows outside any survey added to `rejected`.
 * @throws RingfallError when the text cannot be imported
 */
export function fitSurveyText(path: string, text: string, importOptions: Omit<ImportOptions, 'source'>, settings: SurveyAnalysisSettings, rejected: SetAsideRow[]): SurveyReport[] {
  const imported = importSurveys(text, { source: path, ...importOptions });
  // each survey's notes already hold the file's (units read, columns ignored, …)
  const reports = imported.surveys.map((survey) => analyseSurvey(survey, settings));
  for (const skipped of imported.skipped) reports.push(unfittedSurveyReport(skipped.survey, skipped.reason));
  for (const row of imported.unassigned) rejected.push({ source: path, ...row });
  const unassigned = summarizeSetAsideRows(imported.unassigned);
  if (unassigned.length > 0 && reports[0] !== undefined) {
    reports[0] = { ...reports[0], warnings: [...unassigned, ...reports[0].warnings] };
  }
  return reports;
}

/** A file's part of `fit --json` made where it was fitted (a worker): text and small records only. */
export interface FitFileTexts {
  /** Each survey's JSON text at the report's indentation (reportSurveyText) of toJsonReport's mapping (no fleet section: nothing else is needed). */
  readonly json: readonly string[];
  /** checksStatus of the file's surveys. */
  readonly status: number;
  /** Surveys no given spec applies to, with what their stderr line reads. */
  readonly unapplied: readonly Pick<SurveyReport, 'source' | 'coil' | 'spec'>[];
  /** The message of the file's RingfallError when it could not be read or imported, else null. */
  readonly problem: string | null;
  readonly rejected: readonly SetAsideRow[];
  readonly inputs: readonly RunInput[];
}

/** fitFile's result as `fit --json` needs it (FitFileTexts); errors that are not RingfallErrors (bugs) are thrown. */
export function fitFileTexts(path: string, importOptions: Omit<ImportOptions, 'source'>, settings: SurveyAnalysisSettings): FitFileTexts {
  const rejected: SetAsideRow[] = [];
  const inputs: RunInput[] = [];
  try {
    return { ...surveyTexts(fitFile(path, importOptions, settings, rejected, inputs)), problem: null, rejected, inputs };
  } catch (error) {
    if (!isRingfallError(error)) throw error;
    return { json: [], status: exitStatus.passed, unapplied: [], problem: error.message, rejected, inputs };
  }
}

/** The JSON texts, checks status and unapplied specs of surveys (FitFileTexts). */
export function surveyTexts(reports: readonly SurveyReport[]): Pick<FitFileTexts, 'json' | 'status' | 'unapplied'> {
  let status: number = exitStatus.passed;
  const unapplied: Pick<SurveyReport, 'source' | 'coil' | 'spec'>[] = [];
  const json = reports.map((survey) => {
    status = worseStatus(status, checksStatus({ surveys: [survey] }));
    if (survey.spec?.applied === false) unapplied.push({ source: survey.source, coil: survey.coil, spec: survey.spec });
    return reportSurveyText(toJsonReport({ surveys: [survey] }).surveys[0]!);
  });
  return { json, status, unapplied };
}
