import type { ChartDataset } from 'chart.js';
import { extent } from 'd3-array';
import type { ParameterEstimate } from '../core/fit/fit-result';
import { formatEstimate } from '../core/report/render-text';
import type { FleetCoil, FleetSummary, Report, SurveyReport } from '../core/report/report';
import { formatNumber, formatQuantity } from '../core/units';
import { julianEpoch } from '../core/units/julian-year';
import { baseOptions, type ChartSpec, type LegendItem } from './chart-spec';
import { chartFigure } from './figure';
import { html, type SafeHtml } from './html';
import { niceTicks } from './nice-ticks';
import { palette, withAlpha } from './palette';
import { reportSummaryFit, summaryBasisWords } from '../core/report/summary-fit';
import { getModel } from '../core/models';
import { historyHeadline } from '../core/analysis/fleet/trend-reading';

/** Colours for coils in the history chart, cycled; our own. */
const seriesColours = ['#b23a48', '#2e6f95', '#3b8a5a', '#8c6d1f', '#7b4f9e', '#1f8a8a', '#a05a8c', '#707c3a'];

/**
 * The ampere-turns estimate of a survey from the model summaries use (reportSummaryFit:
 * the spec's, else the coil history's, else the best physical model by AICc), with that
 * model's name and why it was chosen; null when that model has no ampere-turns.
 */
export function ampereTurnsOf(report: Report, survey: SurveyReport): { model: string; basis: string; estimate: ParameterEstimate } | null {
  const summary = reportSummaryFit(report, survey, getModel);
  const estimate = summary?.fit.params['ampereTurns'];
  return summary && estimate ? { model: summary.fit.model, basis: summaryBasisWords[summary.basis], estimate } : null;
}

const amperes = (value: number) => formatQuantity(value, 'current', { significant: 4 });

/**
 * Fleet overview for a report with several surveys: the coils (surveys, latest date,
 * ampere-turn trend per year with interval, reference, flags and the sentences behind
 * them) when the report has a fleet section; every survey with the model its summary
 * uses (the spec's, else the coil history's, else the best physical one; the same model
 * the coils table names) and why, its ampere-turns and verdict, linking to its section; and a history chart of ampere-turns
 * per coil over time. `surveyIds[i]` is survey i's element id, or empty when the
 * report shows that survey in this table only (its row then has no link).
 */
export function renderFleetSection(report: Report, surveyIds: readonly string[]): SafeHtml {
  const history = historyChart(report);
  return html`<section class="rf-fleet" aria-labelledby="rf-fleet-heading"><h2 id="rf-fleet-heading">Fleet: ${report.fleet ? `${report.fleet.coils.length} coils, ` : ''}${report.surveys.length} surveys</h2>
${report.fleet ? coilsBlock(report.fleet) : ''}
${history ? chartFigure('rf-fleet-history', 'History: ampere-turns of each coil over time', history) : html`<p class="rf-note">No history chart: no coil has two or more dated surveys with a fitted ampere-turns value.</p>`}
<h3>Surveys</h3>
<table class="rf-table rf-fleet-table"><thead><tr><th scope="col">coil</th><th scope="col">date</th><th scope="col">file</th><th scope="col">model</th><th scope="col">ampere-turns (95% interval)</th><th scope="col">verdict</th></tr></thead>
<tbody>${report.surveys.map((survey, i) => {
    const summary = reportSummaryFit(report, survey, getModel);
    const estimate = summary?.fit.params['ampereTurns'];
    const shown = estimate ? formatEstimate(estimate) : null;
    return html`<tr><th scope="row" class="rf-nowrap">${surveyIds[i] ? html`<a href="${`#${surveyIds[i]}`}" data-survey-index="${i}">${survey.coil ?? '(no id)'}</a>` : survey.coil ?? '(no id)'}</th><td class="rf-nowrap">${survey.date ?? '—'}</td><td>${survey.source}</td><td>${summary ? html`${summary.fit.model} <span class="rf-note">(${summaryBasisWords[summary.basis]})</span>` : 'no coil model converged'}</td><td class="rf-num">${shown ? `${shown.value} (${shown.interval})` : '—'}</td><td>${survey.verdict ? html`<span class="${`rf-status rf-status-${survey.verdict.status}`}">${survey.verdict.status}</span>` : '—'}</td></tr>`;
  })}</tbody></table>
</section>`;
}

function coilsBlock(fleet: FleetSummary): SafeHtml {
  const trend = (coil: FleetCoil) => {
    const perYear = coil.trend.ampereTurnsPerYear;
    // the word first (steady, declining, undetermined — and what would decide), then the numbers
    const words = historyHeadline({ ...coil, flags: [] }, (rate) => `${formatNumber(rate, 3)} A/yr`);
    return perYear ? `${words}: ${formatNumber(perYear.value, 3)} A/yr (${formatNumber(perYear.ci95[0], 3)} to ${formatNumber(perYear.ci95[1], 3)})` : words;
  };
  const reference = (coil: FleetCoil) => (coil.reference ? `${amperes(coil.reference.ampereTurns)} (${coil.reference.kind === 'spec' ? 'label' : 'first survey'})` : '—');
  return html`<table class="rf-table rf-coils-table"><thead><tr><th scope="col">coil</th><th scope="col">surveys</th><th scope="col">latest</th><th scope="col">model</th><th scope="col">compared with</th><th scope="col">ampere-turn trend</th><th scope="col">flags</th></tr></thead>
