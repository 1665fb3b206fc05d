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

/** A claimed field at a point: "1.7 mT at 0 mm". */
export interface SpecClaim {
  /** Distance along the axis from the datum, m. */
  readonly distance: number;
  /** Radial offset from the axis, m (0 on axis). */
  readonly radial: number;
  /** Claimed field, T, in the spec's reading type. */
  readonly field: number;
  readonly tolerance: RelativePlusAbsolute;
  /** As written, for messages: "1.7 mT at 0 mm". */
  readonly text: string;
}
