import type { RingfallError } from '../core/errors';

/** Exit status for a project error (CONTRACT.md): usage and input errors are 2. */
export function exitCodeFor(_error: RingfallError): number {
  return 2;
}
