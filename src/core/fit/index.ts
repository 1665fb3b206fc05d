export type { FitResult, FitStats, ParameterEstimate } from './fit-result';
export { fitLeastSquares } from './least-squares';
export type {
  AbortFlag,
  LeastSquaresOptions,
  LeastSquaresProblem,
  LeastSquaresSolution,
  StopCode,
} from './least-squares-types';
export { createLeastSquaresWorkspace, type LeastSquaresWorkspace } from './least-squares-workspace';
export { parameterUncertainty, type ParameterUncertainty } from './parameter-uncertainty';
export {
  effectiveUncertainty,
  fitEffectiveVariance,
  type EffectiveVarianceFit,
  type EffectiveVarianceOptions,
} from './effective-variance';
export { fitRobust, type RobustFit, type RobustLoss, type RobustOptions } from './robust-fit';
export { fitMultiStart, type MultiStartFit, type MultiStartOptions } from './multi-start-fit';
export { distanceSlope, fieldModelProblem } from './field-model-problem';
export { fitSurvey, fitSurveyNotes } from './fit-survey';
export { defaultModels, checkFixedParameters, type FitSurveyOptions } from './fit-survey-options';
export { compareModels, type ModelComparison } from './compare-models';
export { describePowerLaw } from './describe-power-law';
export { farFieldMoment, momentEstimate, type MomentEstimate } from './far-field-moment';
export { readingUncertainty, type ReadingUncertainty } from './reading-uncertainty';
export { runsTest, type RunsTest } from './runs-test';
export { surveyPoints } from './survey-points';
