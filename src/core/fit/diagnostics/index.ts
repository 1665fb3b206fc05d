/**
 * core/fit/diagnostics: what is said about a finished fit: its warnings (convergence,
 * identifiability, bounds, scatter, plausibility), the runs test, the power-law
 * description and the far-field moment. Reads the engine's solution and the shared result
 * types (../fit-result.ts); type-only use of strategy's ModelSearch.
 */
export { describePowerLaw, powerLawContext, type PowerLawContext } from './describe-power-law';
export { farFieldMoment, momentEstimate, type MomentEstimate } from './far-field-moment';
export { fitWarnings } from './fit-warnings';
export type { FitWarningInput } from './fit-warning-input';
export { formatParameter } from './format-parameter';
export { runsTest, type RunsTest } from './runs-test';
