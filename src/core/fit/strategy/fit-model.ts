import type { FieldModel, SurveyPoints } from '../../models/field-model';
import { chiSquareCriteria, leastSquaresCriteria } from '../../stats/information-criteria';
import { studentTQuantile } from '../../stats/student-t-quantile';
import type { Survey } from '../../survey/survey';
import type { FitResult, ParameterEstimate } from '../fit-result';
import type { FitSurveyOptions } from '../fit-survey-options';
import { fitWarnings } from '../diagnostics/fit-warnings';
import { momentEstimate } from '../diagnostics/far-field-moment';
import { parameterUncertainty } from '../engine/parameter-uncertainty';
import { searchModelFit } from './search-model-fit';
import { unfittedResult } from './unfitted-result';

/**
 * Fit one catalog model to one survey and report everything a FitResult holds: the
 * search of searchModelFit, then the linearised uncertainty (parameterUncertainty:
 * covariance (JᵀWJ)⁻¹ with stated σ, s²(JᵀWJ)⁻¹ with s² = χ²/(n − k) otherwise, DOMAIN.md
 * §7.4), intervals only for parameters the data determine (§7.6), information criteria
 * (§7.2: χ² with stated σ, n·ln(RSS/n) with K = k + 1 otherwise), per-reading points and
 * plain-language warnings. With position uncertainty the σ differ between models, so
 * the deviance adds Σ ln(σ_eff,i²/σ_B,i²) — the Gaussian likelihood's own normalisation —
 * keeping the criteria comparable across models.
 *
 * @param readingUncertainty σ_B,i (T) or null; seed of this model's multi-start.
 */
export function fitModel(
  model: FieldModel,
  survey: Survey,
  points: SurveyPoints,
  readingUncertainty: Float64Array | null,
  options: FitSurveyOptions,
  seed: number,
): FitResult {
  const n = points.n;
  const fixedNames = Object.keys(options.fixed ?? {});
  const freeCount = model.parameters.filter((p) => !fixedNames.includes(p.name)).length;
  if (n < freeCount) return unfittedResult(model, survey, points, options, readingUncertainty);
  const search = searchModelFit(model, points, readingUncertainty, options, seed);
  const { solution, standardUncertainty: sigma } = search;
  const stated = sigma !== null;
  const uncertainty = parameterUncertainty(solution, stated ? 'stated' : 'estimated');
  const k = solution.freeIndices.length + search.pinned.length;
  const freedom = n - k;

  const params: Record<string, ParameterEstimate> = {};
  model.parameters.forEach((spec, j) => {
    const free = solution.freeIndices.indexOf(j);
    const pinned = search.pinned.includes(j);
    const determined = !pinned && (free < 0 || uncertainty.identifiability.determined[free] === true);
    const stderr = free >= 0 && determined ? uncertainty.standardErrors?.[free] ?? null : null;
    const ci95 = free >= 0 && determined ? uncertainty.intervals?.[free] ?? null : null;
    params[spec.name] = { name: spec.name, unit: spec.unit, value: solution.params[j]!, stderr, ci95, fixed: free < 0 && !pinned, determined };
  });

  let chiSquare = solution.rss;
  let logScale = 0;
  if (stated) {
    chiSquare = 0;
    for (let i = 0; i < n; i++) {
      chiSquare += (solution.residuals[i]! / sigma[i]!) ** 2;
      logScale += Math.log((sigma[i]! / readingUncertainty![i]!) ** 2);
    }
  }
  const criteria = stated ? chiSquareCriteria(n, k, chiSquare + logScale) : leastSquaresCriteria(n, k + 1, solution.rss);
  const coverage = coverageFactor(stated ? Infinity : Math.max(1, freedom));
  const moment = momentEstimate(model, solution.params, solution.freeIndices, uncertainty.covariance, coverage);
  // One object literal per reading (no spread): the outlier flag only after a robust fit. A plain
  // loop, not map: no callback per reading.
  const outliers = search.outliers;
  const readings = survey.readings;
  const fitPoints: FitResult['points'][number][] = [];
  for (let i = 0; i < readings.length; i++) {
    const reading = readings[i]!;
    fitPoints.push(outliers === null
      ? {
          line: reading.line, distance: reading.distance, radial: reading.radial, field: reading.field,
          predicted: solution.predicted[i]!, residual: solution.residuals[i]!, standardUncertainty: stated ? sigma[i]! : null,
        }
      : {
          line: reading.line, distance: reading.distance, radial: reading.radial, field: reading.field,
          predicted: solution.predicted[i]!, residual: solution.residuals[i]!, standardUncertainty: stated ? sigma[i]! : null,
          outlier: outliers[i] === true,
        });
  }
  const warnings = fitWarnings({ model, survey, points, solution, uncertainty, params, moment, search, chiSquare, options });
  return {
    model: model.id,
    converged: solution.converged,
    stopReason: solution.stopReason,
    iterations: solution.iterations,
    params,
    freeParameters: solution.freeIndices.map((j) => model.parameters[j]!.name),
    covariance: uncertainty.covariance,
    correlation: uncertainty.correlation,
    uncertaintyScale: stated ? 'stated' : 'estimated',
    stats: {
      n,
      k,
      rss: solution.rss,
      rmse: Math.sqrt(solution.rss / n),
      chiSquare,
      reducedChiSquare: stated && freedom > 0 ? chiSquare / freedom : null,
      aicc: criteria.aicc,
      bic: criteria.bic,
      akaikeWeight: null,
    },
    points: fitPoints,
    ...(moment === null ? {} : { moment }),
    warnings,
  };
}

/** t quantile 0.975 by degrees of freedom: the few values a batch asks for, kept (an iterative inversion each). */
const coverageFactors = new Map<number, number>();

function coverageFactor(freedom: number): number {
  let value = coverageFactors.get(freedom);
  if (value === undefined) {
    value = studentTQuantile(0.975, freedom);
    if (coverageFactors.size < 64) coverageFactors.set(freedom, value);
  }
  return value;
}
