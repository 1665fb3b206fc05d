import type { FitResult } from '../fit/fit-result';
import type { Report, SurveyReport } from './report';

/** Schema tag of the JSON report (CONTRACT.md). */
export const reportSchema = 'ringfall-report/1';

/**
 * Map a Report onto the CONTRACT.md JSON report: fixed field names, SI values with
 * their units. Non-finite numbers become null (JSON has no NaN). Extra fields beyond the
 * contract (notes, cautions, comparison, correlation) are additions the contract allows.
 */
export function toJsonReport(report: Report): Record<string, unknown> {
  const json: Record<string, unknown> = { schema: reportSchema };
  // how the report was made comes first, so a reader of the file sees it before the numbers
  if (report.run !== undefined) json['run'] = report.run;
  json['surveys'] = report.surveys.map(surveyToJson);
  if (report.fleet !== undefined) json['fleet'] = report.fleet;
  return json;
}

function surveyToJson(survey: SurveyReport): Record<string, unknown> {
  return {
    source: survey.source,
    coil: survey.coil,
    date: survey.date,
    readingType: survey.readingType,
    readings: {
      total: survey.readings.total,
      used: survey.readings.used,
      rejected: survey.readings.rejected.map((row) => ({
        line: row.line,
        column: row.column,
        value: row.value,
        reason: row.reason,
      })),
    },
    fits: survey.fits.map(fitToJson),
    best: survey.best,
    comparison: survey.comparison,
    verdict: survey.verdict,
    thresholds: survey.thresholds,
    warnings: survey.warnings,
    notes: survey.notes,
    cautions: survey.cautions,
  };
}

function fitToJson(fit: FitResult): Record<string, unknown> {
  const params: Record<string, unknown> = {};
  for (const [name, estimate] of Object.entries(fit.params)) {
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
function pointsToJson(points: FitResult['points']): Record<string, unknown> {
  const column = (read: (p: FitResult['points'][number]) => number | null) => points.map((p) => finite(read(p)));
  return {
    line: points.map((p) => p.line),
    distance: column((p) => p.distance),
    radial: column((p) => p.radial),
    field: column((p) => p.field),
    predicted: column((p) => p.predicted),
    residual: column((p) => p.residual),
    standardUncertainty: column((p) => p.standardUncertainty),
    ...(points.length > 0 && 'outlier' in points[0]! ? { outlier: points.map((p) => p.outlier === true) } : {}),
  };
}

function finite(value: number | null): number | null {
  return value === null || !Number.isFinite(value) ? null : value;
}
