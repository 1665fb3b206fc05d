/**
 * The report view: renders a Report (core/report) as HTML. The web page shows it; the
 * CLI's `--html` writes it with
 * `renderReportDocument(report, { chartLibrary: chartLibrarySource() })`, where
 * `chartLibrarySource` comes from ./chart-library-node (Node only: it reads the
 * installed Chart.js bundle).
 */
export { renderReportDocument, renderReportBody, surveyElementId, type ReportDocumentOptions } from './report-document';
export { renderSurveySection } from './survey-section';
export { renderFleetSection } from './fleet-section';
export { renderRunSection } from './run-section';
export { drawCharts, installTickLabels, oneTwoFiveLabels, type TickFormatters } from './figure';
export { reportStyles } from './report-styles';
export { escapeHtml } from './html';
export { catalogLookup, type ModelLookup } from './survey-facts';
