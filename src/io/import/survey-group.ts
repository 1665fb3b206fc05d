import type { Reading, ReadingType, RejectedRow } from '../../core/survey/survey';

/** The rows of one coil, date and reading type, gathered in file order. */
export interface SurveyGroup {
  readonly coil: string | null;
  readonly date: string | null;
  readonly readingType: ReadingType | null;
  readonly readings: Reading[];
  readonly rejected: RejectedRow[];
  /** Rows whose negative radial offset was read as its absolute value. */
  negativeRadial: number;
}
