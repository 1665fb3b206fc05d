import type { ModelId } from '../../models/field-model';
import type { SpecCheck } from './spec-check';
import { decideConformity } from '../decide-conformity';
import { parameterQuantityKind } from '../../models';
import { parameterWords, valueWords, type ValueWords } from '../describe-value';
import type { FittedModel } from '../fitted-model';
import { parameterRole, type ParameterRole } from '../parameter-roles';
import { decidingMeasurement } from './deciding-measurement';
import type { ReadingRelation } from './reading-relation';
import type { SpecParameter } from './spec';

/** A spec check plus what findings need: the parameter's role and which side it fell on. */
export interface CheckOutcome {
  readonly check: SpecCheck;
  readonly role: ParameterRole | 'claim' | 'moment';
  /** Estimate below or above the label (whatever the status). */
  readonly side: 'low' | 'high';
  /** Why no decision was possible, when that was not the interval: 'fixed', 'undetermined', 'reading-type'. */
  readonly blocked: 'fixed' | 'undetermined' | 'reading-type' | null;
  /** Claims only: a descriptive curve that reproduces the claimed value within its tolerance. */
  readonly matchesNaive?: ModelId | null;
}

/**
 * Check one label parameter against the fit: the fitted value and its 95 % interval
 * (amplitudes scaled into the label's reading type) decided against label ± tolerance by
 * decideConformity. A fixed or undetermined parameter, or an amplitude whose reading type
 * cannot be related, is inconclusive with the reason; an inconclusive interval gets the
 * measurement that would decide it.
 */
export function checkParameter(fitted: FittedModel, label: SpecParameter, relation: ReadingRelation, shown: ValueWords = valueWords()): CheckOutcome {
  const index = fitted.point.model.parameters.findIndex((p) => p.name === label.name);
  const spec = fitted.point.model.parameters[index]!;
  const estimate = fitted.fit.params[label.name]!;
  const role = parameterRole(label.name);
  const kind = parameterQuantityKind(spec.unit);
  const words = parameterWords(label.name);
  const scaled = role === 'amplitude' || role === 'background';
  const factor = scaled ? relation.factor : 1;
  const value = estimate.value * factor;
  const ci95 = estimate.ci95 ? ([estimate.ci95[0] * factor, estimate.ci95[1] * factor] as const) : null;
  const side = value < label.value ? 'low' : 'high';
  const base = {
    what: label.name,
    kind: 'parameter' as const,
    expected: { value: label.value, unit: spec.unit },
    measured: { value, unit: spec.unit, ci95 },
    tolerance: label.tolerance,
  };
  const labelText = shown.tolerance(label.value, kind, label.tolerance);
  const inconclusive = (evidence: string, toDecide: string, blocked: CheckOutcome['blocked']): CheckOutcome => ({
    check: { ...base, status: 'inconclusive', evidence, toDecide }, role, side, blocked,
  });
  if (scaled && !relation.comparable) {
    return inconclusive(`${words} ${shown.value(value, kind, ci95)} is in the survey's reading type, the label's ${labelText} in another.`, relation.note ?? '', 'reading-type');
  }
  if (estimate.fixed) {
    return inconclusive(`${words} was held fixed at ${shown.value(value, kind)} in the fit, so the survey does not test the label's ${labelText}.`, `Fit ${label.name} freely (drop --fix ${label.name}).`, 'fixed');
  }
  if (!estimate.determined || ci95 === null) {
    return inconclusive(
      `these readings do not determine ${words} (fit ${shown.value(value, kind)}); the label says ${labelText}.`,
      'Add readings where the curve changes shape — closer than about the coil\'s size; far-field readings fix only the moment N·I·area — or fix the parameters the label states (--fix NAME=…) so that the rest are determined.',
      'undetermined',
    );
  }
  const decision = decideConformity(value, ci95, label.value, label.tolerance);
  const zone = `${shown.value(decision.lower, kind)} to ${shown.value(decision.upper, kind)}`;
  const measuredText = `${words} ${shown.value(value, kind, ci95)} vs ${labelText} on the label`;
  const verdicts = {
    pass: `${measuredText}: the whole interval lies within ${zone}.`,
    fail: `${measuredText}: the whole interval lies ${side === 'low' ? 'below' : 'above'} the tolerance zone ${zone}.`,
    inconclusive: `${measuredText}: the interval straddles a tolerance limit (zone ${zone}).`,
  };
  const check: SpecCheck = { ...base, status: decision.status, evidence: verdicts[decision.status] };
  if (decision.status !== 'inconclusive') return { check, role, side, blocked: null };
  const gradient = new Float64Array(fitted.values.length);
  gradient[index] = factor;
  const currentHalf = Math.max(value - ci95[0], ci95[1] - value);
  const toDecide = decision.shrinkFactor === 0
    ? `The estimate sits on the tolerance limit; no amount of readings can move it off.`
    : decidingMeasurement(fitted, { gradient, neededHalfWidth: currentHalf * decision.shrinkFactor!, words: `the ${words} interval`, kind }, shown) +
      (role === 'geometry' ? ' Geometry is best pinned by readings near z ≈ R, where the curve bends.' : '');
  return { check: { ...check, toDecide }, role, side, blocked: null };
}
