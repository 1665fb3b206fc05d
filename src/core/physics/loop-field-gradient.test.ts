import { describe, expect, it } from 'vitest';
import { loopField } from './loop-field';
import { loopFieldGradient } from './loop-field-gradient';
import { expectClose } from '../../../test/support/expect-close';
import { centralDifference } from '../../../test/support/central-difference';

const gradient = new Float64Array(7);
const out = new Float64Array(2);
const at = (radius: number, z: number, rho: number): [number, number] => {
  loopField(1, radius, z, rho, out);
  return [out[0]!, out[1]!];
};

describe('loopFieldGradient()', () => {
  it('loopFieldGradient() matches mpmath derivatives of the closed form, near axis, near wire and far', () => {
    // computed with mpmath 1.3.0 (mp.dps = 50): mp.diff of DOMAIN.md §1.2 B_z, B_ρ in z, ρ and a; a = 0.1 m, NI = 1 A
    const reference: [z: number, rho: number, dzBz: number, dzBr: number, drBr: number, daBz: number, daBr: number][] = [
      [0.001, 0.099, -0.10100774139652339, -3.8064868067521027e-5, 0.099992974642404402, -1.0995729786477542e-5, -0.099997283333878029],
      [0.03, 0.05, -9.0103904908447393e-5, 1.6591235221907643e-5, 5.7329657661298088e-5, -4.1623097175029458e-5, -5.0029323020795999e-5],
      [0.0001, 0.098, -0.0050509388060348473, 0.050090625989580129, 0.0049995695337231283, -0.050141930018269182, -0.0050000106559037718],
      [10, 0.05, -1.8842489563979503e-12, -1.8840723190985056e-14, 9.4206560940171487e-13, 1.2561659689691583e-10, 9.4194784089953033e-13],
      [0.02, 0.001, -3.4189308422641911e-5, 6.9021036725139008e-7, 1.7097459345828466e-5, -5.2414511448179064e-5, -4.7993515767669721e-7],
      [0.3, 0.01, -1.7808633178665932e-6, -1.0401131560160579e-7, 8.8859217059646939e-7, 3.3712815393929589e-6, 1.3394761501815803e-7],
    ];
    for (const [z, rho, ...expected] of reference) {
      loopFieldGradient(1, 0.1, z, rho, gradient);
      const actual = [gradient[2]!, gradient[3]!, gradient[4]!, gradient[5]!, gradient[6]!];
      const size = Math.max(...expected.map(Math.abs));
      actual.forEach((value, i) => expectClose(value, expected[i]!, { abs: 1e-13 * size }, `entry ${i} at z = ${z}, ρ = ${rho}`));
    }
  });

  it('loopFieldGradient() agrees with central differences of loopField in z, ρ and a', () => {
    // independent check: finite differences of the (separately verified) field
    const points: [number, number][] = [[0.04, 0], [0.07, 1e-7], [0.07, 3e-3], [0.02, 0.06], [-0.05, 0.14], [0.4, -0.2]];
    for (const [z, rho] of points) {
      loopFieldGradient(1, 0.1, z, rho, gradient);
      const size = Math.hypot(gradient[0]!, gradient[1]!) / 0.1;
      const dz = centralDifference((t) => at(0.1, t, rho), z, 0.1);
      const da = centralDifference((t) => at(t, z, rho), 0.1);
      expectClose(gradient[2]!, dz[0]!, { abs: 1e-7 * size }, `∂B_z/∂z at ${z}, ${rho}`);
      expectClose(gradient[3]!, dz[1]!, { abs: 1e-7 * size }, `∂B_ρ/∂z at ${z}, ${rho}`);
      expectClose(gradient[5]!, da[0]!, { abs: 1e-7 * size }, `∂B_z/∂a at ${z}, ${rho}`);
      expectClose(gradient[6]!, da[1]!, { abs: 1e-7 * size }, `∂B_ρ/∂a at ${z}, ${rho}`);
      if (rho !== 0) {
        const dr = centralDifference((t) => at(0.1, z, t), rho, 0.1);
        expectClose(gradient[3]!, dr[0]!, { abs: 1e-7 * size }, `∂B_z/∂ρ at ${z}, ${rho}`);
        expectClose(gradient[4]!, dr[1]!, { abs: 1e-7 * size }, `∂B_ρ/∂ρ at ${z}, ${rho}`);
      }
    }
  });

  it('loopFieldGradient() on axis is −3μ0NI a² z/(2 s⁵) with ∂B_ρ/∂ρ = −½ ∂B_z/∂z', () => {
    // derivative of DOMAIN.md §1.1; ∇·B = 0 on the axis
    loopFieldGradient(1, 0.1, 0.05, 0, gradient);
    const s2 = 0.1 * 0.1 + 0.05 * 0.05;
    expectClose(gradient[2]!, (-3 * 1.25663706212e-6 * 0.01 * 0.05) / (2 * s2 * s2 * Math.sqrt(s2)), { rel: 1e-14 });
    expectClose(gradient[4]!, -0.5 * gradient[2]!, { rel: 1e-14 });
    expect(Math.abs(gradient[1]!)).toBe(0);
    expect(Math.abs(gradient[3]!)).toBe(0);
  });
});
