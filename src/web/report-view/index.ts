/**
 * The report view: renders a Report (core/report) as HTML. The web page shows it; the
 * CLI's `--html` writes it with `renderReportDocument` (in Node, get the Chart.js bundle
 * from `chartLibrarySource()` in ./chart-library-node).
 */
export { renderReportDocument, renderReportBody, surveyElementId, type ReportDocumentOptions } from './report-document';
export { renderSurveySection } from './survey-section';
export { renderFleetSection } from './fleet-section';
export { drawCharts } from './figure';
export { reportStyles } from './report-styles';
export { escapeHtml } from './html';
export type { ModelLookup } from './survey-facts';
