import { describe, expect, it } from 'vitest';
import { dipoleField, dipoleFieldGradient } from './dipole-field';
import { loopFieldOnAxis } from './loop-field';
import { blockMagnetFieldOnAxis, cylinderMagnetFieldOnAxis } from './magnet-field';
import { powerLawField } from './power-law-field';
import { gaussLegendre } from './gauss-legendre';
import { expectClose } from '../../../test/support/expect-close';
import { centralDifference } from '../../../test/support/central-difference';

const out = new Float64Array(4);
const dipole = (moment: number, z: number, rho: number): [number, number] => {
  dipoleField(moment, z, rho, out);
  return [out[0]!, out[1]!];
};

describe('dipoleField()', () => {
  it('dipoleField() on the axis is μ0m/(2πz³)', () => {
    // DOMAIN.md §9 row 31: m = π·0.01 A m² → 6.283185311e-6 T at 0.1 m, 6.283185311e-9 T at 1 m
    expectClose(dipole(Math.PI * 0.01, 0.1, 0)[0]!, 6.283185311e-6, { rel: 1e-9 });
    expectClose(dipole(Math.PI * 0.01, 1, 0)[0]!, 6.283185311e-9, { rel: 1e-9 });
  });

  it('dipoleField() in the equatorial plane is −μ0m/(4πr³), half the axial magnitude', () => {
    // DOMAIN.md §1.7
    expectClose(dipole(2, 0, 0.3)[0]!, -dipole(2, 0.3, 0)[0]! / 2, { rel: 1e-15 });
    expect(dipole(2, 0, 0.3)[1]).toBe(0);
  });

  it('dipoleField() over the loop on axis gives the DOMAIN ratios 0.3535533906 … 0.9851853368', () => {
    // DOMAIN.md §9 row 32: (1 + R²/z²)^(−3/2) at z = R, 2R, 5R, 10R
    const expected = [0.3535533906, 0.7155417528, 0.9428660343, 0.9851853368];
    [1, 2, 5, 10].forEach((k, i) => {
      expectClose(loopFieldOnAxis(1, 0.1, 0.1 * k) / dipole(Math.PI * 0.01, 0.1 * k, 0)[0]!, expected[i]!, { abs: 1e-10 });
    });
  });

  it('dipoleField() is within 10 %, 5 %, 1 % of the loop beyond z/R = 3.7071, 5.3616, 12.1963', () => {
    // DOMAIN.md §9 row 33
    for (const [zOverR, level] of [[3.7071, 0.1], [5.3616, 0.05], [12.1963, 0.01]] as const) {
      const ratio = loopFieldOnAxis(1, 1, zOverR) / dipole(Math.PI, zOverR, 0)[0]!;
      expectClose(1 - ratio, level, { rel: 1e-4 });
    }
  });

  it('dipoleField() falls to 0.5 mT, 0.1 mT and 50 µT at the DOMAIN dipole threshold distances', () => {
    // DOMAIN.md §9 row 37: m = 400 A × π (0.05 m)², z_th = (μ0 m/(2π B_th))^(1/3) = 107.912, 184.527, 232.489 mm
    const moment = 400 * Math.PI * 0.05 ** 2;
    for (const [z, level] of [[0.107912, 0.5e-3], [0.184527, 0.1e-3], [0.232489, 50e-6]] as const) {
      expectClose(dipole(moment, z, 0)[0]!, level, { rel: 2e-5 });
    }
  });

  it('dipoleField() returns NaN at the origin', () => {
    // the point dipole is singular there (Jackson 3rd ed. §5.6)
    expect(dipole(1, 0, 0).every(Number.isNaN)).toBe(true);
  });

  it('dipoleFieldGradient() agrees with central differences in z', () => {
    // independent check: finite differences of dipoleField
    for (const [z, rho] of [[0.1, 0], [0.05, 0.07], [-0.2, 0.01]] as const) {
      const [dzBz, dzBr] = centralDifference((t) => dipole(1.5, t, rho), z);
      dipoleFieldGradient(1.5, z, rho, out);
      const size = Math.hypot(out[0]!, out[1]!) / Math.hypot(z, rho);
      expectClose(out[2]!, dzBz!, { abs: 1e-8 * size });
      expectClose(out[3]!, dzBr!, { abs: 1e-8 * size });
    }
  });
});

