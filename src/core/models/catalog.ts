import { RingfallError } from '../errors';
import type { FieldModel, ModelId } from './field-model';
import { coilPairModel } from './coil-pair-model';
import { dipoleModel } from './dipole-model';
import { loopModel } from './loop-model';
import { inverseCubeModel, inverseSquareModel, powerLawModel } from './power-law-model';
import { rectangleModel } from './rectangle-model';
import { solenoidModel } from './solenoid-model';
import { thickCoilModel } from './thick-coil-model';

const catalog: Readonly<Record<ModelId, FieldModel>> = {
  'loop': loopModel,
  'thick-coil': thickCoilModel,
  'solenoid': solenoidModel,
  'coil-pair': coilPairModel,
  'rectangle': rectangleModel,
  'dipole': dipoleModel,
  'power-law': powerLawModel,
  'inverse-square': inverseSquareModel,
  'inverse-cube': inverseCubeModel,
};

/** The catalog ids in DESIGN.md order (part of the CLI and JSON contract). */
export const modelIds: readonly ModelId[] = [
  'loop', 'thick-coil', 'solenoid', 'coil-pair', 'rectangle', 'dipole', 'power-law', 'inverse-square', 'inverse-cube',
];

/** True when `id` is a catalog id. @example isModelId('loop') // true */
export function isModelId(id: string): id is ModelId {
  return Object.prototype.hasOwnProperty.call(catalog, id);
}

/**
 * The catalog model with this id. Accepts any string so that callers holding user input
 * get a usable error: "Model: "helix" is not a model (--model). Use one of: loop, …".
 *
 * @throws RingfallError code `MODEL_UNKNOWN` for an id not in the catalog
 * @example getModel('loop').parameters.map((p) => p.name) // ['ampereTurns', 'radius', 'probeOffset', 'background']
 */
export function getModel(id: ModelId | string, where = '--model'): FieldModel {
  if (!isModelId(id)) {
    throw new RingfallError('MODEL_UNKNOWN', `Model: "${id}" is not a model (${where}). Use one of: ${modelIds.join(', ')}.`, { value: id, where });
  }
  return catalog[id];
}
