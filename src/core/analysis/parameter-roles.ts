import type { ModelId } from '../models/field-model';

/**
 * What a parameter does to the survey curve (DOMAIN.md §5): an amplitude scales the whole
 * curve, a geometry parameter changes its normalised shape, the probe offset shifts it
 * along the axis, the background adds a constant, an exponent sets a power law's slope.
 */
export type ParameterRole = 'amplitude' | 'geometry' | 'offset' | 'background' | 'exponent';

const roles: Readonly<Record<string, ParameterRole>> = {
  ampereTurns: 'amplitude',
  moment: 'amplitude',
  amplitude: 'amplitude',
  radius: 'geometry',
  innerRadius: 'geometry',
  outerRadius: 'geometry',
  length: 'geometry',
  separation: 'geometry',
  width: 'geometry',
  height: 'geometry',
  probeOffset: 'offset',
  background: 'background',
  exponent: 'exponent',
};

/**
 * Role of a catalog parameter (DESIGN.md catalog names); an unknown name counts as
 * geometry, the conservative reading (a shape change is never reported as amplitude loss).
 * @example parameterRole('radius') // 'geometry'
 */
export function parameterRole(name: string): ParameterRole {
  return roles[name] ?? 'geometry';
}

/**
 * Far-field magnetic moment m (A·m²) implied by a physical model's parameters, the only
 * quantity far-field readings determine (DOMAIN.md §7.6): loop and thin solenoid
 * m = N·I·π·R²; thick coil m = N·I·π·(a₁² + a₁a₂ + a₂²)/3 (DOMAIN.md §1.4); coaxial pair
 * m = 2·N·I·π·R² (ampere-turns per coil); rectangle m = N·I·w·h (§1.6); dipole its moment.
 * Null for descriptive power laws or a missing parameter.
 *
 * @example farFieldMoment('loop', { ampereTurns: 400, radius: 0.05 }) // π (A·m²)
 */
export function farFieldMoment(model: ModelId, p: Readonly<Record<string, number>>): number | null {
  const ni = p['ampereTurns'];
  let moment: number | undefined;
  switch (model) {
    case 'loop':
    case 'solenoid':
      moment = ni === undefined || p['radius'] === undefined ? undefined : ni * Math.PI * p['radius'] ** 2;
      break;
    case 'thick-coil': {
      const a1 = p['innerRadius'];
      const a2 = p['outerRadius'];
      moment = ni === undefined || a1 === undefined || a2 === undefined ? undefined : (ni * Math.PI * (a1 * a1 + a1 * a2 + a2 * a2)) / 3;
      break;
    }
    case 'coil-pair':
      moment = ni === undefined || p['radius'] === undefined ? undefined : 2 * ni * Math.PI * p['radius'] ** 2;
      break;
    case 'rectangle':
      moment = ni === undefined || p['width'] === undefined || p['height'] === undefined ? undefined : ni * p['width'] * p['height'];
      break;
    case 'dipole':
      moment = p['moment'];
      break;
    default:
      moment = undefined;
  }
  return moment === undefined || !Number.isFinite(moment) ? null : moment;
}
