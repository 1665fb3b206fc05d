import type { FieldModel } from '../models/field-model';
import { parameterRole } from './parameter-roles';

/**
 * Copy of a parameter vector with the probe offset and the background set to zero, so that
 * the model gives the coil's own field at a distance from the datum: what a label claim
 * or a threshold distance refers to. The offset is where the probe's sensing point sat
 * (DESIGN.md "Distance datum"), the background the field with the coil off; neither is a
 * property of the coil.
 */
export function coilOnlyValues(model: FieldModel, values: Float64Array, into = new Float64Array(values.length)): Float64Array {
  into.set(values);
  model.parameters.forEach((parameter, j) => {
    const role = parameterRole(parameter.name);
    if (role === 'offset' || role === 'background') into[j] = 0;
  });
  return into;
}

/** Model-order flags: true for the parameters coilOnlyValues sets to zero. */
export function coilOnlyMask(model: FieldModel): boolean[] {
  return model.parameters.map((parameter) => {
    const role = parameterRole(parameter.name);
    return role === 'offset' || role === 'background';
  });
}
