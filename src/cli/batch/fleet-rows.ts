import { summaryBasisWords, summaryFit } from '../../core/report/summary-fit';
import { parameterWords, valueWords, type ValueWords } from '../../core/analysis/describe-value';
import { surveyUnits } from '../../core/units';
import { parameterRole } from '../../core/analysis/parameter-roles';
import type { FitResult, ParameterEstimate } from '../../core/fit/fit-result';
import { getModel, parameterQuantityKind } from '../../core/models';
import type { FleetCoil, Report, SurveyReport } from '../../core/report/report';

/** One row of the fleet summary: a coil with its history, or a survey that has no coil id. */
export interface FleetRow {
  /** Coil id, or null for a survey without one. */
  readonly coil: string | null;
  /** The coil's history from the fleet section; null for a survey without a coil id. */
  readonly history: FleetCoil | null;
  /** The coil's latest survey (latest date; among equal dates or none, the last in file order). */
  readonly latest: SurveyReport;
  readonly surveys: number;
}

/**
 * The rows of a batch report: each coil of the fleet section in its order (first
 * appearance), then each survey without a coil id in report order. The latest survey is
 * picked the way the fleet history orders them (date order, undated last, stable).
 */
export function fleetRows(report: Report): FleetRow[] {
  const latest = new Map<string, SurveyReport>();
  for (const survey of report.surveys) {
    if (survey.coil === null || survey.coil.trim() === '') continue;
    const current = latest.get(survey.coil);
    if (current === undefined || later(survey, current)) latest.set(survey.coil, survey);
  }
  const rows: FleetRow[] = [];
  for (const coil of report.fleet?.coils ?? []) {
    const survey = latest.get(coil.coil);
    if (survey) rows.push({ coil: coil.coil, history: coil, latest: survey, surveys: coil.surveys });
  }
  for (const survey of report.surveys) {
    if (survey.coil === null || survey.coil.trim() === '') rows.push({ coil: null, history: null, latest: survey, surveys: 1 });
  }
  return rows;
}

/** True when `a` comes after `b` in history order: a dated survey after an undated one, a later date, or the same date later in the file list. */
export function later(a: Pick<SurveyReport, 'date'>, b: Pick<SurveyReport, 'date'>): boolean {
  if (a.date === null) return b.date === null;
  if (b.date === null) return true;
  return a.date >= b.date;
}

/**
 * The coil as the row's latest survey measured it, read with the model summaries use
 * (summaryFit: the spec's model, else the coil history's, else the best physical model
 * by AICc; never a power law), and its amplitude and geometry parameters, each as
 * "ampere-turns 306 A (301–311)" (95 % interval; "fixed" or "not determined" instead when
 * so), lengths in the units the survey's file was written in (surveyUnits). `model` names
 * the model and why it was chosen. Null when no physical model converged.
 */
export function coilFigures(row: FleetRow): { fit: FitResult; model: string; figures: string[] } | null {
  const summary = summaryFit(row.latest, getModel, row.history?.model ?? null);
  if (summary === null) return null;
  const fit = summary.fit;
  const survey = row.latest;
  const shown = valueWords(surveyUnits(survey));
  const figures = Object.values(fit.params)
    .filter((estimate) => ['amplitude', 'geometry'].includes(parameterRole(estimate.name)))
    .map((estimate) => `${parameterWords(estimate.name)} ${describeEstimate(estimate, shown)}`);
  const ranked = survey.best !== null && survey.best !== fit.model ? `; lowest AICc: ${survey.best}` : '';
  return { fit, model: `${fit.model} (${summaryBasisWords[summary.basis]}${ranked})`, figures };
}

function describeEstimate(estimate: ParameterEstimate, shown: ValueWords): string {
  const kind = parameterQuantityKind(estimate.unit);
  if (estimate.fixed) return `${shown.value(estimate.value, kind)} fixed`;
  if (!estimate.determined) return `${shown.value(estimate.value, kind)} not determined`;
  return shown.value(estimate.value, kind, estimate.ci95);
}
