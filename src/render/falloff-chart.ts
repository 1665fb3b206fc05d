import type { ChartDataset } from 'chart.js';
import { extent } from 'd3-array';
import { confidenceBand, fittedCurve, logSpacedDistances } from '../core/report/curves';
import type { SurveyReport } from '../core/report/report';
import { surveyUnits } from '../core/units';
import {
  baseOptions, distanceUnitFor, fieldUnitFor, sampleIndices,
  type ChartSpec, type LegendItem,
} from './chart-spec';
import { oneTwoFiveLabels } from './figure';
import { niceLogBound } from './nice-ticks';
import { isPowerLaw, modelColour, palette, withAlpha } from './palette';
import { readingDatasets } from './reading-datasets';
import { chartFrame, chartReadings, rankedFits, readingsFit, type ModelLookup } from './survey-facts';

type Point = { x: number; y: number | null };
const curveSamples = 160;

/**
 * Falloff chart on log–log axes: on-axis readings with ±1σ error bars (σ as used by the
 * fit), off-axis readings marked apart, each converged model's on-axis curve, the best
 * model's 95 % confidence band, and the threshold levels with their distances.
 * Null when the survey has no fit or no reading at a positive distance.
 */
export function falloffChart(survey: SurveyReport, lookup: ModelLookup): ChartSpec | null {
  const reference = readingsFit(survey);
  if (!reference) return null;
  const readings = chartReadings(survey, lookup);
  const frame = chartFrame(survey, lookup);
  const at = (p: { distance: number }) => p.distance + frame.offset;
  const positive = readings.filter((p) => at(p) > 0 && p.field > 0);
  if (positive.length === 0) return null;
  const notes: string[] = [];

  const units = surveyUnits(survey);
  // positive holds at least one reading, so every extent below is a number
  const [fieldLow, fieldHigh] = extent(positive, (p) => p.field) as [number, number];
  let [xMin, xMax] = extent(positive, at) as [number, number];
  const field = fieldUnitFor(fieldHigh, units);
  const length = distanceUnitFor(xMax, units);
  for (const t of survey.thresholds) {
    for (const d of [t.distance?.value, t.naive?.distance?.value]) {
      if (d !== undefined && d > 0 && d < xMax * 20) xMax = Math.max(xMax, d);
    }
  }
  xMin = niceLogBound(xMin / 1.05, -1);
  xMax = niceLogBound(xMax * 1.05, 1);
  const yMax = niceLogBound(fieldHigh * 1.3, 1);
  const yMin = niceLogBound(Math.max(Math.min(fieldLow, ...survey.thresholds.map((t) => t.level.value)) / 1.5, yMax * 1e-6), -1);
  const X = (d: number) => d / length.factor;
  const Y = (b: number): number | null => (b > 0 && Number.isFinite(b) ? b / field.factor : null);

  const datasets: ChartDataset<'scatter', Point[]>[] = [];
  const legend: LegendItem[] = [];

  readingDatasets(positive, (p) => X(at(p)), Y, (p) => Math.max(p.field - (p.standardUncertainty ?? 0), yMin), datasets, legend, notes);
  const skipped = readings.length - positive.length;
  if (skipped > 0) notes.push(`${skipped} reading(s) at zero distance or with a field ≤ 0 cannot sit on log axes; the residuals chart shows them.`);
  if (frame.model !== null && frame.offset !== 0) {
    notes.push(`Distances run from the datum to the sensing point: the ruler distance plus the ${frame.model} fit's probe offset (${units.format(frame.offset, 'length', { significant: 3, fallback: { symbol: 'mm', factor: 1e-3 } })}), the same datum as the threshold distances.`);
  }

  const distances = logSpacedDistances(xMin, xMax, curveSamples);
  // the models take ruler distances; the chart's axis is the sensing point's distance
  const stated = distances.map((d) => d - frame.offset);
  const ranked = rankedFits(survey).filter((fit) => fit.converged);
  for (const fit of ranked) {
    const model = lookup(fit.model);
    if (!model) continue;
    const curve = fittedCurve(model, fit, stated);
    const colour = modelColour(fit.model);
    const best = fit.model === survey.best;
    if (best) {
      const band = confidenceBand(model, fit, stated);
      if (band) {
        const bandColour = withAlpha(colour, 0.18);
        datasets.push({ label: `${fit.model} 95% band (lower)`, data: Array.from(distances, (d, i) => ({ x: X(d), y: Y(Math.max(band.lower[i]!, yMin)) })), showLine: true, pointRadius: 0, borderWidth: 0, borderColor: bandColour, backgroundColor: bandColour, order: 3 });
        datasets.push({ label: `${fit.model} 95% band`, data: Array.from(distances, (d, i) => ({ x: X(d), y: Y(band.upper[i]!) })), showLine: true, pointRadius: 0, borderWidth: 0, borderColor: bandColour, backgroundColor: bandColour, fill: '-1', order: 3 });
        legend.push({ label: `${fit.model}: 95% confidence band of the curve`, colour: bandColour, shape: 'band' });
      }
    }
    datasets.push({
      label: fit.model, data: Array.from(distances, (d, i) => ({ x: X(d), y: Y(curve[i]!) })), showLine: true, pointRadius: 0,
      borderColor: colour, borderWidth: best ? 2.5 : 1.5, ...(isPowerLaw(fit.model) ? { borderDash: [6, 4] } : {}), order: 2,
    });
    legend.push({ label: `${fit.model}${best ? ' (best)' : ''}`, colour, shape: isPowerLaw(fit.model) ? 'dashed' : 'line' });
  }

  survey.thresholds.forEach((t, index) => {
    const level = Y(t.level.value);
    if (level === null) return;
    const name = units.format(t.level.value, 'field', { significant: 3 }) + (t.level.label ? ` ${t.level.label}` : '');
    datasets.push({ label: `level ${name}`, data: [{ x: X(xMin), y: level }, { x: X(xMax), y: level }], showLine: true, pointRadius: 0, borderColor: palette.threshold, borderWidth: 1, borderDash: [2, 3], order: 4 });
    if (t.distance && t.distance.value > 0) {
      datasets.push({ label: `${t.model} reaches ${name}`, data: [{ x: X(t.distance.value), y: Y(yMin) }, { x: X(t.distance.value), y: level }], showLine: true, pointRadius: [0, 4], pointStyle: 'rectRot', borderColor: palette.threshold, backgroundColor: palette.threshold, borderWidth: 1.5, order: 4 });
    }
    if (t.naive?.distance && t.naive.distance.value > 0) {
      datasets.push({ label: `${t.naive.model} reaches ${name}`, data: [{ x: X(t.naive.distance.value), y: Y(yMin) }, { x: X(t.naive.distance.value), y: level }], showLine: true, pointRadius: [0, 4], pointStyle: 'crossRot', borderColor: withAlpha(palette.thresholdNaive, 0.6), borderWidth: 1.5, borderDash: [5, 3], order: 4 });
    }
    if (index === 0) {
      legend.push({ label: 'threshold level; solid drop: where the best physical model falls below it', colour: palette.threshold, shape: 'line' });
      legend.push({ label: 'dashed drop: where the naive power law says it does', colour: withAlpha(palette.thresholdNaive, 0.6), shape: 'dashed' });
    }
  });

  const options = baseOptions();
  options.scales = {
    x: { type: 'logarithmic', min: X(xMin), max: X(xMax), title: { display: true, text: `distance from datum to sensing point (${length.symbol}), log scale` }, ticks: { format: { maximumSignificantDigits: 3 }, rfLabels: oneTwoFiveLabels, autoSkip: false }, grid: { color: palette.grid } },
    y: { type: 'logarithmic', min: yMin / field.factor, max: yMax / field.factor, title: { display: true, text: `field |B| (${field.symbol}), log scale` }, ticks: { format: { maximumSignificantDigits: 3 }, rfLabels: oneTwoFiveLabels, autoSkip: false }, grid: { color: palette.grid } },
  } as NonNullable<typeof options.scales>;
  return {
    config: { type: 'scatter', data: { datasets }, options },
    width: 760,
    height: 420,
    description: `Field against distance on log–log axes: ${readings.length} readings and ${ranked.length} fitted model curves.`,
    legend,
    notes,
  };
}
