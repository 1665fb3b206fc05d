import type { ChartDataset } from 'chart.js';
import { extent, max } from 'd3-array';
import { confidenceBand, fittedCurve } from '../core/report/curves';
import type { SurveyReport } from '../core/report/report';
import { nearFaceModels, scanModel } from '../core/models/scan-model';
import { surveyUnits } from '../core/units';
import { baseOptions, distanceUnitFor, fieldUnitFor, type ChartSpec, type LegendItem } from './chart-spec';
import { niceCeiling, niceTicks } from './nice-ticks';
import { isPowerLaw, modelColour, palette, withAlpha } from './palette';
import { readingDatasets } from './reading-datasets';
import { rankedFits, readingsFit, type ModelLookup } from './survey-facts';

type Point = { x: number; y: number | null };
const curveSamples = 400;

/**
 * A scan through the coil (Survey.axis 'position') as it was taken: field against the
 * signed position on the ruler, on linear axes, both sides of the coil and the inside of a
 * solenoid or pair as read. Readings with ±1σ bars, each converged model's curve along
 * the axis (the model at |position − centre|: a power law's spike at the centre is cut at
 * the top of the chart), the best model's 95 % band, its fitted centre as a dashed line,
 * and the threshold levels with the positions on each side where the best physical
 * model falls below them. Null when the survey is not a scan or has no fit.
 */
