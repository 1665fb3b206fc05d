import { fleetHistory, type FleetSurvey } from '../../core/analysis/fleet/fleet-history';
import type { FleetSummary, Report, SurveyReport } from '../../core/report/report';
import { exitStatus, worseStatus } from '../exit-codes';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome, UnreadableEntry } from './batch-types';
import { later } from './fleet-rows';
import { digestSurvey, type SurveyDigest } from './survey-digest';
import { spoolLine, type SpoolPlace, type SurveySpool } from './survey-spool';

/** A coil's surveys as the collector keeps them: places in the spool, not the surveys. */
interface CoilPlaces {
  /** Each survey's history part (FleetSurvey), in file order. */
  readonly history: SpoolPlace[];
  /** The summary row of its latest survey so far, and that survey's date. */
  latest: { readonly date: string | null; readonly row: SpoolPlace };
}

/**
 * Gathers a batch's file outcomes (in file order) into what the fleet summary, the fleet
 * section and the exit status need, without keeping the surveys in memory: per survey
 * what the fleet history reads (source, coil, date, verdict status and findings, and the
 * fits of physical models and spec models without per-reading points, covariance or
 * warnings) goes to the spool on disk, as does the summary row of each coil's latest
 * survey; memory keeps only their places (two numbers a survey) and each coil's latest
 * date. So a run over 50,000 files holds a few MB while its workers fit; the fleet section
 * is made at the end (`report`), coil by coil, from what the spool gives back.
 */
export class FleetCollector {
  /** Coils by id, in order of first appearance (the fleet section's order). */
  private readonly coils = new Map<string, CoilPlaces>();
  /** Surveys without a coil id, each a row of the summary (and one of the fleet's ungrouped). */
  private readonly uncoiled: SpoolPlace[] = [];
  private readonly unreadable: UnreadableEntry[] = [];
  private readonly specModels: ReadonlySet<string>;
  private surveys = 0;
  private status: number = exitStatus.passed;

  constructor(private readonly settings: BatchSettings, private readonly spool: SurveySpool) {
    this.specModels = new Set(settings.specs.map((spec) => spec.model));
  }

  /** Take one file's outcome (call in file order); its surveys as digests, made here when the worker sent reports. */
  add(outcome: FileOutcome): readonly SurveyDigest[] {
    this.unreadable.push(...outcome.unreadable);
    const digests = outcome.digests ?? outcome.reports.map((survey) => digestSurvey(survey, this.specModels));
    for (const digest of digests) {
      this.surveys += 1;
      this.status = worseStatus(this.status, digest.status);
      const row = digest.row;
      if (row.coil === null || row.coil.trim() === '') {
        // the row holds all the fleet history reads of a survey without a coil id (its source)
        this.uncoiled.push(this.spool.append(spoolLine(row)));
        continue;
      }
      const history = this.spool.append(spoolLine(digest.history));
      const coil = this.coils.get(row.coil);
      if (coil === undefined) {
        this.coils.set(row.coil, { history: [history], latest: { date: row.date, row: this.spool.append(spoolLine(row)) } });
      } else {
        coil.history.push(history);
        if (later(row, coil.latest)) coil.latest = { date: row.date, row: this.spool.append(spoolLine(row)) };
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
   * survey), and the fleet section over all surveys — fleetHistory of one coil at a time
   * (it treats each coil on its own, so this is the section of all surveys at once).
   */
  report(): Report {
    const uncoiled = this.uncoiled.map((place) => this.spool.at(place));
    const coils = [...this.coils].map(([coil, places]) => {
      const history = fleetHistory(places.history.map((place) => this.spool.at<FleetSurvey>(place)), { specs: this.settings.specs }).coils;
      if (history.length !== 1 || history[0]!.coil !== coil) throw new Error(`batch: the history of coil ${coil} came back as ${history.length} coils`);
      return history[0]!;
    });
    const rest = fleetHistory(uncoiled.map(historyOfUncoiled), { specs: this.settings.specs, unreadable: this.unreadable });
    const fleet: FleetSummary = { ...rest, coils };
    const surveys = [...[...this.coils.values()].map((places) => this.spool.at(places.latest.row)), ...uncoiled];
    return { surveys, fleet };
  }
}

/** What the fleet history reads of a survey without a coil id: it is listed as ungrouped. */
function historyOfUncoiled(row: SurveyReport): FleetSurvey {
  return { source: row.source, coil: row.coil, date: row.date, fits: row.fits, verdict: row.verdict };
}
