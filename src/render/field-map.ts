import { simplifyPolyline, type Point } from './simplify-path';
import { max, min } from 'd3-array';
import { contours } from 'd3-contour';
import type { FitResult } from '../core/fit/fit-result';
import { fieldMapGrid, probeOffset } from '../core/report/curves';
import type { SurveyReport } from '../core/report/report';
import { surveyUnits } from '../core/units';
import { distanceUnitFor, fieldUnitFor } from './chart-spec';
import { escapeHtml, html, trusted, type SafeHtml } from './html';
import { niceTicks } from './nice-ticks';
import { fieldRamp, palette } from './palette';
import { chartReadings, isAxisymmetric, rankedFits, type ModelLookup } from './survey-facts';

/** The field map figure: inline SVG plus what it shows. */
export interface FieldMapFigure {
  readonly svg: SafeHtml;
  readonly model: string;
  readonly notes: readonly string[];
}

const width = 760;
const height = 440;
const margin = { left: 64, right: 104, top: 16, bottom: 48 };
const innerWidth = width - margin.left - margin.right;
const innerHeight = height - margin.top - margin.bottom;
const columns = 161;
const halfRows = 51;
const bands = 12;

/**
 * Field map: |B| of the best axisymmetric fitted model in the plane through the coil
 * axis (distance along the axis across, radial offset up and down, equal scales),
 * filled by log-spaced bands, with each threshold level drawn as a contour (d3-contour
 * marching squares on log10|B|) and the readings' positions marked.
 * Null when no axisymmetric model converged (with the reason in `reason`).
 */
