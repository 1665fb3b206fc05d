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
  /** index[j] = position in θ of free parameter j. */
  readonly index: Int32Array;
  readonly kind: Uint8Array;
  readonly lower: Float64Array;
  readonly upper: Float64Array;
  /** Length scale of the one-sided transforms. */
  readonly scale: Float64Array;
  /** Floor of the finite-difference step base. */
  readonly typicalSize: Float64Array;
}

/** Where a start on or outside a bound is moved: this fraction of the range (or scale) inside. */
const INSET = 1e-3;

/**
 * Build the free-parameter map from the options and move any start that sits on or
 * outside its bounds just inside them (a transform has zero slope on the bound), with
 * a warning. `params` holds θ₀ on entry and the possibly moved start on return.
 * @throws RangeError when option lengths do not match p or a lower bound exceeds its upper.
 */
export function freeParameters(
  params: Float64Array,
  fixed: ArrayLike<boolean> | undefined,
  lower: ArrayLike<number> | undefined,
  upper: ArrayLike<number> | undefined,
  typicalSize: ArrayLike<number> | undefined,
  warnings: string[],
): FreeParameters {
  const p = params.length;
  for (const [name, array] of [['fixed', fixed], ['lower', lower], ['upper', upper], ['typicalSize', typicalSize]] as const) {
    if (array !== undefined && array.length !== p) {
      throw new RangeError(`least squares: ${name} has length ${array.length}, expected ${p}`);
    }
  }
  const chosen: number[] = [];
  for (let j = 0; j < p; j++) {
    const lo = lower?.[j] ?? -Infinity;
    const hi = upper?.[j] ?? Infinity;
    if (!(lo <= hi)) throw new RangeError(`least squares: parameter ${j} has lower bound ${lo} above upper bound ${hi}`);
    if (fixed?.[j] === true) continue;
    if (lo === hi) {
      params[j] = lo;
      warnings.push(`parameter ${j} has equal bounds and is held at ${lo}`);
      continue;
    }
    chosen.push(j);
  }
  const k = chosen.length;
  const map: FreeParameters = {
    count: k,
    index: Int32Array.from(chosen),
    kind: new Uint8Array(k),
    lower: new Float64Array(k),
    upper: new Float64Array(k),
    scale: new Float64Array(k),
    typicalSize: new Float64Array(k),
  };
  for (let j = 0; j < k; j++) {
    const at = chosen[j]!;
    const lo = lower?.[at] ?? -Infinity;
    const hi = upper?.[at] ?? Infinity;
    const kind = boundKind(lo, hi);
    const typical = Math.abs(typicalSize?.[at] ?? 1) || 1;
    map.kind[j] = kind;
    map.lower[j] = lo;
    map.upper[j] = hi;
    map.typicalSize[j] = typical;
    const x = params[at]!;
    let moved = x;
    if (kind === TWO_SIDED && !(x > lo && x < hi)) moved = x >= hi ? hi - INSET * (hi - lo) : lo + INSET * (hi - lo);
    if (kind === LOWER_ONLY && !(x > lo)) moved = lo + INSET * typical;
    if (kind === UPPER_ONLY && !(x < hi)) moved = hi - INSET * typical;
    if (moved !== x) {
      warnings.push(`start of parameter ${at} (${x}) was on or outside its bounds [${lo}, ${hi}]; moved to ${moved}`);
      params[at] = moved;
    }
    map.scale[j] = kind === LOWER_ONLY ? moved - lo : kind === UPPER_ONLY ? hi - moved : 1;
  }
  return map;
}

/** Internal variables u from θ (length k from length p). */
export function internalFromParams(map: FreeParameters, params: Float64Array, internal: Float64Array): void {
  for (let j = 0; j < map.count; j++) {
    internal[j] = toInternal(kindAt(map, j), map.lower[j]!, map.upper[j]!, map.scale[j]!, params[map.index[j]!]!);
  }
}

/** Write θ's free entries from u; fixed entries of `params` are left as they are. */
export function paramsFromInternal(map: FreeParameters, internal: Float64Array, params: Float64Array): void {
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
