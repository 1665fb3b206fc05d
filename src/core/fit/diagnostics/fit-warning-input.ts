import type { FieldModel, SurveyPoints } from '../../models/field-model';
import type { Survey } from '../../survey/survey';
import type { MomentEstimate } from './far-field-moment';
import type { ParameterEstimate } from '../fit-result';
import type { FitSurveyOptions } from '../fit-survey-options';
import type { LeastSquaresSolution } from '../engine/least-squares-types';
import type { ParameterUncertainty } from '../engine/parameter-uncertainty';
import type { ModelSearch } from '../strategy/search-model-fit';

/** Everything the warnings of one fit are read from. */
export interface FitWarningInput {
  readonly model: FieldModel;
  readonly survey: Survey;
  readonly points: SurveyPoints;
  readonly solution: LeastSquaresSolution;
  readonly uncertainty: ParameterUncertainty;
  readonly params: Readonly<Record<string, ParameterEstimate>>;
  readonly moment: MomentEstimate | null;
  readonly search: ModelSearch;
  /** Σ (r/σ)² with the σ used (T²/T²), or RSS when none were stated. */
  readonly chiSquare: number;
  readonly options: FitSurveyOptions;
}
