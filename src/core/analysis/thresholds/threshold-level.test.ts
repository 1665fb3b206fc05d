import { describe, it, expect } from 'vitest';
import { icnirp2010ReferenceLevel } from './icnirp-reference-level';
import { parseThresholdLevel, thresholdPresets } from './threshold-level';
import { thresholdCautions } from './threshold-cautions';
import { RingfallError } from '../../errors';
import { expectClose } from '../../../../test/support/expect-close';

function thrown(action: () => unknown): RingfallError {
  try {
    action();
  } catch (error) {
    expect(error).toBeInstanceOf(RingfallError);
    return error as RingfallError;
  }
  throw new Error('expected a RingfallError');
}

describe('icnirp2010ReferenceLevel()', () => {
  it('icnirp2010ReferenceLevel() gives 200 µT, 80 µT and 27 µT for the public at 50 Hz, 1 kHz, ≥3 kHz', () => {
    // DOMAIN.md §9 row 55 [V][C]: ICNIRP 2010 public 50/60 Hz 200 µT; 1 kHz 80 µT; ≥3 kHz 27 µT
    expectClose(icnirp2010ReferenceLevel(50, 'public').value, 200e-6, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(60, 'public').value, 200e-6, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(1000, 'public').value, 80e-6, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(3000, 'public').value, 27e-6, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(50e3, 'public').value, 27e-6, { rel: 1e-12 });
  });

  it('icnirp2010ReferenceLevel() gives 1 mT, 300 µT and 100 µT for workers at 50 Hz, 1 kHz, ≥3 kHz', () => {
    // DOMAIN.md §9 row 56 [V][C]
    expectClose(icnirp2010ReferenceLevel(50, 'occupational').value, 1e-3, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(1000, 'occupational').value, 300e-6, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(3000, 'occupational').value, 100e-6, { rel: 1e-12 });
  });

  it('icnirp2010ReferenceLevel() follows 1/f² and 1/f below 25 Hz', () => {
    // DOMAIN.md §4.2 evaluated [C]: occupational 1 Hz 0.2 T, 8 Hz 3.125 mT; public 1 Hz 40 mT, 8 Hz 0.625 mT
    expectClose(icnirp2010ReferenceLevel(1, 'occupational').value, 0.2, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(8, 'occupational').value, 3.125e-3, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(1, 'public').value, 40e-3, { rel: 1e-12 });
    expectClose(icnirp2010ReferenceLevel(8, 'public').value, 0.625e-3, { rel: 1e-12 });
    // the 1/f² and 1/f rows meet at 8 Hz (DOMAIN.md §4.2 table): just below 8 Hz is continuous
    expectClose(icnirp2010ReferenceLevel(8 - 1e-9, 'public').value, 0.625e-3, { rel: 1e-9 });
  });

  it('icnirp2010ReferenceLevel() carries its source flag and says that levels are rms', () => {
    const level = icnirp2010ReferenceLevel(50, 'public');
    // the source line names the published document (ICNIRP 2010, Health Physics 99(6):818–836) and says it was not verified against it
    expect(level.flag).toContain('ICNIRP 2010, Health Physics 99(6):818–836');
    expect(level.flag).toContain('not verified');
    expect(level.notes.join(' ')).toContain('rms');
    expect(icnirp2010ReferenceLevel(3000, 'public').notes.join(' ')).toContain('26.7 µT');
  });

  it('icnirp2010ReferenceLevel() rejects a frequency outside the table with THRESHOLD_FREQUENCY', () => {
    const error = thrown(() => icnirp2010ReferenceLevel(0.5, 'public'));
    expect(error.code).toBe('THRESHOLD_FREQUENCY');
    expect(error.message).toContain('1 Hz – 10 MHz');
    expect(thrown(() => icnirp2010ReferenceLevel(Number.NaN, 'public')).code).toBe('THRESHOLD_FREQUENCY');
  });
});

