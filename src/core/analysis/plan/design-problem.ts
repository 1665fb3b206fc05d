import type { FieldModel } from '../../models/field-model';
import { modelPoint, type ModelPoint } from '../model-point';

/**
 * Standard uncertainty of one planned reading (DOMAIN.md §3.8 per-point model):
 * σ² = (relative·|B|)² + absolute² + (∂B/∂d · position)².
 */
export interface NoiseModel {
  /** Fraction of the reading (0.02 for 2 %). */
  readonly relative: number;
  /** T. */
  readonly absolute: number;
  /** Standard uncertainty of each distance, m. */
  readonly position: number;
}

/** A probe position: distance along the axis from the datum and radial offset, m. */
export interface DesignPoint {
  readonly distance: number;
  readonly radial: number;
}

/** A coil model at rough parameter values, which of them a fit would free, and the noise. */
export interface DesignProblem {
  readonly model: FieldModel;
  /** Every parameter, SI, model order. */
  readonly values: Float64Array;
  /** Model-order indices of the parameters the fit would free. */
  readonly free: readonly number[];
  readonly noise: NoiseModel;
}

/**
 * Rows of the weighted sensitivity matrix for a set of points: row i is (∂B/∂θ_free)/σᵢ,
 * so that the Fisher information of a design is Σ rowᵢ·rowᵢᵀ = JᵀWJ (DOMAIN.md §7.4).
 * Written row-major into a new Float64Array of length n·k.
 */
export function sensitivityRows(problem: DesignProblem, points: readonly DesignPoint[], point: ModelPoint = modelPoint(problem.model)): Float64Array {
  const k = problem.free.length;
  const rows = new Float64Array(points.length * k);
  const gradient = new Float64Array(problem.model.parameters.length);
  points.forEach((p, i) => {
    const field = point.field(problem.values, p.distance, p.radial);
    const slope = point.slope(problem.values, p.distance, p.radial);
    const sigma = readingUncertainty(problem.noise, field, slope);
    point.gradient(problem.values, p.distance, p.radial, gradient);
    for (let a = 0; a < k; a += 1) rows[i * k + a] = gradient[problem.free[a]!]! / sigma;
  });
  return rows;
}

/** σ = √((p·B)² + c² + (∂B/∂d·σ_d)²), T; never zero (a floor of 1e-30 T keeps weights finite). */
export function readingUncertainty(noise: NoiseModel, field: number, slope: number): number {
  return Math.max(1e-30, Math.hypot(noise.relative * field, noise.absolute, slope * noise.position));
}

/** Σ rowᵢ·rowᵢᵀ over the chosen rows (all when `chosen` is omitted), k×k row-major. */
export function informationMatrix(rows: Float64Array, k: number, chosen?: readonly number[]): Float64Array {
  const information = new Float64Array(k * k);
  const count = chosen ? chosen.length : rows.length / k;
  for (let c = 0; c < count; c += 1) {
    const offset = (chosen ? chosen[c]! : c) * k;
    for (let a = 0; a < k; a += 1) {
      const ra = rows[offset + a]!;
      for (let b = 0; b < k; b += 1) information[a * k + b]! += ra * rows[offset + b]!;
    }
  }
  return information;
}
