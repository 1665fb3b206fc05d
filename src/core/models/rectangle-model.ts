import { rectangleField, rectangleFieldOnAxisGradient } from '../physics/rectangle-field';
import type { FieldModel, SurveyPoints } from './field-model';
import { scanSize } from './initial-guess';
import {
  ampereTurnsParameter, backgroundParameter, evaluateFromComponents, fieldReadingDerivative, lengthParameter, probeOffsetParameter,
} from './model-reading';

const field = new Float64Array(2);
const plus = new Float64Array(2);
const minus = new Float64Array(2);
const onAxis = new Float64Array(4);

/** Rectangle field at z = distance + probeOffset from the winding plane, offset `radial` along the width. */
function rectangleComponents(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
  rectangleField(params[0]!, params[1]!, params[2]!, distance + params[3]!, radial, out);
}

/**
 * Catalog model `rectangle`: a flat rectangular coil (mats; DOMAIN.md §1.6), parameters
 * [ampereTurns (A), width (m), height (m), probeOffset (m), background (T)].
 *
 * Datum: the distance is measured along the normal through the centre from the winding
 * plane; the sensing point is at z = distance + probeOffset, offset by `radial` along the
 * WIDTH direction (the rectangle has no axial symmetry; readings off the width axis need a
 * second coordinate that surveys do not carry). Reading = |B| or B_z of rectangleField
 * (closed-form straight segments) plus background.
 *
 * Jacobian: analytic on the axis (rectangleFieldOnAxisGradient); off the axis ∂/∂N·I is
 * exact (the field is linear in it) and the width, height and probe-offset columns are
 * central differences of the closed form with steps 6e-6 of the coil size (relative error
 * ≈ 1e-10), since the segment formula's derivatives are long and gain nothing here.
 * Initial guess: scan of a 1.25·s × 0.8·s rectangle (area s²) with the best N·I; not a
 * square, where width and height trade places on the axis and the search would pick
 * between the two mirror answers by rounding. Off the square the choice is made by the
 * start: the mirror with the longer side as width, as fits report it (canonicalParameters).
 */
export const rectangleModel: FieldModel = {
  id: 'rectangle',
  label: 'rectangular loop (flat mat)',
  physical: true,
  parameters: [
    ampereTurnsParameter,
    lengthParameter('width', 'side along which off-axis readings are offset'),
    lengthParameter('height', 'other side'),
    probeOffsetParameter,
    backgroundParameter,
  ],
  components: rectangleComponents,
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    evaluateFromComponents(rectangleComponents, 4, params, points, out);
  },
  jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    const ampereTurns = params[0]!;
    const width = params[1]!;
    const height = params[2]!;
    const step = 6e-6 * Math.max(width, height);
    for (let i = 0; i < points.n; i++) {
      const z = points.distance[i]! + params[3]!;
      const x = points.radial[i]!;
      const kind = points.kind;
      const row = 5 * i;
      out[row + 4] = 1;
      if (x === 0) {
        rectangleFieldOnAxisGradient(1, width, height, z, onAxis);
        const bz = ampereTurns * onAxis[0]!;
        out[row] = fieldReadingDerivative(kind, bz, 0, onAxis[0]!, 0);
        out[row + 1] = fieldReadingDerivative(kind, bz, 0, ampereTurns * onAxis[2]!, 0);
        out[row + 2] = fieldReadingDerivative(kind, bz, 0, ampereTurns * onAxis[3]!, 0);
        out[row + 3] = fieldReadingDerivative(kind, bz, 0, ampereTurns * onAxis[1]!, 0);
        continue;
      }
      rectangleField(1, width, height, z, x, field);
      const bz = ampereTurns * field[0]!;
      const br = ampereTurns * field[1]!;
      out[row] = fieldReadingDerivative(kind, bz, br, field[0]!, field[1]!);
      for (let column = 1; column <= 3; column++) {
        const w = column === 1 ? step : 0;
        const h = column === 2 ? step : 0;
        const t = column === 3 ? step : 0;
        rectangleField(ampereTurns, width + w, height + h, z + t, x, plus);
        rectangleField(ampereTurns, width - w, height - h, z - t, x, minus);
        out[row + column] = fieldReadingDerivative(kind, bz, br,
          (plus[0]! - minus[0]!) / (2 * step), (plus[1]! - minus[1]!) / (2 * step));
      }
    }
  },
  /**
   * On the axis the field is symmetric in width and height (DOMAIN.md §1.6), so a survey
   * with every reading on the axis reports the longer side as width.
   */
  canonicalParameters(params: Float64Array, points: SurveyPoints, fixed: readonly boolean[]): boolean {
    for (let i = 0; i < points.n; i++) if (points.radial[i] !== 0) return false;
    if (fixed[0] || fixed[1] || fixed[2] || !(params[1]! < params[2]!)) return false;
    const width = params[1]!;
    params[1] = params[2]!;
    params[2] = width;
    return true;
  },
  initialGuess(points: SurveyPoints): Float64Array {
    return scanSize(rectangleModel, points, (size, out) => {
      out[0] = 1; out[1] = 1.25 * size; out[2] = 0.8 * size; out[3] = 0; out[4] = 0;
    }, 0);
  },
};
