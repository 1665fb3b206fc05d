import { solenoidField } from '../physics/solenoid-field';
import { solenoidFieldGradient } from '../physics/solenoid-field-gradient';
import { thickCoilField } from '../physics/thick-coil-field';
import { thickCoilFieldGradient } from '../physics/thick-coil-field-gradient';
import type { FieldModel, SurveyPoints } from './field-model';
import { scanSize } from './initial-guess';
import {
  ampereTurnsParameter, backgroundParameter, evaluateFromComponents, fieldReadingDerivative, lengthParameter, probeOffsetParameter,
} from './model-reading';

const gradient = new Float64Array(10);
const shellGradient = new Float64Array(8);

/** Below this depth/outer radius the winding is evaluated as a thin solenoid at its mean radius. */
const thinRatio = 1e-6;

/** The winding of a parameter vector with the radii in sorted order (the field is symmetric in them). */
function winding(params: Float64Array) {
  const inner = Math.min(params[1]!, params[2]!);
  const outer = Math.max(params[1]!, params[2]!);
  return { ampereTurns: params[0]!, inner, outer, length: params[3]!, thin: outer - inner < thinRatio * outer };
}

/** Thick-coil field at z_centre = distance + probeOffset + length/2 (near-face datum), ρ = radial. */
function thickCoilComponents(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
  const inner = Math.min(params[1]!, params[2]!);
  const outer = Math.max(params[1]!, params[2]!);
  const z = distance + params[4]! + 0.5 * params[3]!;
  if (outer - inner < thinRatio * outer) solenoidField(params[0]!, 0.5 * (inner + outer), params[3]!, z, radial, out);
  else thickCoilField(params[0]!, inner, outer, params[3]!, z, radial, out);
}

/**
 * Catalog model `thick-coil`: a multilayer coil with uniform turn density over the
 * rectangular winding cross-section innerRadius ≤ r ≤ outerRadius, |z| ≤ length/2
 * (DOMAIN.md §1.4), parameters [ampereTurns (A), innerRadius (m), outerRadius (m),
 * length (m), probeOffset (m), background (T)].
 *
 * Datum: the distance is measured from the NEAR FACE of the winding (DESIGN.md), so the
 * sensing point is at z_centre = distance + probeOffset + length/2, ρ = radial. Reading =
 * |B| or B_z of thickCoilField (log formula on axis, graded Gauss–Legendre over the depth
 * off axis, accuracy 1e-12) plus background. The two radii may cross during a fit: the
 * field is symmetric in them, so they are used in sorted order; a depth below 1e-6 of the
 * outer radius is evaluated as a thin solenoid at the mean radius.
 *
 * Jacobian: analytic on and off axis (thickCoilFieldGradient: radial quadrature of
 * end-plane loop fields, shell fields at the two radii); ∂/∂length includes the datum
 * shift ½∂/∂z. Initial guess: scan of one size s with innerRadius = s/2, outerRadius = 3s/2,
 * length = s and the best N·I (scanSize); DOMAIN.md §7.6 warns that a₁, a₂, L are weakly
 * identifiable from on-axis data, so fix what the label gives.
 */
export const thickCoilModel: FieldModel = {
  id: 'thick-coil',
  label: 'multilayer coil (thick winding)',
  physical: true,
  parameters: [
    ampereTurnsParameter,
    lengthParameter('innerRadius', 'inner radius of the winding'),
    lengthParameter('outerRadius', 'outer radius of the winding'),
    lengthParameter('length', 'winding length along the axis'),
    probeOffsetParameter,
    backgroundParameter,
  ],
  components: thickCoilComponents,
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    evaluateFromComponents(thickCoilComponents, 5, params, points, out);
  },
  jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    const { ampereTurns, inner, outer, length, thin } = winding(params);
    const innerColumn = params[1]! > params[2]! ? 2 : 1;
    for (let i = 0; i < points.n; i++) {
      const z = points.distance[i]! + params[4]! + 0.5 * length;
      if (thin) {
        // ∂/∂a₁ = ∂/∂a₂ = ½ ∂/∂a of the thin shell at the mean radius
        solenoidFieldGradient(1, 0.5 * (inner + outer), length, z, points.radial[i]!, shellGradient);
        for (let j = 0; j < 6; j++) gradient[j] = shellGradient[j]!;
        gradient[6] = 0.5 * shellGradient[6]!;
        gradient[7] = 0.5 * shellGradient[7]!;
        gradient[8] = gradient[6]!;
        gradient[9] = gradient[7]!;
      } else {
        thickCoilFieldGradient(1, inner, outer, length, z, points.radial[i]!, gradient);
      }
      const bz = ampereTurns * gradient[0]!;
      const br = ampereTurns * gradient[1]!;
      const kind = points.kind;
      const row = 6 * i;
      out[row] = fieldReadingDerivative(kind, bz, br, gradient[0]!, gradient[1]!);
      out[row + innerColumn] = fieldReadingDerivative(kind, bz, br, ampereTurns * gradient[6]!, ampereTurns * gradient[7]!);
      out[row + 3 - innerColumn] = fieldReadingDerivative(kind, bz, br, ampereTurns * gradient[8]!, ampereTurns * gradient[9]!);
      out[row + 3] = fieldReadingDerivative(kind, bz, br,
        ampereTurns * (gradient[4]! + 0.5 * gradient[2]!), ampereTurns * (gradient[5]! + 0.5 * gradient[3]!));
      out[row + 4] = fieldReadingDerivative(kind, bz, br, ampereTurns * gradient[2]!, ampereTurns * gradient[3]!);
      out[row + 5] = 1;
    }
  },
  initialGuess(points: SurveyPoints): Float64Array {
    return scanSize(thickCoilModel, points, (size, out) => {
      out[0] = 1; out[1] = 0.5 * size; out[2] = 1.5 * size; out[3] = size; out[4] = 0; out[5] = 0;
    }, 0);
  },
};
