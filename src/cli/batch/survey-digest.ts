import type { FleetSurvey } from '../../core/analysis/fleet/fleet-history';
import { parameterRole } from '../../core/analysis/parameter-roles';
import type { FitResult } from '../../core/fit/fit-result';
import { getModel } from '../../core/models';
import type { SurveyReport } from '../../core/report/report';
import { checksStatus } from '../checks-status';
import { surveyJsonRecord } from './survey-json';
import { spoolLine } from './survey-spool';

/**
 * One survey of a batch as the main thread needs it, made where the survey was fitted (the
 * worker): for the pages, the whole survey as one spool line, and for the JSON report its
 * finished JSON text (both text: copied between threads as one string, not an object graph
 * the main thread would rebuild and collect), the summary row (the survey without
 * per-reading data, covariance, checks or sentences a row does not show), what the fleet
 * history reads, and the exit status of its own checks.
 */
export interface SurveyDigest {
  /** The survey as a line of the spool (survey-spool.ts), when pages are written (DigestParts.pages). */
  readonly line?: string;
  /** The survey's part of the JSON report (surveyJsonRecord), when one is written (DigestParts.json). */
  readonly json?: string;
  readonly row: SurveyReport;
  readonly history: FleetSurvey;
  /** checksStatus of this survey alone. */
  readonly status: number;
}

/** Which texts of a survey a digest carries besides its row and history: only what the run writes. */
export interface DigestParts {
  /** The survey as a spool line, for the pages of `batch --out`. */
  readonly pages: boolean;
  /** The survey's JSON text, for `batch --json`. */
  readonly json: boolean;
}

/** The digest of `survey`; `specModels` are the models the specs name (their fits join the history). */
export function digestSurvey(survey: SurveyReport, specModels: ReadonlySet<string>, parts: DigestParts = { pages: false, json: false }): SurveyDigest {
  return {
    ...(parts.pages ? { line: spoolLine(survey) } : {}),
    ...(parts.json ? { json: surveyJsonRecord(survey) } : {}),
    row: rowSurvey(survey), history: historySurvey(survey, specModels), status: checksStatus({ surveys: [survey] }),
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
