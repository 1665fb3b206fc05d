import type { ChartSpec, LegendItem } from './chart-spec';
import { html, inlineJson, type SafeHtml } from './html';

/**
 * Markup for a chart figure: a fixed-size canvas marked `data-rf-chart`, its Chart.js
 * configuration as inline JSON right after it (drawn by `drawCharts` in the page or
 * the inline script of an exported report), our HTML legend and the notes.
 */
export function chartFigure(id: string, title: string, spec: ChartSpec, extra: SafeHtml | null = null): SafeHtml {
  return html`<figure class="rf-figure" aria-labelledby="${id}-title">
<figcaption id="${id}-title" class="rf-figure-title">${title}</figcaption>
<div class="rf-canvas-box"><canvas id="${id}" data-rf-chart="${id}-config" width="${spec.width}" height="${spec.height}" role="img" aria-label="${spec.description}">${spec.description}</canvas></div>
<script type="application/json" id="${id}-config">${inlineJson(spec.config, { significant: 6 })}</script>
${legendList(spec.legend)}
${spec.notes.map((note) => html`<p class="rf-note">${note}</p>`)}
${extra}
</figure>`;
}

/** Our own legend as an HTML list (text stays selectable and prints crisply). */
export function legendList(items: readonly LegendItem[]): SafeHtml {
  if (items.length === 0) return html``;
  return html`<ul class="rf-legend">${items.map((item) => html`<li><span class="rf-swatch rf-swatch-${item.shape}" style="${`--swatch:${safeColour(item.colour)}`}" aria-hidden="true"></span>${item.label}</li>`)}</ul>`;
}

/** Colours come from our palette; anything else is refused so no text reaches a style. */
function safeColour(colour: string): string {
  return /^(#[0-9a-f]{3,8}|rgba?\([0-9., ]+\))$/i.test(colour) ? colour : '#000000';
}

/**
 * Marker for a log axis's `ticks.rfLabels`: label only 1, 2 and 5 × 10ⁿ. Chart.js's own
 * log formatter also labels every tick in the axis's top fifth (6, 7, 8, 9, 10 run into
 * each other); a callback cannot travel in the JSON config, so drawCharts installs it.
 */
export const oneTwoFiveLabels = 'one-two-five';

/** The slice of Chart.js's `Ticks` used for labels (its numeric formatter, with the axis as `this`). */
export interface TickFormatters {
  formatters: { numeric: (this: unknown, value: number, index: number, ticks: unknown[]) => string };
}

/** Install the 1-2-5 label callback on every axis of `config` marked with oneTwoFiveLabels. */
export function installTickLabels(config: unknown, ticks: TickFormatters): void {
  const scales = (config as { options?: { scales?: Record<string, { ticks?: Record<string, unknown> }> } }).options?.scales ?? {};
  for (const axis of Object.values(scales)) {
    if (axis.ticks?.['rfLabels'] !== oneTwoFiveLabels) continue;
    axis.ticks['callback'] = function (this: unknown, value: number, index: number, all: unknown[]): string {
      const significand = Math.round((value / Math.pow(10, Math.floor(Math.log10(value)))) * 1e6) / 1e6;
      return significand === 1 || significand === 2 || significand === 5 ? ticks.formatters.numeric.call(this, value, index, all) : '';
    };
  }
}

/** The page's `drawCharts` (src/web/draw-charts.ts) and `installTickLabels` as inline script for a self-contained report (expects the global `Chart`). */
export const drawChartsSource = `document.querySelectorAll('canvas[data-rf-chart]').forEach(function (canvas) {
  var source = document.getElementById(canvas.getAttribute('data-rf-chart'));
  if (!source || !source.textContent) return;
  var config = JSON.parse(source.textContent);
  var scales = (config.options && config.options.scales) || {};
  Object.keys(scales).forEach(function (key) {
    var axis = scales[key];
    if (!axis.ticks || axis.ticks.rfLabels !== '${oneTwoFiveLabels}') return;
    axis.ticks.callback = function (value, index, all) {
      var significand = Math.round((value / Math.pow(10, Math.floor(Math.log10(value)))) * 1e6) / 1e6;
      return significand === 1 || significand === 2 || significand === 5 ? Chart.Ticks.formatters.numeric.call(this, value, index, all) : '';
    };
  });
  new Chart(canvas, config);
});`;
