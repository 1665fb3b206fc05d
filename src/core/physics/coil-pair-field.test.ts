import { describe, expect, it } from 'vitest';
import { coilPairField, coilPairFieldGradient } from './coil-pair-field';
import { dipoleField } from './dipole-field';
import { vacuumPermeability } from './vacuum-permeability';
import { expectClose } from '../../../test/support/expect-close';
import { loopByBiotSavart } from '../../../test/support/biot-savart';
import { centralDifference } from '../../../test/support/central-difference';

const out = new Float64Array(2);
const pair = (ni: number, radius: number, separation: number, z: number, rho: number, sense: 1 | -1 = 1): [number, number] => {
  coilPairField(ni, radius, separation, z, rho, out, sense);
  return [out[0]!, out[1]!];
};

describe('coilPairField()', () => {
  it('coilPairField() gives the Helmholtz centre field (4/5)^(3/2) μ0NI/R', () => {
    // DOMAIN.md §9 rows 23–25
    expectClose(pair(1, 0.1, 0.1, 0, 0)[0]!, 8.991762861e-6, { rel: 1e-9 });
    expectClose(pair(100, 0.15, 0.15, 0, 0)[0]!, 5.994508574e-4, { rel: 1e-9 });
    expectClose(pair(1, 1, 1, 0, 0)[0]! / vacuumPermeability, 0.7155417528, { rel: 1e-10 });
  });

  it('coilPairField() in Helmholtz spacing is flat to −1.1394e-4 at 0.1R and −1.7635e-3 at 0.2R', () => {
    // DOMAIN.md §9 row 26
    const centre = pair(1, 0.1, 0.1, 0, 0)[0]!;
    const near = pair(1, 0.1, 0.1, 0.01, 0)[0]! / centre - 1;
    const far = pair(1, 0.1, 0.1, 0.02, 0)[0]! / centre - 1;
    expectClose(near, -1.1394e-4, { rel: 1e-4 });
    expectClose(far, -1.7635e-3, { rel: 1e-4 });
    // fourth-order flatness (DOMAIN.md §1.5): doubling z multiplies the deviation by ≈ 2⁴ = 16
    // (15.48 from row 26, the sixth-order term pulling it below 16), not by 2² = 4
    expectClose(far / near, 1.7635e-3 / 1.1394e-4, { rel: 2e-4 });
    expect(far / near).toBeGreaterThan(15);
  });

  it('coilPairField() opposing (anti-Helmholtz) is zero at the centre and falls with local exponent 3.9663 at 10R', () => {
    // DOMAIN.md §9 row 27 and §1.5: far field ∝ z⁻⁴
    expect(pair(1, 0.1, 0.1, 0, 0, -1)[0]).toBe(0);
    const exponent = (z: number) => {
      const h = 1e-4 * z;
      return -(Math.log(Math.abs(pair(1, 0.1, 0.1, z + h, 0, -1)[0]!)) - Math.log(Math.abs(pair(1, 0.1, 0.1, z - h, 0, -1)[0]!))) /
        (Math.log(z + h) - Math.log(z - h));
    };
    expectClose(exponent(1), 3.9663, { abs: 1e-4 });
    expectClose(exponent(2), 3.9916, { abs: 1e-4 });
  });

  it('coilPairField() off axis equals the sum of two Biot–Savart loops', () => {
    // independent: direct trapezoid Biot–Savart integration (test/support/biot-savart.ts)
    for (const [z, rho] of [[0.02, 0.03], [0.07, 0.12], [-0.3, 0.05]] as const) {
      const [bz, br] = pair(2, 0.1, 0.08, z, rho);
      const upper = loopByBiotSavart(2, 0.1, z - 0.04, rho);
      const lower = loopByBiotSavart(2, 0.1, z + 0.04, rho);
      const size = Math.hypot(upper[0] + lower[0], upper[1] + lower[1]);
      expectClose(bz!, upper[0] + lower[0], { abs: 1e-12 * size });
      expectClose(br!, upper[1] + lower[1], { abs: 1e-12 * size });
    }
  });

  it('coilPairField() far away is a dipole of twice one loop\'s moment', () => {
    // DOMAIN.md §1.5 "far-field moment" and §1.11
    const dipole = new Float64Array(2);
    for (const angle of [0, 1.1, Math.PI / 2]) {
      const r = 20;
      const [bz, br] = pair(1, 0.1, 0.1, r * Math.cos(angle), r * Math.sin(angle));
      dipoleField(2 * Math.PI * 0.01, r * Math.cos(angle), r * Math.sin(angle), dipole);
      expect(Math.hypot(bz! - dipole[0]!, br! - dipole[1]!) / Math.hypot(dipole[0]!, dipole[1]!)).toBeLessThan(1e-4);
    }
  });

  it('coilPairFieldGradient() agrees with central differences in z, R and separation', () => {
    // independent check: finite differences of the verified field
    const gradient = new Float64Array(8);
    for (const [z, rho] of [[0, 0], [0.03, 0], [0.02, 0.05], [0.2, 0.15]] as const) {
      coilPairFieldGradient(3, 0.1, 0.12, z, rho, gradient);
      const size = Math.hypot(gradient[0]!, gradient[1]!) / 0.1;
      const dz = centralDifference((t) => pair(3, 0.1, 0.12, t, rho), z, 0.1);
      const da = centralDifference((t) => pair(3, t, 0.12, z, rho), 0.1);
      const dd = centralDifference((t) => pair(3, 0.1, t, z, rho), 0.12);
      [dz[0], dz[1], da[0], da[1], dd[0], dd[1]].forEach((expected, i) =>
        expectClose(gradient[i + 2]!, expected!, { abs: 1e-7 * size }, `entry ${i + 2} at ${z}, ${rho}`));
    }
  });
});
