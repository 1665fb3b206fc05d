/**
 * core/physics: field sources in SI (A, m, T, A·m²), each returning the axial and radial
 * components at (z along the axis, ρ off it). μ0 is CODATA 2018 (vacuum-permeability.ts).
 */
export { vacuumPermeability } from './vacuum-permeability';
export { ellipticKE } from './elliptic-ke';
export { bulirschCel } from './bulirsch-cel';
export { gaussLegendre, type GaussLegendreRule } from './gauss-legendre';
export { loopField, loopFieldOnAxis, loopFieldBulk, paraxialLimit, bulkParameterLimit } from './loop-field';
export { loopFieldBatch, loopFieldBatchEngine, type LoopFieldBatchEngine } from './loop-field-batch';
export { loopFieldGradient } from './loop-field-gradient';
export { loopAxisDerivatives } from './loop-axis-derivatives';
export { solenoidField, solenoidFieldOnAxis } from './solenoid-field';
export { solenoidFieldGradient } from './solenoid-field-gradient';
export { thickCoilField, thickCoilFieldOnAxis, radialLog } from './thick-coil-field';
export { thickCoilFieldGradient } from './thick-coil-field-gradient';
export { coilPairField, coilPairFieldGradient } from './coil-pair-field';
export { addSegmentField, polygonField } from './segment-field';
export { rectangleField, rectangleFieldOnAxis, rectangleFieldOnAxisGradient } from './rectangle-field';
export { dipoleField, dipoleFieldGradient } from './dipole-field';
export { cylinderMagnetFieldOnAxis, blockMagnetFieldOnAxis } from './magnet-field';
export { powerLawField } from './power-law-field';
