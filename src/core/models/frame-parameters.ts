import type { ParameterSpec } from './field-model';
import { lateralCentreParameter } from './lateral-model';
import { poseParameters, vectorBackgroundParameters } from './pose-model';
import { centreParameter } from './scan-model';

/** The parameters a survey's frame puts in a catalog model (scan, transverse scan, 3-D map), for their descriptions. */
export const frameParameters: readonly ParameterSpec[] = [centreParameter, lateralCentreParameter, ...poseParameters, ...vectorBackgroundParameters];
