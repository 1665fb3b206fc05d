/**
 * core/fit: the public face of the fitting code. engine/ (least squares, no models) ←
 * strategy/ (fitting a survey) → diagnostics/ (warnings and descriptions of a fit);
 * fit-result.ts and fit-survey-options.ts are the types and options all three share.
 */
export type { FitResult, FitStats, ParameterEstimate } from './fit-result';
export { defaultModels, checkFixedParameters, type FitSurveyOptions } from './fit-survey-options';
export {
  fitLeastSquares,
  createLeastSquaresWorkspace,
  parameterUncertainty,
  type AbortFlag,
  type LeastSquaresOptions,
  type LeastSquaresProblem,
  type LeastSquaresSolution,
  type LeastSquaresWorkspace,
  type ParameterUncertainty,
  type StopCode,
} from './engine';
export {
  compareModels,
  distanceSlope,
  effectiveUncertainty,
  fieldModelProblem,
  fitEffectiveVariance,
  fitMultiStart,
  fitRobust,
  fitSurvey,
  fitSurveyNotes,
  readingUncertainty,
  surveyPoints,
  type EffectiveVarianceFit,
  type EffectiveVarianceOptions,
  type ModelComparison,
  type MultiStartFit,
  type MultiStartOptions,
  type ReadingUncertainty,
  type RobustFit,
  type RobustLoss,
  type RobustOptions,
} from './strategy';
export { describePowerLaw, farFieldMoment, momentEstimate, runsTest, type MomentEstimate, type RunsTest } from './diagnostics';
