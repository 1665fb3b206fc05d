import type { Report } from '../core/report/report';
import { drawChartsSource } from './figure';
import { renderFleetSection } from './fleet-section';
import { documentHead } from './document-head';
import { html, trusted, type SafeHtml } from './html';
import { renderRunSection } from './run-section';
import { renderSurveySection } from './survey-section';
import { catalogLookup, type ModelLookup } from './survey-facts';

/** Element id of survey `index` in a rendered report. */
export function surveyElementId(index: number): string {
  return `rf-survey-${index + 1}`;
}

/**
 * The report body (fleet overview when there are several surveys, then every survey)
 * as HTML. Used by the web page and by `renderReportDocument`.
 */
export function renderReportBody(report: Report, lookup: ModelLookup = catalogLookup, detail: 'every' | 'latest' = 'every'): SafeHtml {
  const latest = latestIndex(report);
  const shown = report.surveys.map((_, i) => detail === 'every' || i === latest);
  const ids = report.surveys.map((_, i) => (shown[i] ? surveyElementId(i) : ''));
  return html`<div class="rf-report">
${report.surveys.length > 1 ? renderFleetSection(report, ids) : ''}
${detail === 'latest' && report.surveys.length > 1 ? html`<p class="rf-note">The latest survey is shown in full; the earlier ones are in the table above (each file's own report: fit it alone).</p>` : ''}
${report.surveys.map((survey, i) => (shown[i] ? renderSurveySection(survey, lookup, ids[i]!) : ''))}
${report.surveys.length === 0 ? html`<p class="rf-empty">The report holds no survey.</p>` : ''}
${report.run ? renderRunSection(report.run) : ''}
</div>`;
}

/** The latest survey of a report: the latest date (undated count as earliest), the last on ties. */
function latestIndex(report: Report): number {
  let best = 0;
  report.surveys.forEach((survey, i) => {
    const current = report.surveys[best]!;
    if ((survey.date ?? '') >= (current.date ?? '')) best = i;
  });
  return best;
}

/** Options of a self-contained report file. */
export interface ReportDocumentOptions {
  /**
   * Chart.js UMD bundle source (chart.umd.js), inlined so the file needs no network; or
   * `{ file }`, one copy beside the page loaded by that relative path (`batch --out` shares
   * one among its pages; still offline).
   */
  readonly chartLibrary: string | { readonly file: string };
  /** Page title; default "ringfall report". */
  readonly title?: string;
  /** One line under the title, e.g. "made by ringfall 0.1.0 from 3 files". */
  readonly subtitle?: string;
  /** Where models come from; default the core catalog (tests pass stand-ins). */
  readonly lookup?: ModelLookup;
  /** Every survey in full (default), or the latest only with the others in the survey table (batch's coil pages). */
  readonly detail?: 'every' | 'latest';
}

/**
 * One self-contained HTML file with the same view as the web page: inline CSS, the
 * Chart.js bundle (or a link to one copy beside the page) and chart data inline, the field map as inline SVG, and a Content
 * Security Policy that forbids every outside request. Opens offline from disk and
 * prints to PDF cleanly. Text from survey files is escaped.
 */
export function renderReportDocument(report: Report, options: ReportDocumentOptions): string {
  const title = options.title ?? 'ringfall report';
  const shared = typeof options.chartLibrary !== 'string';
  // "</script" inside the library would end the element early; "<\/" means the same in JS.
  const library = typeof options.chartLibrary === 'string'
    ? html`<script>${trusted(options.chartLibrary.replace(/<\/(script)/gi, '<\\/$1'))}</script>`
    : html`<script src="${options.chartLibrary.file}"></script>`;
  // 'self' lets a page load the shared library beside it, and nothing from elsewhere
  const csp = `default-src 'none'; style-src 'unsafe-inline'; script-src ${shared ? "'self' " : ''}'unsafe-inline'; img-src data:`;
  const page: SafeHtml = html`${documentHead(csp, title, 820)}<body>
<header class="rf-report rf-doc-head"><h1>${title}</h1>${options.subtitle ? html`<p>${options.subtitle}</p>` : ''}</header>
${renderReportBody(report, options.lookup ?? catalogLookup, options.detail ?? 'every')}
${library}
<script>${trusted(drawChartsSource)}
window.addEventListener('beforeprint', function () { document.querySelectorAll('details').forEach(function (d) { d.open = true; }); });</script>
</body>
</html>
`;
  return page.value;
}
