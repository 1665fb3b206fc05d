import { loopField } from '../physics/loop-field';
import { loopFieldGradient } from '../physics/loop-field-gradient';
import type { FieldModel, SurveyPoints } from './field-model';
import { halfValueRadius } from './half-value-radius';
import { scanSize } from './initial-guess';
import {
  ampereTurnsParameter, backgroundParameter, evaluateFromComponents, fieldReadingDerivative, lengthParameter, probeOffsetParameter,
} from './model-reading';

const gradient = new Float64Array(7);

/** Loop field at z = distance + probeOffset (winding-plane datum), ρ = radial. */
function loopComponents(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
  loopField(params[0]!, params[1]!, distance + params[2]!, radial, out);
}

/**
 * Catalog model `loop`: a flat circular coil of N turns (DOMAIN.md §1.1–1.2), parameters
 * [ampereTurns (A), radius (m), probeOffset (m), background (T)].
 *
 * Datum: the distance is measured along the axis from the winding plane; the sensing point
 * is at z = distance + probeOffset, radial offset ρ = radial. Reading = |B| or B_z
 * (points.kind) of loopField, plus background.
 *
 * Jacobian: analytic on and off axis, from loopFieldGradient (∂/∂N·I = field per ampere-turn,
 * ∂/∂radius by Euler's relation, ∂/∂probeOffset = ∂/∂z).
 *
 * Initial guess: radius from the half-value distance (DOMAIN.md §1.1) as a hint to a scan
 * of radii with the best N·I solved in closed form (scanSize); probe offset and background 0.
 */
export const loopModel: FieldModel = {
  id: 'loop',
  label: 'circular loop (elliptic integrals)',
  physical: true,
  parameters: [ampereTurnsParameter, lengthParameter('radius', 'loop radius (to the middle of the winding)'), probeOffsetParameter, backgroundParameter],
  components: loopComponents,
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    evaluateFromComponents(loopComponents, 3, params, points, out);
  },
  jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    const ampereTurns = params[0]!;
    const radius = params[1]!;
    const offset = params[2]!;
    for (let i = 0; i < points.n; i++) {
      loopFieldGradient(1, radius, points.distance[i]! + offset, points.radial[i]!, gradient);
      const bz = ampereTurns * gradient[0]!;
      const br = ampereTurns * gradient[1]!;
      const row = 4 * i;
      out[row] = fieldReadingDerivative(points.kind, bz, br, gradient[0]!, gradient[1]!);
      out[row + 1] = fieldReadingDerivative(points.kind, bz, br, ampereTurns * gradient[5]!, ampereTurns * gradient[6]!);
      out[row + 2] = fieldReadingDerivative(points.kind, bz, br, ampereTurns * gradient[2]!, ampereTurns * gradient[3]!);
      out[row + 3] = 1;
    }
  },
  initialGuess(points: SurveyPoints): Float64Array {
    return scanSize(loopModel, points, (radius, out) => out.set([1, radius, 0, 0]), 0, halfValueRadius(points));
  },
};
