/**
 * The HTML renderer shared by the web page and the CLI: renders a Report (core/report) as
 * HTML strings, in the browser and in Node alike. Nothing here touches the DOM or Node
 * (src/render/tsconfig.json compiles it with neither). The page shows the markup and draws
 * its charts (src/web/draw-charts.ts); the CLI's `--html` writes
 * `renderReportDocument(report, { chartLibrary: chartLibrarySource() })`, where
 * `chartLibrarySource` (src/cli/chart-library.ts) reads the installed Chart.js bundle.
 */
export { renderReportDocument, renderReportBody, surveyElementId, type ReportDocumentOptions } from './report-document';
export { renderSurveySection } from './survey-section';
export { renderFleetSection } from './fleet-section';
export { renderRunSection } from './run-section';
export { installTickLabels, oneTwoFiveLabels, type TickFormatters } from './figure';
export { reportStyles } from './report-styles';
export { escapeHtml } from './html';
export { catalogLookup, type ModelLookup } from './survey-facts';
