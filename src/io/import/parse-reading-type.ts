import type { ReadingType } from '../../core/survey/survey';

/** A Map, not an object literal: "constructor" or "__proto__" must not find Object.prototype's members. */
const spellings: ReadonlyMap<string, ReadingType> = new Map([
  ['dc', 'dc'], ['d.c.', 'dc'], ['static', 'dc'],
  ['rms', 'rms'], ['true rms', 'rms'], ['trms', 'rms'], ['ac rms', 'rms'], ['rms ac', 'rms'],
  ['peak', 'peak'], ['pk', 'peak'], ['ac peak', 'peak'], ['peak ac', 'peak'],
]);

/**
 * Read a detector type (DOMAIN §3.6): dc, rms or peak, case-insensitively, with a few
 * common spellings ("true RMS", "pk"). A bare "AC" is refused: it can mean true RMS or
 * an average-responding meter, and peak-to-peak is not peak.
 *
 * @returns the reading type, or null when the text is not one of them
 * @example parseReadingType('True RMS') // 'rms'
 */
export function parseReadingType(text: string): ReadingType | null {
  return spellings.get(text.trim().toLowerCase().replace(/[\s_-]+/g, ' ')) ?? null;
}
