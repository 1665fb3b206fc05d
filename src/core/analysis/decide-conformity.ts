import type { RelativePlusAbsolute } from '../units';

export type CheckStatus = 'pass' | 'fail' | 'inconclusive';

/** The outcome of comparing a 95 % interval with a tolerance zone around a nominal value. */
export interface ConformityDecision {
  readonly status: CheckStatus;
  /** Tolerance zone [nominal − T, nominal + T] with T = relative·|nominal| + absolute (SI). */
  readonly lower: number;
  readonly upper: number;
  /**
   * For an inconclusive decision: the factor (0 < s < 1) by which the interval's
   * half-widths must shrink, about its estimate, for a pass or fail; 0 when the estimate sits
   * on a limit (no shrinking decides it); null when already decided.
   */
  readonly shrinkFactor: number | null;
  /** Which decision shrinking would reach ('pass' when the estimate is inside the zone). */
  readonly leaning: 'pass' | 'fail' | null;
}

/**
 * The decision rule every spec check uses, in words for reports (CONTRACT.md "Decision
 * rule"): guarded acceptance and rejection with the 95 % interval as the guard band.
 */
export const decisionRule =
  'pass when the whole 95 % interval lies inside the tolerance zone, fail when it lies wholly outside, ' +
  'inconclusive when it straddles a limit (guard bands as in ISO 14253-1:2017 and JCGM 106:2012)';

/**
 * Three-way conformity decision of an interval against a two-sided tolerance zone:
 * **pass** when the whole interval lies within [nominal − T, nominal + T], **fail** when it
 * lies wholly outside, **inconclusive** otherwise. This is guarded acceptance and guarded
 * rejection with the guard band equal to the interval's half-width (JCGM 106:2012 §8,
 * acceptance/rejection zones with guard bands; ISO 14253-1:2017, decision rules for
 * proving conformity and nonconformity with specifications; clause numbers from memory), giving the
 * non-binary statement of the Eurachem/CITAC guide "Use of uncertainty information in
 * compliance assessment", 2nd ed. 2021, §4.4 (conditional / inconclusive results).
 * The zone is closed: an interval end exactly on a limit still passes.
 *
 * @param estimate the measured value (SI); must lie within `interval`
 * @param interval its 95 % interval (SI), possibly asymmetric
 * @param nominal the label or claimed value (SI)
 * @param tolerance T = relative·|nominal| + absolute
 * @throws RangeError when the interval is not ordered or does not contain the estimate
 * @example decideConformity(96, [92, 100], 120, { relative: 0.1, absolute: 0 }).status // 'fail'
 */
export function decideConformity(
  estimate: number,
  interval: readonly [number, number],
  nominal: number,
  tolerance: RelativePlusAbsolute,
): ConformityDecision {
  const [low, high] = interval;
  if (!(low <= estimate && estimate <= high)) {
    throw new RangeError(`decideConformity: interval [${low}, ${high}] must contain the estimate ${estimate}`);
  }
  const halfZone = tolerance.relative * Math.abs(nominal) + tolerance.absolute;
  const lower = nominal - halfZone;
  const upper = nominal + halfZone;
  if (low >= lower && high <= upper) return { status: 'pass', lower, upper, shrinkFactor: null, leaning: null };
  if (high < lower || low > upper) return { status: 'fail', lower, upper, shrinkFactor: null, leaning: null };
  const below = estimate - low;
  const above = high - estimate;
  let shrinkFactor: number;
  let leaning: 'pass' | 'fail';
  if (estimate > lower && estimate < upper) {
    leaning = 'pass';
    shrinkFactor = Math.min(below > 0 ? (estimate - lower) / below : Infinity, above > 0 ? (upper - estimate) / above : Infinity);
  } else if (estimate < lower) {
    leaning = 'fail';
    shrinkFactor = (lower - estimate) / above;
  } else if (estimate > upper) {
    leaning = 'fail';
    shrinkFactor = (estimate - upper) / below;
  } else {
    leaning = 'pass';
    shrinkFactor = 0;
  }
  return { status: 'inconclusive', lower, upper, shrinkFactor: Math.min(1, shrinkFactor), leaning };
}
