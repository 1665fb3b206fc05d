import type { FieldModel, ModelId, ParameterSpec, SurveyPoints } from './field-model';

/**
 * The coil centre's position on a scan's ruler (m): winding plane of a loop or rectangle,
 * midpoint of a coil pair, mid-length of a solenoid or thick coil, the dipole itself, the
 * origin of a power law. Unbounded: the ruler's zero may be anywhere.
 */
export const centreParameter: ParameterSpec = {
  name: 'centre', unit: 'm', role: 'centre', lower: -Infinity, upper: Infinity,
  description: 'position of the coil\'s centre on the survey\'s ruler (winding plane, midpoint of a pair, mid-length of a solenoid)',
};

/** Models whose distance datum is the near face, half a length from the centre (DESIGN.md "Distance datum"). */
export const nearFaceModels: ReadonlySet<string> = new Set<ModelId>(['solenoid', 'thick-coil']);

const cache = new WeakMap<FieldModel, FieldModel>();

/**
 * A catalog model fitted to a scan: readings at signed positions p along the axis from any
 * ruler zero (Survey.axis 'position'). The model's `probeOffset` is replaced by `centre`,
 * and every reading is evaluated by the model itself at the distance |p − centre| from
 * the centre — the coil's field is even in z about its centre (B_z and |B|) — with the
 * probe offset set to −length/2 for a near-face model (solenoid, thick coil), 0 otherwise,
 * so that the model's own datum lands on the centre. Readings inside a solenoid and
 * between the coils of a pair are thus used as they are. Dipole and power laws are
 * evaluated at r = |p − centre| too: centred on the coil, diverging there.
 *
 * Jacobian from the model's own: ∂/∂centre = −sign(p − centre)·∂/∂probeOffset (the
 * offset enters as distance + offset), ∂/∂length = ∂/∂length − ½·∂/∂probeOffset for a
 * near-face model (its ∂/∂length includes the datum shift, removed here); the rest as is.
 *
 * Initial guess: the centre at the middle of the positions where |B| is at least half its
 * largest value (the peak of a symmetric profile, robust to a flat top; moved a quarter of
 * the reading spacing off a reading it falls on), then the model's own start on the
 * readings folded to |p − centre|.
 *
 * @returns the same object for the same model (cached); the model itself when it
 *   has no probe offset.
 */
export function scanModel(base: FieldModel): FieldModel {
  const cached = cache.get(base);
  if (cached !== undefined) return cached;
  const offsetIndex = base.parameters.findIndex((p) => p.role === 'offset');
  if (offsetIndex < 0) return base;
  const lengthIndex = nearFaceModels.has(base.id) ? base.parameters.findIndex((p) => p.name === 'length') : -1;
  const k = base.parameters.length;
  const inner = new Float64Array(k);
  let folded = new Float64Array(0);
  let innerJacobian = new Float64Array(0);
  const innerParams = (params: Float64Array): Float64Array => {
    inner.set(params);
    inner[offsetIndex] = lengthIndex >= 0 ? -0.5 * params[lengthIndex]! : 0;
    return inner;
  };
  const foldedPoints = (params: Float64Array, points: SurveyPoints): SurveyPoints => {
    if (folded.length < points.n) folded = new Float64Array(points.n);
    const centre = params[offsetIndex]!;
    for (let i = 0; i < points.n; i++) folded[i] = Math.abs(points.distance[i]! - centre);
    return { ...points, distance: folded.length === points.n ? folded : folded.subarray(0, points.n) };
  };
  const components = base.components;
  const model: FieldModel = {
    id: base.id,
    label: base.label,
    physical: base.physical,
    parameters: base.parameters.map((p, j) => (j === offsetIndex ? centreParameter : p)),
    evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
      base.evaluate(innerParams(params), foldedPoints(params, points), out);
    },
    initialGuess(points: SurveyPoints): Float64Array {
      const centre = offReadings(peakCentre(points), points);
      const at = new Float64Array(k);
      at[offsetIndex] = centre;
      const start = base.initialGuess(foldedPoints(at, points));
      start[offsetIndex] = centre;
      return start;
    },
    ...(components === undefined ? {} : {
      components(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
        components.call(base, innerParams(params), Math.abs(distance - params[offsetIndex]!), radial, out);
      },
    }),
  };
  const jacobian = base.jacobian;
  if (jacobian !== undefined) {
    (model as { jacobian?: FieldModel['jacobian'] }).jacobian = (params: Float64Array, points: SurveyPoints, out: Float64Array): void => {
      const n = points.n;
      if (innerJacobian.length < n * k) innerJacobian = new Float64Array(n * k);
      jacobian.call(base, innerParams(params), foldedPoints(params, points), innerJacobian);
      const centre = params[offsetIndex]!;
      for (let i = 0; i < n; i++) {
        const row = i * k;
        for (let j = 0; j < k; j++) out[row + j] = innerJacobian[row + j]!;
        const slope = innerJacobian[row + offsetIndex]!;
        out[row + offsetIndex] = -Math.sign(points.distance[i]! - centre) * slope;
        if (lengthIndex >= 0) out[row + lengthIndex] = innerJacobian[row + lengthIndex]! - 0.5 * slope;
      }
    };
  }
  cache.set(base, model);
  return model;
}

/**
 * `centre` moved off any reading it coincides with (within 1e-9 of the span), by a quarter
 * of the smallest gap between distinct positions: a dipole or power law is infinite at its
 * centre, so a start there could not be evaluated.
 */
function offReadings(centre: number, points: SurveyPoints): number {
  const sorted = Float64Array.from(points.distance).sort();
  const span = sorted.length > 0 ? sorted[sorted.length - 1]! - sorted[0]! : 0;
  if (!sorted.some((p) => Math.abs(p - centre) <= 1e-9 * span)) return centre;
  let gap = Infinity;
  for (let i = 1; i < sorted.length; i++) if (sorted[i]! > sorted[i - 1]!) gap = Math.min(gap, sorted[i]! - sorted[i - 1]!);
  return Number.isFinite(gap) ? centre + 0.25 * gap : centre;
}

/**
 * Middle of the positions where |B| − min|B| is at least half its range: the centre of a
 * symmetric profile through the coil (m); 0 without readings.
 *
 * @example peakCentre({ n: 3, distance: Float64Array.of(-1, 1, 3), field: Float64Array.of(1, 5, 1), … }) // 1
 */
export function peakCentre(points: SurveyPoints): number {
  let low = Infinity;
  let high = -Infinity;
  for (let i = 0; i < points.n; i++) {
    const b = Math.abs(points.field[i]!);
    if (!Number.isFinite(b)) continue;
    low = Math.min(low, b);
    high = Math.max(high, b);
  }
  if (!(high >= low)) return 0;
  const half = low + 0.5 * (high - low);
  let first = Infinity;
  let last = -Infinity;
  for (let i = 0; i < points.n; i++) {
    if (!(Math.abs(points.field[i]!) >= half)) continue;
    first = Math.min(first, points.distance[i]!);
    last = Math.max(last, points.distance[i]!);
  }
  return Number.isFinite(first) ? 0.5 * (first + last) : 0;
}
