import {
  boundedDerivative,
  boundKind,
  LOWER_ONLY,
  toBounded,
  toInternal,
  TWO_SIDED,
  UNBOUNDED,
  UPPER_ONLY,
  type BoundKind,
} from './bound-transform';

/**
 * The free parameters of a least-squares problem: which entries of θ move, their
 * bounds and the internal (unbounded) variables that represent them. Fixed parameters
 * are simply absent, so they cannot leak into the Jacobian or the step.
 */
export interface FreeParameters {
  readonly count: number;
  /** True when any free parameter has a bound (the chain rule through dθ/du is needed). */
  readonly bounded: boolean;
  /** index[j] = position in θ of free parameter j (entries beyond `count` are stale). */
  readonly index: Int32Array;
  readonly kind: Uint8Array;
  readonly lower: Float64Array;
  readonly upper: Float64Array;
  /** Length scale of the one-sided transforms. */
  readonly scale: Float64Array;
  /** Base of the finite-difference step when θⱼ = 0. */
  readonly typicalSize: Float64Array;
}

/** Buffers of length p that a FreeParameters map is written into (see the workspace). */
export type FreeParameterBuffers = Omit<FreeParameters, 'count' | 'bounded'>;

/** Where a start on or outside a bound is moved: this fraction of the range (or typical size) inside. */
const INSET = 1e-3;
/**
 * A start nearer a bound than this fraction of the range (or typical size) is moved to
 * INSET too: the transforms are flat on the bound, and from within rounding of it the
 * first steps can vanish and stop the search on the step test.
 */
const NEAR = 1e-10;

/**
 * Build the free-parameter map from the options into `buffers` and move any start that
 * sits on, outside or within NEAR of its bounds to INSET inside them (a transform has zero
 * slope on the bound), with a warning. `params` holds θ₀ on entry and the possibly moved start on return.
 * @throws RangeError when option lengths do not match p or a lower bound exceeds its upper.
 */
export function freeParameters(
  params: Float64Array,
  fixed: ArrayLike<boolean> | undefined,
  lower: ArrayLike<number> | undefined,
  upper: ArrayLike<number> | undefined,
  typicalSize: ArrayLike<number> | undefined,
  warnings: string[],
  buffers: FreeParameterBuffers,
): FreeParameters {
  const p = params.length;
  checkLength('fixed', fixed, p);
  checkLength('lower', lower, p);
  checkLength('upper', upper, p);
  checkLength('typicalSize', typicalSize, p);
  let k = 0;
  let bounded = false;
  for (let at = 0; at < p; at++) {
    const lo = lower === undefined ? -Infinity : lower[at]!;
    const hi = upper === undefined ? Infinity : upper[at]!;
    if (!(lo <= hi)) throw new RangeError(`least squares: parameter ${at} has lower bound ${lo} above upper bound ${hi}`);
    if (fixed !== undefined && fixed[at] === true) continue;
    if (lo === hi) {
      params[at] = lo;
      warnings.push(`parameter ${at} has equal bounds and is held at ${lo}`);
      continue;
    }
    const kind = boundKind(lo, hi);
    const typical = Math.abs(typicalSize === undefined ? 1 : typicalSize[at]!) || 1;
    const x = params[at]!;
    let moved = x;
    const size = kind === TWO_SIDED ? hi - lo : typical;
    const near = NEAR * size;
    const inset = INSET * size;
    if (kind === TWO_SIDED && !(x > lo + near && x < hi - near)) moved = x > 0.5 * (lo + hi) ? hi - inset : lo + inset;
    if (kind === LOWER_ONLY && !(x > lo + near)) moved = lo + inset;
    if (kind === UPPER_ONLY && !(x < hi - near)) moved = hi - inset;
    if (moved !== x) {
      warnings.push(`start of parameter ${at} (${x}) was on, outside or within rounding of its bounds [${lo}, ${hi}]; moved to ${moved}`);
      params[at] = moved;
    }
    buffers.index[k] = at;
    buffers.kind[k] = kind;
    buffers.lower[k] = lo;
    buffers.upper[k] = hi;
    buffers.typicalSize[k] = typical;
    buffers.scale[k] = kind === LOWER_ONLY ? moved - lo : kind === UPPER_ONLY ? hi - moved : 1;
    if (kind !== UNBOUNDED) bounded = true;
    k += 1;
  }
  // Spelled out, not spread: this runs once per fit.
  const b = buffers;
  return { count: k, bounded, index: b.index, kind: b.kind, lower: b.lower, upper: b.upper, scale: b.scale, typicalSize: b.typicalSize };
}

function checkLength(name: string, array: ArrayLike<unknown> | undefined, p: number): void {
  if (array !== undefined && array.length !== p) {
    throw new RangeError(`least squares: ${name} has length ${array.length}, expected ${p}`);
  }
}

/** Internal variables u from θ (length k from length p). */
export function internalFromParams(map: FreeParameters, params: Float64Array, internal: Float64Array): void {
  // Without bounds every transform is the identity (toInternal's default): copy.
  if (!map.bounded) {
    for (let j = 0; j < map.count; j++) internal[j] = params[map.index[j]!]!;
    return;
  }
  for (let j = 0; j < map.count; j++) {
    internal[j] = toInternal(kindAt(map, j), map.lower[j]!, map.upper[j]!, map.scale[j]!, params[map.index[j]!]!);
  }
}

/** Write θ's free entries from u; fixed entries of `params` are left as they are. */
export function paramsFromInternal(map: FreeParameters, internal: Float64Array, params: Float64Array): void {
  // Without bounds every transform is the identity (toBounded's default): copy.
  if (!map.bounded) {
    for (let j = 0; j < map.count; j++) params[map.index[j]!] = internal[j]!;
    return;
  }
  for (let j = 0; j < map.count; j++) {
    params[map.index[j]!] = toBounded(kindAt(map, j), map.lower[j]!, map.upper[j]!, map.scale[j]!, internal[j]!);
  }
}

/** dθ/du of each free parameter at u. */
export function internalDerivatives(map: FreeParameters, internal: Float64Array, out: Float64Array): void {
  for (let j = 0; j < map.count; j++) {
    out[j] = boundedDerivative(kindAt(map, j), map.lower[j]!, map.upper[j]!, map.scale[j]!, internal[j]!);
  }
}

/** True when free parameter j sits on a bound (within 1e-8 of its range or scale). */
export function onBound(map: FreeParameters, j: number, x: number): boolean {
  const kind = kindAt(map, j);
  if (kind === UNBOUNDED) return false;
  const lo = map.lower[j]!;
  const hi = map.upper[j]!;
  const width = kind === TWO_SIDED ? hi - lo : map.scale[j]!;
  const near = 1e-8 * width;
  return (kind !== UPPER_ONLY && x - lo <= near) || (kind !== LOWER_ONLY && hi - x <= near);
}

function kindAt(map: FreeParameters, j: number): BoundKind {
  return map.kind[j] as BoundKind;
}
