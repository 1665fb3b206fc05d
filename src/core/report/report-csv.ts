import { describeRun } from './describe-run';
import type { Report } from './report';

/**
 * A text cell made safe for spreadsheets: a cell starting with = + - @ (or tab / CR)
 * gets a leading apostrophe so it is not run as a formula (OWASP, "CSV Injection").
 * Numbers we write ourselves are not text cells and stay numbers.
 * @example neutraliseCell('=HYPERLINK("x")') // "'=HYPERLINK(\"x\")"
 */
export function neutraliseCell(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** RFC 4180 quoting of a text cell, after neutralising it. */
function textCell(text: string | null): string {
  if (text === null) return '';
  const safe = neutraliseCell(text);
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

function numberCell(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '' : String(value);
}

/**
 * Per-reading CSV of a report: for every survey and every fitted model, each reading's
 * position, value, the model's prediction, the residual and the uncertainty used. SI
 * units, stated in the header names. When the report carries its run record, the file
 * opens with it as `# label: text` lines above the header (the form ringfall's own survey
 * files use for metadata; read with a comment character of "#"). When a survey is a 3-D
 * map, four columns follow: the reading's x_m, y_m, z_m and, for vector readings, the
 * component of the map's frame its `field_T` is (empty for other surveys).
 */
export function reportCsv(report: Report): string {
  const map = report.surveys.some((survey) => survey.axis === 'map');
  const header = ['source', 'coil', 'date', 'reading_type', 'model', 'best', 'line', 'distance_m', 'radial_m', 'field_T', 'predicted_T', 'residual_T', 'standard_uncertainty_T', 'outlier',
    ...(map ? ['x_m', 'y_m', 'z_m', 'component'] : [])];
  const lines = report.run === undefined ? [] : describeRun(report.run).map((line) => `# ${line.label}: ${line.text.replace(/[\r\n]+/g, ' ')}`);
  lines.push(header.join(','));
  for (const survey of report.surveys) {
    for (const fit of survey.fits) {
      for (const p of fit.points) {
        lines.push([
          textCell(survey.source), textCell(survey.coil), textCell(survey.date), textCell(survey.readingType), fit.model,
          fit.model === survey.best ? 'yes' : 'no', String(p.line), numberCell(p.distance), numberCell(p.radial), numberCell(p.field),
          numberCell(p.predicted), numberCell(p.residual), numberCell(p.standardUncertainty), p.outlier ? 'yes' : 'no',
          ...(map ? [numberCell(p.position?.x), numberCell(p.position?.y), numberCell(p.position?.z), p.component ?? ''] : []),
        ].join(','));
      }
    }
  }
  return lines.join('\r\n') + '\r\n';
}
