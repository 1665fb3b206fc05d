import type { RingfallError } from '../core/errors';

/**
 * Exit statuses (CONTRACT.md "Exit status"). 0–3 are ringfall's own; 70 is EX_SOFTWARE of
 * sysexits.h (an internal software error: a defect, never the user's input); 130 is
 * 128 + SIGINT, as shells report a run stopped by Ctrl-C.
 */
export const exitStatus = {
  /** Done; every check passed, or none was asked for. */
  passed: 0,
  /** At least one check failed (spec, threshold not reached, history flag). */
  failed: 1,
  /** Usage or input error: a bad option, a file that cannot be read, a spec that applies to no survey. */
  input: 2,
  /** No check failed, but at least one is inconclusive (its 95 % interval straddles a tolerance limit). */
  inconclusive: 3,
  /** Internal error (sysexits.h EX_SOFTWARE): a defect; please report it with the input. */
  internal: 70,
  /** Stopped by Ctrl-C (128 + SIGINT). */
  interrupted: 130,
  /** Stopped by SIGTERM (128 + 15), as a service manager or `kill` stops a run. */
  terminated: 143,
} as const;

/** Which status wins when several apply: internal > terminated > interrupted > input > failed > inconclusive > passed. */
const precedence: readonly number[] = [exitStatus.passed, exitStatus.inconclusive, exitStatus.failed, exitStatus.input, exitStatus.interrupted, exitStatus.terminated, exitStatus.internal];

/**
 * The status to report when two apply: the one that says more is wrong (a failed check
 * outranks an inconclusive one although 1 < 3). Unknown codes rank above all.
 * @example worseStatus(3, 1) // 1
 */
export function worseStatus(a: number, b: number): number {
  const rank = (code: number) => (precedence.includes(code) ? precedence.indexOf(code) : precedence.length);
  return rank(b) > rank(a) ? b : a;
}

/** Exit status for a project error (CONTRACT.md): usage and input errors are 2. */
export function exitCodeFor(_error: RingfallError): number {
  return exitStatus.input;
}
