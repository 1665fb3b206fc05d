import type { FitResult, ParameterEstimate } from '../fit/fit-result';
import { parameterQuantityKind } from '../models/parse-parameter-assignment';
import { printable } from '../text/printable';
import { formatNumber, surveyUnits, type DisplayUnit, type SurveyUnitChoice } from '../units';
import { describeRun } from './describe-run';
import type { Report, SpecUse, SurveyReport, ThresholdResult, Verdict } from './report';
import type { RunRecord } from './run-record';

/** Threshold distances of a survey whose units are not known are shown in mm. */
const millimetres: DisplayUnit = { symbol: 'mm', factor: 1e-3 };

/** How many set-aside rows the text report lists before pointing to --json. */
const rejectedListed = 20;

/**
 * Render a Report as plain text for an 80-column terminal: per survey its provenance,
 * the best model's parameters with 95 % intervals, the model comparison, verdict,
 * threshold distances, warnings and cautions. Fields and lengths are shown in the units
 * the survey's file was written in (surveyUnits), else in units chosen from the values.
 */
export function renderTextReport(report: Report): string {
  const surveys = report.surveys.map(renderSurvey).join('\n' + '═'.repeat(78) + '\n\n');
  return report.run === undefined ? surveys : `${surveys}\n${renderRunText(report.run)}`;
}

/**
 * The run record as a text block (heading, then one wrapped "label: text" line per fact,
 * ending in a newline): what every text report ends with (CONTRACT.md `run`).
 */
export function renderRunText(run: RunRecord): string {
  const lines = ['Run record'];
  for (const line of describeRun(run)) lines.push(...wrap(`${line.label}: ${line.text}`, 2, 4));
  return `${lines.join('\n')}\n`;
}

function renderSurvey(survey: SurveyReport): string {
  const lines: string[] = [];
  const units = surveyUnits(survey);
  // file names, coil ids, notes and reasons come from files and arguments: shown escaped (printable), one line each
  lines.push(`Survey ${printable(survey.source)}`);
  const facts = [
    `coil ${survey.coil === null ? '(not stated)' : printable(survey.coil, 60)}`,
    `date ${survey.date ?? '(not stated)'}`,
    `${survey.readingType ?? 'detector type not stated'}`,
    `${survey.readings.used} of ${survey.readings.total} rows used`,
  ];
  lines.push('  ' + facts.join(' · '));
  for (const note of survey.notes) lines.push(...wrap(`note: ${note}`, 2, 4));
  const rejected = survey.readings.rejected;
  if (rejected.length > 0) {
    lines.push(`  rows set aside (${rejected.length}):`);
    for (const row of rejected.slice(0, rejectedListed)) lines.push(...wrap(`line ${row.line}: ${row.reason}`, 4, 6));
    if (rejected.length > rejectedListed) {
      lines.push(`    … ${rejected.length - rejectedListed} more; --json lists every one.`);
    }
  }
  lines.push('');

  const best = survey.fits.find((fit) => fit.model === survey.best) ?? null;
  if (best) {
    const weight = best.stats.akaikeWeight;
    lines.push(`Coil as measured — ${best.model}` + (weight === null ? '' : ` (Akaike weight ${formatNumber(weight, 3)})`));
    lines.push(...parameterTable(best, units));
    if (best.uncertaintyScale === 'estimated') {
      lines.push('  Intervals use the scatter of the readings (no instrument uncertainty given).');
    }
    lines.push('');
  } else {
    lines.push(survey.fits.some((fit) => fit.converged) ? 'No model can be ranked (too few readings); see the warnings below.' : 'No model converged; see the warnings below.', '');
  }

  if (survey.fits.length > 0) {
    lines.push('Models side by side (same readings; lower AICc is better)');
    lines.push(...comparisonTable(survey.fits, survey.best, units));
    for (const sentence of survey.comparison) lines.push(...wrap(sentence, 2));
    lines.push('');
  }

  if (survey.spec?.applied === false) lines.push(...wrap(`Spec check: NOT MADE — ${survey.spec.reason ?? ''}`, 0, 2), '');
  if (survey.verdict) lines.push(...verdictLines(survey.verdict, survey.spec ?? null), '');
  if (survey.thresholds.length > 0) lines.push(...thresholdLines(survey.thresholds, units), '');

  // The survey's and the best model's warnings in full; the other models' are counted
  // here and listed in full in --json and the HTML report (a terminal report stays readable).
  const bestFit = survey.fits.find((f) => f.model === survey.best);
  const warnings = [...survey.warnings, ...(bestFit?.warnings ?? []).map((w) => `${bestFit!.model}: ${w}`)];
  const others = survey.fits.filter((f) => f !== bestFit && f.warnings.length > 0);
  if (others.length > 0) {
    warnings.push(`Other models: ${others.map((f) => `${f.model} ${f.warnings.length}`).join(', ')} warning(s); --json or --html lists them.`);
  }
  if (warnings.length > 0) {
    lines.push('Warnings');
    for (const warning of warnings) lines.push(...wrap(`- ${warning}`, 2, 4));
    lines.push('');
  }
  if (survey.cautions.length > 0) {
    lines.push('Cautions');
    for (const caution of survey.cautions) lines.push(...wrap(`- ${caution}`, 2, 4));
    lines.push('');
  }
  return lines.join('\n');
}

