import type { FitResult } from '../../core/fit/fit-result';
import type { Report, SurveyReport } from '../../core/report/report';
import { summaryModelJson, toJsonReport } from '../../core/report/to-json-report';
import { readSpoolLine, spoolLine } from './survey-spool';

/**
 * A survey's part of the JSON report, made where the survey was fitted (a batch worker) so
 * the main thread of a large batch neither rebuilds nor re-stringifies it: the text of
 * `JSON.stringify(survey, null, 2)` for the survey as toJsonReport maps it, with a gap
 * where `summaryModel` goes — the one field that needs the fleet (the coil history's
 * model), filled in by surveyJsonText once the fleet section is made. The record is one
 * spool line with what summaryModel reads of the survey (coil, spec, and each fit's model,
 * convergence and AICc: summaryFit and best-fit.ts read nothing else), then the text
 * before the gap, a NUL (JSON text never holds one: JSON.stringify writes it as \u0000),
 * and the text after it.
 */
export function surveyJsonRecord(survey: SurveyReport): string {
  const json = toJsonReport({ surveys: [survey] }).surveys[0] as unknown as Record<string, unknown>;
  const keys = Object.keys(json);
  const at = keys.indexOf('summaryModel');
  const key: SummaryKey = { coil: survey.coil, spec: survey.spec, fits: survey.fits.map((fit) => ({ model: fit.model, converged: fit.converged, stats: { aicc: fit.stats.aicc } })) };
  if (at < 0) return `${spoolLine(null)}${JSON.stringify(json, null, 2)}`;
  const part = (names: readonly string[]) => JSON.stringify(Object.fromEntries(names.map((name) => [name, json[name]])), null, 2);
  // "{\n  …\n}" of the keys before and after summaryModel, joined around it as one object's text
  const head = part(keys.slice(0, at));
  const tail = part(keys.slice(at + 1));
  const before = `${head === '{}' ? '{' : `${head.slice(0, -2)},`}\n  "summaryModel": `;
  const after = tail === '{}' ? '\n}' : `,\n${tail.slice(2)}`;
  return `${spoolLine(key)}${before}\u0000${after}`;
}

/**
 * The survey's text from its record (surveyJsonRecord), with summaryModel as toJsonReport
 * gives it in `report` (its fleet section names each coil's history model): the bytes
 * JsonReportStream.survey would write for the whole survey.
 */
export function surveyJsonText(record: string, report: Pick<Report, 'fleet'>): string {
  const newline = record.indexOf('\n');
  const gap = record.indexOf('\u0000', newline + 1);
  if (gap < 0) return record.slice(newline + 1);
  const key = readSpoolLine<SummaryKey>(record.slice(0, newline + 1));
  const summary = summaryModelJson({ surveys: [], ...report }, key as unknown as SurveyReport);
  return `${record.slice(newline + 1, gap)}${JSON.stringify(summary, null, 2).replace(/\n/g, '\n  ')}${record.slice(gap + 1)}`;
}

/** What summaryModel reads of a survey. */
interface SummaryKey {
  readonly coil: SurveyReport['coil'];
  readonly spec: SurveyReport['spec'];
  readonly fits: readonly (Pick<FitResult, 'model' | 'converged'> & { readonly stats: Pick<FitResult['stats'], 'aicc'> })[];
}
