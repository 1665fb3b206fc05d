import { max, min } from 'd3-array';
import type { FitResult } from '../core/fit/fit-result';
import { axisDirection } from '../core/physics/coil-pose';
import type { SurveyReport } from '../core/report/report';
import { surveyUnits } from '../core/units';
import { distanceUnitFor } from './chart-spec';
import { escapeHtml, html, trusted, type SafeHtml } from './html';
import { niceTicks } from './nice-ticks';
import { modelColour, palette } from './palette';
import { isAxisymmetric, rankedFits } from './survey-facts';

/** The pose figure of a 3-D map: inline SVG plus a sentence of what it shows. */
export interface PoseFigure {
  readonly svg: SafeHtml;
  readonly notes: readonly string[];
}

const panel = 340;
const gap = 56;
const margin = { left: 56, right: 16, top: 22, bottom: 46 };
const width = margin.left + 2 * panel + gap + margin.right;
const height = margin.top + panel + margin.bottom;
/** Points on the drawn winding. */
const windingSteps = 96;

type Vector = readonly [number, number, number];

/**
 * Where the fitted coil sits in a 3-D map (Survey.axis 'map'): a side view (x across, z
 * up) and a top view (x across, y up) of the map's frame, equal scales, with the readings'
 * positions, the fitted winding (a circle of the fitted radius in the plane normal to the
 * axis, drawn as it projects; a coil pair's two windings, a solenoid's or thick coil's two
 * end circles), its centre and its axis as an arrow along +n (tilt from +z, azimuth from
 * +x towards +y). Null when the survey is not a map or no axisymmetric model converged
 * with a pose.
 */
export function poseView(survey: SurveyReport): PoseFigure | null {
  if (survey.axis !== 'map') return null;
  const fit = rankedFits(survey).find((f) => f.converged && isAxisymmetric(f.model) && f.params['tilt'] !== undefined);
  if (!fit) return null;
  const value = (name: string): number => fit.params[name]?.value ?? 0;
  const centre: Vector = [value('centreX'), value('centreY'), value('centreZ')];
  const n = new Float64Array(3);
  axisDirection(value('tilt'), value('azimuth'), n);
  const axis: Vector = [n[0]!, n[1]!, n[2]!];
  const positions = uniquePositions(fit);
  // at most about 600 dots drawn (an even sample); every position counts in the extent
  const shown = positions.length > 600 ? positions.filter((_, i) => i % Math.ceil(positions.length / 600) === 0) : positions;
  const windings = windingCircles(fit, centre, axis);
  const size = Math.max(max(windings, (w) => w.radius) ?? 0, 1e-3);
  const arrow: Vector = add(centre, scale(axis, 1.6 * size));
  const all: Vector[] = [...positions, centre, arrow, ...windings.flatMap((w) => circle(w.centre, axis, w.radius))];
  const units = surveyUnits(survey);
  const length = distanceUnitFor(max(all, (p) => Math.max(Math.abs(p[0]), Math.abs(p[1]), Math.abs(p[2]))) ?? 0, units);

  const parts: string[] = [];
  const views: readonly { title: string; across: 0; up: 1 | 2; left: number }[] = [
    { title: 'side view: x across, z up', across: 0, up: 2, left: margin.left },
    { title: 'top view: x across, y up', across: 0, up: 1, left: margin.left + panel + gap },
  ];
  for (const view of views) {
    const [lowX, highX] = [min(all, (p) => p[view.across])!, max(all, (p) => p[view.across])!];
    const [lowY, highY] = [min(all, (p) => p[view.up])!, max(all, (p) => p[view.up])!];
    const span = Math.max(highX - lowX, highY - lowY) * 1.1 || 1e-3;
    const midX = (highX + lowX) / 2;
    const midY = (highY + lowY) / 2;
    const px = (v: number) => view.left + ((v - (midX - span / 2)) / span) * panel;
    const py = (v: number) => margin.top + panel - ((v - (midY - span / 2)) / span) * panel;
    const at = (p: Vector) => `${px(p[view.across]).toFixed(1)},${py(p[view.up]).toFixed(1)}`;
    parts.push(`<rect x="${view.left}" y="${margin.top}" width="${panel}" height="${panel}" fill="#ffffff" stroke="${palette.ink}" stroke-width="0.8"/>`);
    for (const p of shown) parts.push(`<circle cx="${px(p[view.across]).toFixed(1)}" cy="${py(p[view.up]).toFixed(1)}" r="2" fill="${palette.readings}" fill-opacity="0.45"/>`);
    const colour = modelColour(fit.model);
    for (const w of windings) parts.push(`<polygon points="${circle(w.centre, axis, w.radius).map(at).join(' ')}" fill="none" stroke="${colour}" stroke-width="2.2"/>`);
    parts.push(`<line x1="${px(centre[view.across]).toFixed(1)}" y1="${py(centre[view.up]).toFixed(1)}" x2="${px(arrow[view.across]).toFixed(1)}" y2="${py(arrow[view.up]).toFixed(1)}" stroke="${palette.ink}" stroke-width="1.4" marker-end="url(#rf-pose-arrow)"/>`);
    parts.push(`<circle cx="${px(centre[view.across]).toFixed(1)}" cy="${py(centre[view.up]).toFixed(1)}" r="3.5" fill="${colour}" stroke="#ffffff" stroke-width="1"/>`);
    parts.push(ticks(view, span, midX, midY, length, px, py));
    parts.push(`<text x="${view.left + panel / 2}" y="${margin.top - 7}" text-anchor="middle" font-size="11" font-weight="600" fill="${palette.ink}">${escapeHtml(view.title)}</text>`);
  }
  const defs = `<defs><marker id="rf-pose-arrow" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="${palette.ink}"/></marker></defs>`;
  const degrees = (name: string) => `${(value(name) * 180 / Math.PI).toFixed(1)}°`;
  const place = centre.map((c) => units.format(c, 'length', { significant: 3, fallback: { symbol: 'mm', factor: 1e-3 } })).join(', ');
  const label = `The ${fit.model} fit placed in the map: centre at (${place}), axis tilted ${degrees('tilt')} from +z towards azimuth ${degrees('azimuth')}`;
  const svg = html`<svg xmlns="http://www.w3.org/2000/svg" class="rf-pose" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${label}">${trusted(defs + parts.join(''))}</svg>`;
  return {
    svg,
    notes: [`${label}. Dots: where the readings were taken (${positions.length} positions${shown.length < positions.length ? `, ${shown.length} drawn` : ''}); coloured: the fitted winding${windings.length > 1 ? 's' : ''} as ${windings.length > 1 ? 'they project' : 'it projects'}; the arrow points along the fitted axis (+n). Distances in ${length.symbol}, equal scales.`],
  };
}

