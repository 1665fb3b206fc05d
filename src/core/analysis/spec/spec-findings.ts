import { parameterQuantityKind, type ParameterUnit } from '../../models';
import { parameterWords, valueWords, type ValueWords } from '../describe-value';
import type { CheckOutcome } from './check-parameter';

/** Findings (CONTRACT.md verdict.findings) with one sentence of evidence each. */
export interface SpecFindings {
  readonly findings: readonly string[];
  readonly explanations: readonly string[];
}

/**
 * Read the failure signatures of DOMAIN.md §5 off the checks: geometry outside its
 * tolerance means the curve's *shape* disagrees with the label → **mislabeled** (whatever
 * the amplitude does); ampere-turns low with every labeled geometry parameter passing
 * means the curve is the label's curve scaled down → **degraded** (shorted turns, low
 * drive current); low with the geometry undecided or unlabeled → **amplitude-low** (a
 * smaller coil is not ruled out); ampere-turns high → **amplitude-high**. When only the far-field moment could be
 * checked, **moment-low/high** says amplitude and size cannot be told apart. A failed
 * claim is **claim-not-met**; one that only a fitted inverse-square or power-law curve
 * reproduces (not the label's own coil) is also **power-law-extrapolation**; values not comparable across detector types give
 * **reading-type-mismatch**.
 */
export function specFindings(outcomes: readonly CheckOutcome[], shown: ValueWords = valueWords()): SpecFindings {
  const findings: string[] = [];
  const explanations: string[] = [];
  const params = outcomes.filter((o) => o.check.kind === 'parameter');
  const amplitude = params.filter((o) => o.role === 'amplitude');
  const geometry = params.filter((o) => o.role === 'geometry');
  const failedGeometry = geometry.filter((o) => o.check.status === 'fail');
  const failedAmplitude = amplitude.filter((o) => o.check.status === 'fail');
  if (failedGeometry.length > 0) {
    findings.push('mislabeled');
    const amplitudeNote = failedAmplitude.length > 0 ? `; the ${failedAmplitude.map((o) => against(o, shown)).join(', ')} may follow from the different geometry` : '';
    explanations.push(`${failedGeometry.map((o) => against(o, shown)).join('; ')} → the curve's shape differs from the labeled geometry: a different, swapped or mislabeled coil${amplitudeNote}.`);
  } else if (failedAmplitude.length > 0) {
    const low = failedAmplitude.every((o) => o.side === 'low');
    const asLabeled = geometry.length > 0 && geometry.every((o) => o.check.status === 'pass');
    const shape = geometry.length === 0
      ? 'no geometry on the label to compare the shape with'
      : geometry.map((o) => (o.check.status === 'pass' ? `${words(o)} ${measured(o, shown)} as labeled` : `${words(o)} ${measured(o, shown).replace(/ \(.*\)$/, '')} not decided`)).join('; ');
    if (asLabeled) {
      findings.push(low ? 'degraded' : 'amplitude-high');
      explanations.push(
        `${failedAmplitude.map((o) => against(o, shown)).join('; ')}; ${shape} → ` +
          (low
            ? 'amplitude loss: shorted turns or lower drive current (a wrong turn count or current on the label looks the same; measure the coil current to tell).'
            : 'more ampere-turns than labeled: a higher drive current or more turns than stated.'),
      );
    } else {
      findings.push(low ? 'amplitude-low' : 'amplitude-high');
      explanations.push(`${failedAmplitude.map((o) => against(o, shown)).join('; ')}; ${shape} → the amplitude is ${low ? 'low' : 'high'}, but without the geometry confirmed a ${low ? 'smaller' : 'larger'} coil is not ruled out: add readings within about one radius to tell degraded from mislabeled.`);
    }
  }
  const moment = outcomes.find((o) => o.role === 'moment' && o.check.status === 'fail');
  if (moment) {
    findings.push(moment.side === 'low' ? 'moment-low' : 'moment-high');
    explanations.push(`${moment.check.evidence} Far-field readings fix only the moment, so amplitude loss and a ${moment.side === 'low' ? 'smaller' : 'larger'} coil cannot be told apart; add readings within about one radius.`);
  }
  const claims = outcomes.filter((o) => o.check.kind === 'claim');
  if (claims.some((o) => o.check.status === 'fail')) findings.push('claim-not-met');
  for (const claim of claims.filter((o) => o.matchesNaive && o.check.status !== 'pass')) {
    if (!findings.includes('power-law-extrapolation')) findings.push('power-law-extrapolation');
    explanations.push(`The claimed ${shown.value(claim.check.expected.value, 'field')} (${claim.check.what}) matches the fitted ${claim.matchesNaive} curve, not the coil's physics (${shown.value(claim.check.measured.value, 'field')}): the datasheet figure was probably extrapolated with a power law.`);
  }
  if (outcomes.some((o) => o.blocked === 'reading-type')) findings.push('reading-type-mismatch');
  for (const outcome of outcomes) {
    if (outcome.check.status === 'inconclusive' && outcome.check.toDecide) explanations.push(`To decide ${outcome.check.what}: ${outcome.check.toDecide}`);
  }
  return { findings, explanations: [...new Set(explanations)] };
}

function words(outcome: CheckOutcome): string {
  return parameterWords(outcome.check.what);
}

function measured(outcome: CheckOutcome, shown: ValueWords): string {
  return shown.value(outcome.check.measured.value, parameterQuantityKind(outcome.check.measured.unit as ParameterUnit), outcome.check.measured.ci95);
}

function against(outcome: CheckOutcome, shown: ValueWords): string {
  return `${words(outcome)} ${measured(outcome, shown)} vs ${shown.value(outcome.check.expected.value, parameterQuantityKind(outcome.check.expected.unit as ParameterUnit))} on the label`;
}