export function scanProfileChart(survey: SurveyReport, lookup: ModelLookup): ChartSpec | null {
  if (survey.axis !== 'position') return null;
  const reference = readingsFit(survey);
  if (!reference || reference.points.length === 0) return null;
  const readings = reference.points;
  const units = surveyUnits(survey);
  const [positionLow, positionHigh] = extent(readings, (p) => p.distance) as [number, number];
  const fieldHigh = max(readings, (p) => Math.abs(p.field) + (p.standardUncertainty ?? 0)) ?? 0;
  const span = Math.max(positionHigh - positionLow, 1e-6);
  const field = fieldUnitFor(fieldHigh, units);
  const length = distanceUnitFor(Math.max(Math.abs(positionLow), Math.abs(positionHigh)), units);
  // round ends: the ruler range widened by 4 % and moved out to the ticks' step
  const ticks = niceTicks((positionLow - 0.04 * span) / length.factor, (positionHigh + 0.04 * span) / length.factor, 8);
  const step = ticks.length > 1 ? ticks[1]! - ticks[0]! : span / length.factor;
  const xMin = Math.floor((positionLow - 0.04 * span) / length.factor / step + 1e-9) * step * length.factor;
  const xMax = Math.ceil((positionHigh + 0.04 * span) / length.factor / step - 1e-9) * step * length.factor;
  const yMax = niceCeiling((fieldHigh * 1.1) / field.factor) * field.factor;
  const X = (d: number) => d / length.factor;
  const Y = (b: number): number | null => (Number.isFinite(b) && Math.abs(b) <= 3 * yMax ? b / field.factor : null);
  const signed = readings.some((p) => p.field < 0);
  const notes: string[] = [];
  const datasets: ChartDataset<'scatter', Point[]>[] = [];
  const legend: LegendItem[] = [];

  readingDatasets(readings, (p) => X(p.distance), Y, (p) => p.field - (p.standardUncertainty ?? 0), datasets, legend, notes);

  const positions = Float64Array.from({ length: curveSamples }, (_, i) => xMin + ((xMax - xMin) * i) / (curveSamples - 1));
  const ranked = rankedFits(survey).filter((fit) => fit.converged);
  const best = ranked.find((fit) => fit.model === survey.best) ?? null;
  for (const fit of ranked) {
    const base = lookup(fit.model);
    if (!base || fit.params['centre'] === undefined) continue;
    const model = scanModel(base);
    const curve = fittedCurve(model, fit, positions);
    const colour = modelColour(fit.model);
    const isBest = fit === best;
    if (isBest) {
      const band = confidenceBand(model, fit, positions);
      if (band) {
        const bandColour = withAlpha(colour, 0.18);
        datasets.push({ label: `${fit.model} 95% band (lower)`, data: Array.from(positions, (d, i) => ({ x: X(d), y: Y(band.lower[i]!) })), showLine: true, pointRadius: 0, borderWidth: 0, borderColor: bandColour, backgroundColor: bandColour, order: 3 });
        datasets.push({ label: `${fit.model} 95% band`, data: Array.from(positions, (d, i) => ({ x: X(d), y: Y(band.upper[i]!) })), showLine: true, pointRadius: 0, borderWidth: 0, borderColor: bandColour, backgroundColor: bandColour, fill: '-1', order: 3 });
        legend.push({ label: `${fit.model}: 95% confidence band of the curve`, colour: bandColour, shape: 'band' });
      }
    }
    datasets.push({
      label: fit.model, data: Array.from(positions, (d, i) => ({ x: X(d), y: Y(curve[i]!) })), showLine: true, spanGaps: false, pointRadius: 0,
      borderColor: colour, borderWidth: isBest ? 2.5 : 1.5, ...(isPowerLaw(fit.model) ? { borderDash: [6, 4] } : {}), order: 2,
    });
    legend.push({ label: `${fit.model}${isBest ? ' (best)' : ''}`, colour, shape: isPowerLaw(fit.model) ? 'dashed' : 'line' });
  }
  const yLow = signed ? -yMax : 0;
  const physical = ranked.find((fit) => lookup(fit.model)?.physical === true && fit.params['centre'] !== undefined) ?? null;
  if (physical) {
    const centre = physical.params['centre']!.value;
    datasets.push({ label: `${physical.model} centre`, data: [{ x: X(centre), y: yLow / field.factor }, { x: X(centre), y: yMax / field.factor }], showLine: true, pointRadius: 0, borderColor: palette.zero, borderWidth: 1.5, borderDash: [4, 4], order: 5 });
    legend.push({ label: `fitted centre of the coil on the ruler (${physical.model}: ${units.format(centre, 'length', { significant: 4, fallback: { symbol: 'mm', factor: 1e-3 } })})`, colour: palette.zero, shape: 'dashed' });
  }

  survey.thresholds.forEach((t, index) => {
    const level = Y(t.level.value);
    if (level === null) return;
    const name = units.format(t.level.value, 'field', { significant: 3 }) + (t.level.label ? ` ${t.level.label}` : '');
    datasets.push({ label: `level ${name}`, data: [{ x: X(xMin), y: level }, { x: X(xMax), y: level }], showLine: true, pointRadius: 0, borderColor: palette.threshold, borderWidth: 1, borderDash: [2, 3], order: 4 });
    const fit = ranked.find((f) => f.model === t.model && f.params['centre'] !== undefined);
    if (t.distance && fit) {
      // threshold distances run from the model's datum; on the ruler that is centre ± (distance + half the length of a near-face model)
      const shift = nearFaceModels.has(fit.model) ? 0.5 * (fit.params['length']?.value ?? 0) : 0;
      const centre = fit.params['centre']!.value;
      for (const side of [-1, 1]) {
        const at = centre + side * (t.distance.value + shift);
        if (at < xMin || at > xMax) continue;
        datasets.push({ label: `${t.model} reaches ${name}`, data: [{ x: X(at), y: yLow / field.factor }, { x: X(at), y: level }], showLine: true, pointRadius: [0, 4], pointStyle: 'rectRot', borderColor: palette.threshold, backgroundColor: palette.threshold, borderWidth: 1.5, order: 4 });
      }
    }
    if (index === 0) legend.push({ label: 'threshold level; solid drops: where the best physical model falls below it, on each side', colour: palette.threshold, shape: 'line' });
  });
  notes.push('A scan through the coil, drawn as taken: field against the position on the survey\'s ruler. Threshold distances in the table are measured from the coil\'s datum (winding plane, midpoint of a pair, near face of a solenoid), not from the ruler\'s zero.');

  const options = baseOptions();
  options.scales = {
    x: { type: 'linear', min: X(xMin), max: X(xMax), title: { display: true, text: `position on the ruler (${length.symbol})` }, ticks: { format: { maximumSignificantDigits: 4 } }, grid: { color: palette.grid } },
    y: { type: 'linear', min: yLow / field.factor, max: yMax / field.factor, title: { display: true, text: `field ${signed ? 'B' : '|B|'} (${field.symbol})` }, ticks: { format: { maximumSignificantDigits: 4 } }, grid: { color: palette.grid } },
  } as NonNullable<typeof options.scales>;
  return {
    config: { type: 'scatter', data: { datasets }, options },
    width: 760,
    height: 420,
    description: `Field against position along a scan through the coil: ${readings.length} readings and ${ranked.length} fitted model curves.`,
    legend,
    notes,
  };
}
