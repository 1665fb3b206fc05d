import { fleetHistory, type FleetSurvey } from '../../core/analysis/fleet/fleet-history';
import type { FitResult } from '../../core/fit/fit-result';
import { getModel } from '../../core/models';
import { parameterRole } from '../../core/analysis/parameter-roles';
import type { Report, SurveyReport } from '../../core/report/report';
import { checksStatus } from '../checks-status';
import { exitStatus, worseStatus } from '../exit-codes';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome, UnreadableEntry } from './batch-types';
import { later } from './fleet-rows';

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

  /** Take one file's outcome (call in file order). */
  add(outcome: FileOutcome): void {
    this.unreadable.push(...outcome.unreadable);
    for (const survey of outcome.reports) {
      this.surveys += 1;
      // the checks of this survey alone (spec, thresholds); the fleet's flags are added at the end
      this.status = worseStatus(this.status, checksStatus({ surveys: [survey] }));
      this.fleetSurveys.push(this.fleetSurvey(survey));
      const row = withoutPoints(survey);
      if (survey.coil === null || survey.coil.trim() === '') this.uncoiled.push(row);
      else {
        const current = this.latest.get(survey.coil);
        if (current === undefined || later(survey, current)) this.latest.set(survey.coil, row);
      }
    }
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

  private fleetSurvey(survey: SurveyReport): FleetSurvey {
    const fits = survey.fits.filter((fit) => this.specModels.has(fit.model) || getModel(fit.model).physical).map(historyFit);
    const verdict = survey.verdict === null ? null : { status: survey.verdict.status, findings: survey.verdict.findings, checks: [], explanations: [] };
    return { source: survey.source, coil: survey.coil, date: survey.date, fits, verdict };
  }
}

/**
 * A survey as a summary row reads it (fleet-rows.ts, attention-list.ts): its fits without
 * per-reading points, covariance, correlation or warnings, the verdict without its checks,
 * no rejected rows, comparison, notes or cautions (the whole survey is in the spool).
 */
function withoutPoints(survey: SurveyReport): SurveyReport {
  return {
    ...survey,
    readings: { ...survey.readings, rejected: [] },
    fits: survey.fits.map(historyFit),
    comparison: [], notes: [], cautions: [],
    verdict: survey.verdict === null ? null : { ...survey.verdict, checks: [] },
  };
}

/**
 * What the history and the summary rows read of a fit (coil-history.ts, geometry-changes.ts,
 * best-fit.ts, summary-fit.ts, fleet-rows.ts): model, convergence, n, k and AICc, and the
 * amplitude and geometry estimates; nothing else is kept.
 */
function historyFit(fit: FitResult): FitResult {
  return {
    model: fit.model,
    converged: fit.converged,
    params: Object.fromEntries(Object.entries(fit.params).filter(([name]) => ['amplitude', 'geometry'].includes(parameterRole(name)))),
    stats: { n: fit.stats.n, k: fit.stats.k, aicc: fit.stats.aicc },
  } as unknown as FitResult;
}
