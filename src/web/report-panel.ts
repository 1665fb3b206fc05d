import { Chart, registerables, Ticks } from 'chart.js';
import type { Report } from '../core/report/report';
import { h, replaceChildren, uniqueId } from './dom';
import { downloadHtmlReport, downloadText } from './downloads';
import type { PipelineProgress } from './pipeline';
import { type TickFormatters, renderFleetSection, renderSurveySection, surveyElementId, type ModelLookup } from '../render';
import { drawCharts } from './draw-charts';
import { reportCsv } from '../core/report/report-csv';
import { renderRunSection } from '../render/run-section';
import { toJsonReport } from '../core/report/to-json-report';

Chart.register(...registerables);

/**
 * The report side of the page: run status with a progress bar, export buttons, a
 * chooser for the survey shown, and the report view itself (the same renderer as the
 * exported HTML), with charts drawn by Chart.js.
 */
export function reportPanel(lookup: ModelLookup): {
  element: HTMLElement;
  showProgress: (progress: PipelineProgress) => void;
  /** Show a report; `statusLine` replaces the usual "N surveys fitted" (a saved report says what it is). */
  showReport: (report: Report, elapsedMs: number, statusLine?: string) => void;
  showMessage: (message: string, state: 'idle' | 'failed') => void;
} {
  let report: Report = { surveys: [] };
  let shown = 0;
  let reportsShown = 0;
  const status = h('p', { id: 'run-status', class: 'muted', role: 'status', 'aria-live': 'polite' }, 'No survey yet.');
  const progress = h('progress', { id: 'run-progress', max: 1, value: 0, hidden: true, 'aria-label': 'Reading and fitting progress' });
  const body = h('div', { id: 'report-body', 'data-state': 'idle' });
  const chooserId = uniqueId('survey-choice');
  const chooser = h('select', { id: chooserId });
  const chooserRow = h('div', { class: 'row chooser', hidden: true }, h('label', { for: chooserId }, 'Survey shown'), chooser);
  chooser.addEventListener('change', () => { shown = Number(chooser.value); render(); });

  const button = (label: string, id: string, action: () => void | Promise<void>) => {
    const element = h('button', { type: 'button', id, disabled: true }, label);
    element.addEventListener('click', () => { void action(); });
    return element;
  };
  const stamp = () => new Date().toISOString().slice(0, 10);
  const exports = [
    button('Save report (HTML)', 'export-html', () => downloadHtmlReport(report, lookup, `ringfall-report-${stamp()}.html`)),
    button('Save JSON', 'export-json', () => downloadText(JSON.stringify(toJsonReport(report), null, 2) + '\n', `ringfall-report-${stamp()}.json`, 'application/json')),
    button('Save CSV', 'export-csv', () => downloadText(reportCsv(report), `ringfall-readings-${stamp()}.csv`, 'text/csv')),
    button('Print or save as PDF', 'export-print', () => window.print()),
  ];

  body.addEventListener('click', (event) => {
    const link = (event.target as Element).closest<HTMLAnchorElement>('a[data-survey-index]');
    if (!link) return;
    event.preventDefault();
    shown = Number(link.dataset['surveyIndex']);
    chooser.value = String(shown);
    render();
    document.getElementById(surveyElementId(shown))?.scrollIntoView({ block: 'start' });
  });

  function render(): void {
    const started = performance.now();
    for (const canvas of body.querySelectorAll('canvas')) Chart.getChart(canvas)?.destroy();
    const survey = report.surveys[shown];
    const parts: string[] = [];
    if (report.surveys.length > 1) parts.push(renderFleetSection(report, report.surveys.map((_, i) => surveyElementId(i))).value);
    if (survey) parts.push(renderSurveySection(survey, lookup, surveyElementId(shown)).value);
    // how the report was made, as every saved report says it
    if (report.run) parts.push(renderRunSection(report.run).value);
    // every piece of file text in these strings was escaped by the report view's html template
    body.innerHTML = `<div class="rf-report">${parts.join('')}</div>`;
    const drawing = performance.now();
    drawCharts(body, Chart as unknown as new (canvas: HTMLCanvasElement, config: unknown) => unknown, Ticks as unknown as TickFormatters);
    // the benchmark reads these to say where the time goes
    body.dataset['renderMs'] = (drawing - started).toFixed(1);
    body.dataset['chartsMs'] = (performance.now() - drawing).toFixed(1);
  }

  const element = h('main', { id: 'report', class: 'report-area', 'aria-labelledby': 'report-heading', tabindex: -1 },
    h('div', { class: 'report-bar' },
      h('h2', { id: 'report-heading' }, 'Report'),
      h('div', { class: 'status-line' }, progress, status),
      h('div', { class: 'row exports', role: 'group', 'aria-label': 'Export the report' }, exports)),
    chooserRow, body);

  return {
    element,
    showProgress: (p) => {
      body.dataset['state'] = 'running';
      progress.hidden = false;
      // one survey gives no steps to count: an indeterminate bar still shows work going on
      if (p.stage === 'fit' && p.total <= 1) progress.removeAttribute('value');
      else progress.value = p.total === 0 ? 0 : p.stage === 'import' ? (0.2 * p.done) / p.total : 0.2 + (0.8 * p.done) / p.total;
      status.textContent = p.stage === 'import'
        ? `Reading ${p.label.replace(/^reading /, '')} (file ${p.done + 1} of ${p.total})`
        : `${p.label.replace(/^fitting/, 'Fitting')} (survey ${Math.min(p.done + 1, p.total)} of ${p.total})`;
    },
    showReport: (next, elapsedMs, statusLine) => {
      report = next;
      shown = Math.min(shown, Math.max(0, next.surveys.length - 1));
      progress.hidden = true;
      status.textContent = statusLine ?? (next.surveys.length === 0
        ? 'No survey could be fitted; see the files on the left.'
        : `${next.surveys.length} survey(s) fitted in ${(elapsedMs / 1000).toFixed(2)} s.`);
      replaceChildren(chooser, next.surveys.map((s, i) => h('option', { value: String(i), selected: i === shown }, `${s.coil ?? '(no id)'} ${s.date ?? ''} — ${s.source}`)));
      chooserRow.hidden = next.surveys.length < 2;
      for (const b of exports) b.disabled = next.surveys.length === 0;
      render();
      body.dataset['state'] = next.surveys.length === 0 ? 'empty' : 'ready';
      // end-to-end tests and the benchmark wait for this count to change
      body.dataset['reportCount'] = String(++reportsShown);
      body.dataset['pipelineMs'] = elapsedMs.toFixed(1);
    },
    showMessage: (message, state) => {
      progress.hidden = true;
      status.textContent = message;
      body.dataset['state'] = state;
    },
  };
}
