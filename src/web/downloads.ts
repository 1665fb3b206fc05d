import type { Report } from '../core/report/report';
import { renderReportDocument, type ModelLookup } from '../render';

/** Offer `text` as a file download (a local blob: URL; nothing leaves the machine). */
export function downloadText(text: string, fileName: string, type: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: `${type};charset=utf-8` }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.appendChild(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/**
 * Save the self-contained HTML report (same view as the page and `ringfall fit --html`).
 * The Chart.js bundle it inlines is loaded on first use only (the package's UMD file,
 * which vite.config.ts maps by name: src/cli/chart-library.ts).
 */
export async function downloadHtmlReport(report: Report, lookup: ModelLookup, fileName: string): Promise<void> {
  const chartLibrary = (await import('chart.js/dist/chart.umd.js?raw')).default;
  const count = report.surveys.length;
  const html = renderReportDocument(report, {
    chartLibrary,
    lookup,
    title: count === 1 ? `ringfall report — ${report.surveys[0]?.coil ?? report.surveys[0]?.source ?? ''}` : `ringfall report — ${count} surveys`,
    subtitle: `Saved from the ringfall web page on ${new Date().toISOString().slice(0, 10)}.`,
  });
  downloadText(html, fileName, 'text/html');
}
