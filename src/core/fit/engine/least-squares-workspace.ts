import type { DampingScratch } from './damping-parameter';
import type { FreeParameterBuffers } from './free-parameters';

/**
 * Preallocated buffers for {@link fitLeastSquares} with m observations and p parameters,
 * so that the iteration allocates nothing. Pass one to many fits of the same size (a
 * benchmark, a multi-start) to avoid even the per-fit allocation.
 */
export interface LeastSquaresWorkspace {
  readonly m: number;
  readonly p: number;
  /** θ in original parameters (current and trial), length p. */
  readonly params: Float64Array;
  readonly trialParams: Float64Array;
  /** Model Jacobian row-major m×p as the problem writes it. */
  readonly modelJacobian: Float64Array;
  /** Weighted Jacobian of the free internal variables, column-major m×k (k ≤ p). */
  readonly jacobian: Float64Array;
  /**
   * Weighted residuals (f − y)/σ and predictions at the current and the trial point,
   * length m; each trades places with its trial twin when a step is taken (not copied).
   */
  residuals: Float64Array;
  trialResiduals: Float64Array;
  predicted: Float64Array;
  trialPredicted: Float64Array;
  /** Finite-difference evaluations, length m. */
  readonly plus: Float64Array;
  readonly minus: Float64Array;
  /** 1/σᵢ, length m. */
  readonly inverseUncertainty: Float64Array;
  /** Length-p vectors over the free internal variables. */
  readonly internal: Float64Array;
  readonly trialInternal: Float64Array;
  readonly step: Float64Array;
  readonly scale: Float64Array;
  readonly qtf: Float64Array;
  readonly rdiag: Float64Array;
  readonly columnNorms: Float64Array;
  readonly work: Float64Array;
  /** k×k scratch for the normal equations. */
  readonly gram: Float64Array;
  /** The fused pass's p×p normal matrix, its gradient (p) and column scales (p). */
  readonly fullGram: Float64Array;
  readonly fullGradient: Float64Array;
  readonly columnScale: Float64Array;
  readonly derivative: Float64Array;
  readonly pivot: Int32Array;
  readonly damping: DampingScratch;
  /** Free-parameter map storage. */
  readonly free: FreeParameterBuffers;
}

/** Allocate a workspace for m observations and p parameters. */
export function createLeastSquaresWorkspace(m: number, p: number): LeastSquaresWorkspace {
  const vm = (): Float64Array => new Float64Array(m);
  const vp = (): Float64Array => new Float64Array(p);
  return {
    m,
    p,
    params: vp(),
    trialParams: vp(),
    modelJacobian: new Float64Array(m * p),
    jacobian: new Float64Array(m * p),
    residuals: vm(),
    trialResiduals: vm(),
    predicted: vm(),
    trialPredicted: vm(),
    plus: vm(),
    minus: vm(),
    inverseUncertainty: vm(),
    internal: vp(),
    trialInternal: vp(),
    step: vp(),
    scale: vp(),
    qtf: vp(),
    rdiag: vp(),
    columnNorms: vp(),
    work: vp(),
    gram: new Float64Array(p * p),
    fullGram: new Float64Array(p * p),
    fullGradient: vp(),
    columnScale: vp(),
    derivative: vp(),
    pivot: new Int32Array(p),
    damping: { sdiag: vp(), work1: vp(), work2: vp(), work3: vp() },
    free: { index: new Int32Array(p), kind: new Uint8Array(p), lower: vp(), upper: vp(), scale: vp(), typicalSize: vp() },
  };
}

/** Spare workspaces by size (m·p key), so fits without a workspace of their own allocate none. */
const spare = new Map<string, LeastSquaresWorkspace[]>();
/** Sizes kept, and spares per size: enough for a survey's models and a nested fit. */
const MAX_SIZES = 16;
const MAX_PER_SIZE = 2;

/**
 * A workspace for m observations and p parameters from the spares, or a new one. Give it
 * back with {@link releaseWorkspace} once the fit's solution is built (solutions copy
 * everything out). A workspace taken is not handed out again until released, so nested
 * fits get their own.
 */
export function takeWorkspace(m: number, p: number): LeastSquaresWorkspace {
  return spare.get(`${m}:${p}`)?.pop() ?? createLeastSquaresWorkspace(m, p);
}

/** Return a workspace from {@link takeWorkspace} to the spares (kept only up to a few per size). */
export function releaseWorkspace(ws: LeastSquaresWorkspace): void {
  const key = `${ws.m}:${ws.p}`;
  const list = spare.get(key);
  if (list !== undefined) {
    if (list.length < MAX_PER_SIZE) list.push(ws);
  } else if (spare.size < MAX_SIZES) {
    spare.set(key, [ws]);
  }
}
