import { describe, expect, it } from 'vitest';
import { bulkParameterLimit, loopField, loopFieldOnAxis } from './loop-field';
import { dipoleField } from './dipole-field';
import { vacuumPermeability } from './vacuum-permeability';
import { expectClose } from '../../../test/support/expect-close';
import { loopByBiotSavart } from '../../../test/support/biot-savart';

const out = new Float64Array(2);
const field = (ampereTurns: number, radius: number, z: number, rho: number): [number, number] => {
  loopField(ampereTurns, radius, z, rho, out);
  return [out[0]!, out[1]!];
};

describe('loopFieldOnAxis()', () => {
  it('loopFieldOnAxis() equals μ0·NI·R²/(2(R²+z²)^1.5) at the DOMAIN check points', () => {
    // DOMAIN.md §9 rows 1–5 (mpmath, CODATA 2018 μ0)
    expectClose(loopFieldOnAxis(1, 0.1, 0), 6.2831853106e-6, { rel: 1e-10 });
    expectClose(loopFieldOnAxis(1, 0.1, 0.1), 2.2214414703e-6, { rel: 1e-10 });
    expectClose(loopFieldOnAxis(1, 0.1, 0.2), 5.619851788e-7, { rel: 1e-9 });
    expectClose(loopFieldOnAxis(1, 0.1, 1), 6.190102037e-9, { rel: 1e-9 });
    expectClose(loopFieldOnAxis(10, 0.1, 0), 6.2831853106e-5, { rel: 1e-10 });
  });

  it('loopFieldOnAxis() halves at z = 0.7664209365 R', () => {
    // DOMAIN.md §9 row 6: z½ = R√(2^(2/3) − 1)
    expectClose(loopFieldOnAxis(1, 0.05, 0.7664209365 * 0.05) / loopFieldOnAxis(1, 0.05, 0), 0.5, { rel: 1e-10 });
  });

  it('loopFieldOnAxis() falls to the threshold levels at the DOMAIN threshold distances', () => {
    // DOMAIN.md §9 row 36: NI = 400 A, R = 50 mm → 0.5 mT at 95.630 mm, 0.1 mT at 177.624 mm, 50 µT at 227.049 mm
    expectClose(loopFieldOnAxis(400, 0.05, 0.09563), 0.5e-3, { rel: 2e-5 });
    expectClose(loopFieldOnAxis(400, 0.05, 0.177624), 0.1e-3, { rel: 1e-5 });
    expectClose(loopFieldOnAxis(400, 0.05, 0.227049), 50e-6, { rel: 1e-5 });
  });
});

