import type { FitResult } from '../../fit/fit-result';
import { getModel } from '../../models';
import type { ModelId } from '../../models/field-model';
import type { ReadingType } from '../../survey/survey';
import { convergedFit } from '../best-fit';
import { decisionRule, type CheckStatus } from '../decide-conformity';
import { coilOnlyValues } from '../coil-only-values';
import { valueWords, type ValueWords } from '../describe-value';
import { fittedModel, type FittedModel } from '../fitted-model';
import { parameterRole } from '../parameter-roles';
import { checkAtLabelGeometry, type Refit } from './check-at-label-geometry';
import { checkClaim } from './check-claim';
import { checkMoment } from './check-moment';
import { checkParameter, type CheckOutcome } from './check-parameter';
import { readingRelation } from './reading-relation';
import type { Spec } from './spec';
import type { SpecCheck } from './spec-check';
import { specFindings } from './spec-findings';

export interface Verdict {
  readonly status: CheckStatus;
  /** The decision rule in words (decide-conformity.ts decisionRule), naming ISO 14253-1 and JCGM 106. */
  readonly rule?: string;
  /** The model the checks were made with: the spec's. */
  readonly model?: ModelId;
  readonly findings: readonly string[];
  readonly checks: readonly SpecCheck[];
  /** Sentences explaining findings (degraded vs mislabeled), and what would decide an inconclusive check. */
  readonly explanations: readonly string[];
}

/**
 * Check a spec against one survey's fits: every label parameter and claim, interval-aware
 * (pass only when the whole 95 % interval lies within tolerance, fail when it lies wholly
 * outside, else inconclusive with the measurement that would decide it), the far-field
 * moment when the survey cannot separate amplitude from size, and the findings of
 * DOMAIN.md §5 (degraded vs mislabeled, …). The verdict is fail if any check fails, pass
 * if every check passes, else inconclusive.
 *
 * When the readings leave the geometry undetermined and a `refit` is given, ampere-turns
 * are also checked with the label's geometry held (checkAtLabelGeometry); when that check
 * cannot be made, the explanations say why.
 *
 * @param fits every fit of the survey; the spec's model must be among them
 * @param readingType the survey's detector type
 * @param refit fits the spec's model again with parameters held (analyseSurvey passes one)
 * @param shown how the sentences write values: valueWords(surveyUnits(survey)) for the
 *   survey's own units (analyseSurvey passes it); units chosen from the values when absent
 */
export function verifySpec(spec: Spec, fits: readonly FitResult[], readingType: ReadingType | null, refit?: Refit, shown: ValueWords = valueWords()): Verdict {
  const fit = convergedFit(fits, spec.model);
  if (fit === null) {
    const tried = fits.some((f) => f.model === spec.model);
    return {
      status: 'inconclusive',
      rule: decisionRule,
      model: spec.model,
      findings: ['not-fitted'],
      checks: [],
      explanations: [`The spec (${spec.source}) is for the ${spec.model} model, which ${tried ? 'did not converge on this survey' : 'was not fitted'}; ${tried ? 'see its warnings' : `fit it with --model ${spec.model}`}.`],
    };
  }
  const fitted = fittedModel(fit, getModel(spec.model));
  const relation = readingRelation(spec.readingType, readingType, spec.crestFactor);
  const outcomes: CheckOutcome[] = spec.params.map((label) => checkParameter(fitted, label, relation, shown));
  const atLabel = refit ? checkAtLabelGeometry(spec, fitted, outcomes, relation, refit, shown) : null;
  if (atLabel && 'check' in atLabel) {
    // the undetermined ampere-turns check no longer needs to suggest holding the label's values: that check was just made
    const index = outcomes.findIndex((o) => o.blocked === 'undetermined' && o.role === 'amplitude');
    const undetermined = outcomes[index];
    if (undetermined) {
      outcomes[index] = { ...undetermined, check: { ...undetermined.check, toDecide: 'Add readings where the curve changes shape — closer than about the coil\'s size — so the geometry is fitted rather than taken from the label; until then the check of ampere-turns at the label\'s geometry is the one that decides.' } };
    }
    outcomes.push(atLabel);
  }
  if (outcomes.some((o) => o.blocked === 'undetermined')) {
    const dipoleFit = convergedFit(fits, 'dipole');
    const moment = checkMoment(fitted, spec.params, relation, dipoleFit && dipoleFit !== fit ? fittedModel(dipoleFit, getModel('dipole')) : null);
    if (moment) outcomes.push(moment);
  }
  const naive = (['inverse-square', 'power-law'] as const).flatMap((id) => {
    const other = convergedFit(fits, id);
    return other && other !== fit ? [fittedModel(other, getModel(id))] : [];
  });
  outcomes.push(...spec.claims.map((claim) => checkClaim(fitted, claim, relation, naive, labelCoil(fitted, spec), shown)));
  const { findings, explanations } = specFindings(outcomes, shown);
  const statuses = outcomes.map((o) => o.check.status);
  const status: CheckStatus = statuses.includes('fail') ? 'fail' : statuses.every((s) => s === 'pass') ? 'pass' : 'inconclusive';
  const notes = relation.note && relation.comparable ? [relation.note] : [];
  if (atLabel && 'unavailable' in atLabel) notes.push(atLabel.unavailable);
  if (fit.warnings.length > 0) notes.push(`The ${fit.model} fit behind this verdict has ${fit.warnings.length} warning${fit.warnings.length === 1 ? '' : 's'} (listed with the fit); read ${fit.warnings.length === 1 ? 'it' : 'them'} before acting on the verdict.`);
  return { status, rule: decisionRule, model: spec.model, findings, checks: outcomes.map((o) => o.check), explanations: [...explanations, ...notes] };
}

/** The spec model at the label's values (coil only) when the label gives every amplitude and geometry parameter; else null. */
function labelCoil(fitted: FittedModel, spec: Spec): Float64Array | null {
  const model = fitted.point.model;
  const values = coilOnlyValues(model, fitted.values);
  for (const [j, parameter] of model.parameters.entries()) {
    const role = parameterRole(parameter.name);
    if (role !== 'amplitude' && role !== 'geometry') continue;
    const label = spec.params.find((p) => p.name === parameter.name);
    if (!label) return null;
    values[j] = label.value;
  }
  return values;
}
