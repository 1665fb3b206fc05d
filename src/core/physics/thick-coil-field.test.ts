import { describe, expect, it } from 'vitest';
import { radialLog, thickCoilField, thickCoilFieldOnAxis } from './thick-coil-field';
import { thickCoilFieldGradient } from './thick-coil-field-gradient';
import { solenoidField, solenoidFieldOnAxis } from './solenoid-field';
import { loopField } from './loop-field';
import { dipoleField } from './dipole-field';
import { expectClose } from '../../../test/support/expect-close';
import { integrate } from '../../../test/support/biot-savart';
import { centralDifference } from '../../../test/support/central-difference';

const out = new Float64Array(2);
const coil = [500, 0.02, 0.04, 0.05] as const;
const field = (z: number, rho: number, ni = 500, a1 = 0.02, a2 = 0.04, length = 0.05): [number, number] => {
  thickCoilField(ni, a1, a2, length, z, rho, out);
  return [out[0]!, out[1]!];
};

/** Independent: nested adaptive Gauss–Kronrod over the winding cross-section of loop fields. */
const crossSectionIntegral = (z: number, rho: number): number[] => {
  const [ni, a1, a2, length] = coil;
  const loop = new Float64Array(2);
  const density = ni / (length * (a2 - a1));
  return [0, 1].map((index) => {
    const overLength = (radius: number) => integrate((t) => {
      loopField(density, radius, z - t, rho, loop);
      return loop[index]!;
    }, -length / 2, length / 2, 1e-13);
    return rho > a1 && rho < a2
      ? integrate(overLength, a1, rho, 1e-12) + integrate(overLength, rho, a2, 1e-12)
      : integrate(overLength, a1, a2, 1e-12);
  });
};

describe('thickCoilFieldOnAxis()', () => {
  it('thickCoilFieldOnAxis() matches the DOMAIN log-formula check values', () => {
    // DOMAIN.md §9 rows 18–20: N = 500, I = 1 A, a₁ = 0.02 m, a₂ = 0.04 m, L = 0.05 m
    expectClose(thickCoilFieldOnAxis(...coil, 0), 8.11025818787e-3, { rel: 1e-10 });
    expectClose(thickCoilFieldOnAxis(...coil, 0.025), 5.38206558032e-3, { rel: 1e-10 });
    expectClose(thickCoilFieldOnAxis(...coil, 0.05), 1.76991145567e-3, { rel: 1e-10 });
    expectClose(thickCoilFieldOnAxis(...coil, 0.1), 2.79502027672e-4, { rel: 1e-10 });
  });

  it('thickCoilFieldOnAxis() keeps its digits far beyond the ends (no log-formula cancellation)', () => {
    // DOMAIN.md §1.4 far field: dipole m = NIπ⟨r²⟩; the next axial multipole makes B·z³ → m·μ0/2π with
    // a (size/z)² correction, so B(z)·z³ at z = 5 m and 50 m must differ by ≈ 1e-2 of that at 5 m
    const moment = 500 * Math.PI * (0.02 ** 2 + 0.02 * 0.04 + 0.04 ** 2) / 3;
    const scaled = (z: number) => (thickCoilFieldOnAxis(...coil, z) * z ** 3) / ((1.25663706212e-6 * moment) / (2 * Math.PI)) - 1;
    expect(Math.abs(scaled(5))).toBeLessThan(2e-5);
    expectClose(scaled(50), scaled(5) / 100, { rel: 1e-3 });
    expectClose(scaled(500), scaled(5) / 10000, { rel: 1e-2 });
  });

  it('thickCoilFieldOnAxis() tends to the pancake value μ0NI ln(a₂/a₁)/(2(a₂ − a₁)) as L → 0', () => {
    // DOMAIN.md §9 row 21
    expectClose(thickCoilFieldOnAxis(500, 0.02, 0.04, 1e-9, 0), 1.08879304574e-2, { rel: 1e-10 });
  });

  it('thickCoilFieldOnAxis() tends to the thin solenoid as a₂ → a₁', () => {
    // DOMAIN.md §1.4: thin-shell limit recovers §1.3 at the mean radius; difference O((a₂ − a₁)²)
    expectClose(thickCoilFieldOnAxis(100, 0.02, 0.02 * (1 + 1e-4), 0.1, 0.03), solenoidFieldOnAxis(100, 0.02 * (1 + 0.5e-4), 0.1, 0.03), { rel: 1e-9 });
  });

  it('radialLog() is ∫ dr/√(r² + x²) over the winding depth', () => {
    // A&S 3.3.44 (∫ dx/√(x² + a²) = asinh(x/a)); at x = 0 it is ln(a₂/a₁)
    expectClose(radialLog(0.02, 0.04, 0), Math.LN2, { rel: 1e-15 });
    expectClose(radialLog(0.02, 0.04, 0.03), Math.asinh(0.04 / 0.03) - Math.asinh(0.02 / 0.03), { rel: 1e-14 });
  });
});

