import type { FitSettings, SettingError } from './fit-settings';
import type { PackedReport } from './packed-report';
import type { FileOutcome, PipelineFile, PipelineProgress } from './pipeline';

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
  | {
    readonly type: 'result';
    readonly job: number;
    /** The PipelineOutcome with the report's per-reading points packed (packed-report.ts). */
    readonly files: readonly FileOutcome[];
    readonly report: PackedReport;
    readonly settingErrors: readonly SettingError[];
    readonly elapsedMs: number;
  }
  | { readonly type: 'failed'; readonly job: number; readonly message: string };
