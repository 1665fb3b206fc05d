/**
 * Types of the survey importer's input options and its result. The result is data the
 * CLI and the web page show as is: which column became what and why, and every row that
 * was not used.
 */
import type { FieldKind, RejectedRow, Survey } from '../../core/survey/survey';

/**
 * What a column holds. `field` is a signed single-axis reading (plain `B`), `magnitude`
 * a |B| column, `bx`/`by`/`bz` components (all three → magnitude; `bz` alone → axial).
 * `lateral` is a signed position across the coil (a transverse scan; with `y`, the x of a
 * 3-D map whose z is the distance column), `y` a 3-D map's y.
 */
export type ColumnRole =
  | 'distance'
  | 'radial'
  | 'lateral'
  | 'y'
  | 'field'
  | 'magnitude'
  | 'bx'
  | 'by'
  | 'bz'
  | 'uncertainty'
  | 'coil'
  | 'date'
  | 'reading';

/** A hand-made column assignment (web page column mapping), overriding detection. */
export interface ColumnMapping {
  /** The column: 0-based index, or its header text exactly as written. */
  readonly column: number | string;
  /**
   * What the column holds, or 'ignore' to leave it out; 'position' is a distance column of
   * signed positions on a ruler (a scan through the coil, whatever its header says).
   */
  readonly role: ColumnRole | 'ignore' | 'position';
  /** Unit of a numeric column (e.g. "mm", "mT"); overrides the unit in the header. */
  readonly unit?: string;
}

export interface ImportOptions {
  /** File name or label for messages and Survey.source ("pasted text"). */
  readonly source: string;
  /** Unit of field columns whose header states none (`--field-unit`), e.g. "mT". */
  readonly fieldUnit?: string;
  /** Unit of distance and radial columns whose header states none (`--distance-unit`). */
  readonly distanceUnit?: string;
  /** Hand-made column assignments; columns not named keep their detected role. */
  readonly mapping?: readonly ColumnMapping[];
}

/** Where a column's unit came from. */
export type UnitSource = 'header' | 'option' | 'metadata' | 'mapping';

/** What the importer made of one column, and why. */
export interface ColumnDetection {
  /** 0-based column index. */
  readonly index: number;
  /** Header text as written (BOM and surrounding spaces removed). */
  readonly header: string;
  /** The role the column plays, or null when it is ignored. */
  readonly role: ColumnRole | null;
  /** Canonical unit symbol ("mm", "mT", "uT") for numeric roles, else null. */
  readonly unit: string | null;
  readonly unitSource: UnitSource | null;
  /** One sentence for people: `name "distance" with unit "mm" in brackets`. */
  readonly reason: string;
  /** A distance column set by hand as ruler positions of a scan ('scan'); absent: as its header says. */
  readonly axis?: 'scan';
}

/** A `# key: value` line before the header. */
export interface MetadataLine {
  readonly line: number;
  /** Lower-cased, runs of spaces, underscores and hyphens made one space. */
  readonly key: string;
  readonly value: string;
}

/** How the file was read: everything the web page needs to show and override detection. */
export interface Detection {
  readonly delimiter: ',' | ';' | '\t';
  /** True when "12,5" is read as 12.5: the delimiter is a semicolon (CONTRACT.md); never with tab or comma. */
  readonly decimalComma: boolean;
  readonly lineBreak: 'LF' | 'CRLF' | 'CR';
  readonly byteOrderMark: boolean;
  /** 1-based line of the header row. */
  readonly headerLine: number;
  readonly metadata: readonly MetadataLine[];
  /** `#` lines before the header that are not `key: value` metadata. */
  readonly comments: readonly { readonly line: number; readonly text: string }[];
  readonly columns: readonly ColumnDetection[];
  readonly fieldKind: FieldKind;
  /** File-level remarks (ignored columns, precedence rules applied). */
  readonly notes: readonly string[];
}

/** A coil/date group with too few usable readings to fit; all its rows are kept here. */
export interface SkippedSurvey {
  readonly survey: Survey;
  readonly reason: string;
}

/** Row bookkeeping: dataRows = used + rejected (in surveys and skipped) + unassigned. */
export interface ImportCounts {
  /** Non-blank records after the header. */
  readonly dataRows: number;
  readonly used: number;
  readonly rejected: number;
  /** Blank lines (or lines of only delimiters) after the header, not data. */
  readonly blankLines: number;
}

export interface ImportResult {
  /** One Survey per coil, date (and reading type when a file mixes them), in file order. */
  readonly surveys: readonly Survey[];
  /** Groups with fewer than MIN_USABLE_READINGS usable readings. */
  readonly skipped: readonly SkippedSurvey[];
  /** Rows that belong to no survey (commented out, or coil/date/reading cell unreadable). */
  readonly unassigned: readonly RejectedRow[];
  readonly detection: Detection;
  readonly counts: ImportCounts;
}

/**
 * Fewest usable readings a survey needs to be returned as a Survey: the smallest model in
 * the catalog (DESIGN.md), the dipole, has 2–3 parameters (moment, background, and the
 * probe offset unless it is fixed), so 3 readings are the fewest that can determine it.
 * An honest uncertainty needs more (residual degrees of freedom); the fit layer says so.
 */
export const MIN_USABLE_READINGS = 3;
