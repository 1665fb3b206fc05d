import fc from 'fast-check';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { repeatStatistics } from './repeat-statistics';
import type { Reading } from './survey';

describe('repeatStatistics()', () => {
  it('repeatStatistics() gives the mean and sample SD (n − 1) that simple-statistics gives, per position', () => {
    const reading = fc.record({ position: fc.integer({ min: 0, max: 3 }), field: fc.double({ min: -1e-2, max: 1e-2, noNaN: true }) });
    fc.assert(
      fc.property(fc.array(reading, { minLength: 1, maxLength: 40 }), (rows) => {
        const readings: Reading[] = rows.map((r, i) => ({ line: i + 2, distance: r.position * 0.01, radial: 0, field: r.field }));
        for (const group of repeatStatistics({ readings })) {
          const fields = rows.filter((r) => r.position * 0.01 === group.distance).map((r) => r.field);
          expect(group.count).toBe(fields.length);
          // independent reference: simple-statistics 7.12 mean() and sampleStandardDeviation()
          expectClose(group.mean, mean(fields), { rel: 1e-12, abs: 1e-18 });
          if (fields.length > 1) expectClose(group.standardDeviation ?? NaN, sampleStandardDeviation(fields), { rel: 1e-9, abs: 1e-15 });
          else expect(group.standardDeviation).toBeNull();
        }
      }),
    );
  });

  it('repeatStatistics() keeps positions apart by radial offset and lists lines in file order', () => {
    const readings: Reading[] = [
      { line: 3, distance: 0.01, radial: 0, field: 1 },
      { line: 4, distance: 0.01, radial: 0.02, field: 2 },
      { line: 9, distance: 0.01, radial: 0, field: 3 },
    ];
    const groups = repeatStatistics({ readings });
    expect(groups.map((g) => [g.radial, g.count, g.mean])).toEqual([[0, 2, 2], [0.02, 1, 2]]);
    expect(groups[0]?.lines).toEqual([3, 9]);
    // sample SD of {1, 3} = √2, by hand
    expectClose(groups[0]?.standardDeviation ?? NaN, Math.SQRT2, { rel: 1e-15 });
  });
});
