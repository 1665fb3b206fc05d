/**
 * Test stand-ins for the report view's unit tests: two closed-form models (on-axis loop,
 * inverse square) and a fabricated SurveyReport built from stated parameters. Not used
 * by the page; the real catalog and engine replace these in the end-to-end tests.
 */
import type { FitResult, ParameterEstimate } from '../core/fit/fit-result';
import type { FieldModel, ModelId, ParameterSpec, SurveyPoints } from '../core/models/field-model';
import type { SurveyReport } from '../core/report/report';

// CODATA 2018 μ0 (DOMAIN.md §6)
const mu0 = 1.25663706212e-6;

const spec = (name: string, unit: ParameterSpec['unit'], role: ParameterSpec['role'], description: string): ParameterSpec => ({ name, unit, role, lower: -Infinity, upper: Infinity, description });

/** On-axis loop, B = μ0·NI·R²/(2(R² + (d + δ)²)^1.5) + background (DOMAIN.md §1.1); ignores ρ. */
export const loopStandIn: FieldModel = {
  id: 'loop',
  label: 'circular loop (stand-in, on axis)',
  physical: true,
  parameters: [spec('ampereTurns', 'A', 'amplitude', 'ampere-turns N·I'), spec('radius', 'm', 'geometry', 'loop radius'), spec('probeOffset', 'm', 'offset', 'sensing point beyond the stated distance'), spec('background', 'T', 'background', 'constant background')],
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    const [ni, r, offset, background] = params as unknown as [number, number, number, number];
    for (let i = 0; i < points.n; i++) {
      const z = points.distance[i]! + offset;
      const s2 = r * r + z * z;
      out[i] = (mu0 * ni * r * r) / (2 * s2 * Math.sqrt(s2)) + background;
    }
  },
  initialGuess: () => Float64Array.of(100, 0.05, 0, 0),
};

/** B = amplitude/(d + δ)² + background. */
export const inverseSquareStandIn: FieldModel = {
  id: 'inverse-square',
  label: 'inverse square (stand-in)',
  physical: false,
  parameters: [spec('amplitude', 'T·m^n', 'amplitude', 'amplitude'), spec('probeOffset', 'm', 'offset', 'probe offset'), spec('background', 'T', 'background', 'background')],
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    const [amplitude, offset, background] = params as unknown as [number, number, number];
    for (let i = 0; i < points.n; i++) out[i] = amplitude / (points.distance[i]! + offset) ** 2 + background;
  },
  initialGuess: () => Float64Array.of(1e-6, 0, 0),
};

/** Look-up over the stand-ins. */
export const standInLookup = (id: ModelId): FieldModel | undefined =>
  id === 'loop' ? loopStandIn : id === 'inverse-square' ? inverseSquareStandIn : undefined;

/**
 * A FitResult whose parameters are exactly `values`, free parameters `free` with the
 * given standard errors (uncorrelated), and points from the model at `distances`.
 */
export function fabricatedFit(
  model: FieldModel,
  values: readonly number[],
  stderrs: Readonly<Record<string, number>>,
  distances: readonly number[],
  readings: readonly number[],
  aicc: number,
): FitResult {
  const free = Object.keys(stderrs);
  const t = 2.0;
  const params: Record<string, ParameterEstimate> = {};
  model.parameters.forEach((p, i) => {
    const stderr = stderrs[p.name];
    const value = values[i]!;
    params[p.name] = {
      name: p.name, unit: p.unit, value, stderr: stderr ?? null,
      ci95: stderr === undefined ? null : [value - t * stderr, value + t * stderr], fixed: stderr === undefined, determined: true,
    };
  });
  const n = distances.length;
  const predicted = new Float64Array(n);
  model.evaluate(Float64Array.from(values), { n, distance: Float64Array.from(distances), radial: new Float64Array(n), field: new Float64Array(n), kind: 'magnitude' }, predicted);
  const covariance = free.flatMap((a) => free.map((b) => (a === b ? stderrs[a]! ** 2 : 0)));
  const points = distances.map((distance, i) => ({
    line: i + 2, distance, radial: 0, field: readings[i]!, predicted: predicted[i]!, residual: readings[i]! - predicted[i]!, standardUncertainty: 0.015 * readings[i]! + 2e-6,
  }));
  const rss = points.reduce((s, p) => s + p.residual ** 2, 0);
  return {
    model: model.id, converged: true, stopReason: 'relative reduction of the cost below 1e-10', iterations: 7, params, freeParameters: free,
    covariance, correlation: null, uncertaintyScale: 'stated',
    stats: { n, k: free.length, rss, rmse: Math.sqrt(rss / n), chiSquare: n, reducedChiSquare: 1.02, aicc, bic: aicc + 1, akaikeWeight: null },
    points, warnings: [],
  };
}

/** A survey report of a 120 A, 45 mm loop read at 12 distances (or `count` from 2 to 150 mm), with a coil id `coil`. */
export function fabricatedReport(coil: string | null, count?: number): SurveyReport {
  const distances = count === undefined
    ? [0.002, 0.005, 0.01, 0.015, 0.02, 0.03, 0.04, 0.05, 0.07, 0.09, 0.12, 0.15]
    : Array.from({ length: count }, (_, i) => 0.002 + (0.148 * i) / (count - 1));
  const truth = [120, 0.045, 0.003, 0];
  const clean = new Float64Array(distances.length);
  loopStandIn.evaluate(Float64Array.from(truth), { n: distances.length, distance: Float64Array.from(distances), radial: new Float64Array(distances.length), field: clean, kind: 'magnitude' }, clean);
  // deterministic ±1 % wiggle standing in for noise
  const readings = Array.from(clean, (b, i) => b * (1 + 0.01 * Math.sin(i * 2.3)));
  const loop = fabricatedFit(loopStandIn, truth, { ampereTurns: 1.2, radius: 4e-4, probeOffset: 2e-4 }, distances, readings, -310);
  const square = fabricatedFit(inverseSquareStandIn, [2.2e-6, 0.028, 0], { amplitude: 1e-7, probeOffset: 1e-3 }, distances, readings, -250);
  return {
    source: 'bench-a.csv', coil, date: '2026-03-14', readingType: 'dc',
    readings: { total: 13, used: 12, rejected: [{ line: 9, column: 'B (mT)', value: '<b>x</b>', reason: 'not a number' }] },
    fits: [square, loop], best: 'loop', comparison: ['inverse-square bends the wrong way near the coil.'], verdict: null,
    thresholds: [{ level: { value: 5e-4, unit: 'T', label: 'implant screening line' }, model: 'loop', distance: { value: 0.0399, unit: 'm', ci95: [0.039, 0.0408] }, extrapolated: false, naive: { model: 'inverse-square', distance: { value: 0.0384, unit: 'm' } }, notes: [] }],
    warnings: [], cautions: ['A threshold distance is a model estimate.'], notes: [],
  };
}
