import type { SpecCheck } from './spec-check';
import { decideConformity } from '../decide-conformity';
import { describeValue, parameterWords } from '../describe-value';
import type { FittedModel } from '../fitted-model';
import { farFieldMoment, momentEstimate } from '../../fit/diagnostics/far-field-moment';
import type { FieldModel } from '../../models/field-model';
import type { CheckOutcome } from './check-parameter';
import type { ReadingRelation } from './reading-relation';
import type { SpecParameter } from './spec';

/**
 * When the survey cannot separate ampere-turns from geometry (far-field readings), check
 * what it does determine: the far-field moment m (fit/far-field-moment) against the moment the
 * label implies. The label's tolerance carries over by linear worst-case stacking,
 * T_m = Σ |∂m/∂pⱼ|·Tⱼ (common practice for tolerance stack-up). The measured moment is
 * the dipole fit's when the dipole describes the readings as well as the coil model
 * (ΔAICc ≤ 2: far-field data, DOMAIN.md §1.11, where the coil model's linearisation is
 * unreliable), else the coil model's by the delta method (JCGM 100:2008 §5.1.2). Null when the label lacks
 * a parameter the moment needs.
 */
export function checkMoment(fitted: FittedModel, labels: readonly SpecParameter[], relation: ReadingRelation, dipole: FittedModel | null): CheckOutcome | null {
  const model = fitted.point.model;
  const labelVector = Float64Array.from(fitted.values);
  for (const label of labels) labelVector[model.parameters.findIndex((p) => p.name === label.name)] = label.value;
  const labelMoment = farFieldMoment(model, labelVector);
  if (labelMoment === null) return null;
  const sensitivity = model.parameters.map((_, j) => partial(model, labelVector, j));
  // the label must give every parameter the moment depends on
  if (!model.parameters.every((p, j) => sensitivity[j] === 0 || labels.some((l) => l.name === p.name))) return null;
  const usedLabels = labels.filter((label) => sensitivity[model.parameters.findIndex((p) => p.name === label.name)] !== 0);
  const stack = usedLabels.reduce(
    (sum, label) => sum + Math.abs(sensitivity[model.parameters.findIndex((p) => p.name === label.name)]!) * (label.tolerance.relative * Math.abs(label.value) + label.tolerance.absolute),
    0,
  );
  const tolerance = { relative: 0, absolute: stack };
  const fromDipole = dipole?.fit.params['moment'];
  let value: number;
  let ci95: readonly [number, number] | null;
  let source: string;
  // The dipole speaks for the far field only when it fits as well as the coil model (ΔAICc ≤ 2, DOMAIN.md §7.2).
  const dipoleFits = dipole !== null && dipole.fit.stats.aicc <= fitted.fit.stats.aicc + 2;
  if (dipoleFits && fromDipole && fromDipole.determined && fromDipole.ci95) {
    value = fromDipole.value * relation.factor;
    ci95 = [fromDipole.ci95[0] * relation.factor, fromDipole.ci95[1] * relation.factor];
    source = 'the dipole fit';
  } else {
    const estimate = momentEstimate(model, fitted.values, fitted.freeIndex, fitted.covariance, fitted.coverageFactor ?? Number.NaN);
    if (estimate === null) return null;
    value = estimate.value * relation.factor;
    ci95 = estimate.ci95 && Number.isFinite(estimate.ci95[0]) ? [estimate.ci95[0] * relation.factor, estimate.ci95[1] * relation.factor] : null;
    source = `the ${model.id} fit`;
  }
  const side = value < labelMoment ? 'low' : 'high';
  const base = {
    what: 'moment',
    kind: 'moment' as const,
    expected: { value: labelMoment, unit: 'A·m²' },
    measured: { value, unit: 'A·m²', ci95 },
    tolerance,
  };
  const text = `far-field moment ${describeValue(value, 'moment', ci95)} from ${source} vs ${describeValue(labelMoment, 'moment')} ± ${describeValue(stack, 'moment')} implied by the label (${usedLabels.map((l) => `${parameterWords(l.name)} ${l.text}`).join(', ')})`;
  if (!relation.comparable || ci95 === null) {
    return { check: { ...base, status: 'inconclusive', evidence: `${text}.`, toDecide: relation.note ?? 'Fit with the coil parameters free so that the fit reports a covariance.' }, role: 'moment', side, blocked: relation.comparable ? 'undetermined' : 'reading-type' };
  }
  const decision = decideConformity(value, ci95, labelMoment, tolerance);
  const check: SpecCheck = { ...base, status: decision.status, evidence: `${text}: ${{ pass: 'within', fail: 'outside', inconclusive: 'straddling' }[decision.status]} the stacked tolerance.` };
  return { check, role: 'moment', side, blocked: null };
}

/** ∂m/∂θⱼ by a central difference with relative step 1e-6 (0 for parameters m does not depend on). */
function partial(model: FieldModel, values: Float64Array, j: number): number {
  const x = values[j]!;
  const h = 1e-6 * Math.max(Math.abs(x), 1e-12);
  const up = Float64Array.from(values);
  const down = Float64Array.from(values);
  up[j] = x + h;
  down[j] = x - h;
  const difference = (farFieldMoment(model, up) ?? Number.NaN) - (farFieldMoment(model, down) ?? Number.NaN);
  return Number.isFinite(difference) ? difference / (2 * h) : 0;
}
