import { describe, expect, it } from 'vitest';
import { rectangleField, rectangleFieldOnAxis, rectangleFieldOnAxisGradient } from './rectangle-field';
import { addSegmentField, polygonField } from './segment-field';
import { dipoleField } from './dipole-field';
import { expectClose } from '../../../test/support/expect-close';
import { polygonByBiotSavart } from '../../../test/support/biot-savart';
import { centralDifference } from '../../../test/support/central-difference';

const out = new Float64Array(2);
const rectangle = (ni: number, width: number, height: number, z: number, x: number): [number, number] => {
  rectangleField(ni, width, height, z, x, out);
  return [out[0]!, out[1]!];
};

describe('rectangleFieldOnAxis()', () => {
  it('rectangleFieldOnAxis() matches the DOMAIN check values and the square-centre formula 2√2μ0NI/(πs)', () => {
    // DOMAIN.md §9 rows 28–30
    expectClose(rectangleFieldOnAxis(1, 0.2, 0.1, 0), 8.94427191487e-6, { rel: 1e-10 });
    expectClose(rectangleFieldOnAxis(1, 0.2, 0.1, 0.05), 4.57238085568e-6, { rel: 1e-10 });
    expectClose(rectangleFieldOnAxis(1, 0.2, 0.1, 0.1), 1.73333333428e-6, { rel: 1e-10 });
    expectClose(rectangleFieldOnAxis(1, 0.1, 0.1, 0), 1.131370851e-5, { rel: 1e-9 });
  });

  it('rectangleFieldOnAxis() is 4.984e-10 T at 2 m for 0.2 × 0.1 m, near the dipole\'s 5.000e-10 T', () => {
    // DOMAIN.md §1.6 far field: dipole m = N I A B
    expectClose(rectangleFieldOnAxis(1, 0.2, 0.1, 2), 4.984e-10, { rel: 1e-4 });
    const dipole = new Float64Array(2);
    dipoleField(0.02, 2, 0, dipole);
    expectClose(dipole[0]!, 5.0e-10, { rel: 1e-9 });
  });

  it('rectangleFieldOnAxisGradient() agrees with central differences in z, width and height', () => {
    // independent check: finite differences of the closed form
    const gradient = new Float64Array(4);
    for (const z of [0, 0.03, 0.2]) {
      rectangleFieldOnAxisGradient(2, 0.2, 0.1, z, gradient);
      expectClose(gradient[0]!, rectangleFieldOnAxis(2, 0.2, 0.1, z), { rel: 1e-15 });
      const size = gradient[0]! / 0.1;
      expectClose(gradient[1]!, centralDifference((t) => [rectangleFieldOnAxis(2, 0.2, 0.1, t)], z, 0.1)[0]!, { abs: 1e-8 * size });
      expectClose(gradient[2]!, centralDifference((t) => [rectangleFieldOnAxis(2, t, 0.1, z)], 0.2)[0]!, { abs: 1e-8 * size });
      expectClose(gradient[3]!, centralDifference((t) => [rectangleFieldOnAxis(2, 0.2, t, z)], 0.1)[0]!, { abs: 1e-8 * size });
    }
  });
});

