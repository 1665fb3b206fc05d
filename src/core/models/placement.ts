import type { ParameterSpec } from './field-model';
import { lateralCentreParameter } from './lateral-model';
import { poseParameters, vectorBackgroundParameters } from './pose-model';
import { centreParameter } from './scan-model';

/**
 * Parameters that place a coil relative to the readings rather than describe the coil:
 * the probe offset, a scan's centre, a transverse scan's lateral centre and a 3-D map's
 * pose (centre coordinates, tilt, azimuth). Sizes, moments and "is this a coil length"
 * checks leave them out.
 */
const placementNames: ReadonlySet<string> = new Set(['probeOffset', 'centre', 'lateralCentre', 'centreX', 'centreY', 'centreZ', 'tilt', 'azimuth']);

/** True for a parameter that places the coil (see above). @example isPlacementParameter('tilt') // true */
export function isPlacementParameter(name: string): boolean {
  return placementNames.has(name);
}

/** True for a background parameter: the scalar `background` or a vector map's backgroundX/Y/Z. */
export function isBackgroundParameter(name: string): boolean {
  return name === 'background' || name === 'backgroundX' || name === 'backgroundY' || name === 'backgroundZ';
}

/** The parameters a survey's frame puts in a catalog model (scan, transverse scan, 3-D map), for their descriptions. */
export const frameParameters: readonly ParameterSpec[] = [centreParameter, lateralCentreParameter, ...poseParameters, ...vectorBackgroundParameters];
