import type { ModelId } from '../../models/field-model';
import type { Spec } from './spec';

/** The spec a survey was checked against (CONTRACT.md "Spec file"). */
export interface SpecUse {
  /** False when specs were given but none applies to this survey's coil. */
  readonly applied: boolean;
  /** The spec that applied ("specs.json" or "specs.json, spec 2"), or the file(s) given when none applied. */
  readonly source: string;
  /** Coil ids the applied spec names (null: it names none, so it applies to every coil); when none applied, every id the file names. */
  readonly coils: readonly string[] | null;
  /** The applied spec's model, or null. */
  readonly model: ModelId | null;
  /** Why no spec applied, in one sentence with what to do; null when one applied. */
  readonly reason: string | null;
}

/**
 * What the report says about the specs for one survey: which one applied (selectSpec's
 * choice), or — when specs were given and none applies — that and why, so that a spec
 * for another coil is never passed over in silence. Null when no spec was given.
 *
 * @example specUse(specs, specs[0], 'QA-107')?.source // 'all-coils.spec.json, spec 1'
 */
export function specUse(specs: readonly Spec[], applied: Spec | null, coil: string | null): SpecUse | null {
  if (specs.length === 0) return null;
  if (applied !== null) return { applied: true, source: applied.source, coils: applied.coils, model: applied.model, reason: null };
  const files = [...new Set(specs.map((spec) => spec.source.replace(/, spec \d+$/, '')))].join(', ');
  const named = [...new Set(specs.flatMap((spec) => spec.coils ?? []))];
  const reason = coil === null || coil.trim() === ''
    ? `The spec file ${files} names coil${named.length === 1 ? '' : 's'} ${named.join(', ')}, and this survey has no coil id, so no spec was checked. Add a "# coil: ID" line or a coil column to the survey, or give a spec without "coil".`
    : `The spec file ${files} is for coil${named.length === 1 ? '' : 's'} ${named.join(', ')}, not ${coil}, so no spec was checked. Give the spec for ${coil}, or a file holding it (e.g. one with every coil's spec).`;
  return { applied: false, source: files, coils: named, model: null, reason };
}