describe('thickCoilField()', () => {
  it('thickCoilField() meets its 1e-12 accuracy target against cross-section integration, down to 0.1 % of the depth from the winding', () => {
    // independent: nested Gauss–Kronrod of loop fields; target stated in thickCoilField's doc comment
    const depth = 0.02;
    const points: [number, number][] = [
      [0.05, 0.01], [0.03, 0.03], [0.1, 0.1], [0, 0.06], [0.02, 0.0198],
      [0.025 + 0.1 * depth, 0.03], [0.025 + 0.01 * depth, 0.0201], [0.025 + 0.001 * depth, 0.04],
      [0.01, 0.04 + 0.001 * depth], [-0.025 - 0.001 * depth, 0.03],
    ];
    for (const [z, rho] of points) {
      const [bz, br] = field(z, rho);
      const [expectedZ, expectedR] = crossSectionIntegral(z, rho);
      const size = Math.hypot(expectedZ!, expectedR!);
      expectClose(bz!, expectedZ!, { abs: 1e-12 * size }, `B_z at ${z}, ${rho}`);
      expectClose(br!, expectedR!, { abs: 1e-12 * size }, `B_ρ at ${z}, ${rho}`);
    }
  });

  it('thickCoilField() far away is a dipole of moment NIπ(a₁² + a₁a₂ + a₂²)/3 (effective radius 30.5505 mm)', () => {
    // DOMAIN.md §9 row 22 and §1.4: R_eff = √((a₁² + a₁a₂ + a₂²)/3)
    const effectiveRadius = Math.sqrt((0.02 ** 2 + 0.02 * 0.04 + 0.04 ** 2) / 3);
    expectClose(effectiveRadius, 0.0305505, { rel: 2e-6 });
    const dipole = new Float64Array(2);
    for (const angle of [0, 0.9, Math.PI / 2]) {
      const r = 50;
      const [bz, br] = field(r * Math.cos(angle), r * Math.sin(angle));
      dipoleField(500 * Math.PI * effectiveRadius ** 2, r * Math.cos(angle), r * Math.sin(angle), dipole);
      const mismatch = Math.hypot(bz! - dipole[0]!, br! - dipole[1]!) / Math.hypot(dipole[0]!, dipole[1]!);
      expect(mismatch).toBeLessThan(1e-5);
    }
    // the 30 mm mean radius is measurably wrong at the same distance
    dipoleField(500 * Math.PI * 0.03 ** 2, 50, 0, dipole);
    expect(Math.abs(field(50, 0)[0]! / dipole[0]! - 1)).toBeGreaterThan(0.03);
  });

  it('thickCoilField() equals the log formula on the axis and approaches it continuously', () => {
    // DOMAIN.md §1.4
    expect(field(0.03, 0)).toEqual([thickCoilFieldOnAxis(...coil, 0.03), 0]);
    expectClose(field(0.03, 1e-9)[0]!, thickCoilFieldOnAxis(...coil, 0.03), { rel: 1e-14 });
  });

  it('thickCoilField() with a thin winding depth reduces to the thin solenoid at the mean radius off axis', () => {
    // DOMAIN.md §1.11: thick coil (a₂ → a₁) ⊃ thin solenoid; difference O((a₂ − a₁)²)
    const thin = new Float64Array(2);
    solenoidField(100, 0.02 * (1 + 0.5e-5), 0.1, 0.07, 0.03, thin);
    const [bz, br] = field(0.07, 0.03, 100, 0.02, 0.02 * (1 + 1e-5), 0.1);
    expectClose(bz!, thin[0]!, { rel: 1e-9 });
    expectClose(br!, thin[1]!, { rel: 1e-9 });
  });
});

describe('thickCoilFieldGradient()', () => {
  it('thickCoilFieldGradient() agrees with central differences in z, L, a₁ and a₂, on and off axis', () => {
    // independent check: finite differences of the verified field
    const gradient = new Float64Array(10);
    for (const [z, rho] of [[0.03, 0], [0.05, 0], [0.04, 0.01], [0.03, 0.03], [0.1, 0.05], [0.026, 0.03], [-0.02, 0.045]] as const) {
      thickCoilFieldGradient(...coil, z, rho, gradient);
      const size = Math.hypot(gradient[0]!, gradient[1]!) / 0.02;
      const dz = centralDifference((t) => field(t, rho), z, 0.05);
      const dl = centralDifference((t) => field(z, rho, 500, 0.02, 0.04, t), 0.05);
      const d1 = centralDifference((t) => field(z, rho, 500, t, 0.04), 0.02);
      const d2 = centralDifference((t) => field(z, rho, 500, 0.02, t), 0.04);
      [dz[0], dz[1], dl[0], dl[1], d1[0], d1[1], d2[0], d2[1]].forEach((expected, i) =>
        expectClose(gradient[i + 2]!, expected!, { abs: 1e-7 * size }, `entry ${i + 2} at ${z}, ${rho}`));
    }
  });
});