/**
 * Value and interval formatted in one display unit: the survey's for fields and lengths
 * (surveyUnits), else one chosen from the largest of the value and its interval's ends.
 */
export function formatEstimate(estimate: ParameterEstimate, units: SurveyUnitChoice = surveyUnits(null)): { value: string; interval: string } {
  const kind = parameterQuantityKind(estimate.unit);
  const reference = Math.max(Math.abs(estimate.value), Math.abs(estimate.ci95?.[0] ?? 0), Math.abs(estimate.ci95?.[1] ?? 0));
  // angles (a 3-D map's tilt and azimuth, SI radians) are shown in degrees
  const unit = kind ? units.unit(kind, reference === 0 ? estimate.value : reference)
    : estimate.unit === 'rad' ? { symbol: '°', factor: Math.PI / 180 } : { symbol: estimate.unit === '1' ? '' : estimate.unit, factor: 1 };
  const show = (x: number) => `${formatNumber(x / unit.factor, 4)}${unit.symbol === '°' ? '°' : unit.symbol ? ' ' + unit.symbol : ''}`;
  let interval: string;
  if (estimate.fixed) interval = 'fixed';
  else if (!estimate.determined) interval = 'not determined by these readings';
  else if (estimate.ci95) interval = `${formatNumber(estimate.ci95[0] / unit.factor, 4)} to ${show(estimate.ci95[1])}`;
  else interval = 'no interval';
  return { value: show(estimate.value), interval };
}

function parameterTable(fit: FitResult, units: SurveyUnitChoice): string[] {
  const rows = Object.values(fit.params).map((estimate) => {
    const { value, interval } = formatEstimate(estimate, units);
    return [estimate.name, value, interval];
  });
  // The far-field moment is what every physical fit determines, even when its parts are not (DOMAIN.md §7.6).
  if (fit.moment && !('moment' in fit.params)) {
    const { value, interval } = formatEstimate({
      name: 'moment', unit: 'A·m²', value: fit.moment.value, stderr: fit.moment.stderr, ci95: fit.moment.ci95, fixed: false, determined: true,
    });
    rows.push(['far-field moment', value, interval]);
  }
  return table(['parameter', 'value', '95% interval'], rows);
}

/** An Akaike weight to 3 significant digits; below 0.001 as "<0.001" (no false precision). */
function formatWeight(weight: number | null): string {
  if (weight === null) return '—';
  return weight > 0 && weight < 0.001 ? '<0.001' : formatNumber(weight, 3);
}

