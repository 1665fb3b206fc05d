import type { FieldKind, ReadingType, Reading, RejectedRow, Survey, SurveyUnits } from '../../core/survey/survey';
import { finishSurvey } from './finish-survey';
import { MIN_USABLE_READINGS, type ImportCounts, type SkippedSurvey } from './import-types';
import type { SurveyGroup } from './survey-group';

export type { SurveyGroup };

/**
 * Gathers rows into one group per (coil, date, reading type) in order of first
 * appearance, and at the end turns the groups into Surveys: groups with fewer than
 * MIN_USABLE_READINGS usable readings are skipped (with all their rows), never dropped.
 */
export class SurveyCollector {
  private readonly groups = new Map<string, SurveyGroup>();
  private last: SurveyGroup | null = null;
  readonly unassigned: RejectedRow[] = [];
  blankLines = 0;

  constructor(
    private readonly context: {
      readonly source: string;
      readonly fieldKind: FieldKind;
      readonly distanceAxis?: 'distance' | 'position' | 'scan';
      readonly meta: Readonly<Record<string, string>>;
      readonly fileNotes: readonly string[];
      readonly units?: SurveyUnits;
    },
  ) {}

  /** The group for a key; the previous row's group is reused without a map lookup. */
  group(coil: string | null, date: string | null, readingType: ReadingType | null): SurveyGroup {
    const last = this.last;
    if (last && last.coil === coil && last.date === date && last.readingType === readingType) return last;
    const key = `${coil ?? '\u0000'}\u0001${date ?? '\u0000'}\u0001${readingType ?? '\u0000'}`;
    let group = this.groups.get(key);
    if (!group) {
      group = { coil, date, readingType, readings: [], rejected: [], negativeRadial: 0 };
      this.groups.set(key, group);
    }
    this.last = group;
    return group;
  }

  /** Build the surveys. */
  finish(): { surveys: Survey[]; skipped: SkippedSurvey[]; counts: ImportCounts } {
    const all = [...this.groups.values()];
    const surveys: Survey[] = [];
    const skipped: SkippedSurvey[] = [];
    let used = 0;
    let rejected = this.unassigned.length;
    const typesBySurvey = new Map<string, (ReadingType | null)[]>();
    for (const group of all) {
      const key = `${group.coil ?? '\u0000'}\u0001${group.date ?? '\u0000'}`;
      typesBySurvey.set(key, [...(typesBySurvey.get(key) ?? []), group.readingType]);
    }
    for (const group of all) {
      const types = typesBySurvey.get(`${group.coil ?? '\u0000'}\u0001${group.date ?? '\u0000'}`) ?? [];
      const survey = finishSurvey(group, types.filter((t) => t !== group.readingType), this.context);
      if (group.readings.length >= MIN_USABLE_READINGS) {
        surveys.push(survey);
        used += group.readings.length;
        rejected += group.rejected.length;
      } else {
        skipped.push({
          survey,
          reason: `${describeGroup(group)} has ${group.readings.length} usable reading${group.readings.length === 1 ? '' : 's'} ` +
            `(${group.rejected.length} rejected); at least ${MIN_USABLE_READINGS} are needed to fit the smallest model`,
        });
        rejected += survey.totalRows;
      }
    }
    return { surveys, skipped, counts: { dataRows: used + rejected, used, rejected, blankLines: this.blankLines } };
  }
}

/** "coil HX-2 on 2026-03-14 (rms)" for messages. */
export function describeGroup(group: Pick<SurveyGroup, 'coil' | 'date' | 'readingType'>): string {
  const parts = [group.coil === null ? 'the survey' : `coil ${group.coil}`];
  if (group.date !== null) parts.push(`on ${group.date}`);
  if (group.readingType !== null) parts.push(`(${group.readingType})`);
  return parts.join(' ');
}
