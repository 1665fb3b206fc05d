import { getModel, modelIds } from '../models/catalog';
import type { ParameterSpec } from '../models/field-model';
import { centreParameter } from '../models/scan-model';

/**
 * What a parameter does to the survey curve (DOMAIN.md §5): an amplitude scales the whole
 * curve, a geometry parameter changes its normalised shape, the probe offset (or a scan's
 * centre) shifts it along the axis, the background adds a constant, an exponent sets a
 * power law's slope. The catalog's ParameterSpec.role, with a scan's centre counted as
 * an offset.
 */
export type ParameterRole = 'amplitude' | 'geometry' | 'offset' | 'background' | 'exponent';

/** The analysis role of a catalog parameter. @example specRole(getModel('loop').parameters[1]!) // 'geometry' */
export function specRole(spec: ParameterSpec): ParameterRole {
  return spec.role === 'centre' ? 'offset' : spec.role;
}

/** Role by parameter name, read from the catalog once (a name has one role in every model). */
const roles = new Map<string, ParameterRole>();
for (const spec of [...modelIds.flatMap((id) => getModel(id).parameters), centreParameter]) roles.set(spec.name, specRole(spec));

/**
 * Role of a catalog parameter by name (DESIGN.md catalog names); an unknown name counts as
 * geometry, the conservative reading (a shape change is never reported as amplitude loss).
 * @example parameterRole('radius') // 'geometry'
 */
export function parameterRole(name: string): ParameterRole {
  return roles.get(name) ?? 'geometry';
}
