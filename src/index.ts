/**
 * ringfall as a library: the few functions a script needs, all SI (m, T, A, A·m²).
 * Everything here is pure TypeScript with no DOM and no Node APIs, so it runs in Node,
 * in a browser and in a Web Worker.
 *
 * @example
 * const { surveys } = importSurveys(csvText, { source: 'coil.csv' });
 * const report = analyseSurvey(surveys[0], { fit: { models: ['loop', 'dipole'] }, specs: [], thresholds: [parseThresholdLevel('0.5mT')] });
 * report.fits.find((f) => f.model === 'loop')?.params.ampereTurns.ci95 // [lower, upper] in A
 */
export { importSurveys, type ImportOptions, type ImportResult } from './io/import';
export { parseSpecText } from './io/spec/parse-spec-text';
export { fitSurvey } from './core/fit/strategy/fit-survey';
export type { FitSurveyOptions } from './core/fit/fit-survey-options';
export { analyseSurvey, type SurveyAnalysisSettings } from './core/report/analyse-survey';
export { verifySpec as checkSpec } from './core/analysis/spec/verify-spec';
export { thresholdDistances } from './core/analysis/thresholds/threshold-distances';
export { parseThresholdLevel, thresholdPresets, type ThresholdLevel } from './core/analysis/thresholds/threshold-level';
export { fleetHistory } from './core/analysis/fleet/fleet-history';
export { predictField, getModel, modelIds, type FieldPrediction, type ModelId } from './core/models';
export { renderTextReport } from './core/report/render-text';
export { toJsonReport } from './core/report/to-json-report';
export { parseQuantity, formatQuantity } from './core/units';
export { RingfallError, isRingfallError } from './core/errors';
export type { Survey, SurveyUnits, Reading, RejectedRow } from './core/survey/survey';
export type { FitResult, ParameterEstimate } from './core/fit/fit-result';
export type { Report, SurveyReport, Verdict, ThresholdResult, FleetSummary } from './core/report/report';
export type {
  JsonReport, JsonSurvey, JsonFit, JsonFitStats, JsonParameter, JsonRejectedRow, JsonInterval, JsonFleet,
  JsonPrediction, JsonPlan, JsonPlanIntervals, JsonQuantity,
} from './core/report/json-types';
