import { installTickLabels, type TickFormatters } from '../render';

/**
 * Draw every `canvas[data-rf-chart]` under `root` with the Chart constructor given (and
 * its `Ticks`, for installTickLabels). The exported report runs `drawChartsSource`
 * (src/render/figure.ts) instead, the same steps as plain script.
 */
export function drawCharts(root: ParentNode, ChartConstructor: new (canvas: HTMLCanvasElement, config: unknown) => unknown, ticks: TickFormatters): void {
  root.querySelectorAll<HTMLCanvasElement>('canvas[data-rf-chart]').forEach((canvas) => {
    const source = root.querySelector(`#${CSS.escape(canvas.dataset['rfChart'] ?? '')}`);
    if (!source?.textContent) return;
    const config: unknown = JSON.parse(source.textContent);
    installTickLabels(config, ticks);
    new ChartConstructor(canvas, config);
  });
}
