import type { FieldModel, SurveyPoints } from '../../models/field-model';
import type { Survey } from '../../survey/survey';
import type { FitResult, ParameterEstimate } from '../fit-result';
import type { FitSurveyOptions } from '../fit-survey-options';

/**
 * The FitResult of a model that cannot be fitted because the survey has fewer readings
 * than the model has free parameters: converged false, the data-driven starting values
 * (fixed ones put in) marked undetermined, infinite AICc (Akaike weight 0), and a warning
 * saying what to do.
 */
export function unfittedResult(
  model: FieldModel, survey: Survey, points: SurveyPoints, options: FitSurveyOptions, readingUncertainty: Float64Array | null,
): FitResult {
  const fixedValues = options.fixed ?? {};
  const values = model.initialGuess(points);
  const params: Record<string, ParameterEstimate> = {};
  const free: string[] = [];
  model.parameters.forEach((spec, j) => {
    const fixed = Object.prototype.hasOwnProperty.call(fixedValues, spec.name);
    if (fixed) values[j] = fixedValues[spec.name]!;
    else free.push(spec.name);
    params[spec.name] = { name: spec.name, unit: spec.unit, value: values[j]!, stderr: null, ci95: null, fixed, determined: fixed };
  });
  const predicted = new Float64Array(points.n);
  model.evaluate(values, points, predicted);
  const n = points.n;
  const reason = `${n} readings cannot determine ${free.length} free parameters (${free.join(', ')})`;
  return {
    model: model.id,
    converged: false,
    stopReason: `not fitted: ${reason}`,
    iterations: 0,
    params,
    freeParameters: free,
    covariance: null,
    correlation: null,
    uncertaintyScale: readingUncertainty === null ? 'estimated' : 'stated',
    stats: { n, k: free.length, rss: NaN, rmse: NaN, chiSquare: NaN, reducedChiSquare: null, aicc: Infinity, bic: Infinity, akaikeWeight: null },
    points: survey.readings.map((reading, i) => ({
      line: reading.line,
      distance: reading.distance,
      radial: reading.radial,
      field: reading.field,
      predicted: predicted[i]!,
      residual: reading.field - predicted[i]!,
      standardUncertainty: readingUncertainty?.[i] ?? null,
    })),
    warnings: [`Not fitted: ${reason}. Fix some of them (--fix NAME=VALUE) or add readings.`],
  };
}
