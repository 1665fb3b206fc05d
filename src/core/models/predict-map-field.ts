import { RingfallError } from '../errors';
import { axisDirection, coilFrame } from '../physics/coil-pose';
import type { ModelId } from './field-model';
import { getModel } from './catalog';
import { poseModel, poseModelIds } from './pose-model';
import { predictField, type FieldPrediction } from './predict-field';
import { nearFaceModels } from './scan-model';

/** The field of a posed coil at a point of a map's frame, SI. */
export interface PosedFieldPrediction extends FieldPrediction {
  /** The field vector of the source alone in the map's frame (T). */
  readonly vector: { readonly x: number; readonly y: number; readonly z: number };
  /** The point's distance along the axis from the model's datum (|u| less length/2 for a near-face model) and offset ρ from the axis (m). */
  readonly distance: number;
  readonly radialOffset: number;
}

/** Pose parameters that default to 0: the coil at the map's origin with its axis along +z. */
const poseDefaults: Readonly<Record<string, number>> = { centreX: 0, centreY: 0, centreZ: 0, tilt: 0, azimuth: 0 };

/**
 * Field of a catalog model with an axis (loop, thick-coil, solenoid, coil-pair, dipole)
 * placed by a pose — centreX, centreY, centreZ (m), tilt from +z and azimuth from +x (rad),
 * each 0 when not given (physics/coil-pose.ts) — at a point (x, y, z) of the map's frame.
 * The coil's own parameters as for predictField (probeOffset has no meaning here); the
 * background is added to |B| only. B = B_z n + B_ρ ρ̂ with B_ρ odd in the axial coordinate.
 *
 * @throws RingfallError as predictField, and `PREDICT_POINT` for a model without an axis
 *   or a point that is not three finite numbers.
 * @example predictFieldAtPoint('loop', { ampereTurns: 1, radius: 0.1, tilt: Math.PI / 2 }, { x: 0.1, y: 0, z: 0 }).vector.x // 2.2214414703e-6
 */
export function predictFieldAtPoint(
  modelId: ModelId | string,
  params: Readonly<Record<string, number>>,
  point: { readonly x: number; readonly y: number; readonly z: number },
): PosedFieldPrediction {
  const base = getModel(modelId, 'model');
  if (!poseModelIds.includes(base.id)) {
    throw new RingfallError('PREDICT_POINT', `Point: the ${base.id} model has no axis to place in a map's x, y, z. Use one of ${poseModelIds.join(', ')}, or give the distance along the axis instead.`, { value: base.id });
  }
  const posed = poseModel(base, false);
  for (const name of Object.keys(params)) {
    if (!posed.parameters.some((p) => p.name === name)) {
      throw new RingfallError('PARAMETER_UNKNOWN', `Parameter: "${name}" is not a parameter of ${base.id} placed in a map. Use: ${posed.parameters.map((p) => p.name).join(', ')}.`, { value: name });
    }
  }
  for (const [label, value] of Object.entries(point)) {
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new RingfallError('PREDICT_POINT', `Point: ${label} ${String(value)} is not a finite number of metres. Give x, y and z of the point in the map's frame in m.`, { value, where: label });
    }
  }
  const pose = { ...poseDefaults, ...Object.fromEntries(Object.entries(params).filter(([name]) => name in poseDefaults)) };
  const axis = new Float64Array(3);
  axisDirection(pose['tilt']!, pose['azimuth']!, axis);
  const frame = new Float64Array(5);
  coilFrame(point.x, point.y, point.z, [pose['centreX']!, pose['centreY']!, pose['centreZ']!], axis, frame);
  const shift = nearFaceModels.has(base.id) ? 0.5 * (params['length'] ?? 0) : 0;
  const own = Object.fromEntries(Object.entries(params).filter(([name]) => !(name in poseDefaults)));
  // the coil's own field at its distance from the datum, radial ρ (predictField checks the values)
  const local = predictField(base.id, own, { distance: Math.abs(frame[0]!) - shift, radial: frame[1]! });
  const radial = frame[0]! < 0 ? -local.radial : local.radial;
  const vector = {
    x: local.axial * axis[0]! + radial * frame[2]!,
    y: local.axial * axis[1]! + radial * frame[3]!,
    z: local.axial * axis[2]! + radial * frame[4]!,
  };
  return { field: local.field, axial: local.axial, radial, vector, distance: Math.abs(frame[0]!) - shift, radialOffset: frame[1]! };
}
