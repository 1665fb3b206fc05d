import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { fallDistance } from './fall-distance';
import { expectClose } from '../../../../test/support/expect-close';

// CODATA 2018, pinned as DOMAIN.md §9 asks
const mu0 = 1.25663706212e-6;
const loopOnAxis = (ampereTurns: number, radius: number) => (z: number) =>
  (mu0 * ampereTurns * radius * radius) / (2 * (radius * radius + z * z) ** 1.5);

describe('fallDistance()', () => {
  it('fallDistance() on a loop equals z = R·√((μ0NI/2RB)^(2/3) − 1) (DOMAIN.md §9 row 36)', () => {
    const field = loopOnAxis(400, 0.05);
    // DOMAIN.md §9 row 36 [C]: 95.630, 177.624, 227.049 mm
    expectClose(fallDistance(field, 0.5e-3, 0.05).distance!, 95.630e-3, { rel: 5e-6 });
    expectClose(fallDistance(field, 0.1e-3, 0.05).distance!, 177.624e-3, { rel: 5e-6 });
    expectClose(fallDistance(field, 50e-6, 0.05).distance!, 227.049e-3, { rel: 5e-6 });
  });

  it('fallDistance() on a dipole equals (μ0m/2πB)^(1/3) (DOMAIN.md §9 row 37)', () => {
    const moment = 400 * Math.PI * 0.05 ** 2;
    const dipole = (z: number) => (mu0 * moment) / (2 * Math.PI * z ** 3);
    // DOMAIN.md §9 row 37 [C]: 107.912, 184.527, 232.489 mm
    expectClose(fallDistance(dipole, 0.5e-3, 0.05).distance!, 107.912e-3, { rel: 5e-6 });
    expectClose(fallDistance(dipole, 0.1e-3, 0.05).distance!, 184.527e-3, { rel: 5e-6 });
    expectClose(fallDistance(dipole, 50e-6, 0.05).distance!, 232.489e-3, { rel: 5e-6 });
    expect(fallDistance(dipole, 0.5e-3, 0.05).peakField).toBe(Infinity);
  });

  it('fallDistance() matches the closed-form loop inversion to 1e-12 for any coil and level (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e4, noNaN: true }),
        fc.double({ min: 1e-3, max: 1, noNaN: true }),
        fc.double({ min: 1e-4, max: 0.999, noNaN: true }),
        (ampereTurns, radius, fraction) => {
          const centre = (mu0 * ampereTurns) / (2 * radius);
          const level = centre * fraction;
          // DOMAIN.md §1.10 [C]: z_th = R √((B0/B_th)^(2/3) − 1)
          const closedForm = radius * Math.sqrt((centre / level) ** (2 / 3) - 1);
          expectClose(fallDistance(loopOnAxis(ampereTurns, radius), level, radius).distance!, closedForm, { rel: 1e-11 });
        },
      ),
      { numRuns: 200 },
    );
  });

  it('fallDistance() returns null when the field never reaches the level', () => {
    const field = loopOnAxis(400, 0.05);
    // centre field μ0NI/(2R) = 5.026548 mT (DOMAIN.md §1.10)
    const result = fallDistance(field, 6e-3, 0.05);
    expect(result.distance).toBeNull();
    expectClose(result.peakField, 5.026548e-3, { rel: 1e-6 });
  });

  it('fallDistance() starts beyond the maximum of a curve that peaks off the datum', () => {
    // Two loops at z = ±60 mm (R = 20 mm), distance from the midpoint: the field dips at the
    // centre and peaks near each coil; the outermost crossing is beyond z = 60 mm.
    const single = loopOnAxis(100, 0.02);
    const pair = (z: number) => single(z - 0.06) + single(z + 0.06);
    const level = 0.2 * pair(0.06);
    const result = fallDistance(pair, level, 0.08);
    expect(result.peakDistance).toBeGreaterThan(0.05);
    expect(result.distance!).toBeGreaterThan(0.06);
    // independent check: the curve equals the level there and stays below it beyond
    expectClose(pair(result.distance!), level, { rel: 1e-10 });
    for (const factor of [1.01, 1.5, 3, 10]) expect(pair(result.distance! * factor)).toBeLessThan(level);
  });
});
