import type { SpecCheck } from '../../report/report';
import { decideConformity } from '../decide-conformity';
import { describeValue, parameterWords } from '../describe-value';
import { deltaVariance, type FittedModel } from '../fitted-model';
import { farFieldMoment } from '../parameter-roles';
import type { CheckOutcome } from './check-parameter';
import type { ReadingRelation } from './reading-relation';
import type { SpecParameter } from './spec';

/**
 * When the survey cannot separate ampere-turns from geometry (far-field readings), check
 * what it does determine: the far-field moment m (farFieldMoment) against the moment the
 * label implies. The label's tolerance carries over by linear worst-case stacking,
 * T_m = Σ |∂m/∂pⱼ|·Tⱼ (common practice for tolerance stack-up). The measured moment is
 * the dipole fit's when there is one (the model that matches far-field data, DOMAIN.md
 * §1.11: the coil model's linearisation is unreliable exactly when this check runs), else
 * the coil model's by the delta method (JCGM 100:2008 §5.1.2). Null when the label lacks
 * a parameter the moment needs.
 */
export function checkMoment(fitted: FittedModel, labels: readonly SpecParameter[], relation: ReadingRelation, dipole: FittedModel | null): CheckOutcome | null {
  const model = fitted.point.model;
  const fittedValues = Object.fromEntries(model.parameters.map((p, j) => [p.name, fitted.values[j]!]));
  const labelValues: Record<string, number> = { ...fittedValues };
  for (const label of labels) labelValues[label.name] = label.value;
  const labelMoment = farFieldMoment(model.id, labelValues);
  const fittedMoment = farFieldMoment(model.id, fittedValues);
  if (labelMoment === null || fittedMoment === null) return null;
  const usedLabels = labels.filter((label) => partial(model.id, labelValues, label.name) !== 0);
  const needed = model.parameters.filter((p) => partial(model.id, fittedValues, p.name) !== 0).map((p) => p.name);
  if (!needed.every((name) => usedLabels.some((label) => label.name === name))) return null;
  const stack = usedLabels.reduce((sum, label) => sum + Math.abs(partial(model.id, labelValues, label.name)) * (label.tolerance.relative * Math.abs(label.value) + label.tolerance.absolute), 0);
  const tolerance = { relative: 0, absolute: stack };
  const fromDipole = dipole?.fit.params['moment'];
  let value: number;
  let ci95: readonly [number, number] | null;
  let source: string;
  if (fromDipole && fromDipole.determined && fromDipole.ci95) {
    value = fromDipole.value * relation.factor;
    ci95 = [fromDipole.ci95[0] * relation.factor, fromDipole.ci95[1] * relation.factor];
    source = 'the dipole fit';
  } else {
    const gradient = model.parameters.map((p) => partial(model.id, fittedValues, p.name) * relation.factor);
    const variance = deltaVariance(fitted, gradient);
    value = fittedMoment * relation.factor;
    const half = variance === null || fitted.coverageFactor === null ? null : fitted.coverageFactor * Math.sqrt(variance);
    ci95 = half === null ? null : [value - half, value + half];
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

/** ∂m/∂p by a central difference with relative step 1e-6. */
function partial(model: Parameters<typeof farFieldMoment>[0], values: Readonly<Record<string, number>>, name: string): number {
  const x = values[name];
  if (x === undefined) return 0;
  const h = 1e-6 * Math.max(Math.abs(x), 1e-12);
  const up = farFieldMoment(model, { ...values, [name]: x + h });
  const down = farFieldMoment(model, { ...values, [name]: x - h });
  return up === null || down === null ? 0 : (up - down) / (2 * h);
}
