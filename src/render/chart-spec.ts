import type { ChartConfiguration } from 'chart.js';
import { surveyUnits, type SurveyUnitChoice } from '../core/units';

/**
 * A chart as plain data: a Chart.js configuration that is pure JSON (no callbacks, so
 * it can be inlined in a self-contained HTML file), our own HTML legend items, and
 * notes on what is not drawn. Charts are fixed-size (responsive: false, animation: false).
 */
export interface ChartSpec {
  readonly config: ChartConfiguration<'scatter'>;
  readonly width: number;
  readonly height: number;
  /** Short description for screen readers. */
  readonly description: string;
  readonly legend: readonly LegendItem[];
  /** Sentences about points not drawn, sampling, axes. */
  readonly notes: readonly string[];
}

/** One entry of our HTML legend: label, colour and how the swatch is drawn. */
export interface LegendItem {
  readonly label: string;
  readonly colour: string;
  readonly shape: 'point' | 'line' | 'dashed' | 'band' | 'triangle';
}

/** A unit for display: symbol and SI factor. */
export interface DisplayUnit {
  readonly symbol: string;
  readonly factor: number;
}

/**
 * Field axis unit: the survey's own (surveyUnits), else chosen from the largest reading,
 * e.g. mT for readings of a few mT.
 */
export function fieldUnitFor(largestField: number, units: SurveyUnitChoice = surveyUnits(null)): DisplayUnit {
  return units.unit('field', largestField > 0 ? largestField : 1e-3);
}

/** Distance axis unit: the survey's own (surveyUnits), else mm up to 2 m and m beyond. */
export function distanceUnitFor(largestDistance: number, units: SurveyUnitChoice = surveyUnits(null)): DisplayUnit {
  return units.unit('length', largestDistance, largestDistance > 2 ? { symbol: 'm', factor: 1 } : { symbol: 'mm', factor: 1e-3 });
}

/** Indices 0..n−1 thinned evenly to at most `limit` (all when n ≤ limit); display only. */
export function sampleIndices(n: number, limit: number): number[] {
  if (n <= limit) return Array.from({ length: n }, (_, i) => i);
  const step = n / limit;
  return Array.from({ length: limit }, (_, i) => Math.floor(i * step));
}

/** Most readings drawn per chart; beyond this an even sample is drawn and the note says so. */
export const drawnReadingsLimit = 1500;

/** Options every ringfall chart shares: fixed size, no animation, sharp on print. */
export function baseOptions(): NonNullable<ChartConfiguration<'scatter'>['options']> {
  return {
    responsive: false,
    animation: false,
    devicePixelRatio: 2,
    plugins: { legend: { display: false }, tooltip: { enabled: true } },
  };
}
