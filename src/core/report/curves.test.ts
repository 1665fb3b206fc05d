import { describe, expect, it } from 'vitest';
import type { FitResult } from '../fit/fit-result';
import type { FieldModel, SurveyPoints } from '../models/field-model';
import { expectClose } from '../../../test/support/expect-close';
import { confidenceBand, fieldMapGrid, fittedCurve, logSpacedDistances } from './curves';

// CODATA 2018 μ0 (DOMAIN.md §6)
const mu0 = 1.25663706212e-6;

/** B = amplitude/d² + background: linear in its parameters, so the delta method is exact. */
const inverseSquare: FieldModel = {
  id: 'inverse-square', label: 'A/d²', physical: false,
  parameters: [
    { name: 'amplitude', unit: 'T·m^n', role: 'amplitude', lower: 0, upper: Infinity, description: '' },
    { name: 'background', unit: 'T', role: 'background', lower: -Infinity, upper: Infinity, description: '' },
  ],
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array) {
    for (let i = 0; i < points.n; i++) out[i] = params[0]! / points.distance[i]! ** 2 + params[1]!;
  },
  initialGuess: () => Float64Array.of(1, 0),
};

/** Point dipole along the axis, |B| = μ0 m/(4π r³)·√(1 + 3cos²θ) (Jackson, Classical Electrodynamics 3rd ed., eq. 5.56), at z = distance + probeOffset, plus background. */
const dipole: FieldModel = {
  id: 'dipole', label: 'dipole', physical: true,
  parameters: [
    { name: 'moment', unit: 'A·m²', role: 'amplitude', lower: 0, upper: Infinity, description: '' },
    { name: 'probeOffset', unit: 'm', role: 'offset', lower: -Infinity, upper: Infinity, description: '' },
    { name: 'background', unit: 'T', role: 'background', lower: -Infinity, upper: Infinity, description: '' },
  ],
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array) {
    for (let i = 0; i < points.n; i++) {
      const z = points.distance[i]! + params[1]!;
      const rho = points.radial[i]!;
      const r = Math.hypot(z, rho);
      out[i] = (mu0 * params[0]! / (4 * Math.PI * r ** 3)) * Math.sqrt(1 + 3 * (z / r) ** 2) + params[2]!;
    }
  },
  initialGuess: () => Float64Array.of(1, 0),
};

function fitOf(model: FieldModel, values: Record<string, number>, stderr: Record<string, number>, t: number): FitResult {
  const free = Object.keys(stderr);
  const params = Object.fromEntries(model.parameters.map((p) => {
    const s = stderr[p.name];
    const value = values[p.name]!;
    return [p.name, { name: p.name, unit: p.unit, value, stderr: s ?? null, ci95: s === undefined ? null : [value - t * s, value + t * s] as const, fixed: s === undefined, determined: true }];
  }));
  return {
    model: model.id, converged: true, stopReason: 'test', iterations: 1, params, freeParameters: free,
    covariance: free.flatMap((a) => free.map((b) => (a === b ? stderr[a]! ** 2 : 0))), correlation: null, uncertaintyScale: 'stated',
    stats: { n: 10, k: free.length, rss: 0, rmse: 0, chiSquare: 0, reducedChiSquare: null, aicc: 0, bic: 0, akaikeWeight: null },
    points: [], warnings: [],
  };
}

describe('report curves', () => {
  it('logSpacedDistances(0.001, 0.1, 3) gives 1 mm, 10 mm, 100 mm', () => {
    const d = logSpacedDistances(0.001, 0.1, 3);
    // exact decades: exp(ln 0.001 + ln 100) = 0.01
    expectClose(d[0]!, 0.001, { rel: 1e-15 });
    expectClose(d[1]!, 0.01, { rel: 1e-14 });
    expect(d[2]).toBe(0.1);
  });

  it('confidenceBand() of A/d² with A free is ±t·σ_A/d² (law of propagation, exact for a linear model)', () => {
    // GUM (JCGM 100:2008) eq. 10: u²(f) = (∂f/∂A)² u²(A), ∂f/∂A = 1/d²
    const t = 2.1;
    const fit = fitOf(inverseSquare, { amplitude: 2e-6, background: 1e-6 }, { amplitude: 5e-8 }, t);
    const distances = Float64Array.of(0.01, 0.05, 0.2);
    const band = confidenceBand(inverseSquare, fit, distances)!;
    const centre = fittedCurve(inverseSquare, fit, distances);
    distances.forEach((d, i) => {
      expectClose(centre[i]!, 2e-6 / d ** 2 + 1e-6, { rel: 1e-14 });
      expectClose(band.upper[i]! - centre[i]!, (t * 5e-8) / d ** 2, { rel: 1e-7 });
      expectClose(centre[i]! - band.lower[i]!, (t * 5e-8) / d ** 2, { rel: 1e-7 });
    });
  });

  it('confidenceBand() with two free parameters adds their variances (uncorrelated)', () => {
    // GUM eq. 10 with ∂f/∂A = 1/d², ∂f/∂background = 1
    const fit = fitOf(inverseSquare, { amplitude: 2e-6, background: 0 }, { amplitude: 5e-8, background: 3e-6 }, 2);
    const band = confidenceBand(inverseSquare, fit, Float64Array.of(0.1))!;
    const half = (band.upper[0]! - band.lower[0]!) / 2;
    expectClose(half, 2 * Math.sqrt((5e-8 / 0.01) ** 2 + (3e-6) ** 2), { rel: 1e-7 });
  });

  it('confidenceBand() is null for a fit without covariance', () => {
    const fit = { ...fitOf(inverseSquare, { amplitude: 2e-6, background: 0 }, { amplitude: 5e-8 }, 2), covariance: null };
    expect(confidenceBand(inverseSquare, fit, Float64Array.of(0.1))).toBeNull();
  });

  it('fieldMapGrid() lays |B| at true field points out as values[radial·nz + z], background left out', () => {
    // the 4 mm probe offset must not shift the map: the grid is in field-point distances
    const fit = fitOf(dipole, { moment: 0.5, probeOffset: 0.004, background: 7e-3 }, { moment: 0.01 }, 2);
    const grid = fieldMapGrid(dipole, fit, { minDistance: 0.02, maxDistance: 0.2, maxRadial: 0.1, nz: 7, nRadial: 5 });
    expect(grid.distance.length).toBe(7);
    expect(grid.radial.length).toBe(5);
    expectClose(grid.distance[6]!, 0.2, { rel: 1e-15 });
    expectClose(grid.radial[4]!, 0.1, { rel: 1e-15 });
    for (const [r, z] of [[0, 0], [4, 6], [2, 3], [1, 5]] as const) {
      const zm = grid.distance[z]!;
      const rho = grid.radial[r]!;
      const rr = Math.hypot(zm, rho);
      // Jackson eq. 5.56, background not included
      const expected = (mu0 * 0.5 / (4 * Math.PI * rr ** 3)) * Math.sqrt(1 + 3 * (zm / rr) ** 2);
      expectClose(grid.values[r * 7 + z]!, expected, { rel: 1e-14 }, `r=${r} z=${z}`);
    }
  });
});
