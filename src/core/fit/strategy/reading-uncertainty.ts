import { RingfallError } from '../../errors';
import type { Survey } from '../../survey/survey';
import { formatQuantity } from '../../units/format-quantity';
import type { RelativePlusAbsolute } from '../../units/tolerance';

/** The standard uncertainty of each reading, and where it came from. */
export interface ReadingUncertainty {
  /** σ_B,i in T (survey order), or null when the readings carry none. */
  readonly standardUncertainty: Float64Array | null;
  /** 'option': σᵢ = relative·|Bᵢ| + absolute from the caller; 'file': the survey's uncertainty column. */
  readonly source: 'option' | 'file' | null;
  /** Sentences for the report (which uncertainty replaced which, readings without one). */
  readonly notes: readonly string[];
}

/**
 * Standard uncertainty of every reading (T): σᵢ = relative·|Bᵢ| + absolute when the
 * instrument's accuracy is given (the linear sum instrument specs "±(p % of reading + c)"
 * are written in, DOMAIN.md §3.2), otherwise the file's per-reading uncertainty when every
 * reading has one > 0, otherwise none (the fit then estimates the scale from the residuals,
 * DOMAIN.md §7.4). A given accuracy replaces the file's column, and the notes say so.
 *
 * @throws RingfallError `FIT_UNCERTAINTY_ZERO` when the given accuracy makes some σᵢ ≤ 0
 *   (a zero reading with no absolute part, or a negative part), which would give that
 *   reading infinite (or no meaningful) weight.
 * @example readingUncertainty(survey, { relative: 0.015, absolute: 2e-6 }) // σ = 0.015·|B| + 2 µT
 */
export function readingUncertainty(survey: Survey, instrument?: RelativePlusAbsolute | null): ReadingUncertainty {
  const readings = survey.readings;
  const inFile = readings.filter((r) => r.standardUncertainty !== undefined && r.standardUncertainty > 0).length;
  if (instrument) {
    // Plain loops: Float64Array.from with a map function goes through the iterator protocol.
    const sigma = new Float64Array(readings.length);
    for (let i = 0; i < readings.length; i++) sigma[i] = instrument.relative * Math.abs(readings[i]!.field) + instrument.absolute;
    const zero = readings.findIndex((_, i) => !(sigma[i]! > 0));
    if (zero >= 0 && !(instrument.relative >= 0 && instrument.absolute >= 0)) {
      // A negative part gives σ ≤ 0 too; say so rather than blame a zero reading.
      throw new RingfallError(
        'FIT_UNCERTAINTY_ZERO',
        `Uncertainty: ${formatPercent(instrument.relative)} + ${formatQuantity(instrument.absolute, 'field')} gives σ = ${formatQuantity(sigma[zero]!, 'field')} for the reading on line ${readings[zero]!.line} of ${survey.source}, not more than 0. Give a relative and an absolute part ≥ 0, e.g. "1.5%+2µT".`,
        { value: instrument, where: `line ${readings[zero]!.line}` },
      );
    }
    if (zero >= 0) {
      throw new RingfallError(
        'FIT_UNCERTAINTY_ZERO',
        `Uncertainty: ${formatPercent(instrument.relative)} of a ${formatQuantity(readings[zero]!.field, 'field')} reading is zero (line ${readings[zero]!.line} of ${survey.source}). Add an absolute part for the meter's floor, e.g. "${formatPercent(instrument.relative)}+1µT".`,
        { value: instrument, where: `line ${readings[zero]!.line}` },
      );
    }
    const notes = inFile > 0 ? [`The given uncertainty (${describeInstrument(instrument)}) replaced the file's uncertainty column.`] : [];
    return { standardUncertainty: sigma, source: 'option', notes };
  }
  if (inFile === readings.length && inFile > 0) {
    const sigma = new Float64Array(readings.length);
    for (let i = 0; i < readings.length; i++) sigma[i] = readings[i]!.standardUncertainty!;
    return { standardUncertainty: sigma, source: 'file', notes: [] };
  }
  const notes = inFile > 0
    ? [`Only ${inFile} of ${readings.length} readings state an uncertainty, so none are used as stated; give one for all (--uncertainty) to get intervals from them.`]
    : [];
  return { standardUncertainty: null, source: null, notes };
}

/** "1.5 % + 2 µT" for a relative-plus-absolute uncertainty. */
function describeInstrument(instrument: RelativePlusAbsolute): string {
  const parts: string[] = [];
  if (instrument.relative > 0) parts.push(formatPercent(instrument.relative));
  if (instrument.absolute > 0) parts.push(formatQuantity(instrument.absolute, 'field'));
  return parts.length === 0 ? '0' : parts.join(' + ');
}

function formatPercent(fraction: number): string {
  return `${Number((fraction * 100).toPrecision(6))}%`;
}
