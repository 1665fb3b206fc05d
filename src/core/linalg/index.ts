export { choleskyFactor, choleskyFactorize, choleskyFromNormalEquations, choleskyInPlace, choleskyInverse, choleskyLogDeterminant } from './cholesky';
export { applyQTransposeAndFinishR, qrFactorize, triangularFactor } from './householder-qr';
export { singularValues, type SingularValues } from './singular-value-decomposition';