function uniquePositions(fit: FitResult): Vector[] {
  const seen = new Set<string>();
  const out: Vector[] = [];
  for (const point of fit.points) {
    const p = point.position;
    if (!p) continue;
    const key = `${p.x},${p.y},${p.z}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push([p.x, p.y, p.z]);
  }
  return out;
}

/** The circles that draw the fitted source: one winding, a pair's two, or a solenoid's or thick coil's end circles; a dipole as a small ring. */
function windingCircles(fit: FitResult, centre: Vector, axis: Vector): { centre: Vector; radius: number }[] {
  const value = (name: string) => fit.params[name]?.value;
  const radius = value('radius') ?? value('outerRadius') ?? null;
  const along = (shift: number): Vector => add(centre, scale(axis, shift));
  if (fit.model === 'coil-pair' && radius !== null) {
    const half = 0.5 * (value('separation') ?? 0);
    return [{ centre: along(-half), radius }, { centre: along(half), radius }];
  }
  if ((fit.model === 'solenoid' || fit.model === 'thick-coil') && radius !== null) {
    const half = 0.5 * (value('length') ?? 0);
    return [{ centre: along(-half), radius }, { centre: along(half), radius }];
  }
  return [{ centre, radius: radius ?? 0.005 }];
}

/** Points of a circle of radius r about `centre` in the plane normal to unit `axis`. */
function circle(centre: Vector, axis: Vector, r: number): Vector[] {
  // two unit vectors normal to the axis: u from the coordinate axis least aligned with n, v = n × u
  const pick: Vector = Math.abs(axis[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
  const u = normalise(sub(pick, scale(axis, dot(pick, axis))));
  const v: Vector = [axis[1] * u[2] - axis[2] * u[1], axis[2] * u[0] - axis[0] * u[2], axis[0] * u[1] - axis[1] * u[0]];
  return Array.from({ length: windingSteps }, (_, i) => {
    const a = (2 * Math.PI * i) / windingSteps;
    return add(centre, add(scale(u, r * Math.cos(a)), scale(v, r * Math.sin(a))));
  });
}

function ticks(
  view: { across: 0; up: 1 | 2; left: number }, span: number, midX: number, midY: number,
  length: { symbol: string; factor: number }, px: (v: number) => number, py: (v: number) => number,
): string {
  const out: string[] = [];
  const text = (x: number, y: number, anchor: string, label: string) => `<text x="${x.toFixed(1)}" y="${y.toFixed(1)}" text-anchor="${anchor}" font-size="10" fill="${palette.ink}">${label}</text>`;
  for (const t of niceTicks((midX - span / 2) / length.factor, (midX + span / 2) / length.factor, 5)) {
    const x = px(t * length.factor);
    out.push(`<line x1="${x.toFixed(1)}" y1="${margin.top + panel}" x2="${x.toFixed(1)}" y2="${margin.top + panel + 4}" stroke="${palette.ink}"/>`, text(x, margin.top + panel + 15, 'middle', String(Number(t.toPrecision(6)))));
  }
  for (const t of niceTicks((midY - span / 2) / length.factor, (midY + span / 2) / length.factor, 5)) {
    const y = py(t * length.factor);
    out.push(`<line x1="${view.left - 4}" y1="${y.toFixed(1)}" x2="${view.left}" y2="${y.toFixed(1)}" stroke="${palette.ink}"/>`, text(view.left - 6, y + 3, 'end', String(Number(t.toPrecision(6)))));
  }
  const names = ['x', 'y', 'z'] as const;
  out.push(text(view.left + panel / 2, margin.top + panel + 34, 'middle', `${names[view.across]} (${length.symbol})`));
  out.push(`<text transform="translate(${view.left - 40} ${margin.top + panel / 2}) rotate(-90)" text-anchor="middle" font-size="10" fill="${palette.ink}">${names[view.up]} (${length.symbol})</text>`);
  return out.join('');
}

const add = (a: Vector, b: Vector): Vector => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
const sub = (a: Vector, b: Vector): Vector => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const scale = (a: Vector, k: number): Vector => [a[0] * k, a[1] * k, a[2] * k];
const dot = (a: Vector, b: Vector): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const normalise = (a: Vector): Vector => scale(a, 1 / Math.sqrt(dot(a, a)));
