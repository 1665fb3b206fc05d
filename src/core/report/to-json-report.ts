import type { FitResult } from '../fit/fit-result';
import type { RejectedRow } from '../survey/survey';
import type { JsonFit, JsonParameter, JsonPoints, JsonRejectedRow, JsonReport, JsonSurvey } from './json-types';
import { reportSummaryFit } from './summary-fit';
import { getModel } from '../models';
import type { Report, SurveyReport } from './report';

/** Schema tag of the JSON report (CONTRACT.md). */
export const reportSchema = 'ringfall-report/1';

/**
 * Map a Report onto the CONTRACT.md JSON report: fixed field names, SI values with
 * their units. Non-finite numbers become null (JSON has no NaN). Extra fields beyond the
 * contract (notes, cautions, comparison, correlation) are additions the contract allows.
 * The shape: JsonReport (json-types.ts) and schema/report.schema.json.
 */
export function toJsonReport(report: Report): JsonReport {
  const json: JsonReport = {
    schema: reportSchema,
    // how the report was made comes first, so a reader of the file sees it before the numbers
    ...(report.run !== undefined ? { run: report.run } : {}),
    surveys: report.surveys.map((survey) => surveyToJson(survey, report)),
  };
  if (report.rejected !== undefined) {
    json['rejected'] = report.rejected.map((row) => ({ source: row.source, ...rowToJson(row) }));
  }
  if (report.skipped !== undefined && report.skipped.length > 0) json['skipped'] = report.skipped;
  if (report.fleet !== undefined) json['fleet'] = report.fleet;
  return json;
}

function surveyToJson(survey: SurveyReport, report: Report): JsonSurvey {
  return {
    source: survey.source,
    coil: survey.coil,
    date: survey.date,
    readingType: survey.readingType,
    ...(survey.units ? { units: { field: survey.units.field, distance: survey.units.distance } } : {}),
    readings: {
      total: survey.readings.total,
      used: survey.readings.used,
      rejected: survey.readings.rejected.map(rowToJson),
    },
    fits: survey.fits.map(fitToJson),
    best: survey.best,
    comparison: survey.comparison,
    summaryModel: summaryModelJson(report, survey),
    spec: survey.spec ?? null,
    verdict: survey.verdict,
    thresholds: survey.thresholds,
    warnings: survey.warnings,
    notes: survey.notes,
    cautions: survey.cautions,
    ...(survey.axis === undefined ? {} : { axis: survey.axis }),
    ...(survey.lateral === undefined ? {} : { lateral: survey.lateral }),
  };
}

function rowToJson(row: RejectedRow): JsonRejectedRow {
  return { line: row.line, column: row.column, value: row.value, code: row.code ?? null, reason: row.reason };
}

/** The model summaries use (reportSummaryFit): { model, basis: "spec" | "coil-history" | "best-physical" }, or null. */
export function summaryModelJson(report: Report, survey: SurveyReport): JsonSurvey['summaryModel'] {
  const summary = reportSummaryFit(report, survey, getModel);
  return summary === null ? null : { model: summary.fit.model, basis: summary.basis };
}

function fitToJson(fit: FitResult): JsonFit {
  const params: Record<string, JsonParameter> = {};
  // for…in over the plain record: its own keys in the same order as Object.entries, without the pairs.
  for (const name in fit.params) {
    const estimate = fit.params[name]!;
    params[name] = {
      value: finite(estimate.value),
      unit: estimate.unit,
      stderr: finite(estimate.stderr),
      ci95: estimate.ci95 ? [finite(estimate.ci95[0]), finite(estimate.ci95[1])] : null,
      fixed: estimate.fixed,
      determined: estimate.determined,
    };
  }
  return {
    model: fit.model,
    converged: fit.converged,
    stopReason: fit.stopReason,
    iterations: fit.iterations,
    params,
    stats: {
      n: fit.stats.n,
      k: fit.stats.k,
      rss: finite(fit.stats.rss),
      rmse: finite(fit.stats.rmse),
      chiSquare: finite(fit.stats.chiSquare),
      reducedChiSquare: finite(fit.stats.reducedChiSquare),
      aicc: finite(fit.stats.aicc),
      bic: finite(fit.stats.bic),
      akaikeWeight: finite(fit.stats.akaikeWeight),
    },
    uncertaintyScale: fit.uncertaintyScale,
    freeParameters: fit.freeParameters,
    correlation: fit.correlation ? fit.correlation.map(finite) : null,
    covariance: fit.covariance ? fit.covariance.map(finite) : null,
    points: pointsToJson(fit.points),
    ...(fit.moment
      ? { moment: { value: finite(fit.moment.value), unit: 'A·m²', stderr: finite(fit.moment.stderr), ci95: fit.moment.ci95 ? [finite(fit.moment.ci95[0]), finite(fit.moment.ci95[1])] : null } }
      : {}),
    warnings: fit.warnings,
  };
}

/**
 * Per-reading points as columns (one array per quantity, SI), so a saved report can be
 * opened again and drawn with its charts (fromJsonReport). `outlier` only when a robust
 * fit flagged readings.
 */
function pointsToJson(points: FitResult['points']): JsonPoints {
  // One pass filling the seven columns every fit has (not one callback per column and reading);
  // push keeps the arrays packed, as map made them.
  const line: number[] = [];
  const distance: (number | null)[] = [];
  const radial: (number | null)[] = [];
  const field: (number | null)[] = [];
  const predicted: (number | null)[] = [];
  const residual: (number | null)[] = [];
  const standardUncertainty: (number | null)[] = [];
  for (const p of points) {
    line.push(p.line);
    distance.push(finite(p.distance));
    radial.push(finite(p.radial));
    field.push(finite(p.field));
    predicted.push(finite(p.predicted));
    residual.push(finite(p.residual));
    standardUncertainty.push(finite(p.standardUncertainty));
  }
  const json: { -readonly [K in keyof JsonPoints]: JsonPoints[K] } = { line, distance, radial, field, predicted, residual, standardUncertainty };
  // The optional columns after these, in this order (the JSON's key order).
  if (points.length === 0) return json;
  const first = points[0]!;
  if ('outlier' in first) json.outlier = points.map((p) => p.outlier === true);
  // a 3-D map's positions and, for vector readings, the component each point holds
  if (first.position !== undefined) {
    const column = (read: (p: FitResult['points'][number]) => number | null) => points.map((p) => finite(read(p)));
    json.x = column((p) => p.position?.x ?? null);
    json.y = column((p) => p.position?.y ?? null);
    json.z = column((p) => p.position?.z ?? null);
  }
  if (first.component !== undefined) json.component = points.map((p) => p.component ?? 'z');
  return json;
}

function finite(value: number | null): number | null {
  return value === null || !Number.isFinite(value) ? null : value;
}
