import { describe, expect, it } from 'vitest';
import { importSurveys } from '../../src/io/index';
import { thrownRingfallError } from '../support/thrown-ringfall-error';

const source = 'frame.csv';

describe('importSurveys() reads transverse scans and 3-D maps (CONTRACT.md "CSV survey files")', () => {
  it('a "lateral position" column is a transverse scan: signed positions across the coil kept as read', () => {
    const text = 'lateral position (mm),distance (mm),B (mT)\n-20,10,1.1\n-10,10,1.5\n0,10,1.7\n10,10,1.5\n20,10,1.1\n';
    const { surveys, detection } = importSurveys(text, { source });
    const survey = surveys[0]!;
    expect(survey.lateral).toBe('position');
    expect(survey.axis).toBeUndefined();
    // SI Brochure 9th ed.: 1 mm = 1e-3 m
    expect(survey.readings.map((r) => r.radial)).toEqual([-0.02, -0.01, 0, 0.01, 0.02]);
    expect(detection.columns[0]?.role).toBe('lateral');
    expect(survey.notes.some((note) => note.includes('lateralCentre'))).toBe(true);
  });

  it('"across" is always a transverse scan, even with no negative value', () => {
    const { surveys } = importSurveys('across (mm),distance (mm),B (mT)\n0,10,1.1\n10,10,1.5\n20,10,1.7\n30,10,1.5\n', { source });
    expect(surveys[0]?.lateral).toBe('position');
  });

  it('an "x" column alone is a transverse scan only when a value is negative; otherwise radial offsets', () => {
    const signed = importSurveys('x (mm),distance (mm),B (mT)\n-10,10,1.5\n0,10,1.7\n10,10,1.5\n', { source }).surveys[0]!;
    expect(signed.lateral).toBe('position');
    const offsets = importSurveys('x (mm),distance (mm),B (mT)\n0,10,1.7\n10,10,1.5\n20,10,1.1\n', { source }).surveys[0]!;
    expect(offsets.lateral).toBeUndefined();
    expect(offsets.readings.map((r) => r.radial)).toEqual([0, 0.01, 0.02]);
  });

  it('a "radial offset" column keeps reading a negative value as its absolute value, with a note', () => {
    const { surveys } = importSurveys('distance (mm),radial offset (mm),B (mT)\n10,-5,1.5\n10,0,1.7\n10,5,1.5\n', { source });
    expect(surveys[0]?.lateral).toBeUndefined();
    expect(surveys[0]?.readings.map((r) => r.radial)).toEqual([0.005, 0, 0.005]);
    expect(surveys[0]?.notes.some((note) => note.includes('1 negative radial offset read as its absolute value'))).toBe(true);
  });

  it('a radial offset column and a lateral position column together are a conflict', () => {
    const error = thrownRingfallError(() => importSurveys('distance (mm),radial offset (mm),lateral position (mm),B (mT)\n10,1,1,1.5\n10,0,1,1.7\n10,5,1,1.5\n', { source }));
    expect(error.code).toBe('IMPORT_COLUMN_CONFLICT');
    expect(error.message).toContain('"radial offset (mm)" (column 2) and "lateral position (mm)" (column 3)');
  });

  it('x, y and z with Bx, By, Bz make a 3-D map: positions kept, components kept as vectors, negative z allowed', () => {
    const text = 'x (mm),y (mm),z (mm),Bx (uT),By (uT),Bz (uT)\n0,0,-10,1,2,300\n10,0,0,10,2,200\n0,10,10,1,12,200\n-10,-10,20,-10,2,200\n';
    const { surveys } = importSurveys(text, { source });
    const survey = surveys[0]!;
    expect(survey.axis).toBe('map');
    expect(survey.fieldKind).toBe('components');
    expect(survey.readings).toHaveLength(4);
    expect(survey.readings[3]).toMatchObject({ position: { x: -0.01, y: -0.01, z: 0.02 }, distance: 0.02, components: { x: -1e-5, y: 2e-6, z: 2e-4 } });
    expect(survey.readings[0]?.position).toEqual({ x: 0, y: 0, z: -0.01 });
    expect(survey.notes.some((note) => note.includes('3-D map') && note.includes('as vectors'))).toBe(true);
  });

  it('x, y, z with |B| make a magnitude map', () => {
    const { surveys } = importSurveys('x (mm),y (mm),z (mm),|B| (uT)\n0,0,-10,300\n10,0,0,200\n0,10,10,200\n', { source });
    expect(surveys[0]?.axis).toBe('map');
    expect(surveys[0]?.fieldKind).toBe('magnitude');
  });

  it('a y column without an x column is IMPORT_MAP_INCOMPLETE, naming what to add', () => {
    const error = thrownRingfallError(() => importSurveys('y (mm),z (mm),B (mT)\n0,0,1\n1,1,1\n2,2,1\n', { source }));
    expect(error.code).toBe('IMPORT_MAP_INCOMPLETE');
    expect(error.message).toContain('Add the x column');
  });
});
