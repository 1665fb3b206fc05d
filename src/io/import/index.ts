export { importSurveys, importSurveysStreaming } from './import-surveys';
export { SurveyImporter } from './survey-importer';
export { detectSurveyLayout } from './detect-survey-layout';
export { distanceColumnAxis } from './header-names';
export type { ImportErrorCode } from './import-errors';
export {
  MIN_USABLE_READINGS,
  type ColumnDetection,
  type ColumnMapping,
  type ColumnRole,
  type Detection,
  type ImportCounts,
  type ImportOptions,
  type ImportResult,
  type MetadataLine,
  type SkippedSurvey,
  type UnitSource,
} from './import-types';
