import { fleetHistory, type FleetSurvey } from '../../core/analysis/fleet/fleet-history';
import type { FleetCoil, FleetSummary, Report, SurveyReport } from '../../core/report/report';
import { exitStatus, worseStatus } from '../exit-codes';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome, UnreadableEntry } from './batch-types';
import { later } from './fleet-rows';
import { digestSurvey, type SurveyDigest } from './survey-digest';
import type { WorkerSpoolPlace, WorkerSpools } from './worker-spool';

/** A coil's surveys as the collector keeps them: places in the spools, not the surveys. */
interface CoilPlaces {
  /** Each survey's history part (FleetSurvey), in file order. */
  readonly history: WorkerSpoolPlace[];
  /** The summary row of its latest survey so far, and that survey's date. */
  latest: { readonly date: string | null; readonly row: WorkerSpoolPlace };
}

/**
 * Gathers a batch's file outcomes (in file order) into what the fleet summary, the fleet
 * section and the exit status need, without keeping the surveys in memory: per survey
 * what the fleet history reads (source, coil, date, verdict status and findings, and the
 * fits of physical models and spec models without per-reading points, covariance or
 * warnings) and its summary row are in a spool on disk (the worker's, survey-digest.ts);
 * memory keeps only the places of the history parts and of each coil's latest row (three
 * numbers a survey) and each coil's latest date, and each coil's history once made. A
 * coil's history is made from what the spool gives back when the next survey is another
 * coil's (so mostly while the workers fit), and again at the end (`report`) for a coil
 * that had more surveys after that.
 */
export class FleetCollector {
  /** Coils by id, in order of first appearance (the fleet section's order). */
  private readonly coils = new Map<string, CoilPlaces>();
  /** Surveys without a coil id, each a row of the summary (and one of the fleet's ungrouped). */
  private readonly uncoiled: WorkerSpoolPlace[] = [];
  private readonly unreadable: UnreadableEntry[] = [];
  private readonly specModels: ReadonlySet<string>;
  private surveys = 0;
  private status: number = exitStatus.passed;
  /** Coil histories made so far (historyOf), and the coil of the last survey taken. */
  private readonly histories = new Map<string, { readonly surveys: number; readonly history: FleetCoil }>();
  private lastCoil: string | null = null;

  constructor(private readonly settings: BatchSettings, private readonly spool: WorkerSpools) {
    this.specModels = new Set(settings.specs.map((spec) => spec.model));
  }

  /** Take one file's outcome (call in file order); its surveys as digests, made here when the worker sent reports. */
  add(outcome: FileOutcome): readonly SurveyDigest[] {
    this.unreadable.push(...outcome.unreadable);
    const digests = outcome.digests ?? outcome.reports.map((survey) => digestSurvey(survey, this.specModels, { pages: false, json: false }, this.spool.writer()));
    for (const digest of digests) {
      this.surveys += 1;
      this.status = worseStatus(this.status, digest.status);
      const { coil: id, date } = digest.head;
      if (id === null || id.trim() === '' || digest.history === undefined) {
        // the row holds all the fleet history reads of a survey without a coil id (its source)
        this.uncoiled.push(digest.row);
        continue;
      }
      // a fleet's files usually hold a coil's surveys one after another: when the coil changes,
      // the last one's history is made now, while the workers fit, not after them (it is made
      // again at the end if more of its surveys come)
      if (this.lastCoil !== null && this.lastCoil !== id) this.historyOf(this.lastCoil, this.coils.get(this.lastCoil)!);
      this.lastCoil = id;
      const coil = this.coils.get(id);
      if (coil === undefined) {
        this.coils.set(id, { history: [digest.history], latest: { date, row: digest.row } });
      } else {
        coil.history.push(digest.history);
        if (later({ date }, coil.latest)) coil.latest = { date, row: digest.row };
      }
    }
    return digests;
  }

  /**
   * The fleet history of one coil (fleetHistory of its surveys alone), kept with the number
   * of surveys it covers so that it is made again only when more came.
   */
  private historyOf(coil: string, places: CoilPlaces): { readonly surveys: number; readonly history: FleetCoil } {
    const made = this.histories.get(coil);
    if (made !== undefined && made.surveys === places.history.length) return made;
    const history = fleetHistory(places.history.map((place) => this.spool.at<FleetSurvey>(place)), { specs: this.settings.specs }).coils;
    if (history.length !== 1 || history[0]!.coil !== coil) throw new Error(`batch: the history of coil ${coil} came back as ${history.length} coils`);
    const entry = { surveys: places.history.length, history: history[0]! };
    this.histories.set(coil, entry);
    return entry;
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
    const uncoiled = this.uncoiled.map((place) => this.spool.at<SurveyReport>(place));
    const coils = [...this.coils].map(([coil, places]) => this.historyOf(coil, places).history);
    const rest = fleetHistory(uncoiled.map(historyOfUncoiled), { specs: this.settings.specs, unreadable: this.unreadable });
    const fleet: FleetSummary = { ...rest, coils };
    const surveys = [...[...this.coils.values()].map((places) => this.spool.at<SurveyReport>(places.latest.row)), ...uncoiled];
    return { surveys, fleet };
  }
}

/** What the fleet history reads of a survey without a coil id: it is listed as ungrouped. */
function historyOfUncoiled(row: SurveyReport): FleetSurvey {
  return { source: row.source, coil: row.coil, date: row.date, fits: row.fits, verdict: row.verdict };
}
