import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { decideConformity } from './decide-conformity';
import { expectClose } from '../../../test/support/expect-close';

const tenPercent = { relative: 0.1, absolute: 0 };

describe('decideConformity()', () => {
  // Worked cases on the four situations of a two-sided tolerance with the interval drawn
  // around the result (guarded acceptance/rejection, guard band = interval half-width):
  // JCGM 106:2012 §8 and Eurachem/CITAC compliance guide 2021 §4.4 (from memory).
  it('decideConformity() passes when the whole interval lies inside nominal ± T', () => {
    // 120 A ± 10 % → zone 108–132 A; interval 115–125 A inside
    const decision = decideConformity(120, [115, 125], 120, tenPercent);
    expect(decision.status).toBe('pass');
    expectClose(decision.lower, 108, { rel: 1e-15 });
    expectClose(decision.upper, 132, { rel: 1e-15 });
    expect(decision.shrinkFactor).toBeNull();
  });

  it('decideConformity() fails when the whole interval lies outside (issue 5: 96 A (92–100) vs 120 A)', () => {
    expect(decideConformity(96, [92, 100], 120, tenPercent).status).toBe('fail');
    expect(decideConformity(140, [134, 146], 120, tenPercent).status).toBe('fail');
  });

  it('decideConformity() is inconclusive when the interval straddles a limit, with the estimate inside', () => {
    // zone 108–132; estimate 110 with ±6 → must shrink to ±2: factor 1/3, then a pass
    const decision = decideConformity(110, [104, 116], 120, tenPercent);
    expect(decision.status).toBe('inconclusive');
    expect(decision.leaning).toBe('pass');
    expectClose(decision.shrinkFactor!, 1 / 3, { rel: 1e-12 });
  });

  it('decideConformity() is inconclusive when the interval straddles a limit, with the estimate outside', () => {
    // estimate 106 below the 108 limit with ±4 → shrink to ±2 (factor 0.5) for a fail
    const decision = decideConformity(106, [102, 110], 120, tenPercent);
    expect(decision.status).toBe('inconclusive');
    expect(decision.leaning).toBe('fail');
    expectClose(decision.shrinkFactor!, 0.5, { rel: 1e-12 });
  });

  it('decideConformity() treats the zone as closed: an interval ending on a limit passes', () => {
    expect(decideConformity(120, [108, 132], 120, tenPercent).status).toBe('pass');
    // and one that only touches the limit from outside is not yet a fail
    expect(decideConformity(100, [90, 108], 120, tenPercent).status).toBe('inconclusive');
  });

  it('decideConformity() adds relative and absolute tolerance (45 mm ± (0 % + 2 mm))', () => {
    // issue 5 example: radius 44.8 mm (43.9–45.7) as labeled 45 mm
    const decision = decideConformity(0.0448, [0.0439, 0.0457], 0.045, { relative: 0, absolute: 0.002 });
    expect(decision.status).toBe('pass');
    expectClose(decision.upper, 0.047, { rel: 1e-12 });
  });

  it('decideConformity() says no shrinking decides an estimate that sits on a limit', () => {
    const decision = decideConformity(108, [104, 112], 120, tenPercent);
    expect(decision.status).toBe('inconclusive');
    expect(decision.shrinkFactor).toBe(0);
  });

  it('decideConformity() reaches the leaning decision once the interval shrinks by the stated factor (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 150, noNaN: true }),
        fc.double({ min: 0.1, max: 30, noNaN: true }),
        fc.double({ min: 0.1, max: 30, noNaN: true }),
        (estimate, below, above) => {
          const decision = decideConformity(estimate, [estimate - below, estimate + above], 120, tenPercent);
          if (decision.status === 'pass') expect(estimate >= 108 && estimate <= 132).toBe(true);
          if (decision.status === 'fail') expect(estimate < 108 || estimate > 132).toBe(true);
          if (decision.status !== 'inconclusive' || decision.shrinkFactor === 0) return;
          const s = decision.shrinkFactor! * 0.999;
          const shrunk = decideConformity(estimate, [estimate - below * s, estimate + above * s], 120, tenPercent);
          expect(shrunk.status).toBe(decision.leaning);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('decideConformity() rejects an interval that does not contain the estimate', () => {
    expect(() => decideConformity(5, [6, 7], 5, tenPercent)).toThrow(RangeError);
  });
});
