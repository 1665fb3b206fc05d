/**
 * Smooth bijective maps between a bounded parameter x and an unbounded internal
 * variable u, so that the Levenberg–Marquardt search never leaves the box and never
 * clamps — the transforms of MINUIT (F. James & M. Winkler, "MINUIT User's Guide",
 * CERN 2004, section on parameter limits), also used by lmfit:
 *
 * - both bounds: x = lo + (hi − lo)·(1 + sin u)/2
 * - lower only:  x = lo + s·(√(u² + 1) − 1)
 * - upper only:  x = hi − s·(√(u² + 1) − 1)
 *
 * MINUIT uses s = 1 in the parameter's own unit; we use a length scale s (the distance
 * of the start from its bound) so the map is the same for a radius in metres and an
 * ampere-turn count, i.e. invariant to the unit. Covariances are always computed in x,
 * never in u.
 */
export type BoundKind = 0 | 1 | 2 | 3;
/** No bound. */
export const UNBOUNDED: BoundKind = 0;
/** Lower bound only. */
export const LOWER_ONLY: BoundKind = 1;
/** Upper bound only. */
export const UPPER_ONLY: BoundKind = 2;
/** Both bounds. */
export const TWO_SIDED: BoundKind = 3;

/** Kind of bound for a parameter with limits `lower`, `upper` (±Infinity for none). */
export function boundKind(lower: number, upper: number): BoundKind {
  const hasLower = lower > -Infinity;
  const hasUpper = upper < Infinity;
  return hasLower ? (hasUpper ? TWO_SIDED : LOWER_ONLY) : hasUpper ? UPPER_ONLY : UNBOUNDED;
}

/** x from u (see the module comment). */
export function toBounded(kind: BoundKind, lo: number, hi: number, s: number, u: number): number {
  switch (kind) {
    case TWO_SIDED:
      return lo + (hi - lo) * 0.5 * (1 + Math.sin(u));
    case LOWER_ONLY:
      return lo + s * (Math.sqrt(u * u + 1) - 1);
    case UPPER_ONLY:
      return hi - s * (Math.sqrt(u * u + 1) - 1);
    default:
      return u;
  }
}

/** dx/du at u. */
export function boundedDerivative(kind: BoundKind, lo: number, hi: number, s: number, u: number): number {
  switch (kind) {
    case TWO_SIDED:
      return (hi - lo) * 0.5 * Math.cos(u);
    case LOWER_ONLY:
      return (s * u) / Math.sqrt(u * u + 1);
    case UPPER_ONLY:
      return (-s * u) / Math.sqrt(u * u + 1);
    default:
      return 1;
  }
}

/** u from x, for x strictly inside the bounds (callers move a start off its bound first). */
export function toInternal(kind: BoundKind, lo: number, hi: number, s: number, x: number): number {
  switch (kind) {
    case TWO_SIDED:
      return Math.asin(Math.min(1, Math.max(-1, (2 * (x - lo)) / (hi - lo) - 1)));
    case LOWER_ONLY: {
      const t = (x - lo) / s + 1;
      return Math.sqrt(Math.max(0, t * t - 1));
    }
    case UPPER_ONLY: {
      const t = (hi - x) / s + 1;
      return Math.sqrt(Math.max(0, t * t - 1));
    }
    default:
      return x;
  }
}
