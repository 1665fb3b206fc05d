import type { FitSettings } from './fit-settings';
import type { PipelineFile, PipelineOutcome, PipelineProgress } from './pipeline';

/** Page → worker: run the pipeline on these files with these settings. */
export interface RunRequest {
  readonly type: 'run';
  readonly job: number;
  readonly files: readonly PipelineFile[];
  readonly settings: FitSettings;
}

/** Worker → page messages, tagged with the job they belong to. */
export type WorkerMessage =
  | { readonly type: 'progress'; readonly job: number; readonly progress: PipelineProgress }
  | { readonly type: 'result'; readonly job: number; readonly outcome: PipelineOutcome; readonly elapsedMs: number }
  | { readonly type: 'failed'; readonly job: number; readonly message: string };
