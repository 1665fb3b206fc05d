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
  centre: 'offset',
  lateralCentre: 'offset',
  centreX: 'offset',
  centreY: 'offset',
  centreZ: 'offset',
  tilt: 'offset',
  azimuth: 'offset',
  background: 'background',
  backgroundX: 'background',
  backgroundY: 'background',
  backgroundZ: 'background',
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
