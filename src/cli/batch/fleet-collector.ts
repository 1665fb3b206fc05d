import { fleetHistory, type FleetSurvey } from '../../core/analysis/fleet/fleet-history';
import type { Report, SurveyReport } from '../../core/report/report';
import { exitStatus, worseStatus } from '../exit-codes';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome, UnreadableEntry } from './batch-types';
import { later } from './fleet-rows';
import { digestSurvey, type SurveyDigest } from './survey-digest';

/**
 * Gathers a batch's file outcomes (in file order) into what the fleet summary, the fleet
 * section and the exit status need, without keeping every survey: per survey only what
 * the fleet history reads (source, coil, date, verdict status and findings, and the fits
 * of physical models and spec models without per-reading points, covariance or warnings),
 * and per coil its latest survey for the summary rows. So memory grows with the number of
 * coils, not the number of files; the surveys themselves go to a spool on disk
 * (SurveySpool) for the JSON report and the pages.
 */
export class FleetCollector {
  private readonly fleetSurveys: FleetSurvey[] = [];
  /** Latest survey per coil id (history order: date, undated before dated, later file wins a tie). */
  private readonly latest = new Map<string, SurveyReport>();
  /** Surveys without a coil id, each a row of the summary. */
  private readonly uncoiled: SurveyReport[] = [];
  private readonly unreadable: UnreadableEntry[] = [];
  private readonly specModels: ReadonlySet<string>;
  private surveys = 0;
  private status: number = exitStatus.passed;

  constructor(private readonly settings: BatchSettings) {
    this.specModels = new Set(settings.specs.map((spec) => spec.model));
  }

  /** Take one file's outcome (call in file order); its surveys as digests, made here when the worker sent reports. */
  add(outcome: FileOutcome): readonly SurveyDigest[] {
    this.unreadable.push(...outcome.unreadable);
    const digests = outcome.digests ?? outcome.reports.map((survey) => digestSurvey(survey, this.specModels));
    for (const digest of digests) {
      this.surveys += 1;
      this.status = worseStatus(this.status, digest.status);
      this.fleetSurveys.push(digest.history);
      const row = digest.row;
      if (row.coil === null || row.coil.trim() === '') this.uncoiled.push(row);
      else {
        const current = this.latest.get(row.coil);
        if (current === undefined || later(row, current)) this.latest.set(row.coil, row);
      }
    }
    return digests;
  }

  /** Surveys taken so far. */
  get surveyCount(): number {
    return this.surveys;
  }

  /** Exit status from the surveys' own checks (checksStatus, survey by survey). */
  get checksStatus(): number {
    return this.status;
  }

  /**
   * The Report for the summary views and the fleet section: each coil's latest survey and
   * each survey without a coil id (fleetRows gives the same rows from it as from every
   * survey), and the fleet section over all surveys.
   */
  report(): Report {
    const fleet = fleetHistory(this.fleetSurveys, { specs: this.settings.specs, unreadable: this.unreadable });
    const surveys = [...fleet.coils.flatMap((coil) => this.latest.get(coil.coil) ?? []), ...this.uncoiled];
    return { surveys, fleet };
  }
}