describe('parseThresholdLevel()', () => {
  it('parseThresholdLevel() reads quantities in any field unit', () => {
    // DOMAIN.md §6: 5 G = 0.5 mT exactly
    expectClose(parseThresholdLevel('5 G').value, 5e-4, { rel: 1e-15 });
    expectClose(parseThresholdLevel('0.5mT').value, 5e-4, { rel: 1e-15 });
    expect(parseThresholdLevel('50uT').label).toBeNull();
  });

  it('parseThresholdLevel() knows the 0.5 mT implant line and the 0.9 mT MR line', () => {
    // DOMAIN.md §9 row 58 [V]: implant screening line 0.5 mT; IEC 60601-2-33 ed. 4: 0.9 mT
    expect(parseThresholdLevel('implant-static').value).toBe(5e-4);
    expect(parseThresholdLevel('implant-static').notes.join(' ')).toContain('0.9 mT');
    expect(parseThresholdLevel('mr-implant').value).toBe(9e-4);
  });

  it('parseThresholdLevel() knows the ICNIRP 2009 static limits', () => {
    // DOMAIN.md §9 row 57 [V]: 2 T head/trunk, 8 T limbs, 400 mT public
    expect(thresholdPresets['static-occupational']!.value).toBe(2);
    expect(thresholdPresets['static-limbs']!.value).toBe(8);
    expect(thresholdPresets['static-public']!.value).toBe(0.4);
  });

  it('parseThresholdLevel() reads "icnirp-public@50Hz" and "icnirp-occupational@1kHz" as rms levels', () => {
    // DOMAIN.md §9 rows 55–56
    const publicLevel = parseThresholdLevel('icnirp-public@50Hz');
    expectClose(publicLevel.value, 2e-4, { rel: 1e-12 });
    expect(publicLevel.readingType).toBe('rms');
    expect(publicLevel.label).toBe('ICNIRP 2010 public, 50 Hz');
    expect(publicLevel.notes[0]).toContain('25 Hz – 400 Hz');
    expectClose(parseThresholdLevel('ICNIRP-occupational@1 kHz').value, 3e-4, { rel: 1e-12 });
  });

  it('parseThresholdLevel() rejects an unknown preset, a missing frequency and a non-positive level', () => {
    expect(thrown(() => parseThresholdLevel('pacemaker')).code).toBe('THRESHOLD_LEVEL');
    expect(thrown(() => parseThresholdLevel('pacemaker')).message).toContain('implant-static');
    expect(thrown(() => parseThresholdLevel('icnirp-public')).code).toBe('THRESHOLD_FREQUENCY');
    expect(thrown(() => parseThresholdLevel('icnirp-public')).message).toContain('"icnirp-public@50Hz"');
    expect(thrown(() => parseThresholdLevel('0 mT')).code).toBe('THRESHOLD_LEVEL');
    expect(thrown(() => parseThresholdLevel('0 mT')).message).toContain('"0 mT" is not a positive field');
    expect(thrown(() => parseThresholdLevel('5 mm')).code).toBe('QUANTITY_KIND');
    expect(thrown(() => parseThresholdLevel('5 mm')).message).toContain('--threshold: "5 mm" is a length');
  });

  it('parseThresholdLevel() names the option and the text when the ICNIRP frequency is outside the table', () => {
    const error = thrown(() => parseThresholdLevel('icnirp-public@0.5Hz'));
    expect(error.code).toBe('THRESHOLD_FREQUENCY');
    expect(error.message).toContain('--threshold: "icnirp-public@0.5Hz"');
    expect(error.message).toContain('1 Hz – 10 MHz');
  });

  it('parseThresholdLevel() knows the 0.1 mT power-frequency pacemaker line as an rms level', () => {
    // DOMAIN.md §4.3 [V]: ORNL guidance for pacemaker wearers, 0.1 mT (1 G) at 60 Hz
    expect(parseThresholdLevel('pacemaker-ac').value).toBe(1e-4);
    expect(parseThresholdLevel('pacemaker-ac').readingType).toBe('rms');
  });

  it('thresholdCautions opens with "not medical advice", then lists the seven cautions of DOMAIN.md §4.5', () => {
    // project brief: exposure output says "not medical advice"; DOMAIN.md §4.5 items 1–7 follow
    expect(thresholdCautions).toHaveLength(8);
    expect(thresholdCautions[0]).toMatch(/^Not medical advice/);
    expect(thresholdCautions.join(' ')).toContain('IEEE C95.1-2019');
    expect(thresholdCautions.join(' ')).toMatch(/maker's guidance/);
    expect(thresholdCautions.join(' ')).toMatch(/not a calibrated compliance instrument/);
    // implant and patient cautions defer to the maker, licensed practice and local codes (DOMAIN.md §4.5 items 1 and 3)
    expect(thresholdCautions[1]).toMatch(/licensed clinical practice and the device maker's instructions/);
    expect(thresholdCautions[3]).toMatch(/clinician's advice and local codes/);
  });
});
