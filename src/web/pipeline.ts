import type { ProblemCode } from '../core/error-codes';
import { isRingfallError } from '../core/errors';
import type { Report, SurveyReport } from '../core/report/report';
import type { RejectedRow, Survey } from '../core/survey/survey';
import { detectSurveyLayout, importSurveys, type ColumnMapping, type Detection, type ImportCounts, type ImportResult } from '../io';
import { fitStage, fleetStage, parameterUnit, unfittedReport } from './fit-stage';
import { parseFitSettings, type FitSettings, type SettingError } from './fit-settings';

/** One file handed to the pipeline, with the user's hand-made column mapping if any. */
export interface PipelineFile {
  readonly id: string;
  readonly name: string;
  readonly text: string;
  readonly mapping?: readonly ColumnMapping[];
}

/** What became of one file: its detection, row counts and problems, or its error. */
export interface FileOutcome {
  readonly id: string;
  readonly name: string;
  /** The importer's file-level error (code and message), or null. */
  readonly error: { readonly code: ProblemCode; readonly message: string } | null;
  /** How the file was read (also after a column error, when the header could be read). */
  readonly detection: Detection | null;
  readonly counts: ImportCounts | null;
  /** Surveys found: coil, date and rows used. */
  readonly surveys: readonly { readonly coil: string | null; readonly date: string | null; readonly used: number; readonly rejected: number }[];
  /** Coil/date groups with too few usable rows, with the reason. */
  readonly skipped: readonly { readonly coil: string | null; readonly date: string | null; readonly reason: string }[];
  /** Every row not used (survey rows set aside, skipped groups, unassigned rows), first `rowsListed`. */
  readonly rowsNotUsed: readonly RejectedRow[];
  readonly rowsNotUsedTotal: number;
}

/** Everything a run gives the page: per-file outcomes, the Report, and setting mistakes. */
export interface PipelineOutcome {
  readonly files: readonly FileOutcome[];
  readonly report: Report;
  readonly settingErrors: readonly SettingError[];
}

/** Progress of a run: `done` of `total` steps of the named stage. */
export interface PipelineProgress {
  readonly stage: 'import' | 'fit';
  readonly done: number;
  readonly total: number;
  readonly label: string;
}

/** Rows not used listed per file in the page (all are counted). */
export const rowsListed = 500;

/**
 * Import every file (a bad file becomes an error on that file; the others go on), then
 * fit every survey with the settings and build the Report. Pure: no DOM; runs in the
 * Web Worker (and in Node for tests).
 */
export function runPipeline(files: readonly PipelineFile[], settings: FitSettings, progress: (p: PipelineProgress) => void = () => {}): PipelineOutcome {
  const { parsed, errors } = parseFitSettings(settings, (name) => parameterUnit(name, settings.models));
  const outcomes: FileOutcome[] = [];
  const surveys: { survey: Survey; skipped: string | null }[] = [];
  files.forEach((file, index) => {
    progress({ stage: 'import', done: index, total: files.length, label: `reading ${file.name}` });
    const options = { source: file.name, ...(file.mapping ? { mapping: file.mapping } : {}) };
    try {
      const result = importSurveys(file.text, options);
      for (const survey of result.surveys) surveys.push({ survey, skipped: null });
      for (const group of result.skipped) surveys.push({ survey: group.survey, skipped: group.reason });
      outcomes.push({ ...rowsOf(result), id: file.id, name: file.name, error: null, detection: result.detection, counts: result.counts });
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      // too few usable rows: the error carries the whole result, so every row not used is still listed
      const partial = error.code === 'IMPORT_TOO_FEW_ROWS' ? (error.value as ImportResult) : null;
      outcomes.push({
        ...(partial ? rowsOf(partial) : { surveys: [], skipped: [], rowsNotUsed: [], rowsNotUsedTotal: 0 }),
        id: file.id, name: file.name, error: { code: error.code, message: error.message },
        detection: partial?.detection ?? layoutOf(file.text, options), counts: partial?.counts ?? null,
      });
    }
  });
  const reports: SurveyReport[] = [];
  if (errors.length === 0) {
    surveys.forEach(({ survey, skipped }, index) => {
      progress({ stage: 'fit', done: index, total: surveys.length, label: `fitting ${survey.coil ?? survey.source}` });
      if (skipped !== null) {
        reports.push(unfittedReport(survey, skipped));
        return;
      }
      try {
        reports.push(fitStage(survey, parsed));
      } catch (error) {
        if (!isRingfallError(error)) throw error;
        // a setting this survey cannot be fitted with (e.g. a position uncertainty and no reading uncertainty)
        if (!errors.some((e) => e.message === error.message)) errors.push({ field: settingFieldOf(error.code), message: error.message });
        reports.push(unfittedReport(survey, error.message));
      }
    });
  }
  progress({ stage: 'fit', done: surveys.length, total: surveys.length, label: 'done' });
  const unreadable = outcomes.flatMap((o) => (o.error ? [{ source: o.name, reason: o.error.message }] : []));
  const report: Report = reports.length > 1 ? { surveys: reports, fleet: fleetStage(reports, parsed, unreadable) } : { surveys: reports };
  return { files: outcomes, report, settingErrors: errors };
}

/** A file's surveys, skipped groups and rows not used (survey rows set aside, skipped groups' rows, unassigned rows). */
function rowsOf(result: ImportResult): Pick<FileOutcome, 'surveys' | 'skipped' | 'rowsNotUsed' | 'rowsNotUsedTotal'> {
  const rows = [
    ...result.surveys.flatMap((s) => s.rejected),
    ...result.skipped.flatMap((s) => [...s.survey.rejected, ...s.survey.readings.map((r) => ({ line: r.line, column: null, value: null, reason: s.reason }))]),
    ...result.unassigned,
  ].sort((a, b) => a.line - b.line);
  return {
    surveys: result.surveys.map((s) => ({ coil: s.coil, date: s.date, used: s.readings.length, rejected: s.rejected.length })),
    skipped: result.skipped.map((s) => ({ coil: s.survey.coil, date: s.survey.date, reason: s.reason })),
    rowsNotUsed: rows.slice(0, rowsListed), rowsNotUsedTotal: rows.length,
  };
}

/** Which input a fit-time RingfallError belongs to. */
function settingFieldOf(code: ProblemCode): string {
  if (code.startsWith('FIT_POSITION')) return 'positionUncertainty';
  if (code === 'FIT_UNCERTAINTY_ZERO') return 'uncertainty';
  if (code === 'FIT_UNKNOWN_PARAMETER' || code === 'FIT_FIXED_OUT_OF_BOUNDS') return 'fixes';
  return 'models';
}

/** The detection of a file whose import failed, when its header can still be read. */
function layoutOf(text: string, options: Parameters<typeof detectSurveyLayout>[1]): Detection | null {
  try {
    return detectSurveyLayout(text.slice(0, 65_536), options).detection;
  } catch (error) {
    if (isRingfallError(error)) return null;
    throw error;
  }
}
