import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { effectiveUncertainty, fitEffectiveVariance } from './effective-variance';
import type { LeastSquaresProblem } from '../engine/least-squares-types';

describe('effectiveUncertainty(σ_B, slope, σ_d, out)', () => {
  it('effectiveUncertainty() adds the loop slope term of DOMAIN.md §9 row 51 in quadrature', () => {
    const mu0 = 1.25663706212e-6;
    const [ampereTurns, radius, z] = [400, 0.05, 0.05];
    // on-axis loop slope dB/dz = −3μ0·NI·R²·z/(2(R² + z²)^2.5) (derivative of DOMAIN.md §1.1)
    const slope = (-3 * mu0 * ampereTurns * radius ** 2 * z) / (2 * (radius ** 2 + z ** 2) ** 2.5);
    // DOMAIN.md §9 row 51 [C]: dB/dz = −0.0533146 T/m, σ_z = 1 mm → 5.3315e-5 T
    expectClose(slope, -0.0533146, { abs: 5e-8 });
    const out = new Float64Array(1);
    effectiveUncertainty([0], [slope], [0.001], out);
    expectClose(out[0]!, 5.3315e-5, { abs: 5e-10 });
    effectiveUncertainty([3e-5], [slope], [0.001], out);
    expectClose(out[0]!, Math.sqrt(3e-5 ** 2 + 5.33146e-5 ** 2), { rel: 1e-6 });
  });
});

describe('fitEffectiveVariance(problem, options, effective)', () => {
  const x = Float64Array.of(0, 1, 2, 3, 4, 5, 6, 7);
  const y = Float64Array.of(0.9, 3.2, 4.8, 7.3, 8.8, 11.3, 12.9, 15.2);
  const sigmaY = Float64Array.from(x, () => 0.1);
  const sigmaX = Float64Array.of(0.05, 0.3, 0.05, 0.2, 0.02, 0.4, 0.1, 0.05);
  const line: LeastSquaresProblem = {
    observed: y,
    parameterCount: 2,
    predict: (t, out) => x.forEach((xi, i) => (out[i] = t[0]! + t[1]! * xi)),
    jacobian: (_, out) => x.forEach((xi, i) => ((out[2 * i] = 1), (out[2 * i + 1] = xi))),
  };

  it('fitEffectiveVariance() on a straight line equals the fixed point of closed-form weighted lines', () => {
    // independent: iterate the weighted-line formulas (Bevington & Robinson §6.3) with
    // w = 1/(σ_y² + b²σ_x²) to convergence (Orear 1982)
    let b = 2;
    let a = 0;
    for (let round = 0; round < 200; round++) {
      let s = 0, sx = 0, sy = 0, sxx = 0, sxy = 0;
      x.forEach((xi, i) => {
        const w = 1 / (sigmaY[i]! ** 2 + b * b * sigmaX[i]! ** 2);
        s += w; sx += w * xi; sy += w * y[i]!; sxx += w * xi * xi; sxy += w * xi * y[i]!;
      });
      const delta = s * sxx - sx * sx;
      a = (sxx * sy - sx * sxy) / delta;
      b = (s * sxy - sx * sy) / delta;
    }
    const fit = fitEffectiveVariance(
      line,
      { initial: [0, 1] },
      { readingUncertainty: sigmaY, positionUncertainty: sigmaX, slope: (t, out) => out.fill(t[1]!), rounds: 50, tolerance: 1e-13 },
    );
    expect(fit.settled).toBe(true);
    expectClose(fit.solution.params[0]!, a, { rel: 1e-9 });
    expectClose(fit.solution.params[1]!, b, { rel: 1e-9 });
    fit.effectiveUncertainty.forEach((s, i) => expectClose(s, Math.hypot(sigmaY[i]!, b * sigmaX[i]!), { rel: 1e-9 }));
  });

  it('fitEffectiveVariance() settles within its default 5 rounds and rejects mismatched lengths', () => {
    const fit = fitEffectiveVariance(line, { initial: [0, 1] }, { readingUncertainty: sigmaY, positionUncertainty: sigmaX, slope: (t, out) => out.fill(t[1]!) });
    expect(fit.settled).toBe(true);
    expect(fit.rounds).toBeLessThanOrEqual(5);
    expect(() =>
      fitEffectiveVariance(line, { initial: [0, 1] }, { readingUncertainty: sigmaY, positionUncertainty: [0.1], slope: () => {} }),
    ).toThrow(/positionUncertainty has length 1, expected 8/);
  });
});
