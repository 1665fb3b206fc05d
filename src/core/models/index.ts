/**
 * core/models: the fit-model catalog of DESIGN.md. Each entry implements FieldModel
 * (field-model.ts): parameters with SI units and bounds, the predicted reading at every
 * survey point, an analytic Jacobian and data-driven starting values.
 */
import { coilPairModel } from './coil-pair-model';
import { dipoleModel } from './dipole-model';
import { loopModel } from './loop-model';
import { inverseCubeModel, inverseSquareModel, powerLawModel } from './power-law-model';
import { rectangleModel } from './rectangle-model';
import { solenoidModel } from './solenoid-model';
import { thickCoilModel } from './thick-coil-model';

export type { FieldModel, ModelId, ParameterSpec, ParameterUnit, SurveyPoints } from './field-model';
export { fieldReading, fieldReadingDerivative } from './model-reading';
export { parseParameterAssignment, parameterQuantityKind, exampleValue } from './parse-parameter-assignment';

export { getModel, isModelId, modelIds } from './catalog';
export { coilPairModel, dipoleModel, inverseCubeModel, inverseSquareModel, loopModel, powerLawModel, rectangleModel, solenoidModel, thickCoilModel };
export { isSurveyParameter, predictField, type FieldPrediction } from './predict-field';
export { centreParameter, nearFaceModels, peakCentre, scanModel } from './scan-model';
