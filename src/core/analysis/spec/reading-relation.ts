import type { ReadingType } from '../../survey/survey';
import { formatNumber } from '../../units';

/** How survey readings relate to the label's figures (detector type, DOMAIN.md §3.6). */
export interface ReadingRelation {
  /** False when field-like values cannot be compared (dc vs ac, or peak vs rms with no stated waveform). */
  readonly comparable: boolean;
  /** Multiply a survey-based field or amplitude by this to express it in the label's reading type. */
  readonly factor: number;
  /** What to tell the reader, or null when nothing needs saying. */
  readonly note: string | null;
}

/**
 * Relate the survey's detector type to the spec's. Peak and rms are converted only with a
 * crest factor the spec states (sine: √2, DOMAIN.md §3.6); otherwise the mismatch is
 * reported, never silently converted. A dc label and an ac survey (or the reverse) are
 * never comparable. When either side does not state its type, values are compared as they
 * are and the note says so.
 *
 * @example readingRelation('peak', 'rms', Math.SQRT2).factor // 1.4142…
 */
export function readingRelation(spec: ReadingType | null, survey: ReadingType | null, crestFactor: number | null): ReadingRelation {
  if (spec === null || survey === null) {
    const missing = spec === null && survey === null ? 'Neither the spec nor the survey states' : spec === null ? 'The spec does not state' : 'The survey does not state';
    return { comparable: true, factor: 1, note: `${missing} its detector type (dc, rms, peak); field and ampere-turn figures are compared as if they were the same.` };
  }
  if (spec === survey) return { comparable: true, factor: 1, note: null };
  const ac = (type: ReadingType) => type === 'rms' || type === 'peak';
  if (ac(spec) && ac(survey) && crestFactor !== null) {
    const factor = spec === 'peak' ? crestFactor : 1 / crestFactor;
    return { comparable: true, factor, note: `The survey's ${survey} readings were converted to the label's ${spec} values with the crest factor ${formatNumber(crestFactor, 4)} the spec states.` };
  }
  const todo = ac(spec) && ac(survey)
    ? 'State the waveform ("waveform": "sine") or a crest factor in the spec to compare them.'
    : 'A static (dc) figure and an ac reading describe different drives; survey the coil in the label\'s mode.';
  return { comparable: false, factor: 1, note: `The label gives ${spec} values and the survey read ${survey}; field and ampere-turn figures are not compared. ${todo}` };
}
