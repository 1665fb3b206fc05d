import { RingfallError } from '../errors';
import type { ModelId, ParameterSpec } from './field-model';
import { getModel } from './catalog';
import { acceptedRange, acceptsValue } from './parse-parameter-assignment';

/** The forward field of a model at one point, SI. */
export interface FieldPrediction {
  /** |B| of the source plus the background parameter (what a magnitude meter reads), T. */
  readonly field: number;
  /** Axial component of the source alone, T. */
  readonly axial: number;
  /** Radial component of the source alone, T. */
  readonly radial: number;
}

/** True for a parameter that defaults to 0 when not given: it describes the survey (probe offset, background), not the coil. */
export function isSurveyParameter(spec: ParameterSpec): boolean {
  return spec.role === 'offset' || spec.role === 'background';
}

/**
 * Field of a catalog model at (distance along the axis from the model's datum, radial
 * offset), with parameters by name in SI (probeOffset and background default to 0).
 * Formulas and sources: the model's physics file (DOMAIN.md §1).
 *
 * @throws RingfallError `MODEL_UNKNOWN`; `PREDICT_MISSING` for a coil parameter not given;
 *   `PARAMETER_UNKNOWN` for a name the model does not have; `PARAMETER_VALUE` for a value
 *   that is not a finite number within the parameter's bounds (lengths > 0); `PREDICT_POINT`
 *   for a distance or radial offset that is not a finite number; `PREDICT_SINGULAR` on the winding
 * @example predictField('loop', { ampereTurns: 1, radius: 0.1 }, { distance: 0.1 }).axial // 2.2214414703e-6 (DOMAIN.md §9 row 2)
 */
export function predictField(
  modelId: ModelId | string,
  params: Readonly<Record<string, number>>,
  point: { readonly distance: number; readonly radial?: number },
): FieldPrediction {
  const model = getModel(modelId, 'model');
  const names = model.parameters.map((p) => p.name);
  for (const [name, given] of Object.entries(params)) {
    // typed as numbers, but library callers in plain JavaScript can pass anything
    const value: unknown = given;
    const parameter = model.parameters[names.indexOf(name)];
    if (parameter === undefined) {
      throw new RingfallError('PARAMETER_UNKNOWN', `Parameter: "${name}" is not a parameter of ${model.id}. Use: ${names.join(', ')}.`, { value: name });
    }
    if (value === undefined) continue; // reported as missing below
    if (typeof value !== 'number' || !acceptsValue(parameter, value)) {
      throw new RingfallError(
        'PARAMETER_VALUE',
        `Parameter: ${name} = ${String(value)} is out of range for ${model.id} (${acceptedRange(parameter)}). Give the ${parameter.description.split(':')[0]} as a finite number in SI (${parameter.unit}).`,
        { value, where: name },
      );
    }
  }
  const radial = point.radial ?? 0;
  for (const [label, value] of [['distance', point.distance], ['radial', radial]] as const) {
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new RingfallError(
        'PREDICT_POINT',
        `Point: ${label} ${String(value)} is not a finite number of metres. Give the distance along the axis from the ${model.id} datum and the radial offset in m.`,
        { value, where: label },
      );
    }
  }
  const missing = model.parameters.filter((p) => params[p.name] === undefined && !isSurveyParameter(p)).map((p) => p.name);
  if (missing.length > 0) {
    throw new RingfallError('PREDICT_MISSING', `Parameters: the ${model.id} model needs ${missing.join(', ')}. Give them in SI (m, A, T).`, { value: missing });
  }
  const vector = Float64Array.from(names, (name) => params[name] ?? 0);
  const out = new Float64Array(2);
  model.components!(vector, point.distance, radial, out);
  const background = params['background'] ?? 0;
  const prediction = { field: Math.hypot(out[0]!, out[1]!) + background, axial: out[0]!, radial: out[1]! };
  if (!Number.isFinite(prediction.field) || !Number.isFinite(prediction.axial) || !Number.isFinite(prediction.radial)) {
    throw new RingfallError(
      'PREDICT_SINGULAR',
      `Point: the ${model.id} field is undefined at ${point.distance} m along the axis, ${radial} m off it (on the winding, or at the source itself). Move the point off the winding.`,
      { value: [point.distance, radial] },
    );
  }
  return prediction;
}
