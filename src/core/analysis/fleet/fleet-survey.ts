import type { FitResult } from '../../fit/fit-result';
import type { SurveyUnits } from '../../survey/survey';
import type { Verdict } from '../spec/verify-spec';

/** One survey as the fleet history needs it. */
export interface FleetSurvey {
  readonly source: string;
  readonly coil: string | null;
  /** ISO date YYYY-MM-DD, or null. */
  readonly date: string | null;
  readonly fits: readonly FitResult[];
  readonly verdict: Verdict | null;
  /** The units the survey's file was written in, when known (SurveyReport.units). */
  readonly units?: SurveyUnits;
}
