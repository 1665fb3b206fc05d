import { historyHeadline } from '../../core/analysis/fleet/trend-reading';
import { wrap } from '../../core/report/render-text';
import { valueWords, type ValueWords } from '../../core/analysis/describe-value';
import type { Report, ThresholdResult } from '../../core/report/report';
import { formatNumber, surveyUnits } from '../../core/units';
import { attentionList } from './attention-list';
import { coilFigures, fleetRows, type FleetRow } from './fleet-rows';

/** Evidence sentences printed per attention item (every unreadable file is always listed). */
const evidenceShown = 3;

/** Said wherever the summary shows a threshold distance (project brief: exposure output cautions). */
const exposureCaution = 'Threshold distances above are model estimates on the coil axis, not medical advice: local codes, the device maker\'s instructions and licensed practice come first (each coil\'s report lists the full cautions).';

/** How far a batch got, for the summary's first lines. */
export interface BatchCoverage {
  readonly filesDone: number;
  readonly filesTotal: number;
  /** True when the run was stopped (Ctrl-C) before every file was done. */
  readonly interrupted: boolean;
  /** Surveys fitted in all, when the report holds only each coil's latest (batch's summary report); else the report's count. */
  readonly surveys?: number;
}

/**
 * The fleet summary of `ringfall batch` as text for an 80-column terminal: a heading with
 * counts (and, for a stopped run, that it is partial), one entry per coil — latest
 * survey, the model the row reads the coil with and why (coilFigures), its amplitude and
 * geometry with 95 % intervals, the latest spec verdict, threshold distances when asked, the history flags
 * and ampere-turn trend — then what
 * needs attention first (attentionList), then every file or part that could not be used.
 */
export function renderFleetSummary(report: Report, coverage: BatchCoverage): string {
  const rows = fleetRows(report);
  const unreadable = report.fleet?.unreadable ?? [];
  const lines: string[] = [];
  if (coverage.interrupted) {
    lines.push(`PARTIAL SUMMARY: stopped after ${coverage.filesDone} of ${coverage.filesTotal} files; it covers those files only.`, '');
  }
  const coils = rows.filter((row) => row.coil !== null).length;
  lines.push(`Fleet summary: ${plural(coils, 'coil')}, ${plural(coverage.surveys ?? report.surveys.length, 'survey')} from ${plural(coverage.filesDone, 'file')}`);
  const extra = [
    rows.length > coils ? `${plural(rows.length - coils, 'survey')} without a coil id` : '',
    unreadable.length > 0 ? `${plural(unreadable.length, 'file or part', 'files or parts')} could not be used` : '',
  ].filter((text) => text !== '');
  if (extra.length > 0) lines.push(`  ${extra.join('; ')}`);
  // what a folder's skip list kept out of the fleet, one line per list
  for (const entry of report.skipped ?? []) {
    lines.push(...wrap(`${plural(entry.files.length, 'file')} left out: ${entry.list} lists ${entry.patterns.join(', ')} as not surveys (--no-skip fits them)`, 2, 4));
  }
  for (const row of rows) lines.push(...(row === rows[0] ? [''] : []), ...rowLines(row));
  if (rows.some((row) => row.latest.thresholds.length > 0)) lines.push('', ...wrap(exposureCaution, 0));

  const attention = attentionList(rows, unreadable);
  lines.push('', 'What needs attention first');
  if (attention.length === 0) lines.push('  Nothing: every survey was fitted, no spec failed and no history flag is set.');
  attention.forEach((item, i) => {
    lines.push(...wrap(`${i + 1}. ${item.subject}: ${item.reasons.join('; ')}`, 2, 5));
    const shown = item.kind === 'unreadable' ? item.evidence : item.evidence.slice(0, evidenceShown);
    for (const sentence of shown) lines.push(...wrap(`- ${sentence}`, 5, 7));
    if (shown.length < item.evidence.length) lines.push(...wrap(`- … ${item.evidence.length - shown.length} more in the report (--json, or --out DIR).`, 5, 7));
  });
  return lines.join('\n') + '\n';
}

function rowLines(row: FleetRow): string[] {
  const survey = row.latest;
  const heading = row.coil === null
    ? `(no coil id) ${survey.source}`
    : `${row.coil}: ${plural(row.surveys, 'survey')}, latest ${survey.date ?? 'undated'}`;
  const verdict = survey.verdict
    ? `spec ${survey.verdict.status}${survey.verdict.findings.length ? ` (${survey.verdict.findings.join(', ')})` : ''}`
    : 'no spec';
  const coil = coilFigures(row);
  const lines = wrap(`${heading} · ${verdict}`, 0, 4);
  if (coil) {
    lines.push(...wrap(`model ${coil.model}: ${coil.figures.join(' · ')}`, 4, 6));
  } else {
    lines.push('    no physical model converged on this survey');
  }
  const shown = valueWords(surveyUnits(survey));
  for (const threshold of survey.thresholds) lines.push(...wrap(thresholdText(threshold, shown), 4, 6));
  lines.push(...wrap(`history: ${historyText(row)}`, 4, 6));
  return lines;
}

/** "below 0.5 mT beyond 80.2 mm (76.8–83.7) on axis (loop)" in the survey's units, marked when extrapolated. */
function thresholdText(threshold: ThresholdResult, shown: ValueWords): string {
  const level = shown.value(threshold.level.value, 'field') + (threshold.level.label ? ` (${threshold.level.label})` : '');
  if (threshold.distance === null) return `below ${level}: not found on the fitted ${threshold.model} curve`;
  return `below ${level} beyond ${shown.value(threshold.distance.value, 'length', threshold.distance.ci95)} on axis (${threshold.model}${threshold.extrapolated ? ', extrapolated beyond the survey' : ''})`;
}

function historyText(row: FleetRow): string {
  if (row.history === null) return 'none (no coil id)';
  const show = (x: number) => formatNumber(x, 3);
  const headline = historyHeadline(row.history, (rate) => `${show(rate)} A/yr`);
  const trend = row.history.trend.ampereTurnsPerYear;
  return trend === null ? headline : `${headline}; ampere-turns ${show(trend.value)} A/yr (95 % ${show(trend.ci95[0])} to ${show(trend.ci95[1])})`;
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}
