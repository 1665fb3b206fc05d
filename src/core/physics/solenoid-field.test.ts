import { describe, expect, it } from 'vitest';
import { solenoidField, solenoidFieldOnAxis } from './solenoid-field';
import { solenoidFieldGradient } from './solenoid-field-gradient';
import { loopField } from './loop-field';
import { dipoleField } from './dipole-field';
import { expectClose } from '../../../test/support/expect-close';
import { integrate } from '../../../test/support/biot-savart';
import { centralDifference } from '../../../test/support/central-difference';

const out = new Float64Array(2);
const field = (ampereTurns: number, radius: number, length: number, z: number, rho: number): [number, number] => {
  solenoidField(ampereTurns, radius, length, z, rho, out);
  return [out[0]!, out[1]!];
};

/** Independent: adaptive Gauss–Kronrod integral of loop fields over the length. */
const stackOfLoops = (ampereTurns: number, radius: number, length: number, z: number, rho: number) => {
  const loop = new Float64Array(2);
  const component = (index: number) => integrate((t) => {
    loopField(ampereTurns / length, radius, z - t, rho, loop);
    return loop[index]!;
  }, -length / 2, length / 2, 1e-14);
  return [component(0), component(1)];
};

describe('solenoidFieldOnAxis()', () => {
  it('solenoidFieldOnAxis() matches the DOMAIN check values at the centre, the end face and outside', () => {
    // DOMAIN.md §9 rows 14–16: N = 100, I = 1 A, R = 0.02 m, L = 0.1 m
    expectClose(solenoidFieldOnAxis(100, 0.02, 0.1, 0), 1.16675822108e-3, { rel: 1e-10 });
    expectClose(solenoidFieldOnAxis(100, 0.02, 0.1, 0.05), 6.16117009736e-4, { rel: 1e-10 });
    expectClose(solenoidFieldOnAxis(100, 0.02, 0.1, 0.1), 3.94277479621e-5, { rel: 1e-10 });
  });

  it('solenoidFieldOnAxis() tends to μ0 n I for a long coil', () => {
    // DOMAIN.md §9 row 17: n = 1000 /m, I = 1 A → 1.25663706212e-3 T; R/L = 1e-4 leaves 2e-8
    expectClose(solenoidFieldOnAxis(1e5, 0.01, 100, 0), 1.25663706212e-3, { rel: 3e-8 });
  });
});

