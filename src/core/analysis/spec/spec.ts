import type { ModelId } from '../../models/field-model';
import type { ReadingType } from '../../survey/survey';
import type { RelativePlusAbsolute } from '../../units';

/**
 * A label or datasheet specification of one coil type (CONTRACT.md "Spec file"), parsed
 * into SI. Produced by src/io/spec, checked against fits by `verifySpec`.
 */
export interface Spec {
  /** Where it came from, for messages: "specs.json" or "specs.json, spec 2". */
  readonly source: string;
  /** Coil ids it applies to; null when it applies to every coil without a spec of its own. */
  readonly coils: readonly string[] | null;
  readonly model: ModelId;
  /** Label parameters, in the order written. */
  readonly params: readonly SpecParameter[];
  /** Field claims at stated distances, in the order written. */
  readonly claims: readonly SpecClaim[];
  /** Detector type the label's field figures refer to; null when not stated. */
  readonly readingType: ReadingType | null;
  /**
   * Peak/rms ratio of the drive waveform when the spec states it (sine → √2, DOMAIN.md §3.6),
   * so that a peak claim can be compared with an rms survey; null when not stated.
   */
  readonly crestFactor: number | null;
}

/** One label parameter: a value in SI with its tolerance. */
export interface SpecParameter {
  /** Model parameter name (ampereTurns, radius, …). */
  readonly name: string;
  /** SI value. */
  readonly value: number;
  /** As written in the file, for messages: "120 A". */
  readonly text: string;
  readonly tolerance: RelativePlusAbsolute;
}

/**
 * Where a claim's distance is measured from (CONTRACT.md "Spec file"): `surface`, the
 * outside of the device where the probe touches it (what a label's "field at 50 mm" means
 * in the trade, and the default), or `winding`, the coil's own datum (the winding plane of
 * a flat coil, the near face of the winding of a coil with length; DESIGN.md "Distance
 * datum"). A surface distance is a ruler distance as the survey reads it, so the check
 * evaluates the fitted coil there with the fitted probe offset added.
 */
export type ClaimDatum = 'surface' | 'winding';

/** Datum of a claim that does not state one: the device surface, as labels mean it. */
export const defaultClaimDatum: ClaimDatum = 'surface';

/** A claimed field at a point: "1.7 mT at 0 mm from the surface". */
export interface SpecClaim {
  /** Distance along the axis from `datum`, m. */
  readonly distance: number;
  /** What `distance` is measured from. */
  readonly datum: ClaimDatum;
  /** Radial offset from the axis, m (0 on axis). */
  readonly radial: number;
  /** Claimed field, T, in the spec's reading type. */
  readonly field: number;
  readonly tolerance: RelativePlusAbsolute;
  /** As written, for messages: "1.7 mT at 0 mm from the surface". */
  readonly text: string;
}
