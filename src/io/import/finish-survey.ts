import type { FieldKind, ReadingType, Reading, Survey, SurveyUnits } from '../../core/survey/survey';
import { surveyUnits } from '../../core/units';
import type { SurveyGroup } from './survey-group';

/**
 * Turn a group of rows into a Survey and write the notes the report must show.
 *
 * Sign of a plain `B` column (signed single-axis reading): small negative readings far
 * from the coil are real (zero offset, background; DOMAIN §3.3–3.4, §5) and are kept.
 * When the largest reading in magnitude is negative and the readings sum below zero,
 * the probe was held reversed: every sign is flipped and a note says so. (A strict
 * "all negative" test would miss a reversed probe whose farthest readings are lifted
 * above zero by background.)
 */
export function finishSurvey(
  group: SurveyGroup,
  otherReadingTypes: readonly (ReadingType | null)[],
  context: { readonly source: string; readonly fieldKind: FieldKind; readonly distanceAxis?: 'distance' | 'position' | 'scan'; readonly meta: Readonly<Record<string, string>>; readonly fileNotes: readonly string[]; readonly units?: SurveyUnits },
): Survey {
  const notes: string[] = [];
  let readings: Reading[] = group.readings;
  if (context.fieldKind === 'axial' && readings.length > 0) {
    let sum = 0;
    let largest = readings[0] as Reading;
    let negatives = 0;
    for (const reading of readings) {
      sum += reading.field;
      if (reading.field < 0) negatives += 1;
      if (Math.abs(reading.field) > Math.abs(largest.field)) largest = reading;
    }
    if (largest.field < 0 && sum < 0) {
      readings = readings.map((reading) => ({ ...reading, field: -reading.field }));
      notes.push(
        `probe read reversed: the largest reading (${surveyUnits(context).format(largest.field, 'field')}, line ${largest.line}) and the sum of the readings are negative, ` +
          `so every sign was flipped (${negatives} of ${readings.length} readings were negative)`,
      );
    } else if (negatives > 0) {
      notes.push(`${negatives} negative reading${negatives === 1 ? '' : 's'} kept as read: a single-axis reading far from a coil can be below zero (zero offset, background)`);
    }
  }
  if (group.negativeRadial > 0) {
    notes.push(`${group.negativeRadial} negative radial offset${group.negativeRadial === 1 ? '' : 's'} read as ${group.negativeRadial === 1 ? 'its' : 'their'} absolute value (the coil's field is symmetric about its axis)`);
  }
  const others = otherReadingTypes.map((t) => t ?? 'unlabelled');
  if (others.length > 0) {
    notes.push(`the same coil and date also has ${others.join(', ')} readings in this file; they form a separate survey, since detector types are never mixed`);
  }
  const scan = context.distanceAxis === 'scan' || (context.distanceAxis === 'position' && readings.some((reading) => reading.distance < 0));
  if (scan) {
    notes.push('distances read as signed positions along the axis from the ruler\'s zero (a scan through the coil): every reading is used and the position of the coil\'s centre on that ruler is fitted (centre)');
  }
  notes.push(...context.fileNotes);
  return {
    source: context.source,
    coil: group.coil,
    date: group.date,
    readingType: group.readingType,
    fieldKind: context.fieldKind,
    readings,
    rejected: group.rejected,
    totalRows: readings.length + group.rejected.length,
    meta: context.meta,
    notes,
    ...(scan ? { axis: 'position' as const } : {}),
    ...(context.units ? { units: context.units } : {}),
  };
}
