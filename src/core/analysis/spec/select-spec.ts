import type { Spec } from './spec';

/**
 * The spec that applies to a coil: the one naming its id, else the one naming no coil,
 * else null. Specs are checked for duplicates when parsed, so at most one matches.
 *
 * @example selectSpec(specs, 'HX-2')?.model // 'loop'
 */
export function selectSpec(specs: readonly Spec[], coil: string | null): Spec | null {
  if (coil !== null) {
    const named = specs.find((spec) => spec.coils?.includes(coil));
    if (named) return named;
  }
  return specs.find((spec) => spec.coils === null) ?? null;
}
