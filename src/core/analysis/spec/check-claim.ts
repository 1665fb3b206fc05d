import type { ModelId } from '../../models/field-model';
import type { SpecCheck } from './spec-check';
import { formatNumber } from '../../units';
import { coilOnlyMask, coilOnlyValues } from '../coil-only-values';
import { decideConformity } from '../decide-conformity';
import { describeValue, valueWords, type ValueWords } from '../describe-value';
import { beyondSurvey, deltaVariance, probeOffsetOf, surveyedFieldRange, type FittedModel } from '../fitted-model';
import type { CheckOutcome } from './check-parameter';
import { decidingMeasurement } from './deciding-measurement';
import type { ReadingRelation } from './reading-relation';
import type { SpecClaim } from './spec';

/**
 * Check a claimed field at a point against the fitted model: the coil's own field there
 * (background removed) with a 95 % interval by the delta method,
 * Var(B) ≈ ∇_θBᵀ·C·∇_θB (JCGM 100:2008 §5.1.2), scaled into the label's reading type and
 * decided by decideConformity. The point follows the claim's datum: from the device
 * surface (the default, what a label means) it is the claimed distance as a ruler reading,
 * so the fitted probe offset is added and its uncertainty propagated; from the winding it
 * is the distance from the coil's own datum, offset removed. Beside it, what the label's
 * own coil (at the same point) and the fitted inverse-square and power-law curves give: a
 * claim that neither the measured coil nor the label's coil reproduces, but a descriptive
 * curve does, was most likely extrapolated with a power law.
 *
 * @param labelValues the spec model at the label's parameters (coil only), or null when the label does not give them all
 *
 * @param naive converged descriptive fits of the same survey (inverse-square, power-law)
 */
export function checkClaim(fitted: FittedModel, claim: SpecClaim, relation: ReadingRelation, naive: readonly FittedModel[], labelValues: Float64Array | null, shown: ValueWords = valueWords()): CheckOutcome {
  const model = fitted.point.model;
  const fromSurface = claim.datum === 'surface' || !model.physical;
  const values = fromSurface ? backgroundFree(fitted) : coilOnlyValues(model, fitted.values);
  const offset = model.physical ? probeOffsetOf(fitted) : 0;
  // distance of the claimed point from the coil's datum, and as a ruler reading
  const fieldPoint = fromSurface ? claim.distance + offset : claim.distance;
  const reading = fieldPoint - offset;
  const factor = relation.factor;
  const value = fitted.point.field(values, claim.distance, claim.radial) * factor;
  const gradient = new Float64Array(values.length);
  fitted.point.gradient(values, claim.distance, claim.radial, gradient);
  const mask = fromSurface ? model.parameters.map((p) => p.role === 'background') : coilOnlyMask(model);
  for (let j = 0; j < gradient.length; j += 1) gradient[j] = mask[j] ? 0 : gradient[j]! * factor;
  const variance = deltaVariance(fitted, gradient);
  const half = variance === null || fitted.coverageFactor === null ? null : fitted.coverageFactor * Math.sqrt(variance);
  const ci95 = half === null ? null : ([value - half, value + half] as const);
  const alternatives = naive.flatMap((other) => {
    const otherValue = fitted === other ? null : other.point.field(backgroundFree(other), reading, claim.radial) * factor;
    return otherValue === null || !Number.isFinite(otherValue) ? [] : [{ model: other.fit.model, value: otherValue, unit: 'T' as const }];
  });
  // the check's name follows the spec's words, whatever units the survey was written in
  const where = `field at ${describeValue(claim.distance, 'length')} from the ${claim.datum}${claim.radial > 0 ? `, ${describeValue(claim.radial, 'length')} off axis` : ''}`;
  // The label's own coil at the claimed point: a claim it reproduces is the label's physics, not an extrapolation.
  const labelField = labelValues === null ? null : fitted.point.field(labelValues, fieldPoint, claim.radial);
  const labelZone = claim.tolerance.relative * claim.field + claim.tolerance.absolute;
  const labelConsistent = labelField !== null && Math.abs(labelField - claim.field) <= labelZone;
  const base = { what: where, kind: 'claim' as const, datum: claim.datum, expected: { value: claim.field, unit: 'T' }, measured: { value, unit: 'T', ci95 }, tolerance: claim.tolerance, alternatives };
  const side = value < claim.field ? 'low' : 'high';
  const claimText = shown.tolerance(claim.field, 'field', claim.tolerance);
  const others = alternatives.map((a) => `${a.model}${a.model === 'power-law' ? exponentOf(naive, a.model) : ''} ${shown.value(a.value, 'field')}`);
  if (labelField !== null) others.unshift(`the label's own coil ${shown.value(labelField, 'field')}`);
  const sideBySide = others.length === 0 ? '' : `; ${others.join(', ')}`;
  const extrapolated = beyondSurvey(fieldPoint, surveyedFieldRange(fitted, offset)) ? ' (outside the surveyed distances: the model extrapolates)' : '';
  const measuredText = `${shown.value(value, 'field', ci95)} from the ${model.id} fit${extrapolated} vs ${claimText} claimed${sideBySide}`;
  if (!relation.comparable) {
    return { check: { ...base, status: 'inconclusive', evidence: `${measuredText}.`, toDecide: relation.note ?? '' }, role: 'claim', side, blocked: 'reading-type', matchesNaive: null };
  }
  if (ci95 === null) {
    return { check: { ...base, status: 'inconclusive', evidence: `${measuredText}; the fit gives no interval.`, toDecide: 'Fit with all coil parameters free so that the fit reports a covariance.' }, role: 'claim', side, blocked: 'undetermined', matchesNaive: null };
  }
  const decision = decideConformity(value, ci95, claim.field, claim.tolerance);
  const matches = labelConsistent || decision.status === 'pass' ? null : alternatives.find((a) => Math.abs(a.value - claim.field) <= labelZone)?.model ?? null;
  const check: SpecCheck = { ...base, status: decision.status, evidence: `${measuredText}: ${{ pass: 'within', fail: 'outside', inconclusive: 'straddling' }[decision.status]} the tolerance.` };
  if (decision.status !== 'inconclusive') return { check, role: 'claim', side, blocked: null, matchesNaive: matches };
  const toDecide = decision.shrinkFactor === 0
    ? 'The estimate sits on the tolerance limit; no amount of readings can move it off.'
    : decidingMeasurement(fitted, { gradient, neededHalfWidth: half! * decision.shrinkFactor!, words: `the ${where} interval`, kind: 'field' }, shown);
  return { check: { ...check, toDecide }, role: 'claim', side, blocked: null, matchesNaive: matches };
}

function backgroundFree(fitted: FittedModel): Float64Array {
  const values = new Float64Array(fitted.values);
  fitted.point.model.parameters.forEach((p, j) => { if (p.role === 'background') values[j] = 0; });
  return values;
}

function exponentOf(naive: readonly FittedModel[], model: ModelId): string {
  const exponent = naive.find((n) => n.fit.model === model)?.fit.params['exponent']?.value;
  return exponent === undefined ? '' : ` (n = ${formatNumber(exponent, 3)})`;
}
