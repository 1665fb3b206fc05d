import type { ColumnLayout } from './detect-columns';
import type { FileLayout } from './read-layout';
import type { SurveyCollector } from './survey-collector';

/** What the row reader needs besides the row. */
export interface RowContext {
  readonly layout: ColumnLayout;
  readonly decimalComma: boolean;
  /** Header text of every column, for messages. */
  readonly headers: readonly string[];
  /** Which columns are used (have a role). */
  readonly used: readonly boolean[];
  readonly defaults: FileLayout['defaults'];
  readonly collector: SurveyCollector;
}
