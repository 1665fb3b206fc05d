import type { FleetSurvey } from '../../core/analysis/fleet/fleet-history';
import { parameterRole } from '../../core/analysis/parameter-roles';
import type { FitResult } from '../../core/fit/fit-result';
import { getModel } from '../../core/models';
import type { SurveyReport } from '../../core/report/report';
import { checksStatus } from '../checks-status';
import { spoolSurveyJson, type SurveyJsonPlace } from './survey-json';
import { spoolLine } from './survey-spool';
import type { WorkerSpoolPlace, WorkerSpoolWriter } from './worker-spool';

/**
 * One survey of a batch as the main thread needs it, made where the survey was fitted (the
 * worker): what it reads at once (source, coil, date, spec; the exit status of the
 * survey's own checks), and the places in the worker's spool (worker-spool.ts) of
 * everything else — the summary row (the survey without per-reading data, covariance,
 * checks or sentences a row does not show), what the fleet history reads, and only the
 * texts the run writes: the whole survey as a line for the pages, the finished JSON text
 * for the report. Texts stay in the spool: a message carries a few numbers a survey, not
 * an object graph or a long string the main thread would copy, keep or collect.
 */
export interface SurveyDigest {
  readonly head: Pick<SurveyReport, 'source' | 'coil' | 'date' | 'spec'>;
  /** The survey as a spool line (spoolLine), when pages are written (DigestParts.pages). */
  readonly line?: WorkerSpoolPlace;
  /** The survey's part of the JSON report (spoolSurveyJson), when one is written (DigestParts.json). */
  readonly json?: SurveyJsonPlace;
  /** The summary row as a spool line. */
  readonly row: WorkerSpoolPlace;
  /** The history's part (FleetSurvey) as a spool line; only for a survey with a coil id (one without is listed by its row). */
  readonly history?: WorkerSpoolPlace;
  /** checksStatus of this survey alone. */
  readonly status: number;
}

/** Which texts of a survey a digest carries besides its row and history: only what the run writes; and where the spools go. */
export interface DigestParts {
  /** The survey as a spool line, for the pages of `batch --out`. */
  readonly pages: boolean;
  /** The survey's JSON text, for `batch --json`. */
  readonly json: boolean;
  /** The run's scratch folder, where each thread keeps its spool file. */
  readonly folder: string;
}

/** The digest of `survey`, its texts appended to `spool`; `specModels` are the models the specs name (their fits join the history). */
export function digestSurvey(survey: SurveyReport, specModels: ReadonlySet<string>, parts: Pick<DigestParts, 'pages' | 'json'>, spool: WorkerSpoolWriter): SurveyDigest {
  const coiled = survey.coil !== null && survey.coil.trim() !== '';
  return {
    head: { source: survey.source, coil: survey.coil, date: survey.date, ...(survey.spec === undefined ? {} : { spec: survey.spec }) },
    ...(parts.pages ? { line: spool.append(spoolLine(survey)) } : {}),
    ...(parts.json ? { json: spoolSurveyJson(survey, spool) } : {}),
    row: spool.append(spoolLine(rowSurvey(survey))),
    ...(coiled ? { history: spool.append(spoolLine(historySurvey(survey, specModels))) } : {}),
    status: checksStatus({ surveys: [survey] }),
  };
}

/**
 * A survey as a summary row reads it (fleet-rows.ts, attention-list.ts): its fits as the
 * history reads them, the verdict without its checks, no rejected rows, comparison, notes
 * or cautions (the whole survey is in the spool).
 */
function rowSurvey(survey: SurveyReport): SurveyReport {
  return {
    ...survey,
    readings: { ...survey.readings, rejected: [] },
    fits: survey.fits.map(historyFit),
    comparison: [], notes: [], cautions: [],
    verdict: survey.verdict === null ? null : { ...survey.verdict, checks: [] },
  };
}

function historySurvey(survey: SurveyReport, specModels: ReadonlySet<string>): FleetSurvey {
  const fits = survey.fits.filter((fit) => specModels.has(fit.model) || getModel(fit.model).physical).map(historyFit);
  const verdict = survey.verdict === null ? null : { status: survey.verdict.status, findings: survey.verdict.findings, checks: [], explanations: [] };
  return { source: survey.source, coil: survey.coil, date: survey.date, fits, verdict };
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
