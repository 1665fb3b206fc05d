import type { FitResult } from '../../fit/fit-result';
import { studentTQuantile } from '../../stats';
import { surveyUnits, type RelativePlusAbsolute } from '../../units';
import { parameterWords, valueWords } from '../describe-value';
import { parameterRole } from '../parameter-roles';
import type { Spec } from '../spec/spec';
import type { FleetSurvey } from './fleet-survey';

/**
 * Sentences for every fitted geometry parameter that jumps between consecutive surveys of
 * one coil: the difference is significant — |Δ| exceeds t·√(σ₁² + σ₂²) with a Bonferroni
 * level 0.05/m over all m comparisons and the smaller of the two fits' degrees of freedom
 * (a conservative choice for two estimates with unequal variances) — and larger than the
 * tolerance (the spec's for that parameter, else the default relative to the earlier
 * value). A coil's windings do not change size, so such a jump means a different
 * (swapped or mislabeled) unit or a changed set-up (DOMAIN.md §5). Lengths are written
 * in the distance unit both surveys' files were written in, else in one chosen from the value.
 */
export function geometryChanges(
  surveys: readonly FleetSurvey[],
  fits: readonly (FitResult | null)[],
  spec: Spec | null,
  defaultTolerance: RelativePlusAbsolute,
): string[] {
  const names = [...new Set(fits.flatMap((fit) => Object.values(fit?.params ?? {}).filter((p) => parameterRole(p.name) === 'geometry').map((p) => p.name)))];
  const pairs: { name: string; a: number; b: number }[] = [];
  for (const name of names) {
    const usable = fits.flatMap((fit, i) => {
      const estimate = fit?.params[name];
      return estimate && !estimate.fixed && estimate.determined && estimate.stderr !== null && estimate.stderr > 0 ? [i] : [];
    });
    for (let j = 1; j < usable.length; j += 1) pairs.push({ name, a: usable[j - 1]!, b: usable[j]! });
  }
  const level = 1 - 0.025 / Math.max(1, pairs.length);
  const sentences: string[] = [];
  for (const { name, a, b } of pairs) {
    const first = fits[a]!;
    const second = fits[b]!;
    const x = first.params[name]!;
    const y = second.params[name]!;
    const difference = y.value - x.value;
    const nu = Math.max(1, Math.min(first.stats.n - first.stats.k, second.stats.n - second.stats.k));
    const margin = studentTQuantile(level, nu) * Math.hypot(x.stderr!, y.stderr!);
    const tolerance = spec?.params.find((p) => p.name === name)?.tolerance ?? defaultTolerance;
    const allowed = tolerance.relative * Math.abs(x.value) + tolerance.absolute;
    if (Math.abs(difference) > margin && Math.abs(difference) > allowed) {
      const shared = surveys[a]!.units?.distance === surveys[b]!.units?.distance ? surveys[b]! : null;
      const written = valueWords(surveyUnits(shared)).value;
      sentences.push(
        `geometry-changed: ${parameterWords(name)} ${written(x.value, 'length', x.ci95)} on ${label(surveys[a]!)} but ${written(y.value, 'length', y.ci95)} on ${label(surveys[b]!)} ` +
          `(difference ${written(difference, 'length')}, beyond both the statistical margin ±${written(margin, 'length')} and the tolerance ±${written(allowed, 'length')}): a swapped or mislabeled unit, or a changed set-up.`,
      );
    }
  }
  return sentences;
}

function label(survey: FleetSurvey): string {
  return survey.date ?? survey.source;
}
