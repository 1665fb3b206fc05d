import type { ProblemCode } from '../error-codes';

/**
 * The Survey: one coil surveyed on one date, as imported. SI inside (m, T).
 * Produced by src/io import, consumed by fitting and analyses.
 */

/** Detector type of the readings (DOMAIN §3.6). */
export type ReadingType = 'dc' | 'rms' | 'peak';

/**
 * How the field value of each reading relates to the coil's field vector:
 * - `magnitude`: |B| (a triaxial meter, or a column written as |B|), never negative;
 * - `axial`: a signed single-axis reading along the coil axis (plain `B` column);
 * - `components`: Bx, By, Bz given; `field` holds their magnitude and `components` keeps them.
 */
export type FieldKind = 'magnitude' | 'axial' | 'components';

export interface Reading {
  /** 1-based line number in the source text (metadata and header lines count). */
  readonly line: number;
  /** Distance along the coil axis from the datum (winding plane or near face), m. */
  readonly distance: number;
  /** Radial offset from the coil axis, m (0 on axis). */
  readonly radial: number;
  /** The reading used for fitting, T (see FieldKind). */
  readonly field: number;
  /** Components as read, T, when the file gave Bx/By/Bz. */
  readonly components?: { readonly x: number; readonly y: number; readonly z: number };
  /** Standard uncertainty of this reading from the file, T. */
  readonly standardUncertainty?: number;
}

/** A row that was not used, and why. Nothing is dropped silently. */
export interface RejectedRow {
  readonly line: number;
  /** Column name as written in the header, or null for whole-row problems. */
  readonly column: string | null;
  /** The offending cell text, or null. */
  readonly value: string | null;
  /** What was wrong and what to do, in one sentence. */
  readonly reason: string;
  /**
   * Stable code of the problem, for programs (the web page highlights by it): one of the
   * ROW_… codes of error-codes.ts (set by src/io/import).
   */
  readonly code?: ProblemCode;
}

/**
 * The units a survey's columns were written in (from the header, an option or a hand
 * mapping), as people write them: the reports show the survey's numbers in these units.
 * Values inside stay SI; this only says how to show them.
 */
export interface SurveyUnits {
  /** Unit of the field columns: 'T', 'mT', 'µT', 'nT', 'kG', 'G' or 'mG' (micro as µ). */
  readonly field: string;
  /** Unit of the distance column: 'm', 'cm', 'mm', 'µm' or 'in'. */
  readonly distance: string;
}

export interface Survey {
  /** File name (or "pasted text", "sample: …"). */
  readonly source: string;
  readonly coil: string | null;
  /** ISO date (YYYY-MM-DD) or null. */
  readonly date: string | null;
  readonly readingType: ReadingType | null;
  readonly fieldKind: FieldKind;
  /** Used readings, in file order. */
  readonly readings: readonly Reading[];
  /** Rows of this survey not used (row-level problems). */
  readonly rejected: readonly RejectedRow[];
  /** Data rows belonging to this survey: readings.length + rejected.length. */
  readonly totalRows: number;
  /** `# key: value` metadata lines, keys lower-cased. */
  readonly meta: Readonly<Record<string, string>>;
  /** Things the importer did that the report must say (e.g. "all readings negative: probe reversed, signs flipped"). */
  readonly notes: readonly string[];
  /**
   * What a reading's `distance` is: absent or 'distance', measured outward from the model's
   * datum (winding plane, midpoint or near face); 'position', a signed position along the
   * axis from any ruler zero (a scan through the coil), fitted with the coil centre's
   * position on that ruler (parameter `centre`) in place of the probe offset.
   */
  readonly axis?: 'distance' | 'position';
  /** Units the file's columns were in; absent for surveys not read from a file (synthetic ones): reports then choose units from the values. */
  readonly units?: SurveyUnits;
}
