import { loopField, paraxialLimit } from '../physics/loop-field';
import { vacuumPermeability } from '../physics/vacuum-permeability';
import { loopFieldGradient } from '../physics/loop-field-gradient';
import type { FieldModel, SurveyPoints } from './field-model';
import { halfValueRadius } from './half-value-radius';
import { scanSize } from './initial-guess';
import {
  ampereTurnsParameter, backgroundParameter, fieldReading, fieldReadingDerivative, lengthParameter, probeOffsetParameter,
} from './model-reading';

const gradient = new Float64Array(7);
const components = new Float64Array(2);
/** One reading's derivatives ∂/∂(ampereTurns, radius, probeOffset, background), written by loopDerivatives. */
const row = new Float64Array(4);

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
/**
 * The reading at point i (loopField + background), without callbacks: on the axis the
 * closed form of loopField's ρ = 0 branch, inline (same operations, same bits).
 */
function loopReading(params: Float64Array, points: SurveyPoints, i: number): number {
  const ampereTurns = params[0]!;
  const a = params[1]!;
  const z = points.distance[i]! + params[2]!;
  const radial = points.radial[i]!;
  if (radial === 0) {
    const s2 = a * a + z * z;
    return fieldReading(points.kind, (vacuumPermeability * ampereTurns * a * a) / (2 * s2 * Math.sqrt(s2)), 0) + params[3]!;
  }
  loopField(ampereTurns, a, z, radial, components);
  return fieldReading(points.kind, components[0]!, components[1]!) + params[3]!;
}

/**
 * ∂reading/∂(ampereTurns, radius, probeOffset, background) at point i into `row`. On the
 * axis (ρ = 0, off the degenerate point a = z = 0) the ρ = 0 case of loopFieldGradient's
 * paraxial branch, inline: there the series terms vanish exactly, so the values are the
 * same to the last bit; elsewhere loopFieldGradient itself.
 */
function loopDerivatives(params: Float64Array, points: SurveyPoints, i: number): void {
  const ampereTurns = params[0]!;
  const a = params[1]!;
  const z = points.distance[i]! + params[2]!;
  const radial = points.radial[i]!;
  const s2 = a * a + z * z;
  if (radial === 0 && 0 < paraxialLimit * s2) {
    // loopAxisDerivatives' f and f′, and loopFieldGradient's scale with N·I = 1.
    const inverseS2 = 1 / (a * a + z * z);
    const f = inverseS2 * Math.sqrt(inverseS2);
    const slope = -3 * z * (f * inverseS2);
    const scale = 0.5 * vacuumPermeability * a * a;
    const bz = scale * f;
    const dzBz = scale * slope;
    const axial = ampereTurns * bz;
    row[0] = fieldReadingDerivative(points.kind, axial, 0, bz, 0);
    row[1] = fieldReadingDerivative(points.kind, axial, 0, ampereTurns * ((-bz - z * dzBz) / a), 0);
    row[2] = fieldReadingDerivative(points.kind, axial, 0, ampereTurns * dzBz, 0);
    row[3] = 1;
    return;
  }
  loopFieldGradient(1, a, z, radial, gradient);
  const bz = ampereTurns * gradient[0]!;
  const br = ampereTurns * gradient[1]!;
  row[0] = fieldReadingDerivative(points.kind, bz, br, gradient[0]!, gradient[1]!);
  row[1] = fieldReadingDerivative(points.kind, bz, br, ampereTurns * gradient[5]!, ampereTurns * gradient[6]!);
  row[2] = fieldReadingDerivative(points.kind, bz, br, ampereTurns * gradient[2]!, ampereTurns * gradient[3]!);
  row[3] = 1;
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
 * ∂/∂radius by Euler's relation, ∂/∂probeOffset = ∂/∂z). `evaluate`, `jacobian` and
 * `normalEquations` are array kernels over the survey (no per-reading callbacks), with the
 * on-axis points (every point of an axial survey) in closed form.
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
    for (let i = 0; i < points.n; i++) out[i] = loopReading(params, points, i);
  },
  jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    for (let i = 0; i < points.n; i++) {
      loopDerivatives(params, points, i);
      out.set(row, 4 * i);
    }
  },
  normalEquations(params, points, weight, columnScale, residuals, gram, gradientOut): void {
    // The 10 entries of the lower triangle and the 4 of the gradient stay in registers.
    const s0 = columnScale[0]!;
    const s1 = columnScale[1]!;
    const s2 = columnScale[2]!;
    const s3 = columnScale[3]!;
    let g00 = 0, g10 = 0, g11 = 0, g20 = 0, g21 = 0, g22 = 0, g30 = 0, g31 = 0, g32 = 0, g33 = 0;
    let b0 = 0, b1 = 0, b2 = 0, b3 = 0;
    for (let i = 0; i < points.n; i++) {
      loopDerivatives(params, points, i);
      const w = weight[i]!;
      const r = residuals[i]!;
      const j0 = row[0]! * w * s0;
      const j1 = row[1]! * w * s1;
      const j2 = row[2]! * w * s2;
      const j3 = row[3]! * w * s3;
      b0 += j0 * r; b1 += j1 * r; b2 += j2 * r; b3 += j3 * r;
      g00 += j0 * j0; g10 += j1 * j0; g11 += j1 * j1; g20 += j2 * j0; g21 += j2 * j1;
      g22 += j2 * j2; g30 += j3 * j0; g31 += j3 * j1; g32 += j3 * j2; g33 += j3 * j3;
    }
    gram[0] = g00; gram[4] = g10; gram[5] = g11; gram[8] = g20; gram[9] = g21;
    gram[10] = g22; gram[12] = g30; gram[13] = g31; gram[14] = g32; gram[15] = g33;
    gradientOut[0] = b0; gradientOut[1] = b1; gradientOut[2] = b2; gradientOut[3] = b3;
  },
  initialGuess(points: SurveyPoints): Float64Array {
    return scanSize(loopModel, points, (radius, out) => {
      out[0] = 1; out[1] = radius; out[2] = 0; out[3] = 0;
    }, 0, halfValueRadius(points));
  },
};
