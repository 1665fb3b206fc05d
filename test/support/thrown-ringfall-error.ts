import { expect } from 'vitest';
import { RingfallError } from '../../src/core/errors';

/** The RingfallError an action throws; the test fails if it throws anything else or nothing. */
export function thrownRingfallError(action: () => unknown): RingfallError {
  try {
    action();
  } catch (error) {
    expect(error).toBeInstanceOf(RingfallError);
    return error as RingfallError;
  }
  throw new Error('expected a RingfallError');
}
