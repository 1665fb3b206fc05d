import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { RingfallError } from '../errors';
import { predictField } from './predict-field';

const errorOf = (run: () => unknown): RingfallError => {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(RingfallError);
    return error as RingfallError;
  }
  throw new Error('expected a RingfallError, nothing was thrown');
};

describe('predictField()', () => {
  it('predictField() on a loop axis equals μ0·NI·R²/(2(R²+z²)^1.5)', () => {
    // DOMAIN.md §9 row 2 [C]: R = 0.1 m, NI = 1 A, z = R → 2.2214414703e-6 T (CODATA 2018 μ0)
    const at = predictField('loop', { ampereTurns: 1, radius: 0.1 }, { distance: 0.1 });
    expectClose(at.axial, 2.2214414703e-6, { rel: 1e-9 });
    expect(at.radial).toBe(0);
    expectClose(at.field, 2.2214414703e-6, { rel: 1e-9 });
  });

  it('predictField() off axis gives both components of the elliptic-integral loop', () => {
    // DOMAIN.md §9 row 7 [C, quadrature-checked]: a = 0.1, ρ = z = 0.05 → B_ρ 1.616890842e-6, B_z 4.345848938e-6 T
    const at = predictField('loop', { ampereTurns: 1, radius: 0.1 }, { distance: 0.05, radial: 0.05 });
    expectClose(at.axial, 4.345848938e-6, { rel: 1e-9 });
    expectClose(at.radial, 1.616890842e-6, { rel: 1e-9 });
  });

  it('predictField() adds the background to |B| only', () => {
    const at = predictField('dipole', { moment: Math.PI * 0.01, background: 1e-6 }, { distance: 1 });
    // DOMAIN.md §9 row 31 [C]: m = π·0.01 A·m², z = 1 m → 6.283185311e-9 T
    expectClose(at.axial, 6.283185311e-9, { rel: 1e-9 });
    expectClose(at.field, 6.283185311e-9 + 1e-6, { rel: 1e-12 });
  });

  it('predictField() refuses a missing coil parameter and an unknown name with codes', () => {
    const missing = (() => { try { predictField('loop', { radius: 0.1 }, { distance: 0 }); } catch (e) { return e; } })();
    expect(missing).toBeInstanceOf(RingfallError);
    expect((missing as RingfallError).code).toBe('PREDICT_MISSING');
    expect((missing as RingfallError).message).toContain('ampereTurns');
    expect(() => predictField('loop', { ampereTurns: 1, radius: 0.1, radii: 1 }, { distance: 0 })).toThrow(/"radii" is not a parameter/);
    expect(errorOf(() => predictField('loop', { ampereTurns: 1, radius: 0.1, radii: 1 }, { distance: 0 })).code).toBe('PARAMETER_UNKNOWN');
  });

  it('predictField() refuses values and points it cannot use, naming the value', () => {
    // STYLE.md errors: class, code and a message fragment
    const negative = errorOf(() => predictField('loop', { ampereTurns: 1, radius: -0.1 }, { distance: 0.1 }));
    expect(negative.code).toBe('PARAMETER_VALUE');
    expect(negative.message).toContain('radius = -0.1');
    expect(negative.message).toContain('greater than 0');
    expect(errorOf(() => predictField('loop', { ampereTurns: NaN, radius: 0.1 }, { distance: 0.1 })).code).toBe('PARAMETER_VALUE');
    const text = { ampereTurns: '5' } as unknown as Record<string, number>;
    expect(errorOf(() => predictField('loop', { ...text, radius: 0.1 }, { distance: 0.1 })).message).toContain('ampereTurns = 5');
    expect(errorOf(() => predictField('power-law', { amplitude: 1e-6, exponent: -1 }, { distance: 0.1 })).code).toBe('PARAMETER_VALUE');
    const point = errorOf(() => predictField('loop', { ampereTurns: 1, radius: 0.1 }, { distance: NaN }));
    expect(point.code).toBe('PREDICT_POINT');
    expect(point.message).toContain('distance NaN');
    expect(errorOf(() => predictField('loop', { ampereTurns: 1, radius: 0.1 }, { distance: 0.1, radial: Infinity })).code).toBe('PREDICT_POINT');
    // DOMAIN.md §1.2: on the wire (ρ = a, z = 0) the filament field is undefined
    const wire = errorOf(() => predictField('loop', { ampereTurns: 1, radius: 0.1 }, { distance: 0, radial: 0.1 }));
    expect(wire.code).toBe('PREDICT_SINGULAR');
    expect(wire.message).toContain('Move the point off the winding');
  });
});