export function fieldMap(survey: SurveyReport, lookup: ModelLookup): FieldMapFigure | { reason: string } {
  const fit = rankedFits(survey).find((f) => f.converged && isAxisymmetric(f.model));
  const model = fit ? lookup(fit.model) : undefined;
  if (!fit || !model) return { reason: 'No axisymmetric coil model (loop, thick coil, solenoid, coil pair, dipole) converged, so there is no field map.' };
  const notes: string[] = [];
  if (fit.model !== survey.best) notes.push(`Drawn with ${fit.model}, the best-ranked axisymmetric model; the best model overall (${survey.best ?? 'none'}) is not axisymmetric.`);
  const offset = probeOffset(model, fit);
  // readings drawn where they were sensed: ruler distance plus this model's probe offset
  const readings = chartReadings(survey, lookup).map((p) => ({ ...p, distance: p.distance + offset }));
  const thresholdDistances = survey.thresholds.filter((t) => t.model === fit.model).map((t) => t.distance?.value ?? 0);
  const maxReading = Math.max(0, max(readings, (p) => p.distance) ?? 0);
  let maxDistance = Math.max(maxReading, ...thresholdDistances.filter((d) => d < maxReading * 20)) * 1.1;
  const needRadial = Math.max(1.6 * coilRadius(fit), 1.1 * Math.max(0, max(readings, (p) => p.radial) ?? 0));
  let maxRadial = (innerHeight / innerWidth) * maxDistance / 2;
  if (maxRadial < needRadial) {
    maxRadial = needRadial;
    maxDistance = (2 * maxRadial * innerWidth) / innerHeight;
  }
  if (!(maxDistance > 0)) return { reason: 'The readings span no distance, so there is no field map.' };
  const grid = fieldMapGrid(model, fit, { maxDistance, maxRadial, nz: columns, nRadial: halfRows });
  const rows = 2 * halfRows - 1;
  const logValues = new Array<number>(columns * rows);
  for (let row = 0; row < rows; row++) {
    const half = Math.abs(halfRows - 1 - row);
    for (let c = 0; c < columns; c++) {
      const value = grid.values[half * columns + c]!;
      logValues[row * columns + c] = value > 0 && Number.isFinite(value) ? Math.log10(value) : Number.POSITIVE_INFINITY;
    }
  }
  const positiveFields = readings.map((p) => Math.abs(p.field)).filter((b) => b > 0);
  const levels = survey.thresholds.map((t) => t.level.value).filter((v) => v > 0);
  const top = Math.log10(Math.max(max(positiveFields) ?? Number.NEGATIVE_INFINITY, ...levels, 1e-12) * 2);
  // five decades at most, so the far field does not wash the near field out
  const bottom = Math.max(top - 5, Math.log10(Math.min(min(positiveFields) ?? Number.POSITIVE_INFINITY, ...levels, 10 ** top) / 2));
  for (let i = 0; i < logValues.length; i++) logValues[i] = Math.min(logValues[i]!, top);
  const bandLevels = Array.from({ length: bands }, (_, i) => bottom + ((top - bottom) * i) / bands);

  const x = (d: number) => margin.left + (d / maxDistance) * innerWidth;
  const y = (rho: number) => margin.top + innerHeight / 2 - (rho / maxRadial) * (innerHeight / 2);
  const gridX = (c: number) => margin.left + Math.min(1, Math.max(0, (c - 0.5) / (columns - 1))) * innerWidth;
  const gridY = (r: number) => margin.top + Math.min(1, Math.max(0, (r - 0.5) / (rows - 1))) * innerHeight;
  // each ring traced cell by cell, thinned to what shows at a quarter pixel (simplify-path.ts)
  const pathOf = (polygons: number[][][][]) => polygons
    .map((polygon) => polygon.map((ring) => 'M' + simplifyPolyline(ring.map(([c, r]): Point => [gridX(c!), gridY(r!)]), 0.25).map(([px, py]) => `${px.toFixed(1)},${py.toFixed(1)}`).join('L') + 'Z').join(''))
    .join('');

  const generator = contours().size([columns, rows]);
  const parts: string[] = [];
  parts.push(`<rect x="${margin.left}" y="${margin.top}" width="${innerWidth}" height="${innerHeight}" fill="${fieldRamp(0)}"/>`);
  bandLevels.forEach((level, i) => {
    const shape = generator.contour(logValues, level);
    parts.push(`<path d="${pathOf(shape.coordinates)}" fill="${fieldRamp((i + 1) / bands)}" stroke="none"/>`);
  });
  const units = surveyUnits(survey);
  const length = distanceUnitFor(maxDistance, units);
  const fieldUnit = fieldUnitFor(10 ** top, units);
  for (const t of survey.thresholds) {
    if (!(t.level.value > 0)) continue;
    const shape = generator.contour(logValues, Math.log10(t.level.value));
    if (shape.coordinates.length === 0) {
      notes.push(`The ${units.format(t.level.value, 'field', { significant: 3 })} contour lies outside the mapped area.`);
      continue;
    }
    parts.push(`<path d="${pathOf(shape.coordinates)}" fill="none" stroke="${palette.threshold}" stroke-width="2"/>`);
    const onAxis = t.model === fit.model && t.distance && t.distance.value <= maxDistance ? t.distance.value : null;
    if (onAxis !== null) {
      const label = escapeHtml(units.format(t.level.value, 'field', { significant: 3 }));
      parts.push(`<circle cx="${x(onAxis).toFixed(1)}" cy="${y(0).toFixed(1)}" r="3.5" fill="${palette.threshold}"/>`);
      parts.push(`<text x="${(x(onAxis) + 5).toFixed(1)}" y="${(y(0) - 6).toFixed(1)}" font-size="11" font-weight="600" fill="${palette.ink}" stroke="#ffffff" stroke-width="3" paint-order="stroke">${label}</text>`);
    }
  }
  parts.push(`<line x1="${margin.left}" y1="${y(0)}" x2="${margin.left + innerWidth}" y2="${y(0)}" stroke="${palette.ink}" stroke-dasharray="4 4" stroke-width="0.8"/>`);
  const shown = readings.length > 400 ? readings.filter((_, i) => i % Math.ceil(readings.length / 400) === 0) : readings;
  for (const p of shown) {
    if (p.distance < 0 || p.distance > maxDistance || p.radial > maxRadial) continue;
    parts.push(`<circle cx="${x(p.distance).toFixed(1)}" cy="${y(p.radial).toFixed(1)}" r="2.2" fill="#ffffff" stroke="${palette.ink}" stroke-width="0.8"/>`);
  }
  parts.push(axes(maxDistance, maxRadial, length, x, y));
  parts.push(colourKey(bottom, top, fieldUnit, survey.thresholds.map((t) => t.level.value)));

  const svg = html`<svg xmlns="http://www.w3.org/2000/svg" class="rf-fieldmap" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${`Map of |B| of the ${fit.model} fit around the coil, with threshold contours`}">${trusted(parts.join(''))}</svg>`;
  notes.push(survey.axis === 'map'
    ? `Field of the coil alone (fitted background left out), ${fit.model} model, in the coil's own frame: distance along the fitted axis from the datum (winding plane or near face) and distance from the axis; the coil axis is the dashed line; white dots are the map's readings placed in that frame (both sides of the winding folded onto one, radial offsets drawn on one side). The figure below shows where the coil sits in the map.`
    : `Field of the coil alone (fitted background left out), ${fit.model} model, at true positions: distance from the datum (winding plane or near face) to the point; the coil axis is the dashed line; white dots are where the readings were sensed (ruler distance plus the fitted probe offset; radial offsets drawn on one side).`);
  return { svg, model: fit.model, notes };
}

