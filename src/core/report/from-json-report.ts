import { RingfallError } from '../errors';
import type { FitResult, ParameterEstimate } from '../fit/fit-result';
import type { Report, SurveyReport } from './report';
import type { SurveyUnits } from '../survey/survey';
import type { RunRecord } from './run-record';
import { reportSchema } from './to-json-report';

type Json = Record<string, unknown>;

/**
 * Read a saved JSON report (toJsonReport, CONTRACT.md) back into the Report it was made
 * from, so a view can show it again exactly: parameter names restored from their keys,
 * per-reading point columns back into points, and the nulls JSON wrote for non-finite
 * numbers back to NaN where a number is expected. Fields a later version added are kept.
 *
 * @param source the file name, for messages
 * @throws RingfallError `REPORT_NOT_RINGFALL` when the text is not a ringfall JSON report
 * @example fromJsonReport(JSON.parse(JSON.stringify(toJsonReport(report))), 'r.json').surveys.length // report.surveys.length
 */
export function fromJsonReport(json: unknown, source: string): Report {
  if (!isObject(json) || json['schema'] !== reportSchema || !Array.isArray(json['surveys'])) {
    const found = isObject(json) && typeof json['schema'] === 'string' ? `its schema is "${json['schema']}"` : 'it has no "schema": "ringfall-report/1"';
    throw new RingfallError('REPORT_NOT_RINGFALL', `${source}: not a saved ringfall report (${found}). Open a JSON report saved by ringfall, or a survey CSV file.`, { value: source });
  }
  const surveys = (json['surveys'] as unknown[]).filter(isObject).map(surveyFromJson);
  return {
    surveys,
    ...(isObject(json['fleet']) ? { fleet: json['fleet'] as unknown as NonNullable<Report['fleet']> } : {}),
    ...(isObject(json['run']) ? { run: json['run'] as unknown as RunRecord } : {}),
  };
}

function surveyFromJson(survey: Json): SurveyReport {
  const readings = isObject(survey['readings']) ? survey['readings'] : {};
  // units are taken only when well formed; the rest of the survey as saved
  const saved: Json = { ...survey };
  delete saved['units'];
  const units = unitsFromJson(survey['units']);
  return {
    ...(saved as unknown as SurveyReport),
    ...(units ? { units } : {}),
    readings: { total: Number(readings['total'] ?? 0), used: Number(readings['used'] ?? 0), rejected: list(readings['rejected']) as unknown as SurveyReport['readings']['rejected'] },
    fits: list(survey['fits']).filter(isObject).map(fitFromJson),
    best: (survey['best'] ?? null) as SurveyReport['best'],
    comparison: list(survey['comparison']) as string[],
    verdict: (survey['verdict'] ?? null) as SurveyReport['verdict'],
    thresholds: list(survey['thresholds']) as unknown as SurveyReport['thresholds'],
    warnings: list(survey['warnings']) as string[],
    cautions: list(survey['cautions']) as string[],
    notes: list(survey['notes']) as string[],
  };
}

/** The survey's units when the report states both as text (a report saved before they were recorded has none). */
function unitsFromJson(units: unknown): SurveyUnits | null {
  if (!isObject(units) || typeof units['field'] !== 'string' || typeof units['distance'] !== 'string') return null;
  return { field: units['field'], distance: units['distance'] };
}

function fitFromJson(fit: Json): FitResult {
  const params: Record<string, ParameterEstimate> = {};
  for (const [name, raw] of Object.entries(isObject(fit['params']) ? fit['params'] : {})) {
    if (!isObject(raw)) continue;
    params[name] = {
      name,
      unit: raw['unit'] as ParameterEstimate['unit'],
      value: number(raw['value']),
      stderr: raw['stderr'] === null || raw['stderr'] === undefined ? null : number(raw['stderr']),
      ci95: interval(raw['ci95']),
      fixed: raw['fixed'] === true,
      determined: raw['determined'] !== false,
    };
  }
  const stats = isObject(fit['stats']) ? fit['stats'] : {};
  const moment = isObject(fit['moment']) ? fit['moment'] : null;
  return {
    ...(fit as unknown as FitResult),
    params,
    freeParameters: list(fit['freeParameters']) as string[],
    covariance: Array.isArray(fit['covariance']) ? (fit['covariance'] as unknown[]).map(number) : null,
    correlation: Array.isArray(fit['correlation']) ? (fit['correlation'] as unknown[]).map(number) : null,
    stats: {
      n: number(stats['n']), k: number(stats['k']), rss: number(stats['rss']), rmse: number(stats['rmse']), chiSquare: number(stats['chiSquare']),
      reducedChiSquare: stats['reducedChiSquare'] === null || stats['reducedChiSquare'] === undefined ? null : number(stats['reducedChiSquare']),
      aicc: number(stats['aicc']), bic: number(stats['bic']),
      akaikeWeight: stats['akaikeWeight'] === null || stats['akaikeWeight'] === undefined ? null : number(stats['akaikeWeight']),
    },
    points: pointsFromJson(fit['points']),
    ...(moment ? { moment: { value: number(moment['value']), stderr: moment['stderr'] === null ? null : number(moment['stderr']), ci95: interval(moment['ci95']) } } : {}),
    warnings: list(fit['warnings']) as string[],
  };
}

function pointsFromJson(columns: unknown): FitResult['points'] {
  if (!isObject(columns) || !Array.isArray(columns['line'])) return [];
  const column = (name: string) => (Array.isArray(columns[name]) ? (columns[name] as unknown[]) : []);
  const [line, distance, radial, field, predicted, residual, sigma] = ['line', 'distance', 'radial', 'field', 'predicted', 'residual', 'standardUncertainty'].map(column) as unknown[][];
  const outlier = Array.isArray(columns['outlier']) ? (columns['outlier'] as unknown[]) : null;
  const [x, y, z] = ['x', 'y', 'z'].map((name) => (Array.isArray(columns[name]) ? (columns[name] as unknown[]) : null));
  const component = Array.isArray(columns['component']) ? (columns['component'] as unknown[]) : null;
  return line!.map((_, i) => {
    const point = {
      line: number(line![i]), distance: number(distance![i]), radial: number(radial![i]), field: number(field![i]),
      predicted: number(predicted![i]), residual: number(residual![i]), standardUncertainty: sigma![i] === null || sigma![i] === undefined ? null : number(sigma![i]),
    };
    const withOutlier = outlier ? { ...point, outlier: outlier[i] === true } : point;
    const placed = x && y && z ? { ...withOutlier, position: { x: number(x[i]), y: number(y[i]), z: number(z[i]) } } : withOutlier;
    const read = component?.[i];
    return read === 'x' || read === 'y' || read === 'z' ? { ...placed, component: read } : placed;
  });
}

function interval(value: unknown): readonly [number, number] | null {
  return Array.isArray(value) && value.length === 2 ? [number(value[0]), number(value[1])] : null;
}

/** A number from JSON; null (JSON's spelling of a non-finite number) and anything else not a number become NaN. */
function number(value: unknown): number {
  return typeof value === 'number' ? value : Number.NaN;
}

function list(value: unknown): unknown[] {
  return Array.isArray(value) ? value : [];
}

function isObject(value: unknown): value is Json {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
