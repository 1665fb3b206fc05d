import { loopField } from '../physics/loop-field';
import { loopFieldGradient } from '../physics/loop-field-gradient';
import { solenoidField } from '../physics/solenoid-field';
import { solenoidFieldGradient } from '../physics/solenoid-field-gradient';
import type { FieldModel, SurveyPoints } from './field-model';
import { scanSize } from './initial-guess';
import {
  ampereTurnsParameter, backgroundParameter, evaluateFromComponents, fieldReadingDerivative, lengthParameter, probeOffsetParameter,
} from './model-reading';

const gradient = new Float64Array(8);
const loopGradient = new Float64Array(7);

/** Below this length/radius the solenoid is evaluated as a loop (difference O((L/R)²) < 1e-12). */
const flatRatio = 1e-6;

/** Axial position of point i from the coil's centre: distance from the near face + offset + L/2. */
function centre(params: Float64Array, points: SurveyPoints, i: number): number {
  return points.distance[i]! + params[3]! + 0.5 * params[2]!;
}

/** Solenoid field at z_centre = distance + probeOffset + length/2 (near-face datum), ρ = radial. */
function solenoidComponents(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
  const z = distance + params[3]! + 0.5 * params[2]!;
  if (params[2]! < flatRatio * params[1]!) loopField(params[0]!, params[1]!, z, radial, out);
  else solenoidField(params[0]!, params[1]!, params[2]!, z, radial, out);
}

/**
 * Catalog model `solenoid`: a single-layer finite solenoid (DOMAIN.md §1.3), parameters
 * [ampereTurns (A), radius (m), length (m), probeOffset (m), background (T)].
 *
 * Datum: the distance is measured along the axis from the NEAR FACE of the winding
 * (DESIGN.md conventions), so the sensing point is at z_centre = distance + probeOffset +
 * length/2 from the coil's centre, radial offset ρ = radial. Reading = |B| or B_z of
 * solenoidField (Derby & Olbert closed form) plus background. A length below 1e-6 of the
 * radius is evaluated as a flat loop.
 *
 * Jacobian: analytic on and off axis (solenoidFieldGradient: end-plane loop fields and
 * Euler's relation); ∂/∂length includes the datum shift, ∂z_centre/∂L = ½.
 * Initial guess: scan of radius with length = radius and best N·I (scanSize).
 */
export const solenoidModel: FieldModel = {
  id: 'solenoid',
  label: 'single-layer solenoid',
  physical: true,
  parameters: [
    ampereTurnsParameter,
    lengthParameter('radius', 'winding radius'),
    lengthParameter('length', 'winding length along the axis'),
    probeOffsetParameter,
    backgroundParameter,
  ],
  components: solenoidComponents,
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    evaluateFromComponents(solenoidComponents, 4, params, points, out);
  },
  jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    const ampereTurns = params[0]!;
    const radius = params[1]!;
    const flat = params[2]! < flatRatio * radius;
    for (let i = 0; i < points.n; i++) {
      const z = centre(params, points, i);
      if (flat) {
        // a loop: ∂B/∂L = 0 at L = 0 (B is even in L) apart from the datum shift
        loopFieldGradient(1, radius, z, points.radial[i]!, loopGradient);
        for (let j = 0; j < 4; j++) gradient[j] = loopGradient[j]!;
        gradient[4] = 0;
        gradient[5] = 0;
        gradient[6] = loopGradient[5]!;
        gradient[7] = loopGradient[6]!;
      } else {
        solenoidFieldGradient(1, radius, params[2]!, z, points.radial[i]!, gradient);
      }
      const bz = ampereTurns * gradient[0]!;
      const br = ampereTurns * gradient[1]!;
      const row = 5 * i;
      const kind = points.kind;
      out[row] = fieldReadingDerivative(kind, bz, br, gradient[0]!, gradient[1]!);
      out[row + 1] = fieldReadingDerivative(kind, bz, br, ampereTurns * gradient[6]!, ampereTurns * gradient[7]!);
      out[row + 2] = fieldReadingDerivative(kind, bz, br,
        ampereTurns * (gradient[4]! + 0.5 * gradient[2]!), ampereTurns * (gradient[5]! + 0.5 * gradient[3]!));
      out[row + 3] = fieldReadingDerivative(kind, bz, br, ampereTurns * gradient[2]!, ampereTurns * gradient[3]!);
      out[row + 4] = 1;
    }
  },
  initialGuess(points: SurveyPoints): Float64Array {
    return scanSize(solenoidModel, points, (size, out) => {
      out[0] = 1; out[1] = size; out[2] = size; out[3] = 0; out[4] = 0;
    }, 0);
  },
};
