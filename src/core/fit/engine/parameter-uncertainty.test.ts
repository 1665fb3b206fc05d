import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { mulberry32 } from '../../random/mulberry32';
import { normalRandom } from '../../random/normal-random';
import { fitLeastSquares } from './least-squares';
import type { LeastSquaresProblem } from './least-squares-types';
import { createLeastSquaresWorkspace } from './least-squares-workspace';
import { parameterUncertainty } from './parameter-uncertainty';

const MU0 = 1.25663706212e-6;
const z = Float64Array.from({ length: 15 }, (_, i) => 0.005 + 0.015 * i);

/** On-axis loop B = μ0·NI·R²/(2(R² + z²)^1.5) (DOMAIN.md §1.1), parameters (NI, R). */
function loop(observed: Float64Array): LeastSquaresProblem {
  return {
    observed,
    parameterCount: 2,
    predict: (t, out) => z.forEach((zi, i) => (out[i] = (MU0 * t[0]! * t[1]! ** 2) / (2 * (t[1]! ** 2 + zi * zi) ** 1.5))),
    jacobian: (t, out) =>
      z.forEach((zi, i) => {
        const [ni, r] = [t[0]!, t[1]!];
        const s = r * r + zi * zi;
        out[2 * i] = (MU0 * r * r) / (2 * s ** 1.5);
        out[2 * i + 1] = (MU0 * ni * r * (2 * zi * zi - r * r)) / (2 * s ** 2.5);
      }),
  };
}

describe('parameterUncertainty(solution, scale)', () => {
  it('parameterUncertainty() of a straight line equals the closed-form standard errors and t interval', () => {
    const x = [0, 1, 2, 3, 4, 5];
    const y = Float64Array.of(0.1, 1.2, 1.9, 3.2, 3.9, 5.1);
    const line: LeastSquaresProblem = { observed: y, parameterCount: 2, predict: (t, out) => x.forEach((xi, i) => (out[i] = t[0]! + t[1]! * xi)) };
    const fit = fitLeastSquares(line, { initial: [0, 0] });
    const u = parameterUncertainty(fit, 'estimated');
    // ordinary LS: se(b) = s/√Sxx, s² = RSS/(n − 2), Sxx = Σ(x − x̄)² = 17.5 (Bevington & Robinson §6.4)
    const s2 = fit.rss / 4;
    expectClose(u.standardErrors![1]!, Math.sqrt(s2 / 17.5), { rel: 1e-9 });
    // t_0.975(4) = 2.776 (NIST e-Handbook table 1.3.6.7.2)
    expectClose((u.intervals![1]![1] - u.intervals![1]![0]) / (2 * u.standardErrors![1]!), 2.776, { abs: 5e-4 });
    expect(u.reducedChiSquare).toBeNull();
    expect(u.degreesOfFreedom).toBe(4);
  });

  it('95 % intervals of NI and R cover the truth in 92–98 % of 400 seeded noisy loop surveys (both scalings)', () => {
    const truth = [400, 0.05];
    const clean = new Float64Array(z.length);
    loop(clean).predict(Float64Array.from(truth), clean);
    const sigma = Float64Array.from(clean, (b) => 0.02 * b);
    const gaussian = normalRandom(mulberry32(20240601));
    const workspace = createLeastSquaresWorkspace(z.length, 2);
    const covered = { stated: [0, 0], estimated: [0, 0] };
    const trials = 400;
    for (let trial = 0; trial < trials; trial++) {
      const observed = Float64Array.from(clean, (b, i) => b + sigma[i]! * gaussian());
      const fit = fitLeastSquares(loop(observed), { initial: [300, 0.04], standardUncertainty: sigma }, workspace);
      expect(fit.converged).toBe(true);
      for (const scale of ['stated', 'estimated'] as const) {
        const intervals = parameterUncertainty(fit, scale).intervals!;
        intervals.forEach(([lo, hi], j) => {
          if (lo <= truth[j]! && truth[j]! <= hi) covered[scale][j]! += 1;
        });
      }
    }
    console.log(`coverage of NI, R over ${trials} surveys: stated ${covered.stated.map((c) => c / trials)}, estimated ${covered.estimated.map((c) => c / trials)}`);
    // nominal 95 %; 400 trials give a binomial SE of 1.1 %, so 92–98 % is ±2.7 SE
    for (const scale of ['stated', 'estimated'] as const) {
      for (const count of covered[scale]) {
        expect(count / trials).toBeGreaterThanOrEqual(0.92);
        expect(count / trials).toBeLessThanOrEqual(0.98);
      }
    }
  });

  it('parameterUncertainty() with stated σ reports χ²/ν and uses the normal quantile', () => {
    const clean = new Float64Array(z.length);
    loop(clean).predict(Float64Array.of(400, 0.05), clean);
    const sigma = Float64Array.from(clean, (b) => 0.01 * b);
    const fit = fitLeastSquares(loop(clean), { initial: [300, 0.04], standardUncertainty: sigma });
    const u = parameterUncertainty(fit, 'stated');
    expectClose(u.reducedChiSquare!, fit.chiSquare / 13, { rel: 1e-15 });
    // A&S Table 26.5: z_0.975 = 1.959963985
    const [lo, hi] = u.intervals![0]!;
    expectClose((hi - lo) / (2 * u.standardErrors![0]!), 1.959963985, { abs: 1e-9 });
    expect(u.identifiability.determined).toEqual([true, true]);
  });
});
