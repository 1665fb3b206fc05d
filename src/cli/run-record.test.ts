import { describe, expect, it } from 'vitest';
import { RingfallError } from '../core/errors';
import { describeBytes, runTime } from './run-record';

describe('run record (CLI half)', () => {
  it('describeBytes() hashes with SHA-256', () => {
    // FIPS 180-2, Appendix B.1: SHA-256("abc")
    expect(describeBytes('abc.txt', new TextEncoder().encode('abc'))).toEqual({
      name: 'abc.txt', sha256: 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad', bytes: 3,
    });
  });

  it('runTime() takes SOURCE_DATE_EPOCH as seconds since 1970-01-01 UTC, else the clock, to the second', () => {
    // POSIX time: 0 is 1970-01-01T00:00:00Z; 1773480600 s = 20526 days + 34200 s = 2026-03-14T09:30:00Z
    expect(runTime({ SOURCE_DATE_EPOCH: '0' })).toBe('1970-01-01T00:00:00Z');
    expect(runTime({ SOURCE_DATE_EPOCH: '1773480600' })).toBe('2026-03-14T09:30:00Z');
    expect(runTime({}, () => new Date(Date.UTC(2026, 2, 14, 9, 30, 0, 789)))).toBe('2026-03-14T09:30:00Z');
  });

  it('runTime() refuses a SOURCE_DATE_EPOCH that is not a whole number of seconds', () => {
    for (const bad of ['yesterday', '-5', '1.5']) {
      expect(() => runTime({ SOURCE_DATE_EPOCH: bad })).toThrow(RingfallError);
      expect(() => runTime({ SOURCE_DATE_EPOCH: bad })).toThrow(/SOURCE_DATE_EPOCH: ".*" is not a whole number of seconds/);
    }
  });
});
