import { chiSquareSurvival } from '../../stats/chi-square-survival';
import { formatNumber } from '../../units/format-quantity';
import type { FitWarningInput } from './fit-warning-input';
import { formatParameter } from './format-parameter';
import { identifiabilityWarnings } from './identifiability-warnings';
import { plausibilityWarnings } from './plausibility-warnings';

/**
 * Plain-language warnings of one fit, in the order a reader needs them: did the search
 * converge; which --fix names do not apply; too few degrees of freedom; what the readings
 * cannot determine (identifiability-warnings.ts); parameters that ended on a bound;
 * scatter larger or smaller than the stated uncertainty (χ² tail probability below 0.01
 * either side, DOMAIN.md §7.3); implausible probe offset or background
 * (plausibility-warnings.ts); readings a robust loss flagged.
 */
export function fitWarnings(input: FitWarningInput): string[] {
  const { model, solution, uncertainty, search, options } = input;
  const warnings: string[] = [];
  if (solution.stopCode === 'non-finite-start') {
    const scan = model.parameters.some((p) => p.role === 'centre');
    const hint = scan ? ' (a dipole or power law is infinite at its centre: leave centre free or fix it between readings)'
      : model.physical ? '' : ' (a power law needs the sensing point beyond distance 0: leave probeOffset free or drop --fix probeOffset)';
    warnings.push(`Not fitted: the model cannot be evaluated at every reading from its start${hint}.`);
  } else if (!solution.converged) {
    warnings.push(`The search did not converge (${solution.stopReason.replace(/^not converged: /, '').replace(/\.$/, '')}); the values are the best found and may be far from the coil's.`);
  }
  for (const name of Object.keys(options.fixed ?? {})) {
    if (!model.parameters.some((p) => p.name === name)) warnings.push(`--fix ${name} does not apply: this model has no parameter "${name}".`);
  }
  const freedom = input.points.n - solution.freeIndices.length - search.pinned.length;
  if (freedom === 0) {
    warnings.push(`As many readings as free parameters (${input.points.n}): the curve passes through every reading, so nothing is left to judge the fit by${uncertainty.uncertaintyScale === 'estimated' ? ' and there are no intervals' : ''}. Add readings or fix parameters.`);
  } else if (freedom < 3) {
    warnings.push(`Only ${freedom} reading${freedom === 1 ? '' : 's'} more than free parameters: intervals are wide and the goodness of fit says little.`);
  }
  warnings.push(...identifiabilityWarnings(input));
  [...solution.freeIndices, ...search.pinned].forEach((j) => {
    if (solution.atBound[j] !== true && !search.pinned.includes(j)) return;
    const spec = model.parameters[j]!;
    const value = formatParameter(solution.params[j]!, spec.unit);
    warnings.push(model.physical
      ? `${spec.name} ended on its limit (${value}): the best fit wants a value this model does not allow, which usually means the model does not describe these readings.`
      : `${spec.name} ended on the edge of the range searched (${value}): no power law follows these readings closely; with a free offset it drifts towards an exponential fall-off, so read its curve, not its parameters.`);
  });
  const reduced = freedom > 0 ? input.chiSquare / freedom : NaN;
  if (uncertainty.uncertaintyScale === 'stated' && freedom > 0 && solution.converged) {
    const upper = chiSquareSurvival(input.chiSquare, freedom);
    if (upper < 0.01) {
      warnings.push(`The scatter is larger than the stated uncertainty allows: reduced χ² = ${formatNumber(reduced, 3)} (probability ${formatProbability(upper)} with ${freedom} degrees of freedom). Either the uncertainty is understated (positioning error? see --position-uncertainty) or this model does not fit; the intervals assume the stated uncertainty and are too narrow if it is understated.`);
    } else if (1 - upper < 0.01) {
      warnings.push(`The scatter is smaller than the stated uncertainty: reduced χ² = ${formatNumber(reduced, 3)} (probability ${formatProbability(1 - upper)} with ${freedom} degrees of freedom). The uncertainty looks overstated, so the intervals are wider than they need be.`);
    }
  }
  if (model.physical) warnings.push(...plausibilityWarnings(input));
  if (search.outliers !== null) {
    const lines = input.survey.readings.filter((_, i) => search.outliers![i] === true).map((r) => r.line);
    if (lines.length > 0) {
      warnings.push(`${lines.length} reading${lines.length === 1 ? '' : 's'} flagged as outlier${lines.length === 1 ? '' : 's'} by the ${options.robust} loss (line${lines.length === 1 ? '' : 's'} ${lines.join(', ')}): kept with reduced weight; check them.`);
    }
  }
  for (const note of search.notes) warnings.push(note.charAt(0).toUpperCase() + note.slice(1));
  return warnings;
}

/** "0.0003" or "2e-12": a small probability without false precision. */
function formatProbability(p: number): string {
  return p < 1e-4 ? p.toExponential(0) : formatNumber(p, 1);
}
