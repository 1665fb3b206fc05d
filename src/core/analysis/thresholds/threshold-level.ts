import { isRingfallError, RingfallError } from '../../errors';
import type { ReadingType } from '../../survey/survey';
import { printable } from '../../text/printable';
import { parseQuantity } from '../../units';
import { icnirp2010ReferenceLevel, type ExposureGroup } from './icnirp-reference-level';

/** A field level to find the distance for, with where it comes from. */
export interface ThresholdLevel {
  /** T. */
  readonly value: number;
  /** For people: "implant screening line, static (ICNIRP 2009)"; null for a plain quantity. */
  readonly label: string | null;
  /** Detector type the level is defined for: 'dc' static limits, 'rms' ICNIRP 2010; null when not stated. */
  readonly readingType: ReadingType | null;
  /** For people: the published source of a preset and how far its value was verified against it; null for a plain quantity. */
  readonly flag: string | null;
  readonly notes: readonly string[];
}

/**
 * Fixed presets a user can name instead of a quantity (ids are our own, part of the CLI).
 * A null-prototype object: a typed "constructor" or "__proto__" finds no preset.
 */
export const thresholdPresets: Readonly<Record<string, ThresholdLevel>> = Object.freeze(Object.assign(Object.create(null) as Record<string, ThresholdLevel>, {
  'implant-static': {
    value: 5e-4,
    label: 'implant line, static (ICNIRP 2009)',
    readingType: 'dc',
    flag: 'ICNIRP 2009 static fields, Health Physics 96(4):504–514: people with implanted electronic devices are in general not adversely affected below 0.5 mT (verified against a published source)',
    notes: ['IEC 60601-2-33 ed. 4 uses 0.9 mT (preset "mr-implant") for inadvertent magnet-mode activation near MR equipment.'],
  },
  'mr-implant': {
    value: 9e-4,
    label: 'MR implant line (IEC 60601-2-33)',
    readingType: 'dc',
    flag: 'IEC 60601-2-33 ed. 4.0 (safety of MR equipment): 0.9 mT for inadvertent magnet-mode activation of active implants (as published summaries of the standard state it; not verified against the standard itself)',
    notes: ['The general screening line for implant wearers is 0.5 mT (preset "implant-static").'],
  },
  'pacemaker-ac': {
    value: 1e-4,
    label: 'pacemaker, 60 Hz (ORNL)',
    readingType: 'rms',
    flag: 'Oak Ridge National Laboratory guidance for pacemaker wearers: 0.1 mT at 60 Hz (as published sources quote it; not verified against the original report)',
    notes: ['Measured in-vivo interference thresholds at 50 Hz span a wide range; follow the device maker\'s guidance.'],
  },
  'static-public': {
    value: 0.4,
    label: 'ICNIRP 2009 static, public',
    readingType: 'dc',
    flag: 'ICNIRP 2009 static fields, Health Physics 96(4):504–514, limits of exposure: general public 400 mT, workers 2 T (head and trunk), limbs 8 T (verified against a published source)',
    notes: [],
  },
  'static-occupational': {
    value: 2,
    label: 'ICNIRP 2009 static, workers',
    readingType: 'dc',
    flag: 'ICNIRP 2009 static fields, Health Physics 96(4):504–514, limits of exposure: general public 400 mT, workers 2 T (head and trunk), limbs 8 T (verified against a published source)',
    notes: [],
  },
  'static-limbs': {
    value: 8,
    label: 'ICNIRP 2009 static, limbs',
    readingType: 'dc',
    flag: 'ICNIRP 2009 static fields, Health Physics 96(4):504–514, limits of exposure: general public 400 mT, workers 2 T (head and trunk), limbs 8 T (verified against a published source)',
    notes: [],
  },
}));

const frequencyPattern = /^\s*((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(Hz|kHz|MHz)\s*$/i;
const frequencyFactor: ReadonlyMap<string, number> = new Map([['hz', 1], ['khz', 1e3], ['mhz', 1e6]]);

/**
 * Read a threshold as written on the command line or in the web page: a field quantity
 * ("0.5mT", "5 G"), a preset name (`thresholdPresets`), or an ICNIRP 2010 reference level
 * "icnirp-public@50Hz" / "icnirp-occupational@1kHz" (rms, DOMAIN.md §4.2).
 *
 * @throws RingfallError code `THRESHOLD_LEVEL` (not a field, not positive, unknown
 *   preset), `THRESHOLD_FREQUENCY` (frequency missing or outside 1 Hz – 10 MHz)
 * @example parseThresholdLevel('icnirp-public@50Hz').value // 2e-4
 */
export function parseThresholdLevel(text: string, what = '--threshold'): ThresholdLevel {
  const trimmed = text.trim();
  const key = trimmed.toLowerCase();
  const preset = Object.hasOwn(thresholdPresets, key) ? thresholdPresets[key] : undefined;
  if (preset) return preset;
  const icnirp = /^icnirp-(public|occupational)(?:@(.*))?$/i.exec(trimmed);
  if (icnirp) return icnirpLevel(icnirp[1]!.toLowerCase() as ExposureGroup, icnirp[2], text, what);
  // a level that does not start like a number is meant as a preset name ("__proto__" too)
  if (!/^[+\-.\d]/.test(trimmed)) {
    throw new RingfallError(
      'THRESHOLD_LEVEL',
      `${what}: unknown preset "${printable(text, 60)}"; it is neither a field nor a known preset. Give a field like "0.5mT" or one of: ${[...Object.keys(thresholdPresets), 'icnirp-public@50Hz', 'icnirp-occupational@50Hz'].join(', ')}.`,
      { value: text },
    );
  }
  const level = parseQuantity(trimmed, 'field', what).value;
  if (!(level > 0)) {
    throw new RingfallError('THRESHOLD_LEVEL', `${what}: "${printable(text, 60)}" is not a positive field. Give a level above zero, e.g. "0.5mT".`, { value: text });
  }
  return { value: level, label: null, readingType: null, flag: null, notes: [] };
}

function icnirpLevel(group: ExposureGroup, frequencyText: string | undefined, text: string, what: string): ThresholdLevel {
  const match = frequencyPattern.exec(frequencyText ?? '');
  if (!match) {
    throw new RingfallError(
      'THRESHOLD_FREQUENCY',
      `${what}: "${printable(text, 60)}" needs the frequency of the field, written like "icnirp-${group}@50Hz" or "icnirp-${group}@1kHz".`,
      { value: text },
    );
  }
  const frequency = Number(match[1]) * frequencyFactor.get(match[2]!.toLowerCase())!;
  let reference: ReturnType<typeof icnirp2010ReferenceLevel>;
  try {
    reference = icnirp2010ReferenceLevel(frequency, group);
  } catch (error) {
    // name the option and the text as written, not only the frequency
    if (isRingfallError(error, 'THRESHOLD_FREQUENCY')) throw new RingfallError('THRESHOLD_FREQUENCY', `${what}: "${printable(text, 60)}": ${error.message}`, { value: text, cause: error });
    throw error;
  }
  return {
    value: reference.value,
    label: `ICNIRP 2010 ${group === 'public' ? 'public' : 'workers'}, ${match[1]} ${match[2]}`,
    readingType: 'rms',
    flag: reference.flag,
    notes: [`ICNIRP 2010 ${group === 'public' ? 'general public' : 'occupational'} reference level, table row ${reference.band}.`, ...reference.notes],
  };
}
