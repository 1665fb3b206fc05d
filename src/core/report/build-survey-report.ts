import { compareModels } from '../fit/strategy/compare-models';
import { getModel } from '../models';
import { surveyUnits } from '../units';
import type { FitResult } from '../fit/fit-result';
import type { Survey } from '../survey/survey';
import type { SpecUse, SurveyReport, ThresholdResult, Verdict } from './report';

/** What analyses add to a survey's report; everything optional. */
export interface SurveyReportExtras {
  /** Spec verdict, or null/absent when no spec applies. */
  readonly verdict?: Verdict | null;
  /** Which spec applied, or why none did; null/absent when no spec was given. */
  readonly spec?: SpecUse | null;
  readonly thresholds?: readonly ThresholdResult[];
  /** Survey-level warnings (set before the fits' own). */
  readonly warnings?: readonly string[];
  readonly cautions?: readonly string[];
  /** Sentences added after the importer's notes (how the readings were weighted, …). */
  readonly notes?: readonly string[];
}

/**
 * Assemble one survey's SurveyReport from its import and its fits: provenance and row
 * counts from the Survey (every rejected row kept), the fits compared by AICc with
 * Akaike weights and the power-law sentences (compareModels, DOMAIN.md §7.2, §1.9), and
 * whatever analyses add (verdict, thresholds, warnings, cautions, notes). Pure; no
 * physics is recomputed by the views afterwards.
 *
 * @param fits the fits of this survey, all to the same readings (fitSurvey), or [] when
 *   none could be made (the warnings then say why).
 * @example buildSurveyReport(survey, fitSurvey(survey)).best // 'loop'
 */
export function buildSurveyReport(survey: Survey, fits: readonly FitResult[], extras: SurveyReportExtras = {}): SurveyReport {
  const compared = fits.length === 0 ? { fits: [], best: null, comparison: [] } : compareModels(fits, getModel, surveyUnits(survey));
  const warnings = [...(extras.warnings ?? [])];
  if (fits.length > 0 && compared.best === null) {
    const converged = fits.filter((fit) => fit.converged);
    if (converged.length === 0) {
      warnings.push('No model converged: the values shown are the best the searches found; check the readings and units, or fix parameters the label states.');
    } else {
      // AICc needs n ≥ k + 2 (Burnham & Anderson 2002, §2.4): with fewer readings no model can be ranked
      const k = Math.min(...converged.map((fit) => fit.stats.k));
      warnings.push(
        `Too few readings to rank the models: ${survey.readings.length} reading${survey.readings.length === 1 ? '' : 's'}, and AICc needs at least ` +
          `${k + 2} for the smallest model fitted (${k} free parameters). Add readings, or fix parameters the label states (--fix), before trusting any of these curves.`,
      );
    }
  }
  return {
    source: survey.source,
    coil: survey.coil,
    date: survey.date,
    readingType: survey.readingType,
    ...(survey.units ? { units: survey.units } : {}),
    readings: { total: survey.totalRows, used: survey.readings.length, rejected: survey.rejected },
    fits: compared.fits,
    best: compared.best,
    comparison: compared.comparison,
    verdict: extras.verdict ?? null,
    spec: extras.spec ?? null,
    thresholds: extras.thresholds ?? [],
    warnings,
    cautions: extras.cautions ?? [],
    notes: [...survey.notes, ...(extras.notes ?? [])],
    ...(survey.axis === 'position' ? { axis: 'position' as const } : {}),
  };
}
