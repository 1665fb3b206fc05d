import { peakCentre } from './scan-model';
import type { FieldModel, ParameterSpec, SurveyPoints } from './field-model';

/**
 * Where the coil's axis crosses a transverse scan's lateral ruler (m). Unbounded: the
 * ruler's zero may be anywhere across the coil.
 */
export const lateralCentreParameter: ParameterSpec = {
  name: 'lateralCentre', unit: 'm', role: 'centre', lower: -Infinity, upper: Infinity,
  description: 'position of the coil\'s axis on the survey\'s lateral ruler (a scan across the coil)',
};

const cache = new WeakMap<FieldModel, FieldModel>();

/**
 * A catalog model (or a scanModel of one) fitted to a transverse scan: the probe moved
 * across the coil at fixed heights, each reading's `radial` a signed lateral position x on
 * a ruler from any zero (Survey.lateral 'position'). The parameter `lateralCentre` (c) is
 * appended; every reading is evaluated by the model itself at the radial offset
 * ρ = |x − c| — an axisymmetric coil's B_z and |B| are even in ρ — so readings on both
 * sides of the axis are used and the axis's position is fitted. Combined with a scanModel
 * (signed axial positions) a grid of positions is fitted with both centres.
 *
 * Jacobian: the model's own for its parameters; ∂/∂c = −sign(x − c)·∂f/∂ρ by a central
 * difference in ρ (step 1e-6 of the survey's extent, at least 1e-9 m).
 *
 * Initial guess: c at the middle of the lateral positions where |B| is at least half its
 * range above its least value (peakCentre on the lateral positions), then the model's own
 * start on the readings folded to |x − c|.
 *
 * @returns the same object for the same model (cached).
 */
export function lateralModel(base: FieldModel): FieldModel {
  const cached = cache.get(base);
  if (cached !== undefined) return cached;
  const k = base.parameters.length;
  let folded = new Float64Array(0);
  let plus = new Float64Array(0);
  let minus = new Float64Array(0);
  let innerJacobian = new Float64Array(0);
  const foldedPoints = (centre: number, points: SurveyPoints, shift = 0): SurveyPoints => {
    if (folded.length < points.n) folded = new Float64Array(points.n);
    for (let i = 0; i < points.n; i++) folded[i] = Math.abs(Math.abs(points.radial[i]! - centre) + shift);
    return { ...points, radial: folded.length === points.n ? folded : folded.subarray(0, points.n) };
  };
  const inner = (params: Float64Array): Float64Array => params.subarray(0, k);
  const components = base.components;
  const model: FieldModel = {
    id: base.id,
    label: base.label,
    physical: base.physical,
    parameters: [...base.parameters, lateralCentreParameter],
    evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
      base.evaluate(inner(params), foldedPoints(params[k]!, points), out);
    },
    jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
      const n = points.n;
      const centre = params[k]!;
      if (innerJacobian.length < n * k) innerJacobian = new Float64Array(n * k);
      if (plus.length < n) {
        plus = new Float64Array(n);
        minus = new Float64Array(n);
      }
      let extent = 0;
      for (let i = 0; i < n; i++) extent = Math.max(extent, Math.abs(points.radial[i]! - centre), Math.abs(points.distance[i]!));
      const h = Math.max(1e-9, 1e-6 * extent);
      base.evaluate(inner(params), foldedPoints(centre, points, h), plus);
      base.evaluate(inner(params), foldedPoints(centre, points, -h), minus);
      if (base.jacobian) {
        base.jacobian(inner(params), foldedPoints(centre, points), innerJacobian);
      } else {
        centralJacobian(base, inner(params), foldedPoints(centre, points), innerJacobian);
      }
      for (let i = 0; i < n; i++) {
        const row = i * (k + 1);
        for (let j = 0; j < k; j++) out[row + j] = innerJacobian[i * k + j]!;
        const slope = (plus[i]! - minus[i]!) / (2 * h);
        out[row + k] = -Math.sign(points.radial[i]! - centre) * slope;
      }
    },
    initialGuess(points: SurveyPoints): Float64Array {
      const centre = peakCentre({ ...points, distance: points.radial });
      const start = new Float64Array(k + 1);
      start.set(base.initialGuess(foldedPoints(centre, points)));
      start[k] = centre;
      return start;
    },
    ...(base.canonicalParameters === undefined ? {} : {
      canonicalParameters(params: Float64Array, points: SurveyPoints, fixed: readonly boolean[]): boolean {
        return base.canonicalParameters!(inner(params), foldedPoints(params[k]!, points), fixed.slice(0, k));
      },
    }),
    ...(components === undefined ? {} : {
      components(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
        components.call(base, inner(params), distance, Math.abs(radial - params[k]!), out);
      },
    }),
  };
  cache.set(base, model);
  return model;
}

/** Central differences of a model without an analytic Jacobian (relative step 1e-6). */
function centralJacobian(model: FieldModel, params: Float64Array, points: SurveyPoints, out: Float64Array): void {
  const k = params.length;
  const n = points.n;
  const at = Float64Array.from(params);
  const up = new Float64Array(n);
  const down = new Float64Array(n);
  for (let j = 0; j < k; j++) {
    const h = 1e-6 * Math.max(Math.abs(params[j]!), 1e-6);
    at[j] = params[j]! + h;
    model.evaluate(at, points, up);
    at[j] = params[j]! - h;
    model.evaluate(at, points, down);
    at[j] = params[j]!;
    for (let i = 0; i < n; i++) out[i * k + j] = (up[i]! - down[i]!) / (2 * h);
  }
}