describe('rectangleField()', () => {
  it('rectangleField() off axis agrees with adaptive quadrature of the Biot–Savart integrand', () => {
    // independent: Gauss–Kronrod along each side (test/support/biot-savart.ts), not the segment closed form
    const corners = [[-0.1, -0.05], [0.1, -0.05], [0.1, 0.05], [-0.1, 0.05]] as const;
    for (const [z, x] of [[0.05, 0.03], [0.01, 0.099], [0.2, 0.4], [-0.03, 0.15]] as const) {
      const [bz, bx] = rectangle(3, 0.2, 0.1, z, x);
      const [expectedX, expectedY, expectedZ] = polygonByBiotSavart(3, corners, x, 0, z);
      const size = Math.hypot(expectedX, expectedZ);
      expectClose(bz!, expectedZ, { abs: 1e-12 * size }, `B_z at ${z}, ${x}`);
      expectClose(bx!, expectedX, { abs: 1e-12 * size }, `B_x at ${z}, ${x}`);
      // mirror symmetry y → −y: no B_y on the width axis
      expect(Math.abs(expectedY)).toBeLessThan(1e-12 * size);
    }
  });

  it('rectangleField() far away is a dipole of moment NI·width·height, error ∝ (size/r)²', () => {
    // DOMAIN.md §1.6 far field
    const dipole = new Float64Array(2);
    for (const angle of [0, 0.6, Math.PI / 2]) {
      for (const r of [20, 200]) {
        const [bz, bx] = rectangle(1, 0.2, 0.1, r * Math.cos(angle), r * Math.sin(angle));
        dipoleField(0.02, r * Math.cos(angle), r * Math.sin(angle), dipole);
        const mismatch = Math.hypot(bz! - dipole[0]!, bx! - dipole[1]!) / Math.hypot(dipole[0]!, dipole[1]!);
        expect(mismatch).toBeLessThan(30 * (0.1 / r) ** 2);
      }
    }
  });

  it('rectangleField() just off the axis continues the on-axis closed form', () => {
    // DOMAIN.md §1.6
    expect(rectangle(1, 0.2, 0.1, 0.05, 0)).toEqual([rectangleFieldOnAxis(1, 0.2, 0.1, 0.05), 0]);
    expectClose(rectangle(1, 0.2, 0.1, 0.05, 1e-9)[0]!, rectangleFieldOnAxis(1, 0.2, 0.1, 0.05), { rel: 1e-14 });
  });
});

describe('addSegmentField()', () => {
  it('addSegmentField() of a straight wire is μ0I/(4πd)·2L/√(L² + d²) and keeps digits 1 µm from the wire', () => {
    // Biot–Savart for a finite straight wire of half-length L, midplane (Griffiths 4th ed. Example 5.5)
    const field = new Float64Array(3);
    for (const d of [0.1, 1e-6]) {
      field.fill(0);
      addSegmentField(2, -1000, 0, 0, 1000, 0, 0, 0, d, 0, field);
      expectClose(field[2]!, ((1.25663706212e-6 * 2) / (4 * Math.PI * d)) * (2000 / Math.sqrt(1e6 + d * d)), { rel: 1e-12 });
      expect(field[0]).toBe(0);
    }
  });

  it('addSegmentField() is zero on the line beyond the segment and NaN on the wire', () => {
    // Biot–Savart: dl ∥ r gives no field
    const field = new Float64Array(3);
    addSegmentField(1, 0, 0, 0, 1, 0, 0, 2, 0, 0, field);
    expect(Array.from(field)).toEqual([0, 0, 0]);
    addSegmentField(1, 0, 0, 0, 1, 0, 0, 0.5, 0, 0, field);
    expect(Array.from(field).every(Number.isNaN)).toBe(true);
  });

  it('polygonField() of a regular 4096-gon approaches the circular loop centre field μ0NI/(2R)', () => {
    // DOMAIN.md §1.1 centre value; a regular n-gon inscribed in R gives μ0NI n tan(π/n)/(2πR)
    const n = 4096;
    const vertices = new Float64Array(2 * n);
    for (let i = 0; i < n; i++) {
      vertices[2 * i] = 0.1 * Math.cos((2 * Math.PI * i) / n);
      vertices[2 * i + 1] = 0.1 * Math.sin((2 * Math.PI * i) / n);
    }
    const field = new Float64Array(3);
    polygonField(1, vertices, 0, 0, 0, field);
    expectClose(field[2]!, (1.25663706212e-6 * n * Math.tan(Math.PI / n)) / (2 * Math.PI * 0.1), { rel: 1e-12 });
  });
});
