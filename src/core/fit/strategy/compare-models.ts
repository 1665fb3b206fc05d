import { getModel } from '../../models';
import type { FieldModel, ModelId } from '../../models/field-model';
import { akaikeWeights } from '../../stats/akaike-weights';
import { describePowerLaw, powerLawContext } from '../diagnostics/describe-power-law';
import { inDistanceForm } from './distance-form-fit';
import type { FitResult } from '../fit-result';
import { surveyUnits, type SurveyUnitChoice } from '../../units/survey-units';

/** The fits with their Akaike weights, the best model and the power-law sentences. */
export interface ModelComparison {
  /** The fits in the order given, stats.akaikeWeight filled in (0 for a fit that did not converge). */
  readonly fits: readonly FitResult[];
  /** Lowest AICc among converged fits, or null when none converged. */
  readonly best: ModelId | null;
  /** One sentence per converged power law on what it gets wrong (describe-power-law.ts). */
  readonly comparison: readonly string[];
}

/**
 * Compare models fitted to the same readings with the same weights (DOMAIN.md §7.2):
 * Akaike weights wᵢ = exp(−Δᵢ/2)/Σ exp(−Δⱼ/2) from the AICc of the converged fits
 * (Burnham & Anderson 2002, §2.9), the best model = lowest AICc (a fit that reproduces
 * every reading exactly, AICc = −∞, wins and shares the weight only with other exact fits), and for each power law a
 * sentence on its apparent exponent, the pattern of its residuals and its extrapolation
 * against the best physical model (DOMAIN.md §1.9).
 *
 * @param modelOf catalog lookup (default getModel), to tell physical models from power laws.
 * @param units the survey's units (surveyUnits): the sentences write distances and fields in them.
 * @throws RangeError when the fits do not share n and the uncertainty scale (different data
 *   or weights cannot be compared).
 */
export function compareModels(fits: readonly FitResult[], modelOf: (id: ModelId) => FieldModel = getModel, units: SurveyUnitChoice = surveyUnits(null)): ModelComparison {
  const weighted = withAkaikeWeights(fits);
  const lowest = (candidates: readonly FitResult[]) =>
    candidates.filter(usable).reduce<FitResult | null>((best, fit) => (best === null || fit.stats.aicc < best.stats.aicc ? fit : best), null);
  const best = lowest(weighted);
  const physical = lowest(weighted.filter((fit) => modelOf(fit.model).physical));
  // A scan's fits are described by distance from the coil (distance form), not by ruler position;
  // each law is restated once (the first one serves the shared context too).
  const laws = weighted.filter((fit) => fit.converged && !modelOf(fit.model).physical).map(inDistanceForm);
  const coil = physical === null ? null : inDistanceForm(physical);
  const shared = laws.length > 0 ? powerLawContext(laws[0]!, coil, modelOf, units) : null;
  const comparison = laws.map((fit) => describePowerLaw(fit, coil, modelOf, shared!));
  return { fits: weighted, best: best?.model ?? null, comparison };
}

/** A fit that takes part in the comparison: converged, with an AICc below +∞. */
function usable(fit: FitResult): boolean {
  return fit.converged && fit.stats.aicc < Infinity;
}

/**
 * The fits with stats.akaikeWeight filled in, as {@link compareModels} gives them, without
 * its sentences (what fitSurvey needs). An exact fit (RSS = 0: AICc = −∞, unbounded
 * likelihood) outranks every other one and shares the weight only with other exact fits.
 *
 * @throws RangeError when the fits do not share n and the uncertainty scale.
 */
export function withAkaikeWeights(fits: readonly FitResult[]): FitResult[] {
  const first = fits[0];
  for (const fit of fits) {
    if (fit.stats.n !== first!.stats.n || fit.uncertaintyScale !== first!.uncertaintyScale) {
      throw new RangeError(`compareModels: fits of ${first!.model} (n ${first!.stats.n}, ${first!.uncertaintyScale}) and ${fit.model} (n ${fit.stats.n}, ${fit.uncertaintyScale}) are not on the same readings and weights`);
    }
  }
  const exact = fits.filter((fit) => usable(fit) && fit.stats.aicc === -Infinity).length;
  const weights = exact > 0
    ? fits.map((fit) => (usable(fit) && fit.stats.aicc === -Infinity ? 1 / exact : 0))
    : akaikeWeights(fits.map((fit) => (usable(fit) ? fit.stats.aicc : Infinity)));
  return fits.map((fit, i) => {
    const akaikeWeight = Number.isNaN(weights[i]!) ? null : weights[i]!;
    // Fits that already carry this weight (fitSurvey's, compared again for the report) are kept as they are.
    return fit.stats.akaikeWeight === akaikeWeight ? fit : { ...fit, stats: { ...fit.stats, akaikeWeight } };
  });
}
