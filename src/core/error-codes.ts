/**
 * Every stable code ringfall gives a problem, with what it means in one line. Scripts read
 * these codes (RingfallError.code; `readings.rejected[].code` and the batch report's
 * unreadable files in JSON); docs/CONTRACT.md "Problem codes" lists this table, and a test
 * keeps the two and the code base in step. The message that goes with a code is built
 * where the problem is found, with the value, the place and what to do; the line here
 * says what the code means.
 */
export const problemCodes = {
  // Command-line usage (exit status 2)
  USAGE_NO_INPUT: 'no survey file or folder named',
  USAGE_LENGTH: 'a distance option is negative',
  USAGE_POINTS: '`plan --points` is not a whole number in range',
  USAGE_REACH: '`plan --reach` is not a range of two distances',
  USAGE_SET: '`plan --set` lacks rough values the model needs',
  OPTION_VALUE: 'an option value is not usable',
  OPTION_TWICE: 'an option names the same parameter twice',
  MODEL_UNKNOWN: 'a model id that is not in the catalog',
  PARAMETER_SYNTAX: 'a parameter assignment not written NAME=QUANTITY',
  PARAMETER_UNKNOWN: 'a parameter name the model does not have',
  PARAMETER_VALUE: 'a parameter value that is not a number or quantity of the right kind',
  QUANTITY_SYNTAX: 'a value that is not a number with a unit',
  QUANTITY_UNIT: 'a quantity with no unit or an unknown one',
  QUANTITY_KIND: 'a quantity whose unit is of the wrong kind (a length where a field belongs)',
  TOLERANCE_SYNTAX: 'a tolerance that is not a percentage, a quantity or both',
  THRESHOLD_LEVEL: 'a threshold that is neither a field nor a known preset',
  THRESHOLD_FREQUENCY: 'a frequency-dependent threshold preset given without a frequency',
  SETTING_NUMBER: 'a value typed in the page that is not a number',
  // Input files and folders (exit status 2)
  INPUT_NOT_FOUND: 'no such file or folder',
  INPUT_UNREADABLE: 'a file that cannot be read',
  INPUT_NOT_REGULAR: 'a path that is not a regular file (a FIFO, device or socket)',
  INPUT_SYMLINK_LOOP: 'a symbolic link that leads into a loop of links',
  INPUT_LINK_BROKEN: 'a symbolic link to a file that does not exist',
  INPUT_EMPTY_FOLDER: 'folders that hold no survey file',
  INPUT_FOLDER_UNREADABLE: 'a folder that cannot be listed',
  INPUT_LIST_EMPTY: 'a `--files-from` list that names no file',
  INPUT_SKIP_LIST_UNREADABLE: 'a `.ringfall-skip` list that cannot be read',
  FILE_UNREADABLE: 'a file added to the page that the browser could not read',
  // Survey import (the whole file; exit status 2)
  IMPORT_EMPTY: 'an empty survey file',
  IMPORT_BINARY: 'a survey file that is not text',
  IMPORT_NO_HEADER: 'a survey file with no header row',
  IMPORT_HEADER_ONLY: 'a header with no data rows',
  IMPORT_TOO_FEW_ROWS: 'too few usable readings in every survey of the file',
  IMPORT_NO_DISTANCE: 'no distance or position column',
  IMPORT_NO_FIELD: 'no field column',
  IMPORT_COLUMN_CONFLICT: 'more than one column for the same role',
  IMPORT_COMPONENTS_INCOMPLETE: 'some but not all of Bx, By, Bz',
  IMPORT_MAPPING: 'a column mapping that names no column or an unknown role',
  IMPORT_METADATA: 'a metadata value (a date) that cannot be read',
  IMPORT_DISTANCE_UNIT_MISSING: 'a distance column with no unit',
  IMPORT_FIELD_UNIT_MISSING: 'a field column with no unit',
  IMPORT_UNIT_UNKNOWN: 'a column unit ringfall does not know',
  IMPORT_UNIT_KIND: 'a column unit of the wrong kind',
  IMPORT_UNIT_AMBIGUOUS: 'a unit spelling that could mean two units (`MT`: mega or milli)',
  IMPORT_OPTION_UNIT: 'a unit option (`--field-unit`, `--distance-unit`) that is not usable',
  // Rows set aside (`readings.rejected[]`, `rejected[]`); the rest of the file is used
  ROW_MISSING_CELLS: 'a row with fewer cells than the header',
  ROW_EXTRA_CELLS: 'a row with a non-empty cell beyond the header',
  ROW_EMPTY_CELL: 'an empty cell where a number belongs',
  ROW_NOT_A_NUMBER: 'a cell that is not a number',
  ROW_NOT_FINITE: 'a cell that is infinite, NaN or too large to be a number',
  ROW_OVER_RANGE: "the meter's over-range display instead of a reading",
  ROW_IMPLAUSIBLE: 'a value beyond any gaussmeter or coil survey (check the unit)',
  ROW_NEGATIVE_DISTANCE: 'a negative distance in a distance (not position) column',
  ROW_NEGATIVE_MAGNITUDE: 'a negative value in a magnitude (|B|) column',
  ROW_NEGATIVE_UNCERTAINTY: 'an uncertainty that is not positive',
  ROW_BAD_DATE: 'a date that cannot be read; the row belongs to no survey',
  ROW_BAD_READING_TYPE: 'a reading type that is not dc, rms or peak; the row belongs to no survey',
  ROW_COMMENTED: 'a row commented out with "#"',
  ROW_UNCLOSED_QUOTE: 'a quoted field never closed',
  ROW_UNASSIGNED: 'a row that belongs to no survey, for another reason',
  SURVEY_TOO_FEW_READINGS: 'a survey in the file with too few usable readings to fit',
  // Spec files (exit status 2)
  SPEC_READ: 'a spec file that cannot be read',
  SPEC_JSON: 'a spec file that is not valid JSON',
  SPEC_SHAPE: 'a spec value of the wrong shape (an object where a list belongs)',
  SPEC_KEY: 'an unknown key in a spec',
  SPEC_EMPTY: 'a spec with neither label parameters nor field claims',
  SPEC_MODEL: 'a spec without a model, or with an unknown one',
  SPEC_PARAM: 'a spec parameter the model does not have',
  SPEC_QUANTITY: 'a spec value that is not a quantity of the right kind, or outside what the model allows',
  SPEC_TOLERANCE: 'a tolerance for a parameter the spec does not give',
  SPEC_READING_TYPE: 'a spec reading type that is not dc, rms or peak',
  SPEC_WAVEFORM: 'a spec waveform ringfall does not know',
  SPEC_DATUM: 'a claim datum that is not "surface" or "winding"',
  SPEC_DUPLICATE: 'two specs for the same coil',
  // Fitting and prediction
  FIT_UNDERDETERMINED: 'fewer readings than free parameters',
  FIT_UNKNOWN_PARAMETER: 'a fixed parameter the model does not have',
  FIT_FIXED_OUT_OF_BOUNDS: 'a fixed value outside what the model allows',
  FIT_UNCERTAINTY_ZERO: 'a reading uncertainty of zero',
  FIT_POSITION_UNCERTAINTY: 'a position uncertainty that is not a length ≥ 0',
  FIT_POSITION_WITHOUT_READING: 'a position uncertainty given without a reading uncertainty',
  PREDICT_MISSING: '`predict` lacks parameters the model needs',
  PREDICT_TWICE: '`predict --set` names a parameter twice',
  PREDICT_POINT: 'a prediction point that is not a finite distance',
  PREDICT_SINGULAR: 'a point where the model field is undefined (on the winding)',
  PLAN_COUNT: 'too few planned positions for the free parameters',
  PLAN_INTEREST: 'a planned parameter that is not free',
  PLAN_REACH: 'a planned reach that is not a range',
  // Reports and outputs
  REPORT_NOT_RINGFALL: 'a JSON file that is not a saved ringfall report',
  OUTPUT_UNWRITABLE: 'an output that cannot be written',
  OUTPUT_BUSY: 'another batch run is writing into the same `--out` folder',
  // Batch (per file, in the batch report; exit status 2, or 70 for an internal error)
  BATCH_FILE_TIMEOUT: 'a file that took longer than `--file-time-limit`',
  BATCH_WORKER_STOPPED: 'a worker stopped (out of memory or killed) while fitting the file',
  BATCH_INTERNAL_ERROR: 'a defect in ringfall met while fitting the file',
} as const satisfies Record<string, string>;

/** A stable problem code: one of `problemCodes`. */
export type ProblemCode = keyof typeof problemCodes;

/** True when `text` is a known problem code (null-prototype safe: `constructor` is not one). */
export function isProblemCode(text: string): text is ProblemCode {
  return Object.prototype.hasOwnProperty.call(problemCodes, text);
}