describe('solenoidField()', () => {
  it('solenoidField() off axis agrees with mpmath integration of loop fields over the length', () => {
    // computed with mpmath 1.3.0 (dps 30): quad over t of the §1.2 loop field; N·I = 100 A, R = 0.02 m, L = 0.1 m
    const reference: [z: number, rho: number, bz: number, br: number][] = [
      [0.03, 0.01, 1.074555732377212e-3, 4.931193774059803e-5],
      [0.08, 0.03, 4.380531354925193e-5, 4.137547591138504e-5],
      [0, 0.05, -3.599918794576265e-5, 0],
      [0.2, 0.1, 1.605244796105755e-6, 1.481188225483741e-6],
      [-0.06, 0.019, 1.837003444038686e-4, -1.748889932385124e-4],
      [0.03, 1e-9, 1.053846804667887e-3, 5.329501282114512e-12],
      [5, 0.1, 2.00856121049004e-10, 6.027596153038538e-12],
    ];
    for (const [z, rho, bz, br] of reference) {
      const [actualZ, actualR] = field(100, 0.02, 0.1, z, rho);
      const size = Math.hypot(bz, br);
      // far away (z = 250 R) the two end terms cancel: error ≈ 1e-16·(z/L)² (documented)
      const tolerance = z > 1 ? 1e-11 : 1e-14;
      expectClose(actualZ, bz, { abs: tolerance * size }, `B_z at ${z}, ${rho}`);
      expectClose(actualR, br, { abs: tolerance * size }, `B_ρ at ${z}, ${rho}`);
    }
  });

  it('solenoidField() agrees with adaptive integration of loops near the winding and its rims', () => {
    // independent: Gauss–Kronrod over the length of the Biot–Savart-verified loop field
    for (const [z, rho] of [[0.05, 0.0201], [0.051, 0.02], [0.03, 0.0199], [0.2, 0.1], [-0.01, 0.004]] as const) {
      const [bz, br] = field(100, 0.02, 0.1, z, rho);
      const [expectedZ, expectedR] = stackOfLoops(100, 0.02, 0.1, z, rho);
      const size = Math.hypot(expectedZ!, expectedR!);
      expectClose(bz, expectedZ!, { abs: 1e-13 * size }, `B_z at ${z}, ${rho}`);
      expectClose(br, expectedR!, { abs: 1e-13 * size }, `B_ρ at ${z}, ${rho}`);
    }
  });

  it('solenoidField() tends to the dipole of moment NIπR² far away, error ∝ (size/r)²', () => {
    // DOMAIN.md §1.3: far field is a dipole with m = N I π R²
    const dipole = new Float64Array(2);
    for (const angle of [0, 0.7, Math.PI / 2]) {
      const r = 100 * 0.1;
      const [bz, br] = field(100, 0.02, 0.1, r * Math.cos(angle), r * Math.sin(angle));
      dipoleField(100 * Math.PI * 0.02 * 0.02, r * Math.cos(angle), r * Math.sin(angle), dipole);
      const mismatch = Math.hypot(bz - dipole[0]!, br - dipole[1]!) / Math.hypot(dipole[0]!, dipole[1]!);
      expect(mismatch).toBeLessThan(5e-4);
      expect(mismatch).toBeGreaterThan(1e-6);
    }
  });

  it('solenoidField() on the axis equals solenoidFieldOnAxis() and is the limit ρ → 0', () => {
    // DOMAIN.md §1.3
    expect(field(100, 0.02, 0.1, 0.03, 0)).toEqual([solenoidFieldOnAxis(100, 0.02, 0.1, 0.03), 0]);
    expectClose(field(100, 0.02, 0.1, 0.03, 1e-12)[0]!, solenoidFieldOnAxis(100, 0.02, 0.1, 0.03), { rel: 1e-15 });
  });

  it('solenoidField() reduces to a loop as the length shrinks', () => {
    // DOMAIN.md §1.11: loop ⊂ thin solenoid (L → 0); difference O(L²)
    const loop = new Float64Array(2);
    loopField(3, 0.05, 0.02, 0.03, loop);
    const [bz, br] = field(3, 0.05, 1e-5, 0.02, 0.03);
    expectClose(bz!, loop[0]!, { rel: 1e-7 });
    expectClose(br!, loop[1]!, { rel: 1e-7 });
  });
});

describe('solenoidFieldGradient()', () => {
  it('solenoidFieldGradient() agrees with central differences in z, L and a', () => {
    // independent check: finite differences of the verified field
    const gradient = new Float64Array(8);
    for (const [z, rho] of [[0.03, 0], [0.07, 0], [0.04, 0.01], [0.03, 0.03], [0.1, 0.05], [-0.02, -0.045]] as const) {
      solenoidFieldGradient(100, 0.02, 0.1, z, rho, gradient);
      const size = Math.hypot(gradient[0]!, gradient[1]!) / 0.02;
      const dz = centralDifference((t) => field(100, 0.02, 0.1, t, rho), z, 0.1);
      const dl = centralDifference((t) => field(100, 0.02, t, z, rho), 0.1);
      const da = centralDifference((t) => field(100, t, 0.1, z, rho), 0.02);
      [dz[0], dz[1], dl[0], dl[1], da[0], da[1]].forEach((expected, i) =>
        expectClose(gradient[i + 2]!, expected!, { abs: 1e-7 * size }, `entry ${i + 2} at ${z}, ${rho}`));
    }
  });
});
