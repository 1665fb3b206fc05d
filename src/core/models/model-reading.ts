import type { ParameterSpec, SurveyPoints } from './field-model';

const scratch = new Float64Array(2);

/**
 * What the meter reads from a field with components (B_z, B_ρ): the magnitude √(B_z² + B_ρ²)
 * for kind 'magnitude', the signed axial component B_z for kind 'axial' (field-model.ts).
 * SI: T. The background is added by the caller.
 *
 * @example fieldReading('magnitude', 3e-6, 4e-6) // 5e-6
 */
export function fieldReading(kind: SurveyPoints['kind'], axial: number, radial: number): number {
  return kind === 'axial' ? axial : Math.sqrt(axial * axial + radial * radial);
}

/**
 * Derivative of fieldReading with respect to a parameter θ, from the components and their
 * derivatives: ∂B_z/∂θ for 'axial'; (B_z ∂B_z/∂θ + B_ρ ∂B_ρ/∂θ)/|B| for 'magnitude'
 * (0 where |B| = 0, where the magnitude has no derivative). SI: T per parameter unit.
 *
 * @example fieldReadingDerivative('magnitude', 3, 4, 1, 0) // 0.6
 */
export function fieldReadingDerivative(
  kind: SurveyPoints['kind'], axial: number, radial: number, axialDerivative: number, radialDerivative: number,
): number {
  if (kind === 'axial') return axialDerivative;
  const magnitude = Math.sqrt(axial * axial + radial * radial);
  return magnitude === 0 ? 0 : (axial * axialDerivative + radial * radialDerivative) / magnitude;
}

/**
 * The two parameters every catalog model ends with (DESIGN.md conventions): the probe
 * offset (the sensing point sits this far beyond the stated distance, DOMAIN.md §3.1) and
 * a constant background field (DOMAIN.md §3.4), both unbounded.
 */
export const probeOffsetParameter: ParameterSpec = {
  name: 'probeOffset', unit: 'm', role: 'offset', lower: -Infinity, upper: Infinity,
  description: 'probe offset: the sensing point is this far beyond the stated distance',
};

/** See probeOffsetParameter. */
export const backgroundParameter: ParameterSpec = {
  name: 'background', unit: 'T', role: 'background', lower: -Infinity, upper: Infinity,
  description: 'background field added to every reading (Earth, offset of the meter)',
};

/**
 * Ampere-turns N·I of one coil. Unbounded below: with signed axial readings a negative
 * value means the field points against the probe's axis; magnitude readings cannot tell
 * the sign and start positive.
 */
export const ampereTurnsParameter: ParameterSpec = {
  name: 'ampereTurns', unit: 'A', role: 'amplitude', lower: -Infinity, upper: Infinity,
  description: 'ampere-turns N·I (turns times current per turn)',
};

/** A length parameter of the winding (m), strictly positive in use. */
export function lengthParameter(name: string, description: string): ParameterSpec {
  return { name, unit: 'm', role: 'geometry', lower: 0, upper: Infinity, description };
}

/** A model's field of the source alone at one survey position (FieldModel.components). */
export type ComponentsFunction = (params: Float64Array, distance: number, radial: number, out: Float64Array) => void;

/**
 * FieldModel.evaluate from FieldModel.components: reading = fieldReading(kind, B_z, B_ρ) +
 * params[backgroundIndex] at every point. Nothing allocated. SI: T.
 */
export function evaluateFromComponents(
  components: ComponentsFunction, backgroundIndex: number, params: Float64Array, points: SurveyPoints, out: Float64Array,
): void {
  const background = params[backgroundIndex]!;
  for (let i = 0; i < points.n; i++) {
    components(params, points.distance[i]!, points.radial[i]!, scratch);
    out[i] = fieldReading(points.kind, scratch[0]!, scratch[1]!) + background;
  }
}
