import { describe, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { getModel } from '../../models';
import { farFieldMoment, momentEstimate } from './far-field-moment';
import { expect } from 'vitest';

describe('farFieldMoment(model, params)', () => {
  it('farFieldMoment() of a loop is N·I·π·R² (DOMAIN.md §1.11, §7.6)', () => {
    expectClose(farFieldMoment(getModel('loop'), [400, 0.05, 0.003, 2e-5])!, 400 * Math.PI * 0.05 ** 2, { rel: 1e-6 });
  });

  it('farFieldMoment() of a thin solenoid is N·I·π·R², whatever its length (DOMAIN.md §1.11)', () => {
    expectClose(farFieldMoment(getModel('solenoid'), [800, 0.03, 0.08, 0, 0])!, 800 * Math.PI * 0.03 ** 2, { rel: 1e-6 });
  });

  it('farFieldMoment() of a coaxial pair is 2·N·I·π·R² (two loops, DOMAIN.md §1.5)', () => {
    expectClose(farFieldMoment(getModel('coil-pair'), [200, 0.1, 0.1, 0, 0])!, 2 * 200 * Math.PI * 0.1 ** 2, { rel: 1e-6 });
  });

  it('farFieldMoment() of a rectangle is N·I·w·h (DOMAIN.md §1.6, §1.11)', () => {
    expectClose(farFieldMoment(getModel('rectangle'), [150, 0.3, 0.2, 0.006, 0])!, 150 * 0.3 * 0.2, { rel: 1e-6 });
  });

  it('farFieldMoment() of a thick coil is N·I·π·(a₁² + a₁a₂ + a₂²)/3 (mean of πr² over the winding depth)', () => {
    const expected = (1500 * Math.PI * (0.02 ** 2 + 0.02 * 0.04 + 0.04 ** 2)) / 3;
    expectClose(farFieldMoment(getModel('thick-coil'), [1500, 0.02, 0.04, 0.03, 0.0015, 2.5e-5])!, expected, { rel: 1e-6 });
  });

  it('farFieldMoment() of a dipole is its moment, and of a power law null', () => {
    expectClose(farFieldMoment(getModel('dipole'), [3, 0.01, 1e-5])!, 3, { rel: 1e-9 });
    expect(farFieldMoment(getModel('power-law'), [1e-6, 2, 0, 0])).toBeNull();
  });

  it('momentEstimate() propagates the covariance: for m = N·I·π·R² with NI alone uncertain, σ(m) = π·R²·σ(NI)', () => {
    const params = Float64Array.of(400, 0.05, 0, 0);
    const estimate = momentEstimate(getModel('loop'), params, [0], [4], 1.959963984540054)!;
    // ∂m/∂NI = π R²; σ(NI) = 2 A
    expectClose(estimate.stderr!, Math.PI * 0.05 ** 2 * 2, { rel: 1e-6 });
    expectClose(estimate.ci95![1] - estimate.value, 1.959963984540054 * estimate.stderr!, { rel: 1e-12 });
  });
});
