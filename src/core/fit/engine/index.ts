/**
 * core/fit/engine: the least-squares engine (MINPACK lmder: pivoted QR or the checked
 * normal-equation factor, lmpar damping, MINUIT bound transforms, a reusable workspace)
 * and the covariance of its solution. Knows nothing of field models or surveys.
 */
export { fitLeastSquares } from './least-squares';
export type { AbortFlag, LeastSquaresOptions, LeastSquaresProblem, LeastSquaresSolution, StopCode } from './least-squares-types';
export { createLeastSquaresWorkspace, type LeastSquaresWorkspace } from './least-squares-workspace';
export { parameterUncertainty, type ParameterUncertainty } from './parameter-uncertainty';