describe('loopField()', () => {
  it('loopField() off axis matches the DOMAIN elliptic-integral check values', () => {
    // DOMAIN.md §9 row 7 (quadrature-checked)
    expectClose(field(1, 0.1, 0.05, 0.05)[1], 1.616890842e-6, { rel: 1e-9 });
    expectClose(field(1, 0.1, 0.05, 0.05)[0], 4.345848938e-6, { rel: 1e-9 });
    // DOMAIN.md §9 row 8: in the loop plane inside, B_ρ = 0 exactly
    expect(field(1, 0.1, 0, 0.05)).toEqual([expect.closeTo(7.826465121e-6, 15), 0]);
    expectClose(field(1, 0.1, 0, 0.05)[0], 7.826465121e-6, { rel: 1e-9 });
    // DOMAIN.md §9 row 9: outside in the plane the field is reversed
    expectClose(field(1, 0.1, 0, 0.15)[0], -1.789118915e-6, { rel: 1e-9 });
    // DOMAIN.md §9 row 10
    expectClose(field(1, 0.1, 0.1, 0.2)[1], 4.042227104e-7, { rel: 1e-9 });
    expectClose(field(1, 0.1, 0.1, 0.2)[0], -6.310294832e-8, { rel: 1e-9 });
    // DOMAIN.md §9 row 11: above the wire
    expectClose(field(1, 0.1, 0.05, 0.1)[1], 3.293511623e-6, { rel: 1e-9 });
    expectClose(field(1, 0.1, 0.05, 0.1)[0], 1.708765523e-6, { rel: 1e-9 });
    // DOMAIN.md §9 row 12: near the wire, m = 0.9999747481
    expectClose(field(1, 0.1, 0, 0.099)[0], 2.067288059e-4, { rel: 1e-9 });
    // DOMAIN.md §9 row 13: paraxial B_ρ at ρ = 1e-6 m
    expectClose(field(1, 0.1, 0.05, 1e-6)[1], 2.697528858e-11, { rel: 1e-9 });
  });

  it('loopField() agrees with mpmath at 50 digits near the axis, near the wire and far away', () => {
    // computed with mpmath 1.3.0, mp.dps = 50, DOMAIN.md §1.2 closed form with ellipk/ellipe; a = 0.1 m, NI = 1 A
    const reference: [z: number, rho: number, bz: number, br: number][] = [
      [0.05, 1e-3, 4.495881410889533e-6, 2.6977446635169075e-8],
      [0.05, 1e-5, 4.4958814303135131e-6, 2.697528879768339e-10],
      [0.05, 3e-5, 4.4958814303134976e-6, 8.0925871572305645e-10],
      [0.03, 2e-4, 5.5212933678648041e-6, 4.5588840412797203e-9],
      [1.0, 1e-3, 6.1900838778077252e-9, 9.1931984853459201e-12],
      [10, 0.05, 6.2817719104474671e-12, 4.7109167349811772e-14],
      [1000, 0.1, 6.2831850278566735e-18, 9.4247774946611239e-22],
      [1000, 100, 6.0981697407756822e-18, 9.1932206229147784e-19],
      [0, 1000, -3.1415926906429181e-18, 0],
      [1e5, 3e4, 4.8374556378749016e-24, 2.2794293581586847e-24],
      [1e-4, 0.098, 1.0581674872864166e-4, 5.0341886865484623e-6],
      [1e-4, 0.0999999, 9.9871992564576893e-6, 1.9999928856853616e-3],
      [1e-5, 0.1, 1.0289781900589184e-5, 1.999999922665387e-2],
      [0.05, 0.0999, 1.7173796686650786e-6, 3.2946375258041799e-6],
      [0.02, 0.3, -1.2948179261094306e-7, 2.8611015520442524e-8],
      [-0.04, 0.07, 4.8069867358897552e-6, -2.9576075087298513e-6],
      // m ≈ 0.9 (the old switch between the rearranged and the textbook brackets)
      [0.01, 0.052645849157390776, 7.7659556244255486e-6, 8.6760179789080034e-7],
      [0.01, 0.052683238532723276, 7.7688598479997247e-6, 8.6905879830915117e-7],
      // 0.9 < m < 0.999: loopFieldBulk's three unrolled AGM steps and series (m in the comment)
      [0.01, 0.06452559316477505, 8.962668780788293e-6, 1.5469850737321347e-6], // m = 0.95
      [0.004, 0.0822181410102255, 1.4875897291265019e-5, 2.5418087403999047e-6], // m = 0.99
      [-0.002, 0.08693324127890949, 1.9383824543405769e-5, -2.3960758237548179e-6], // m = 0.995
      [0.0015, 0.09375131963945715, 3.5225079857136737e-5, 7.4537890807587257e-6], // m = 0.9989
      // either side of the m = 0.999 switch between loopFieldBulk and the textbook brackets
      [0.002, 0.09419351781154074, 3.5732539065804836e-5, 1.0862097930910271e-5], // m = 0.998999997
      [0.002, 0.09419353665024618, 3.5732619562681375e-5, 1.0862160197110061e-5], // m = 0.999000003
    ];
    for (const [z, rho, bz, br] of reference) {
      const [actualZ, actualR] = field(1, 0.1, z, rho);
      const size = Math.hypot(bz, br);
      expectClose(actualZ, bz, { abs: 1e-14 * size }, `B_z at z = ${z}, ρ = ${rho}`);
      expectClose(actualR, br, { abs: 1e-14 * size }, `B_ρ at z = ${z}, ρ = ${rho}`);
    }
  });

  it('loopField() agrees with direct Biot–Savart integration, including near the wire and at 100 R', () => {
    // independent: trapezoid rule on the Biot–Savart integrand (test/support/biot-savart.ts)
    const radius = 0.1;
    const points: [z: number, rho: number][] = [
      [0.001 * radius, 0.98 * radius],
      [100 * radius, 0],
      [100 * radius, 30 * radius],
      [0.3 * radius, 0.5 * radius],
      [-0.7 * radius, 1.6 * radius],
      [0.01 * radius, 1.02 * radius],
    ];
    for (const [z, rho] of points) {
      const [bz, br] = field(2.5, radius, z, rho);
      const [expectedZ, expectedR] = loopByBiotSavart(2.5, radius, z, rho);
      const size = Math.hypot(expectedZ, expectedR);
      expectClose(bz, expectedZ, { abs: 2e-12 * size }, `B_z at z = ${z}, ρ = ${rho}`);
      expectClose(br, expectedR, { abs: 2e-12 * size }, `B_ρ at z = ${z}, ρ = ${rho}`);
    }
  });

  it('loopField() tends to the dipole field of moment NIπR² far away, with error ∝ (R/r)²', () => {
    // DOMAIN.md §1.7 and §1.11: every finite source → dipole; the next multipole is (R/r)² smaller
    const dipole = new Float64Array(2);
    for (const angle of [0, Math.PI / 5, Math.PI / 2.5, Math.PI / 2]) {
      for (const distance of [100, 1000]) {
        const radius = 0.1;
        const z = distance * radius * Math.cos(angle);
        const rho = distance * radius * Math.sin(angle);
        const [bz, br] = field(3, radius, z, rho);
        dipoleField(3 * Math.PI * radius * radius, z, rho, dipole);
        const size = Math.hypot(dipole[0]!, dipole[1]!);
        const mismatch = Math.hypot(bz - dipole[0]!, br - dipole[1]!) / size;
        expect(mismatch).toBeLessThan(3 / (distance * distance));
        expect(mismatch).toBeGreaterThan(0.1 / (distance * distance));
      }
    }
  });

  it('loopField() equals the on-axis formula at ρ = 0 and joins the paraxial series smoothly', () => {
    // DOMAIN.md §1.2: ρ = 0 branch explicit; §1.1 for the value
    expect(field(1, 0.1, 0.03, 0)).toEqual([loopFieldOnAxis(1, 0.1, 0.03), 0]);
    // just inside and just outside the paraxial switch (ρ² = 1e-8 (a² + z²)) the two forms agree
    const s = Math.hypot(0.1, 0.03);
    const inside = field(1, 0.1, 0.03, 0.99999e-4 * s);
    const outside = field(1, 0.1, 0.03, 1.00001e-4 * s);
    expectClose(outside[1] / inside[1], 1.00001 / 0.99999, { rel: 1e-12 });
    expectClose(outside[0], inside[0], { rel: 1e-12 });
  });

  it('loopField() reads a negative radial offset as the mirror point: B_x = −B_ρ', () => {
    // axial symmetry (DOMAIN.md §1.2, B_φ = 0)
    const [bz, br] = field(1, 0.1, 0.04, 0.07);
    expect(field(1, 0.1, 0.04, -0.07)).toEqual([bz, -br]);
  });

  it('loopField() returns NaN exactly on the wire and approaches μ0I/(2πd) next to it', () => {
    // DOMAIN.md §1.2: at d = 10 µm from a 0.1 m loop (inside, in its plane) 0.020011 T vs 0.020000 T straight-wire
    expect(field(1, 0.1, 0, 0.1).every(Number.isNaN)).toBe(true);
    const [bz, br] = field(1, 0.1, 0, 0.1 - 1e-5);
    expectClose(bz, 0.020011, { rel: 2e-5 });
    expect(br).toBe(0);
    expectClose(vacuumPermeability / (2 * Math.PI * 1e-5), 0.02, { rel: 1e-9 });
    // above the wire the straight-wire field is radial
    expectClose(field(1, 0.1, 1e-5, 0.1)[1], 0.02, { rel: 1e-6 });
  });

  it('loopField() is linear in ampere-turns and scales as 1/size', () => {
    // Biot–Savart: B ∝ I, and B(λ·geometry) = B/λ (common practice: dimensional analysis)
    const [bz, br] = field(1, 0.1, 0.02, 0.03);
    const [bz2, br2] = field(-7, 0.3, 0.06, 0.09);
    expectClose(bz2, (-7 * bz) / 3, { rel: 1e-14 });
    expectClose(br2, (-7 * br) / 3, { rel: 1e-14 });
  });

  it('loopField() puts the m = 0.999 switch where it says', () => {
    // the two mpmath points above straddle it; check they really fall on either side
    for (const [rho, below] of [[0.09419351781154074, true], [0.09419353665024618, false]] as const) {
      const a = 0.1;
      const q = (a + rho) ** 2 + 0.002 ** 2;
      expect(4 * a * rho <= bulkParameterLimit * q).toBe(below);
    }
  });
});
