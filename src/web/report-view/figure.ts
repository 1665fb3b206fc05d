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
<script type="application/json" id="${id}-config">${inlineJson(spec.config)}</script>
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
 * Draw every `canvas[data-rf-chart]` under `root` with the Chart constructor given.
 * The exported report runs `drawChartsSource` instead, the same steps as plain script.
 */
export function drawCharts(root: ParentNode, ChartConstructor: new (canvas: HTMLCanvasElement, config: unknown) => unknown): void {
  root.querySelectorAll<HTMLCanvasElement>('canvas[data-rf-chart]').forEach((canvas) => {
    const source = root.querySelector(`#${CSS.escape(canvas.dataset['rfChart'] ?? '')}`);
    if (source?.textContent) new ChartConstructor(canvas, JSON.parse(source.textContent));
  });
}

/** `drawCharts` as inline script for a self-contained report (expects the global `Chart`). */
export const drawChartsSource = `document.querySelectorAll('canvas[data-rf-chart]').forEach(function (canvas) {
  var source = document.getElementById(canvas.getAttribute('data-rf-chart'));
  if (source && source.textContent) new Chart(canvas, JSON.parse(source.textContent));
});`;