function comparisonTable(fits: readonly FitResult[], best: string | null, units: SurveyUnitChoice): string[] {
  const finiteAicc = fits.filter((f) => f.converged && Number.isFinite(f.stats.aicc)).map((f) => f.stats.aicc);
  const minimum = finiteAicc.length > 0 ? Math.min(...finiteAicc) : NaN;
  const rows = fits.map((fit) => [
    (fit.model === best ? '* ' : '  ') + fit.model,
    String(fit.stats.k),
    units.format(fit.stats.rmse, 'field', { significant: 3 }),
    fit.stats.reducedChiSquare === null ? '—' : formatNumber(fit.stats.reducedChiSquare, 3),
    !fit.converged ? 'did not converge' : Number.isFinite(fit.stats.aicc) ? formatNumber(fit.stats.aicc - minimum, 3) : 'too few readings',
    formatWeight(fit.stats.akaikeWeight),
  ]);
  return table(['model', 'k', 'RMS residual', 'red. χ²', 'ΔAICc', 'weight'], rows);
}

function verdictLines(verdict: Verdict, spec: SpecUse | null): string[] {
  const lines = [`Spec check: ${verdict.status.toUpperCase()}` + (verdict.findings.length ? ` — ${verdict.findings.join(', ')}` : '')];
  const which = [spec?.applied ? `spec ${spec.source}` : '', verdict.model ? `${verdict.model} model` : ''].filter((part) => part !== '').join(', ');
  if (which !== '') lines.push(...wrap(`checked against ${which}`, 2, 4));
  if (verdict.rule) lines.push(...wrap(`rule: ${verdict.rule}`, 2, 4));
  for (const check of verdict.checks) lines.push(...wrap(`[${check.status}] ${check.what}: ${check.evidence}`, 2, 4));
  for (const sentence of verdict.explanations) lines.push(...wrap(sentence, 2));
  return lines;
}

function thresholdLines(thresholds: readonly ThresholdResult[], units: SurveyUnitChoice): string[] {
  const length = units.unit('length', 1, millimetres);
  const show = (value: number) => formatNumber(value / length.factor, 3);
  const rows = thresholds.map((t) => {
    const level = units.format(t.level.value, 'field', { significant: 3 }) + (t.level.label ? ` (${t.level.label})` : '');
    const distance = t.distance ? `${show(t.distance.value)} ${length.symbol}` : '—';
    const interval = t.distance?.ci95 ? `${show(t.distance.ci95[0])} to ${show(t.distance.ci95[1])} ${length.symbol}` : '—';
    const naive = t.naive?.distance ? `${show(t.naive.distance.value)} ${length.symbol} (${t.naive.model})` : '—';
    return [level, `${distance}${t.extrapolated ? ' (extrapolated)' : ''}`, interval, naive];
  });
  const lines = ['Where the field falls below a level (on axis, from the distance datum)'];
  lines.push(...table(['level', 'distance', '95% interval', 'naive power law'], rows));
  for (const t of thresholds) for (const note of t.notes) lines.push(...wrap(`- ${note}`, 2, 4));
  return lines;
}

/** A left-aligned text table with two-space indent and a rule under the header. */
export function table(header: readonly string[], rows: readonly (readonly string[])[]): string[] {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: readonly string[]) => '  ' + cells.map((c, i) => c.padEnd(widths[i] ?? 0)).join('  ').trimEnd();
  return [line(header), '  ' + widths.map((w) => '─'.repeat(w)).join('  '), ...rows.map(line)];
}

/** Word-wrap to 78 columns with a first-line indent and a hanging indent. */
export function wrap(text: string, indent: number, hanging = indent, width = 78): string[] {
  const words = printable(text).split(/\s+/).filter((w) => w !== '');
  const lines: string[] = [];
  let current = ' '.repeat(indent);
  let empty = true;
  for (const word of words) {
    if (!empty && current.length + 1 + word.length > width) {
      lines.push(current);
      current = ' '.repeat(hanging) + word;
    } else {
      current += (empty ? '' : ' ') + word;
    }
    empty = false;
  }
  if (!empty) lines.push(current);
  return lines;
}
