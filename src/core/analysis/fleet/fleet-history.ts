import type { RelativePlusAbsolute } from '../../units';
import type { Spec } from '../spec/spec';
import { coilHistory, type FleetCoil } from './coil-history';
import type { FleetSurvey } from './fleet-survey';

export type { FleetSurvey };

/** The fleet section of a batch report (CONTRACT.md). */
export interface FleetSummary {
  readonly coils: readonly FleetCoil[];
  readonly unreadable: readonly { readonly source: string; readonly reason: string }[];
  /** Surveys without a coil id, which cannot join a history. */
  readonly ungrouped?: readonly { readonly source: string; readonly reason: string }[];
}

/** Options of the fleet history. */
export interface FleetOptions {
  /** Specs (labels and tolerances) for the coils. */
  readonly specs?: readonly Spec[];
  /** Tolerance for "beyond tolerance" when a coil has no spec. Default 5 %. */
  readonly tolerance?: RelativePlusAbsolute;
  /** Files that could not be read, passed through to the summary. */
  readonly unreadable?: readonly { readonly source: string; readonly reason: string }[];
}

/** Default tolerance for coils without a spec: 5 % of the reference (common practice for coil output checks). */
export const defaultFleetTolerance: RelativePlusAbsolute = { relative: 0.05, absolute: 0 };

/**
 * The fleet section: surveys grouped by coil id (in order of first appearance), each coil
 * analysed by coilHistory (date order, ampere-turn trend, degrading and geometry-change
 * flags). Surveys without a coil id are listed as ungrouped with the reason; nothing is
 * dropped silently.
 *
 * @example fleetHistory(surveys).coils[0].trend.ampereTurnsPerYear // { value: -4.1, unit: 'A/yr', ci95: [...] }
 */
export function fleetHistory(surveys: readonly FleetSurvey[], options: FleetOptions = {}): FleetSummary {
  const groups = new Map<string, FleetSurvey[]>();
  const ungrouped: { source: string; reason: string }[] = [];
  for (const survey of surveys) {
    if (survey.coil === null || survey.coil.trim() === '') {
      ungrouped.push({ source: survey.source, reason: 'No coil id, so it cannot join a coil\'s history. Add a "# coil: ID" line or a coil column.' });
      continue;
    }
    const list = groups.get(survey.coil) ?? [];
    list.push(survey);
    groups.set(survey.coil, list);
  }
  return {
    coils: [...groups.entries()].map(([coil, list]) => coilHistory(coil, list, options.specs ?? [], options.tolerance ?? defaultFleetTolerance)),
    unreadable: options.unreadable ?? [],
    ungrouped,
  };
}
