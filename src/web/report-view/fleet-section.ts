import type { ChartDataset } from 'chart.js';
import type { ParameterEstimate } from '../../core/fit/fit-result';
import { formatEstimate } from '../../core/report/render-text';
import type { Report, SurveyReport } from '../../core/report/report';
import { baseOptions, type ChartSpec, type LegendItem } from './chart-spec';
import { chartFigure } from './figure';
import { html, type SafeHtml } from './html';
import { palette, withAlpha } from './palette';
import { rankedFits } from './survey-facts';

/** Colours for coils in the history chart, cycled; our own. */
const seriesColours = ['#b23a48', '#2e6f95', '#3b8a5a', '#8c6d1f', '#7b4f9e', '#1f8a8a', '#a05a8c', '#707c3a'];

/** The ampere-turns estimate of a survey: from the best-ranked converged model that has one. */
export function ampereTurnsOf(survey: SurveyReport): { model: string; estimate: ParameterEstimate } | null {
  for (const fit of rankedFits(survey)) {
    const estimate = fit.params['ampereTurns'];
    if (fit.converged && estimate) return { model: fit.model, estimate };
  }
  return null;
}

/** Flags per coil from the report's fleet section, when the analyses supplied one. */
function fleetFlags(report: Report): Map<string, string[]> {
  const flags = new Map<string, string[]>();
  const fleet = report.fleet as { coils?: unknown } | undefined;
  if (fleet && Array.isArray(fleet.coils)) {
    for (const entry of fleet.coils as { coil?: unknown; flags?: unknown }[]) {
      if (typeof entry.coil === 'string' && Array.isArray(entry.flags)) flags.set(entry.coil, entry.flags.filter((f): f is string => typeof f === 'string'));
    }
  }
  return flags;
}

/** Decimal year of an ISO date (2026-07-02 → 2026.5), or null. */
export function decimalYear(date: string | null): number | null {
  const match = date ? /^(\d{4})-(\d{2})-(\d{2})/.exec(date) : null;
  if (!match) return null;
  const year = Number(match[1]);
  const start = Date.UTC(year, 0, 1);
  const length = Date.UTC(year + 1, 0, 1) - start;
  const day = Date.UTC(year, Number(match[2]) - 1, Number(match[3]));
  return Number.isFinite(day) ? year + (day - start + 43_200_000) / length : null;
}

/**
 * Fleet overview for a report with several surveys: one row per survey (coil, date,
 * best model, ampere-turns with interval, verdict, flags) linking to its section, and a
 * history chart of ampere-turns per coil over time. `surveyIds[i]` is survey i's anchor.
 */
export function renderFleetSection(report: Report, surveyIds: readonly string[]): SafeHtml {
  const flags = fleetFlags(report);
  const history = historyChart(report.surveys);
  return html`<section class="rf-fleet" aria-labelledby="rf-fleet-heading"><h2 id="rf-fleet-heading">Fleet: ${report.surveys.length} surveys</h2>
<table class="rf-table rf-fleet-table"><thead><tr><th scope="col">coil</th><th scope="col">date</th><th scope="col">file</th><th scope="col">best model</th><th scope="col">ampere-turns (95% interval)</th><th scope="col">verdict</th><th scope="col">flags</th></tr></thead>
<tbody>${report.surveys.map((survey, i) => {
    const at = ampereTurnsOf(survey);
    const shown = at ? formatEstimate(at.estimate) : null;
    return html`<tr><th scope="row"><a href="${`#${surveyIds[i] ?? ''}`}" data-survey-index="${i}">${survey.coil ?? '(no id)'}</a></th><td>${survey.date ?? '—'}</td><td>${survey.source}</td><td>${survey.best ?? 'none'}</td><td class="rf-num">${shown ? `${shown.value} (${shown.interval})${at && at.model !== survey.best ? ` from ${at.model}` : ''}` : '—'}</td><td>${survey.verdict ? html`<span class="${`rf-status rf-status-${survey.verdict.status}`}">${survey.verdict.status}</span>` : '—'}</td><td>${(survey.coil ? flags.get(survey.coil) ?? [] : []).join(', ') || '—'}</td></tr>`;
  })}</tbody></table>
${history ? chartFigure('rf-fleet-history', 'History: ampere-turns of each coil over time', history) : html`<p class="rf-note">No history chart: no coil has two or more dated surveys with a fitted ampere-turns value.</p>`}
</section>`;
}

function historyChart(surveys: readonly SurveyReport[]): ChartSpec | null {
  const byCoil = new Map<string, { x: number; value: number; low: number | null; high: number | null }[]>();
  for (const survey of surveys) {
    const x = decimalYear(survey.date);
    const at = ampereTurnsOf(survey);
    if (survey.coil === null || x === null || !at) continue;
    const list = byCoil.get(survey.coil) ?? [];
    list.push({ x, value: at.estimate.value, low: at.estimate.ci95?.[0] ?? null, high: at.estimate.ci95?.[1] ?? null });
    byCoil.set(survey.coil, list);
  }
  const series = [...byCoil.entries()].filter(([, points]) => points.length >= 2);
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
  const xs = series.flatMap(([, points]) => points.map((p) => p.x));
  const span = Math.max(Math.max(...xs) - Math.min(...xs), 0.1);
  const options = baseOptions();
  options.scales = {
    x: { type: 'linear', min: Math.min(...xs) - span * 0.05, max: Math.max(...xs) + span * 0.05, title: { display: true, text: 'survey date (decimal year)' }, ticks: { format: { useGrouping: false, maximumFractionDigits: 2 } }, grid: { color: palette.grid } },
    y: { type: 'linear', title: { display: true, text: 'ampere-turns (A), 95% interval bars' }, grid: { color: palette.grid } },
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