<tbody>${fleet.coils.map((coil) => html`<tr><th scope="row" class="rf-nowrap">${coil.coil}</th><td class="rf-num">${coil.surveys}</td><td class="rf-nowrap">${coil.latest ?? '—'}</td><td>${coil.model ?? '—'}</td><td class="rf-num">${reference(coil)}</td><td class="rf-num">${trend(coil)}</td><td>${coil.flags.length > 0 ? coil.flags.map((flag, i) => html`${i > 0 ? ', ' : ''}<strong class="rf-flag">${flag}</strong>`) : '—'}</td></tr>`)}</tbody></table>
${fleet.coils.some((coil) => coil.explanations.length > 0) ? html`<ul class="rf-fleet-notes">${fleet.coils.flatMap((coil) => coil.explanations.map((sentence) => html`<li><strong>${coil.coil}</strong>: ${sentence}</li>`))}</ul>` : ''}
${fleet.unreadable.length > 0 ? html`<p class="rf-note">Files not read: ${fleet.unreadable.map((u, i) => html`${i > 0 ? '; ' : ''}${u.source} (${u.reason})`)}</p>` : ''}
${(fleet.ungrouped ?? []).length > 0 ? html`<p class="rf-note">Not in any coil's history: ${(fleet.ungrouped ?? []).map((u, i) => html`${i > 0 ? '; ' : ''}${u.source} (${u.reason})`)}</p>` : ''}`;
}

interface HistoryPoint { readonly x: number; readonly value: number; readonly low: number | null; readonly high: number | null }

/** Ampere-turns per coil over time: from the fleet section when there is one, else from each survey's best fit. */
function historySeries(report: Report): [string, HistoryPoint[]][] {
  const byCoil = new Map<string, HistoryPoint[]>();
  const add = (coil: string, date: string | null, value: number, ci95: readonly [number, number] | null) => {
    // in Julian years, the year of the printed trend (A/yr)
    const x = julianEpoch(date);
    if (x === null || !Number.isFinite(value)) return;
    const list = byCoil.get(coil) ?? [];
    list.push({ x, value, low: ci95?.[0] ?? null, high: ci95?.[1] ?? null });
    byCoil.set(coil, list);
  };
  if (report.fleet) {
    for (const coil of report.fleet.coils) for (const entry of coil.history) if (entry.ampereTurns) add(coil.coil, entry.date, entry.ampereTurns.value, entry.ampereTurns.ci95);
  } else {
    for (const survey of report.surveys) {
      const at = ampereTurnsOf(report, survey);
      if (survey.coil !== null && at) add(survey.coil, survey.date, at.estimate.value, at.estimate.ci95);
    }
  }
  return [...byCoil.entries()].filter(([, points]) => points.length >= 2);
}

function historyChart(report: Report): ChartSpec | null {
  const series = historySeries(report);
  if (series.length === 0) return null;
  const datasets: ChartDataset<'scatter', { x: number; y: number | null }[]>[] = [];
  const legend: LegendItem[] = [];
  series.forEach(([coil, points], i) => {
    points.sort((a, b) => a.x - b.x);
    const colour = seriesColours[i % seriesColours.length]!;
    datasets.push({ label: coil, data: points.map((p) => ({ x: p.x, y: p.value })), showLine: true, borderColor: colour, backgroundColor: colour, pointRadius: 3.5 });
    datasets.push({ label: `${coil} 95% interval`, data: points.flatMap((p) => (p.low === null || p.high === null ? [] : [{ x: p.x, y: p.low }, { x: p.x, y: p.high }, { x: p.x, y: null }])), showLine: true, spanGaps: false, pointRadius: 0, borderColor: withAlpha(colour, 0.6), borderWidth: 1.5 });
    legend.push({ label: coil, colour, shape: 'line' });
  });
  // every series holds two points or more, so the extent is two numbers
  const [first, last] = extent(series.flatMap(([, points]) => points.map((p) => p.x))) as [number, number];
  const ticks = niceTicks(first - 0.05, last + 0.05, 6);
  const step = ticks.length > 1 ? ticks[1]! - ticks[0]! : 0.25;
  const options = baseOptions();
  options.scales = {
    x: { type: 'linear', min: Math.floor(first / step) * step, max: Math.ceil(last / step) * step, title: { display: true, text: 'survey date (decimal year)' }, ticks: { stepSize: step, format: { useGrouping: false, maximumFractionDigits: 2 } }, grid: { color: palette.grid } },
    y: { type: 'linear', title: { display: true, text: 'ampere-turns (A), bars: 95% interval' }, grid: { color: palette.grid } },
  } as NonNullable<typeof options.scales>;
  return {
    config: { type: 'scatter', data: { datasets }, options },
    width: 760,
    height: 320,
    description: `Ampere-turns of ${series.length} coil(s) against survey date.`,
    legend,
    notes: [],
  };
}
