/**
 * core/fit/strategy: how a survey is fitted with the engine: the model as a least-squares
 * problem, starts (profile start, settled fits, multi-start), effective variance, robust
 * loss, the search of one model (searchModelFit, fitModel), fitSurvey and compareModels,
 * and a scan fit restated in distance form.
 */
export { compareModels, withAkaikeWeights, type ModelComparison } from './compare-models';
export { distanceFormFit, inDistanceForm } from './distance-form-fit';
export { effectiveUncertainty, fitEffectiveVariance, type EffectiveVarianceFit, type EffectiveVarianceOptions } from './effective-variance';
export { distanceSlope, fieldModelProblem } from './field-model-problem';
export { fitSurvey, fitSurveyNotes } from './fit-survey';
export { fitMultiStart, type MultiStartFit, type MultiStartOptions } from './multi-start-fit';
export { readingUncertainty, type ReadingUncertainty } from './reading-uncertainty';
export { fitRobust, type RobustFit, type RobustLoss, type RobustOptions } from './robust-fit';
export { surveyPoints } from './survey-points';