function coilRadius(fit: FitResult): number {
  for (const name of ['radius', 'outerRadius']) {
    const estimate = fit.params[name];
    if (estimate && Number.isFinite(estimate.value) && estimate.value > 0) return estimate.value;
  }
  return 0;
}

function axes(
  maxDistance: number, maxRadial: number, length: { symbol: string; factor: number },
  x: (d: number) => number, y: (rho: number) => number,
): string {
  const out: string[] = [];
  const text = (tx: number, ty: number, anchor: string, label: string) =>
    `<text x="${tx.toFixed(1)}" y="${ty.toFixed(1)}" text-anchor="${anchor}" font-size="11" fill="${palette.ink}">${label}</text>`;
  out.push(`<rect x="${margin.left}" y="${margin.top}" width="${innerWidth}" height="${innerHeight}" fill="none" stroke="${palette.ink}" stroke-width="0.8"/>`);
  for (const tick of niceTicks(0, maxDistance / length.factor, 8)) {
    const px = x(tick * length.factor);
    out.push(`<line x1="${px}" y1="${margin.top + innerHeight}" x2="${px}" y2="${margin.top + innerHeight + 5}" stroke="${palette.ink}"/>`);
    out.push(text(px, margin.top + innerHeight + 18, 'middle', tickLabel(tick)));
  }
  for (const tick of niceTicks(-maxRadial / length.factor, maxRadial / length.factor, 6)) {
    const py = y(tick * length.factor);
    out.push(`<line x1="${margin.left - 5}" y1="${py}" x2="${margin.left}" y2="${py}" stroke="${palette.ink}"/>`);
    out.push(text(margin.left - 8, py + 4, 'end', tickLabel(tick)));
  }
  out.push(text(margin.left + innerWidth / 2, height - 10, 'middle', `distance from datum along the axis (${length.symbol})`));
  out.push(`<text transform="translate(16 ${margin.top + innerHeight / 2}) rotate(-90)" text-anchor="middle" font-size="11" fill="${palette.ink}">radial offset (${length.symbol})</text>`);
  return out.join('');
}

function colourKey(bottom: number, top: number, unit: { symbol: string; factor: number }, levels: readonly number[]): string {
  const left = width - margin.right + 22;
  const barWidth = 16;
  const out: string[] = [];
  const yOf = (log: number) => margin.top + innerHeight - ((log - bottom) / (top - bottom)) * innerHeight;
  const step = (top - bottom) / bands;
  for (let i = 0; i < bands; i++) {
    const upper = yOf(bottom + (i + 1) * step);
    out.push(`<rect x="${left}" y="${upper.toFixed(1)}" width="${barWidth}" height="${(yOf(bottom + i * step) - upper + 0.5).toFixed(1)}" fill="${fieldRamp((i + 1) / bands)}"/>`);
  }
  out.push(`<rect x="${left}" y="${margin.top}" width="${barWidth}" height="${innerHeight}" fill="none" stroke="${palette.ink}" stroke-width="0.6"/>`);
  for (let exponent = Math.ceil(bottom); exponent <= Math.floor(top); exponent++) {
    const py = yOf(exponent);
    out.push(`<line x1="${left + barWidth}" y1="${py.toFixed(1)}" x2="${left + barWidth + 3}" y2="${py.toFixed(1)}" stroke="${palette.ink}"/>`);
    out.push(`<text x="${left + barWidth + 5}" y="${(py + 4).toFixed(1)}" font-size="10" fill="${palette.ink}">${tickLabel(10 ** exponent / unit.factor)}</text>`);
  }
  for (const level of levels) {
    if (!(level > 0)) continue;
    const py = yOf(Math.log10(level));
    if (py < margin.top || py > margin.top + innerHeight) continue;
    out.push(`<line x1="${left - 4}" y1="${py.toFixed(1)}" x2="${left + barWidth + 2}" y2="${py.toFixed(1)}" stroke="${palette.threshold}" stroke-width="2"/>`);
  }
  out.push(`<text x="${left}" y="${margin.top + innerHeight + 18}" font-size="11" fill="${palette.ink}">|B| (${unit.symbol})</text>`);
  return out.join('');
}

/** A tick value without trailing zeros or float noise: 60, 0.1, 2.5. */
function tickLabel(value: number): string {
  return String(Number(value.toPrecision(6)));
}
