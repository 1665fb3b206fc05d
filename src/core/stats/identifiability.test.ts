import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { correlationMatrix } from './correlation-matrix';
import { deltaMethodVariance } from './delta-method-variance';
import { identifiability } from './identifiability';
import { leastSquaresCovariance } from './least-squares-covariance';

const MU0 = 1.25663706212e-6; // CODATA 2018, as DOMAIN.md §9

/**
 * Weighted Jacobian of the on-axis loop B = μ0·NI·R²/(2(R² + z²)^1.5) (DOMAIN.md §1.1)
 * with respect to (NI, R), σᵢ = 1 % of Bᵢ. Derivatives by hand:
 * ∂B/∂NI = B/NI, ∂B/∂R = μ0·NI·R·(2z² − R²)/(2(R² + z²)^2.5).
 */
function loopJacobian(ampereTurns: number, radius: number, z: readonly number[]): Float64Array {
  return Float64Array.from(
    z.flatMap((zi) => {
      const s = radius * radius + zi * zi;
      const field = (MU0 * ampereTurns * radius * radius) / (2 * s ** 1.5);
      const sigma = 0.01 * field;
      const dRadius = (MU0 * ampereTurns * radius * (2 * zi * zi - radius * radius)) / (2 * s ** 2.5);
      return [field / ampereTurns / sigma, dRadius / sigma];
    }),
  );
}

function survey(ampereTurns: number, radius: number, from: number, to: number) {
  const z = Array.from({ length: 12 }, (_, i) => from + ((to - from) * i) / 11);
  const result = leastSquaresCovariance(loopJacobian(ampereTurns, radius, z), 12, 2, { scale: 'stated', chiSquare: 10 });
  const c = result.covariance!;
  const correlation = correlationMatrix(c, 2);
  // moment m = NI·π·R²: ∇m = (πR², 2π·NI·R)
  const momentVariance = deltaMethodVariance([Math.PI * radius ** 2, 2 * Math.PI * ampereTurns * radius], c);
  return {
    relativeAmpereTurns: Math.sqrt(c[0]!) / ampereTurns,
    relativeRadius: Math.sqrt(c[3]!) / radius,
    correlation: correlation[1]!,
    relativeMoment: Math.sqrt(momentVariance) / (ampereTurns * Math.PI * radius ** 2),
    verdict: identifiability(result, correlation),
  };
}

describe('identifiability() on loop surveys (DOMAIN.md §7.6)', () => {
  it('far field only (12 points 5R–10R, σ = 1 %): NI and R undetermined, the moment to 0.72 % (DOMAIN.md §9 row 63)', () => {
    const far = survey(400, 0.05, 0.25, 0.5);
    // DOMAIN.md §9 row 63 [C]: σ(NI)/NI 21.4 %, σ(R)/R 11.0 %, ρ = −0.99991, σ(m)/m 0.72 %
    expectClose(far.relativeAmpereTurns, 0.214, { abs: 0.0005 });
    expectClose(far.relativeRadius, 0.11, { abs: 0.0005 });
    expectClose(far.correlation, -0.99991, { abs: 0.000005 });
    expectClose(far.relativeMoment, 0.0072, { abs: 0.00005 });
    expect(far.verdict.determined).toEqual([false, false]);
    expect(far.verdict.strongPairs).toHaveLength(1);
  });

  it('near field included (12 points 0–5R): NI and R determined to 0.45 % and 0.31 %, ρ = −0.76', () => {
    const near = survey(400, 0.05, 0, 0.25);
    // DOMAIN.md §7.6 [C]: 0.45 %, 0.31 %, correlation −0.76
    expectClose(near.relativeAmpereTurns, 0.0045, { abs: 0.00005 });
    expectClose(near.relativeRadius, 0.0031, { abs: 0.00005 });
    expectClose(near.correlation, -0.76, { abs: 0.005 });
    expect(near.verdict.determined).toEqual([true, true]);
    expect(near.verdict.strongPairs).toEqual([]);
  });

  it('identifiability() marks parameters moving along a flat direction as undetermined, others as determined', () => {
    // f = a·x + b·x + c: a and b are confounded, c is free of them
    const x = [1, 2, 3, 4];
    const j = Float64Array.from(x.flatMap((xi) => [xi, xi, 1]));
    const result = leastSquaresCovariance(j, 4, 3, { scale: 'stated', chiSquare: 1 });
    const verdict = identifiability(result, null);
    expect(verdict.determined).toEqual([false, false, true]);
    expect(Array.from(verdict.multipleCorrelation.slice(0, 2))).toEqual([1, 1]);
  });
});
