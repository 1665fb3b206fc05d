import { RingfallError } from '../../errors';

/** Who an exposure reference level is for. */
export type ExposureGroup = 'occupational' | 'public';

/** A magnetic-flux-density reference level: rms tesla for an unperturbed field. */
export interface ReferenceLevel {
  /** Reference level, T (rms). */
  readonly value: number;
  readonly frequency: number;
  readonly group: ExposureGroup;
  /** The frequency band of the table row, for people: "25 Hz – 300 Hz". */
  readonly band: string;
  /** For people: the published source and how far the value was verified against it. */
  readonly flag: string;
  /** Things to say with this value (rounding, other limits that also apply). */
  readonly notes: readonly string[];
}

interface Band {
  readonly from: number;
  readonly to: number;
  readonly level: (f: number) => number;
  readonly text: string;
}

// ICNIRP, Health Physics 99(6):818–836 (2010), magnetic flux density reference levels,
// rows merged as in DOMAIN.md §4.2 (occupational 25–300 Hz and 300 Hz–3 kHz; public
// 25–400 Hz and 400 Hz–3 kHz). Continuous at every band edge except public 3 kHz, where
// the table rounds 8e-2/3000 = 26.7 µT to 27 µT.
const occupational: readonly Band[] = [
  { from: 1, to: 8, level: (f) => 0.2 / (f * f), text: '1 Hz – 8 Hz: 0.2/f² T' },
  { from: 8, to: 25, level: (f) => 2.5e-2 / f, text: '8 Hz – 25 Hz: 2.5×10⁻²/f T' },
  { from: 25, to: 300, level: () => 1e-3, text: '25 Hz – 300 Hz: 1 mT' },
  { from: 300, to: 3e3, level: (f) => 0.3 / f, text: '300 Hz – 3 kHz: 0.3/f T' },
  { from: 3e3, to: 1e7, level: () => 1e-4, text: '3 kHz – 10 MHz: 0.1 mT' },
];
const generalPublic: readonly Band[] = [
  { from: 1, to: 8, level: (f) => 4e-2 / (f * f), text: '1 Hz – 8 Hz: 4×10⁻²/f² T' },
  { from: 8, to: 25, level: (f) => 5e-3 / f, text: '8 Hz – 25 Hz: 5×10⁻³/f T' },
  { from: 25, to: 400, level: () => 2e-4, text: '25 Hz – 400 Hz: 200 µT' },
  { from: 400, to: 3e3, level: (f) => 8e-2 / f, text: '400 Hz – 3 kHz: 8×10⁻²/f T' },
  { from: 3e3, to: 1e7, level: () => 2.7e-5, text: '3 kHz – 10 MHz: 27 µT' },
];

// Shown to people: the published document, and plainly that the values come from a
// textbook's reproduction of its table (DOMAIN.md §4.2), not from the guideline itself.
const tableFlag =
  'ICNIRP 2010, Health Physics 99(6):818–836, reference levels for magnetic flux density (rms, unperturbed field), as reproduced in a bioelectromagnetism textbook; not verified against the guideline\'s own tables';

/**
 * ICNIRP 2010 magnetic flux density reference level (rms, unperturbed field) for one
 * frequency and exposure group, 1 Hz – 10 MHz (DOMAIN.md §4.2). A frequency on a band edge
 * takes the higher band; the bands are continuous there except public at 3 kHz (27 µT
 * table value vs 26.7 µT from the lower band's formula).
 *
 * @param frequency Hz
 * @throws RingfallError code `THRESHOLD_FREQUENCY` outside 1 Hz – 10 MHz
 * @example icnirp2010ReferenceLevel(50, 'public').value // 2e-4 (200 µT)
 */
export function icnirp2010ReferenceLevel(frequency: number, group: ExposureGroup): ReferenceLevel {
  const bands = group === 'occupational' ? occupational : generalPublic;
  const band = bands.find((b) => frequency >= b.from && frequency < b.to) ?? (frequency === 1e7 ? bands[bands.length - 1] : undefined);
  if (!Number.isFinite(frequency) || band === undefined) {
    throw new RingfallError(
      'THRESHOLD_FREQUENCY',
      `ICNIRP 2010 reference level: ${frequency} Hz is outside the table (1 Hz – 10 MHz). Give a frequency in that range, e.g. "icnirp-public@50Hz".`,
      { value: frequency },
    );
  }
  const notes = ['ICNIRP reference levels are rms values of the unperturbed field for whole-body exposure; compare them with rms readings.'];
  if (group === 'public' && frequency >= 3e3) notes.push('The table gives 27 µT above 3 kHz; the 400 Hz – 3 kHz formula gives 26.7 µT at 3 kHz.');
  if (frequency > 1e5) notes.push('Above 100 kHz the radio-frequency reference levels also apply.');
  return { value: band.level(frequency), frequency, group, band: band.text, flag: tableFlag, notes };
}
