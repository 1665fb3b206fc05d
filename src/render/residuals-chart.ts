import type { ChartDataset } from 'chart.js';
import { extent, max } from 'd3-array';
import type { FitResult } from '../core/fit/fit-result';
import type { SurveyReport } from '../core/report/report';
import { surveyUnits } from '../core/units';
import { baseOptions, distanceUnitFor, drawnReadingsLimit, sampleIndices, type ChartSpec, type LegendItem } from './chart-spec';
import { oneTwoFiveLabels } from './figure';
import { niceCeiling, niceLogBound } from './nice-ticks';
import { modelColour, palette } from './palette';
import { bestFit, bestPowerLaw, chartFrame, type ModelLookup } from './survey-facts';

/**
 * Residuals chart: each reading's residual y − f divided by its standard uncertainty
 * (or by the fit's RMS residual when none was stated), against distance, for the best
 * model and the best power law. Systematic runs show where a model bends the wrong
 * way; |value| > 2 marks readings worth a second look. Null when there is no best fit.
 */
export function residualsChart(survey: SurveyReport, lookup: ModelLookup): ChartSpec | null {
  const best = bestFit(survey);
  if (!best) return null;
  const fits: FitResult[] = [best];
  const powerLaw = bestPowerLaw(survey);
  if (powerLaw && powerLaw.model !== best.model) fits.push(powerLaw);
  const notes: string[] = [];
  const offset = chartFrame(survey, lookup).offset;
  const length = distanceUnitFor(max(best.points, (p) => p.distance + offset) ?? Number.NEGATIVE_INFINITY, surveyUnits(survey));
  const logAxis = best.points.every((p) => p.distance + offset > 0);
  const stated = best.points.some((p) => p.standardUncertainty !== null && p.standardUncertainty > 0);
  const datasets: ChartDataset<'scatter', { x: number; y: number }[]>[] = [];
  const legend: LegendItem[] = [];
  let extreme = 3;
  for (const fit of fits) {
    const indices = sampleIndices(fit.points.length, drawnReadingsLimit);
    if (indices.length < fit.points.length) notes.push(`${fit.model}: ${indices.length} of ${fit.points.length} residuals drawn (an even sample).`);
    const data = indices.map((i) => {
      const p = fit.points[i]!;
      const scale = p.standardUncertainty !== null && p.standardUncertainty > 0 ? p.standardUncertainty : fit.stats.rmse;
      const y = scale > 0 ? p.residual / scale : 0;
      extreme = Math.max(extreme, Math.abs(y));
      return { x: (p.distance + offset) / length.factor, y };
    });
    const colour = modelColour(fit.model);
    datasets.push({ label: fit.model, data, backgroundColor: colour, borderColor: colour, pointRadius: 2.5, pointStyle: fit === best ? 'circle' : 'rect' });
    legend.push({ label: `${fit.model}${fit === best ? ' (best)' : ' (best power law)'}`, colour, shape: 'point' });
  }
  const [low = Number.POSITIVE_INFINITY, high = Number.NEGATIVE_INFINITY] = extent(datasets.flatMap((d) => d.data.map((p) => p.x)));
  const xMin = logAxis ? niceLogBound(low / 1.05, -1) : Math.min(0, low);
  const xMax = logAxis ? niceLogBound(high * 1.05, 1) : niceCeiling(high * 1.02);
  const guide = (y: number, dash: number[]): ChartDataset<'scatter', { x: number; y: number }[]> => ({
    label: y === 0 ? 'zero' : `${y > 0 ? '+' : '−'}2`, data: [{ x: xMin, y }, { x: xMax, y }], showLine: true, pointRadius: 0,
    borderColor: palette.zero, borderWidth: 1, borderDash: dash,
  });
  datasets.push(guide(0, []), guide(2, [2, 3]), guide(-2, [2, 3]));
  const limit = Math.min(Math.ceil(extreme * 1.1), 50);
  if (extreme > 50) notes.push('Some residuals lie beyond ±50 and are clipped at the chart edge.');
  const options = baseOptions();
  options.scales = {
    x: { type: logAxis ? 'logarithmic' : 'linear', min: xMin, max: xMax, title: { display: true, text: `${survey.axis === 'position' ? 'position on the ruler (a scan through the coil)' : 'distance from datum to sensing point'} (${length.symbol})${logAxis ? ', log scale' : ''}` }, ...(logAxis ? { ticks: { format: { maximumSignificantDigits: 3 }, rfLabels: oneTwoFiveLabels, autoSkip: false } } : {}), grid: { color: palette.grid } },
    y: { type: 'linear', min: -limit, max: limit, title: { display: true, text: stated ? 'residual ÷ standard uncertainty' : 'residual ÷ RMS residual' }, grid: { color: palette.grid } },
  } as unknown as NonNullable<typeof options.scales>;
  return {
    config: { type: 'scatter', data: { datasets }, options },
    width: 760,
    height: 280,
    description: `Residuals of ${fits.map((f) => f.model).join(' and ')} against distance, scaled by the reading uncertainty.`,
    legend,
    notes,
  };
}
