import type { FitResult } from '../fit/fit-result';
import type { FieldModel, ModelId } from '../models/field-model';

/**
 * The converged fit with the lowest AICc among those whose model is physical (DOMAIN.md
 * §1.11: the coil models, not the descriptive power laws); null when none converged.
 * Ties keep the earlier fit.
 *
 * @param modelOf the catalog lookup (getModel)
 */
export function bestPhysicalFit(fits: readonly FitResult[], modelOf: (id: ModelId) => FieldModel): FitResult | null {
  let best: FitResult | null = null;
  for (const fit of fits) {
    if (!fit.converged || !modelOf(fit.model).physical || !Number.isFinite(fit.stats.aicc)) continue;
    if (best === null || fit.stats.aicc < best.stats.aicc) best = fit;
  }
  return best;
}

/** The converged fit of one model id, or null. */
export function convergedFit(fits: readonly FitResult[], model: ModelId): FitResult | null {
  return fits.find((fit) => fit.model === model && fit.converged) ?? null;
}