describe('cylinderMagnetFieldOnAxis() and blockMagnetFieldOnAxis()', () => {
  it('cylinderMagnetFieldOnAxis() matches the DOMAIN check values for B_r = 1.2 T, Ø10 × 10 mm', () => {
    // DOMAIN.md §9 row 34
    const expected = [0.5366563146, 0.144945910118, 0.0454291854872, 0.00975085421209];
    [0, 0.005, 0.01, 0.02].forEach((z, i) => expectClose(cylinderMagnetFieldOnAxis(1.2, 0.005, 0.01, z), expected[i]!, { rel: 1e-10 }));
  });

  it('blockMagnetFieldOnAxis() matches the DOMAIN check values for B_r = 1.2 T, 20 × 10 × 5 mm', () => {
    // DOMAIN.md §9 row 35
    const expected = [0.293677750365, 0.138643811071, 0.0555489135416, 0.0136664880431];
    [0.001, 0.005, 0.01, 0.02].forEach((z, i) => expectClose(blockMagnetFieldOnAxis(1.2, 0.02, 0.01, 0.005, z), expected[i]!, { rel: 1e-10 }));
    // at the pole face a block infinitely thick along the magnetisation reads B_r/2 (the end of a
    // semi-infinite stack of current loops, DOMAIN.md §1.8: the back term vanishes, the near term is π/2);
    // a finite block reads less, and z = 0 (atan2) joins z → 0⁺ continuously
    const face = blockMagnetFieldOnAxis(1.2, 0.02, 0.01, 0.005, 0);
    expect(face).toBeLessThan(0.6);
    expectClose(face, blockMagnetFieldOnAxis(1.2, 0.02, 0.01, 0.005, 1e-12), { rel: 1e-9 });
    expectClose(blockMagnetFieldOnAxis(1.2, 0.02, 0.01, 1e9, 0), 0.6, { rel: 1e-12 });
  });

  it('cylinderMagnetFieldOnAxis() far away is the dipole of m = B_r V/μ0 (1.87558e-5 T at 0.2 m)', () => {
    // DOMAIN.md §1.8: 0.75 A m² for Ø10 × 10 mm, exact 1.87558e-5 T vs dipole 1.875e-5 T at 0.2 m from the centre
    const volume = Math.PI * 0.005 ** 2 * 0.01;
    const moment = (1.2 * volume) / 1.25663706212e-6;
    expectClose(moment, 0.75, { rel: 1e-9 });
    expectClose(cylinderMagnetFieldOnAxis(1.2, 0.005, 0.01, 0.2 - 0.005), 1.87558e-5, { rel: 1e-5 });
    expectClose(dipole(moment, 0.2, 0)[0]!, 1.875e-5, { rel: 1e-9 });
  });
});

describe('powerLawField() and gaussLegendre()', () => {
  it('powerLawField() is amplitude / r^n and NaN for r ≤ 0', () => {
    // DOMAIN.md §1.9 definition
    expectClose(powerLawField(1e-6, 2, 0.1), 1e-4, { rel: 1e-15 });
    expectClose(powerLawField(3e-7, 1.378, 0.05), 3e-7 * 0.05 ** -1.378, { rel: 1e-15 });
    expect(powerLawField(1, 2, 0)).toBeNaN();
  });

  it('gaussLegendre(n) integrates polynomials of degree 2n − 1 exactly and has the A&S nodes', () => {
    // A&S Table 25.4: n = 3 nodes 0, ±0.774596669241483, weights 8/9, 5/9
    const rule = gaussLegendre(3);
    expectClose(rule.nodes[2]!, 0.774596669241483, { rel: 1e-15 });
    expectClose(rule.weights[1]!, 8 / 9, { rel: 1e-15 });
    expectClose(rule.weights[0]!, 5 / 9, { rel: 1e-15 });
    for (const n of [4, 16, 24]) {
      const { nodes, weights } = gaussLegendre(n);
      const degree = 2 * n - 2;
      let sum = 0;
      for (let i = 0; i < n; i++) sum += weights[i]! * nodes[i]! ** degree;
      expectClose(sum, 2 / (degree + 1), { rel: 1e-14 }, `n = ${n}`);
    }
    expect(() => gaussLegendre(0)).toThrow(RangeError);
  });
});
