import type { FitResult } from '../../fit/fit-result';
import { parameterQuantityKind } from '../../models';
import type { SpecCheck } from './spec-check';
import { decideConformity } from '../decide-conformity';
import { parameterWords, valueWords, type ValueWords } from '../describe-value';
import type { FittedModel } from '../fitted-model';
import { parameterRole } from '../parameter-roles';
import type { CheckOutcome } from './check-parameter';
import type { ReadingRelation } from './reading-relation';
import type { Spec, SpecParameter } from './spec';

/**
 * Fit the spec's model again to the same survey with some parameters held at the values
 * given (on top of any the user fixed); null when that fit fails or does not converge.
 */
export type Refit = (held: Readonly<Record<string, number>>) => FitResult | null;

/** The name of the check this adds, as it appears in reports. */
export const atLabelGeometry = 'ampereTurns at label geometry';

/**
 * When the readings cannot determine the coil's geometry (on-axis readings of a thick coil
 * or a rectangle, far-field readings), the label's ampere-turns cannot be checked on its
 * own. A practitioner then holds the geometry at the label's values and checks the
 * ampere-turns that remain (DOMAIN.md §7.6: fix what the label states so the rest is
 * determined). The label's geometry has its own tolerance, so the ampere-turns tolerance is
 * widened by how far the held fit's ampere-turns move when each geometry value moves by
 * its tolerance, T = T_NI + Σ |ΔNI_j| (refits at g_j ± T_j; linear worst-case stacking, common
 * practice for tolerance stack-up). Pass means the readings agree with the label as a
 * whole; fail means the readings disagree with the label even when each dimension is given
 * its tolerance (to the linear stacking above).
 *
 * Null (no check) unless: the spec gives ampere-turns and the free fit could not determine
 * them; the label gives every geometry parameter the model has (or the user fixed it); and
 * the reading types can be compared. When the check applies but a refit fails, does not
 * converge or gives no interval, the result is `unavailable`: a sentence for the verdict
 * naming the values held, so the missing check is not dropped silently.
 *
 * @param fitted the free fit of the spec's model
 * @param outcomes the label-parameter checks already made (to see what was undetermined)
 */
export function checkAtLabelGeometry(
  spec: Spec, fitted: FittedModel, outcomes: readonly CheckOutcome[], relation: ReadingRelation, refit: Refit, shown: ValueWords = valueWords(),
): CheckOutcome | { readonly unavailable: string } | null {
  const amplitude = spec.params.find((p) => parameterRole(p.name) === 'amplitude');
  const amplitudeOutcome = outcomes.find((o) => o.check.what === amplitude?.name);
  if (!amplitude || amplitudeOutcome?.blocked !== 'undetermined' || !relation.comparable) return null;
  const model = fitted.point.model;
  const geometry: SpecParameter[] = [];
  for (const parameter of model.parameters) {
    if (parameterRole(parameter.name) !== 'geometry') continue;
    const label = spec.params.find((p) => p.name === parameter.name);
    if (label) geometry.push(label);
    else if (!fitted.fit.params[parameter.name]?.fixed) return null;
  }
  if (geometry.length === 0) return null;
  const held = Object.fromEntries(geometry.map((g) => [g.name, g.value]));
  const heldText = (values: Readonly<Record<string, number>>) =>
    geometry.map((g) => `${parameterWords(g.name)} ${shown.value(values[g.name]!, parameterQuantityKind(model.parameters.find((p) => p.name === g.name)!.unit))}`).join(', ');
  const unavailable = (values: Readonly<Record<string, number>>, why: string) => ({
    unavailable: `The check of ${parameterWords(amplitude.name)} at the label's geometry was not made: the ${model.id} fit with ${heldText(values)} held ${why}. ` +
      'Add readings within about one radius so the geometry is fitted rather than assumed, or check the label\'s dimensions and their tolerances.',
  });
  const atLabel = estimateOf(refit(held), amplitude.name);
  if (typeof atLabel === 'string') return unavailable(held, atLabel);
  let stack = 0;
  for (const g of geometry) {
    const half = g.tolerance.relative * Math.abs(g.value) + g.tolerance.absolute;
    if (!(half > 0)) continue;
    let largest = 0;
    for (const moved of [g.value - half, g.value + half]) {
      const values = { ...held, [g.name]: moved };
      const estimate = estimateOf(refit(values), amplitude.name);
      if (typeof estimate === 'string') return unavailable(values, estimate);
      largest = Math.max(largest, Math.abs(estimate.value - atLabel.value));
    }
    stack += largest;
  }
  const factor = relation.factor;
  const value = atLabel.value * factor;
  const ci95 = [atLabel.ci95[0] * factor, atLabel.ci95[1] * factor] as const;
  const tolerance = { relative: amplitude.tolerance.relative, absolute: amplitude.tolerance.absolute + stack * factor };
  const decision = decideConformity(value, ci95, amplitude.value, tolerance);
  const side = value < amplitude.value ? 'low' : 'high';
  const kind = parameterQuantityKind('A');
  const geometryText = heldText(held);
  const zone = `${shown.value(decision.lower, kind)} to ${shown.value(decision.upper, kind)}`;
  const measured = `with the label's geometry held (${geometryText}), ${parameterWords(amplitude.name)} ${shown.value(value, kind, ci95)} vs ${shown.tolerance(amplitude.value, kind, amplitude.tolerance)} on the label, ` +
    `widened by ±${shown.value(stack * factor, kind)} for the geometry's own tolerance`;
  const evidence = {
    pass: `${measured}: the whole interval lies within ${zone}, so the readings agree with the label as a whole.`,
    fail: `${measured}: the whole interval lies ${side === 'low' ? 'below' : 'above'} ${zone}, so the readings disagree with the label even with each dimension given its tolerance.`,
    inconclusive: `${measured}: the interval straddles a limit of ${zone}.`,
  }[decision.status];
  const check: SpecCheck = {
    what: atLabelGeometry,
    kind: 'parameter',
    status: decision.status,
    expected: { value: amplitude.value, unit: 'A' },
    measured: { value, unit: 'A', ci95 },
    tolerance,
    evidence,
    ...(decision.status === 'inconclusive'
      ? { toDecide: 'Measure the coil\'s dimensions to narrow the geometry tolerance, or add readings within about one radius so the geometry is fitted rather than assumed.' }
      : {}),
  };
  return { check, role: 'amplitude', side, blocked: null };
}

/** The refit's estimate with its interval, or why there is none (the end of a sentence). */
function estimateOf(fit: FitResult | null, name: string): { value: number; ci95: readonly [number, number] } | string {
  if (fit === null) return 'could not be fitted (a held value is outside the model\'s range)';
  if (!fit.converged) return 'did not converge';
  const estimate = fit.params[name];
  if (!estimate || !estimate.determined || estimate.fixed || !estimate.ci95) return `gives no interval for ${parameterWords(name)}`;
  if (!(estimate.ci95[0] <= estimate.value && estimate.value <= estimate.ci95[1])) return `gives an interval for ${parameterWords(name)} that does not contain its estimate`;
  return { value: estimate.value, ci95: estimate.ci95 };
}
