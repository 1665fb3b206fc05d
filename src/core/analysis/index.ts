/** The analyses' public surface: spec verdicts, threshold distances, fleet history, measurement plans. */
export { decideConformity, decisionRule, type ConformityDecision } from './decide-conformity';
export { defaultClaimDatum, type Spec, type SpecParameter, type SpecClaim, type ClaimDatum } from './spec/spec';
export { selectSpec } from './spec/select-spec';
export { specUse } from './spec/spec-use';
export { verifySpec } from './spec/verify-spec';
export { readingRelation, type ReadingRelation } from './spec/reading-relation';
export { thresholdDistances, type ThresholdContext } from './thresholds/threshold-distances';
export { parseThresholdLevel, thresholdPresets, type ThresholdLevel } from './thresholds/threshold-level';
export { icnirp2010ReferenceLevel, type ExposureGroup, type ReferenceLevel } from './thresholds/icnirp-reference-level';
export { thresholdCautions } from './thresholds/threshold-cautions';
export { fallDistance, type FallDistance } from './thresholds/fall-distance';
export { fleetHistory, defaultFleetTolerance, type FleetSurvey, type FleetOptions } from './fleet/fleet-history';
export { weightedLine, type WeightedLine } from './fleet/weighted-line';
export { planMeasurements, type PlanOptions, type MeasurementPlan } from './plan/plan-measurements';
export { expectedIntervals, type ExpectedIntervals, type ExpectedParameter } from './plan/expected-intervals';
export type { DesignProblem, DesignPoint, NoiseModel } from './plan/design-problem';
export { fittedModel, deltaVariance, type FittedModel } from './fitted-model';
export { parameterRole, type ParameterRole } from './parameter-roles';
export { bestPhysicalFit } from './best-fit';

