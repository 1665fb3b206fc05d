import { historyHeadline } from '../../core/analysis/fleet/trend-reading';
import { describeValue } from '../../core/analysis/describe-value';
import type { Report } from '../../core/report/report';
import { documentHead } from '../../render/document-head';
import { html, type SafeHtml } from '../../render/html';
import { renderRunSection } from '../../render/run-section';
import { attentionList } from './attention-list';
import { coilFigures, fleetRows } from './fleet-rows';
import type { BatchCoverage } from './render-fleet-summary';

/**
 * The index page of `batch --out DIR`: one self-contained HTML file (inline CSS, no
 * script, a Content Security Policy that forbids every outside request) with one table
 * row per coil linking to its report page, what needs attention first, and the files that
 * could not be used. Every text from a file (coil ids, file names, reasons) is escaped.
 *
 * @param pages file name of each row's page, in fleetRows order; null for a page not
 *   written (the run was stopped first): the row is listed without a link
 */
export function renderFleetIndexPage(report: Report, pages: readonly (string | null)[], coverage: BatchCoverage & { readonly pagesStopped?: boolean }): string {
  const rows = fleetRows(report);
  const unreadable = report.fleet?.unreadable ?? [];
  const attention = attentionList(rows, unreadable);
  const page: SafeHtml = html`${documentHead("default-src 'none'; style-src 'unsafe-inline'", 'ringfall fleet summary', 1000)}<body class="rf-report">
<header><h1>Fleet summary</h1>
<p>${rows.filter((row) => row.coil !== null).length} coils, ${coverage.surveys ?? report.surveys.length} surveys from ${coverage.filesDone} files${coverage.interrupted ? html` — <strong>partial: stopped after ${coverage.filesDone} of ${coverage.filesTotal} files</strong>` : ''}.</p>
${coverage.pagesStopped === true ? html`<p><strong>Partial: the run was stopped while writing the coil pages; coils without a link have no page.</strong></p>` : ''}
${(report.skipped ?? []).map((entry) => html`<p class="rf-note">${entry.files.length} files left out: ${entry.list} lists ${entry.patterns.join(', ')} as not surveys (${entry.files.join(', ')}).</p>`)}</header>
<section class="rf-fleet"><h2>Coils</h2>
<table class="rf-table"><thead><tr><th scope="col">coil</th><th scope="col">surveys</th><th scope="col">latest</th><th scope="col">model</th><th scope="col">coil as measured (95% interval)</th><th scope="col">spec</th><th scope="col">history</th></tr></thead>
<tbody>${rows.map((row, i) => {
    const figures = coilFigures(row);
    const verdict = row.latest.verdict;
    return html`<tr><th scope="row" class="rf-nowrap">${pages[i] ? html`<a href="${pages[i]!}">${row.coil ?? `(no coil id) ${row.latest.source}`}</a>` : html`${row.coil ?? `(no coil id) ${row.latest.source}`} <span class="rf-note">(no page)</span>`}</th><td class="rf-num">${row.surveys}</td><td class="rf-nowrap">${row.latest.date ?? '—'}</td><td>${figures ? figures.model : 'no physical model converged'}</td><td>${figures ? figures.figures.join('; ') : '—'}</td><td>${verdict ? html`<span class="${`rf-status rf-status-${verdict.status}`}">${verdict.status}</span>${verdict.findings.length ? ` (${verdict.findings.join(', ')})` : ''}` : 'no spec'}</td><td>${row.history ? historyHeadline(row.history, (rate) => `${describeValue(rate, 'current')}/yr`) : 'no coil id'}</td></tr>`;
  })}</tbody></table></section>
<section class="rf-fleet"><h2>What needs attention first</h2>
${attention.length === 0 ? html`<p>Nothing: every survey was fitted, no spec failed and no history flag is set.</p>` : html`<ol>${attention.map((item) => html`<li><strong>${item.subject}</strong>: ${item.reasons.join('; ')}<ul>${item.evidence.map((sentence) => html`<li>${sentence}</li>`)}</ul></li>`)}</ol>`}
</section>
${unreadable.length > 0 ? html`<section class="rf-fleet"><h2>Files or parts that could not be used</h2><ul>${unreadable.map((entry) => html`<li><strong>${entry.source}</strong>: ${entry.reason}</li>`)}</ul></section>` : ''}
${report.run ? renderRunSection(report.run) : ''}
</body>
</html>
`;
  return page.value;
}
