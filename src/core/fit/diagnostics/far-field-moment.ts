import type { FieldModel, SurveyPoints } from '../../models/field-model';
import { vacuumPermeability } from '../../physics/vacuum-permeability';
import { deltaMethodVariance } from '../../stats/delta-method-variance';

/**
 * Far-field magnetic moment m (A·m²) of a physical model at parameters θ (SI, model
 * order): the one quantity far-field readings determine (DOMAIN.md §7.6). Every finite
 * source tends on axis to the dipole field B = μ0·m/(2π z³) (DOMAIN.md §1.7, §1.11), so
 * m = lim 2π z³ B(z)/μ0. The limit is taken numerically from the model itself with probe
 * offset and background set to 0: g(h) = 2π z³ B(z)/μ0 at z = 1/h = 100, 200 and 400 times
 * the coil's largest length, then two Richardson steps remove the h and h² terms (error
 * O((size/z)³) ≈ 1e-6), so loops (m = N·I·π·R²), pairs, rectangles (N·I·w·h) and thick
 * coils need no formula of their own. Null for descriptive models (power laws).
 *
 * @example farFieldMoment(loopModel, Float64Array.of(400, 0.05, 0, 0)) // 400·π·0.05² = 3.14159 A·m²
 */
export function farFieldMoment(model: FieldModel, params: ArrayLike<number>): number | null {
  return model.physical ? momentAt(model, params, momentScratch(model)) : null;
}

/** Buffers of one far-field moment evaluation (three axial points). */
interface MomentScratch {
  readonly coil: Float64Array;
  readonly points: SurveyPoints;
  readonly field: Float64Array;
}

function momentScratch(model: FieldModel): MomentScratch {
  const distance = new Float64Array(3);
  return {
    coil: new Float64Array(model.parameters.length),
    points: { n: 3, distance, radial: new Float64Array(3), field: new Float64Array(3), kind: 'axial' },
    field: new Float64Array(3),
  };
}

/** farFieldMoment of a physical model in preallocated buffers. */
function momentAt(model: FieldModel, params: ArrayLike<number>, scratch: MomentScratch): number | null {
  const { coil, points, field } = scratch;
  const distance = points.distance as Float64Array;
  let size = 0;
  for (let j = 0; j < coil.length; j++) {
    const spec = model.parameters[j]!;
    coil[j] = spec.role === 'offset' || spec.role === 'centre' || spec.role === 'orientation' || spec.role === 'background' ? 0 : params[j]!;
    if (spec.role === 'geometry') size = Math.max(size, Math.abs(coil[j]!));
  }
  if (!(size > 0) || !Number.isFinite(size)) size = 1e-3;
  distance[0] = 100 * size;
  distance[1] = 200 * size;
  distance[2] = 400 * size;
  model.evaluate(coil, points, field);
  const g0 = (2 * Math.PI * distance[0] ** 3 * field[0]!) / vacuumPermeability;
  const g1 = (2 * Math.PI * distance[1] ** 3 * field[1]!) / vacuumPermeability;
  const g2 = (2 * Math.PI * distance[2] ** 3 * field[2]!) / vacuumPermeability;
  // Richardson in h = 1/z with ratio 2: remove the O(h), then the O(h²) term.
  const first0 = 2 * g1 - g0;
  const first1 = 2 * g2 - g1;
  const moment = (4 * first1 - first0) / 3;
  return Number.isFinite(moment) ? moment : null;
}

/** The far-field moment with its standard uncertainty and interval. */
export interface MomentEstimate {
  /** A·m². */
  readonly value: number;
  /** Delta-method standard uncertainty (A·m²), or null without a covariance. */
  readonly stderr: number | null;
  /** value ± coverage·stderr, or null. */
  readonly ci95: readonly [number, number] | null;
}

/**
 * farFieldMoment with its uncertainty by the delta method, Var(m) ≈ ∇mᵀ·C·∇m (JCGM
 * 100:2008 eq. (13); DOMAIN.md §7.5), the gradient over the free parameters by central
 * differences with relative step 1e-6. m is linear in the ampere-turns and smooth in the
 * geometry, so the linearisation is good even when ampere-turns and radius separately are
 * undetermined.
 *
 * @param freeIndices model-order index of each covariance row; covariance row-major k×k or
 *   null; coverageFactor the multiplier of the fit's own intervals (1.96 or a t quantile).
 */
export function momentEstimate(
  model: FieldModel,
  params: Float64Array,
  freeIndices: readonly number[],
  covariance: ArrayLike<number> | null,
  coverageFactor: number,
): MomentEstimate | null {
  if (!model.physical) return null;
  const scratch = momentScratch(model);
  const value = momentAt(model, params, scratch);
  if (value === null) return null;
  if (covariance === null) return { value, stderr: null, ci95: null };
  const moved = Float64Array.from(params);
  const gradient = freeIndices.map((j) => {
    const x = params[j]!;
    const h = 1e-6 * (x !== 0 ? Math.abs(x) : 1e-3);
    moved[j] = x + h;
    const up = momentAt(model, moved, scratch) ?? NaN;
    moved[j] = x - h;
    const down = momentAt(model, moved, scratch) ?? NaN;
    moved[j] = x;
    return (up - down) / (2 * h);
  });
  const variance = deltaMethodVariance(gradient, covariance);
  if (!(variance >= 0) || !Number.isFinite(variance)) return { value, stderr: null, ci95: null };
  const stderr = Math.sqrt(variance);
  return { value, stderr, ci95: [value - coverageFactor * stderr, value + coverageFactor * stderr] };
}
