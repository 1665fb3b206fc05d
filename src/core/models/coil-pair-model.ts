import { coilPairField, coilPairFieldGradient } from '../physics/coil-pair-field';
import type { FieldModel, SurveyPoints } from './field-model';
import { scanSize } from './initial-guess';
import {
  ampereTurnsParameter, backgroundParameter, evaluateFromComponents, fieldReadingDerivative, lengthParameter, probeOffsetParameter,
} from './model-reading';

const gradient = new Float64Array(8);

/** Pair field at z = distance + probeOffset from the midpoint, ρ = radial. */
function pairComponents(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
  coilPairField(params[0]!, params[1]!, params[2]!, distance + params[3]!, radial, out);
}

/**
 * Catalog model `coil-pair`: two identical coaxial flat loops with currents aiding
 * (Helmholtz when separation = radius, DOMAIN.md §1.5), parameters [ampereTurns (A, each
 * coil), radius (m), separation (m), probeOffset (m), background (T)].
 *
 * Datum: the distance is measured along the axis from the MIDPOINT between the coils
 * (DESIGN.md), so the sensing point is at z = distance + probeOffset, ρ = radial.
 * Reading = |B| or B_z of coilPairField plus background.
 *
 * Jacobian: analytic on and off axis (coilPairFieldGradient, from the two loops' gradients).
 * Initial guess: scan of radius with separation = radius (Helmholtz) and best N·I; note
 * (DOMAIN.md §1.5) that centre-region data fix only N·I/R.
 */
export const coilPairModel: FieldModel = {
  id: 'coil-pair',
  label: 'coaxial coil pair (Helmholtz when separation = radius)',
  physical: true,
  parameters: [
    { ...ampereTurnsParameter, description: 'ampere-turns N·I of each coil' },
    lengthParameter('radius', 'radius of each coil'),
    lengthParameter('separation', 'distance between the coil planes'),
    probeOffsetParameter,
    backgroundParameter,
  ],
  components: pairComponents,
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    evaluateFromComponents(pairComponents, 4, params, points, out);
  },
  jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    const ampereTurns = params[0]!;
    for (let i = 0; i < points.n; i++) {
      coilPairFieldGradient(1, params[1]!, params[2]!, points.distance[i]! + params[3]!, points.radial[i]!, gradient);
      const bz = ampereTurns * gradient[0]!;
      const br = ampereTurns * gradient[1]!;
      const kind = points.kind;
      const row = 5 * i;
      out[row] = fieldReadingDerivative(kind, bz, br, gradient[0]!, gradient[1]!);
      out[row + 1] = fieldReadingDerivative(kind, bz, br, ampereTurns * gradient[4]!, ampereTurns * gradient[5]!);
      out[row + 2] = fieldReadingDerivative(kind, bz, br, ampereTurns * gradient[6]!, ampereTurns * gradient[7]!);
      out[row + 3] = fieldReadingDerivative(kind, bz, br, ampereTurns * gradient[2]!, ampereTurns * gradient[3]!);
      out[row + 4] = 1;
    }
  },
  initialGuess(points: SurveyPoints): Float64Array {
    return scanSize(coilPairModel, points, (size, out) => {
      out[0] = 1; out[1] = size; out[2] = size; out[3] = 0; out[4] = 0;
    }, 0);
  },
};
