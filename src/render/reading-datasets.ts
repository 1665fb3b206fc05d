import type { ChartDataset } from 'chart.js';
import type { FitResult } from '../core/fit/fit-result';
import { drawnReadingsLimit, sampleIndices, type LegendItem } from './chart-spec';
import { palette, withAlpha } from './palette';

type Point = { x: number; y: number | null };
type Reading = FitResult['points'][number];

/**
 * The readings as chart datasets: on-axis readings (an even sample beyond
 * drawnReadingsLimit, said in `notes`) with ±1σ bars, and off-axis readings marked apart.
 * `x` and `y` map a reading's position and a field to chart units (null: not drawn);
 * `barLow` is where a bar's lower end is drawn (a log axis clips it at its floor).
 */
export function readingDatasets(
  readings: readonly Reading[],
  x: (reading: Reading) => number,
  y: (field: number) => number | null,
  barLow: (reading: Reading) => number,
  datasets: ChartDataset<'scatter', Point[]>[],
  legend: LegendItem[],
  notes: string[],
): void {
  const onAxis = readings.filter((p) => p.radial === 0);
  const offAxis = readings.filter((p) => p.radial !== 0);
  const drawn = sampleIndices(onAxis.length, drawnReadingsLimit).map((i) => onAxis[i]!);
  if (drawn.length < onAxis.length) notes.push(`${drawn.length} of ${onAxis.length} on-axis readings are drawn (an even sample); every reading was fitted.`);
  const bars: Point[] = [];
  for (const p of drawn) {
    if (p.standardUncertainty === null || !(p.standardUncertainty > 0)) continue;
    bars.push({ x: x(p), y: y(barLow(p)) }, { x: x(p), y: y(p.field + p.standardUncertainty) }, { x: x(p), y: null });
  }
  datasets.push({ label: 'readings', data: drawn.map((p) => ({ x: x(p), y: y(p.field) })), backgroundColor: palette.readings, borderColor: palette.readings, pointRadius: 2.5, order: 0 });
  legend.push({ label: 'readings on axis', colour: palette.readings, shape: 'point' });
  if (bars.length > 0) {
    datasets.push({ label: '±1σ', data: bars, showLine: true, spanGaps: false, borderColor: withAlpha(palette.readings, 0.55), borderWidth: 1, pointRadius: 0, order: 1 });
    legend.push({ label: '±1 standard uncertainty', colour: withAlpha(palette.readings, 0.55), shape: 'line' });
  }
  if (offAxis.length > 0) {
    const sample = sampleIndices(offAxis.length, drawnReadingsLimit).map((i) => offAxis[i]!);
    datasets.push({ label: 'off-axis readings', data: sample.map((p) => ({ x: x(p), y: y(p.field) })), backgroundColor: palette.offAxis, borderColor: palette.offAxis, pointStyle: 'triangle', pointRadius: 3.5, order: 0 });
    legend.push({ label: 'readings off axis (curves are on axis; see residuals)', colour: palette.offAxis, shape: 'triangle' });
  }
}
