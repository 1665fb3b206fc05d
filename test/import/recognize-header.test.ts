import { describe, expect, it } from 'vitest';
import { recognizeHeader } from '../../src/io/import/recognize-header';

describe('recognizeHeader()', () => {
  // CONTRACT.md "CSV survey files" and issue 3 list these header forms
  const cases: [header: string, role: string, unit: string | null][] = [
    ['distance (mm)', 'distance', 'mm'],
    ['distance_mm', 'distance', 'mm'],
    ['z [cm]', 'distance', 'cm'],
    ['Distance/in', 'distance', 'in'],
    ['DISTANCE (MM)', 'distance', 'MM'],
    ['axial distance {m}', 'distance', 'm'],
    ['distance in mm', 'distance', 'mm'],
    ['B (mT)', 'field', 'mT'],
    ['field_G', 'field', 'G'],
    ['|B| (uT)', 'magnitude', 'uT'],
    ['B [µT]', 'field', 'µT'],
    ['B total (mT)', 'magnitude', 'mT'],
    ['Bx (mT)', 'bx', 'mT'],
    ['B_y [mT]', 'by', 'mT'],
    ['bz_mT', 'bz', 'mT'],
    ['radial offset (mm)', 'radial', 'mm'],
    ['rho (mm)', 'radial', 'mm'],
    ['Radial_Offset_mm', 'radial', 'mm'],
    ['uncertainty (uT)', 'uncertainty', 'uT'],
    ['u(B) (uT)', 'uncertainty', 'uT'],
    ['coil', 'coil', null],
    ['Coil ID', 'coil', null],
    ['date', 'date', null],
    ['Date (UTC)', 'date', null],
    ['reading', 'reading', null],
    ['Reading (mT)', 'field', 'mT'],
    ['value [G]', 'field', 'G'],
    ['B', 'field', null],
    ['distance', 'distance', null],
  ];
  for (const [header, role, unit] of cases) {
    it(`recognizeHeader("${header}") is ${role}${unit === null ? ' with no unit' : ` in ${unit}`}`, () => {
      const reading = recognizeHeader(header);
      expect(reading.role).toBe(role);
      expect(reading.unitText).toBe(unit);
      expect(reading.reason.length).toBeGreaterThan(0);
    });
  }

  it('recognizeHeader() keeps an unknown unit for the unit check instead of dropping it', () => {
    // never guess: "Oe" is reported as an unknown unit later (IMPORT_UNIT_UNKNOWN)
    expect(recognizeHeader('B (Oe)')).toMatchObject({ role: 'field', unitText: 'Oe' });
  });

  it('recognizeHeader() reports a name it does not know and guesses nothing', () => {
    // "x" is known since transverse scans and 3-D maps (a lateral position); "w" is not
    for (const header of ['temperature (C)', 'r (mm)', 'offset', 'w', 'probe_T2']) {
      const reading = recognizeHeader(header);
      expect(reading.role, header).toBeNull();
      expect(reading.reason).toContain('not a column name ringfall knows');
    }
  });

  it('recognizeHeader() reads "x", "lateral position" and "across" as a lateral position and "y" as a map\'s y', () => {
    for (const header of ['x (mm)', 'lateral position [mm]', 'across_mm', 'transverse position (cm)']) expect(recognizeHeader(header).role, header).toBe('lateral');
    expect(recognizeHeader('y (mm)').role).toBe('y');
  });

  it('recognizeHeader() does not read "radial offset" as "radial" with a unit "offset"', () => {
    expect(recognizeHeader('radial offset')).toMatchObject({ role: 'radial', unitText: null });
  });
});
