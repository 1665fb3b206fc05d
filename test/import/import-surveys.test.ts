import { describe, expect, it } from 'vitest';
import { importSurveys, importSurveysStreaming, MIN_USABLE_READINGS } from '../../src/io/index';
import { repeatStatistics } from '../../src/core/survey/repeat-statistics';
import { expectClose } from '../support/expect-close';

const source = 'test.csv';

describe('importSurveys() reads the file forms of CONTRACT.md', () => {
  it('importSurveys() converts mm and mT to SI and keeps file order', () => {
    const { surveys } = importSurveys('distance (mm),B (mT)\n0,1.7\n10,1.6\n20,1.3\n', { source });
    // SI Brochure 9th ed.: 1 mm = 1e-3 m, 1 mT = 1e-3 T
    expect(surveys[0]?.readings.map((r) => [r.distance, r.field])).toEqual([[0, 0.0017], [0.01, 0.0016], [0.02, 0.0013]]);
    expect(surveys[0]?.fieldKind).toBe('axial');
  });

  it('importSurveys() converts gauss and inches with the exact NIST SP 811 factors', () => {
    const { surveys } = importSurveys('Distance/in,field_G\n1,17\n2,9\n3,4\n', { source });
    // NIST SP 811 (2008) App. B.8/B.9: 1 in = 0.0254 m, 1 G = 1e-4 T exactly
    expectClose(surveys[0]?.readings[1]?.distance ?? NaN, 0.0508, { rel: 1e-15 });
    expectClose(surveys[0]?.readings[0]?.field ?? NaN, 0.0017, { rel: 1e-15 });
  });

  it('importSurveys() reads # key: value metadata into meta, coil, date and reading type', () => {
    const text = '# coil: HX-2\n# Date: 2026-03-14\n# reading: RMS\n# probe: transverse, 1.2 mm recess\n# free comment\ndistance (mm),B (mT)\n0,1\n1,1\n2,1\n';
    const { surveys, detection } = importSurveys(text, { source });
    const survey = surveys[0];
    expect(survey).toMatchObject({ coil: 'HX-2', date: '2026-03-14', readingType: 'rms' });
    expect(survey?.meta).toMatchObject({ probe: 'transverse, 1.2 mm recess', coil: 'HX-2' });
    expect(detection.metadata.map((m) => m.line)).toEqual([1, 2, 3, 4]);
    expect(detection.comments).toEqual([{ line: 5, text: '# free comment' }]);
    expect(detection.headerLine).toBe(6);
    expect(survey?.readings[0]?.line).toBe(7);
  });

  it('importSurveys() detects tab and semicolon delimiters and reads a decimal comma only with a semicolon (CONTRACT.md)', () => {
    // in a tab file "1,700" uT beside 987 uT was read as 1.7 uT with no note
    const tab = importSurveys('z [mm]\tB [uT]\n0\t1,700\n1\t987\n2\t600\n3\t400\n', { source });
    expect(tab.detection).toMatchObject({ delimiter: '\t', decimalComma: false });
    expect(tab.surveys[0]?.readings.map((r) => r.line)).toEqual([3, 4, 5]);
    expect(tab.surveys[0]?.rejected).toEqual([expect.objectContaining({ line: 2, column: 'B [uT]', value: '1,700', code: 'ROW_NOT_A_NUMBER' })]);
    expect(tab.surveys[0]?.rejected[0]?.reason).toContain('only in files delimited by semicolons');
    expect(tab.surveys[0]?.rejected[0]?.reason).toContain('could mean 1.7 or 1700');
    const semicolon = importSurveys('z [mm];B [mT]\n0;1,5\n1;1.25\n2;1\n', { source });
    expect(semicolon.detection.delimiter).toBe(';');
    expect(semicolon.surveys[0]?.readings.map((r) => r.field)).toEqual([0.0015, 0.00125, 0.001]);
  });

  it('importSurveys() handles a byte-order mark, CRLF, quoted fields and trailing blank lines', () => {
    const text = '\uFEFF"distance (mm)","B (mT)","note"\r\n0,1.7,"near, touching"\r\n10,"1.6","two\r\nlines"\r\n20,1.3,x\r\n\r\n\r\n';
    const { surveys, detection, counts } = importSurveys(text, { source });
    expect(detection).toMatchObject({ byteOrderMark: true, lineBreak: 'CRLF', delimiter: ',' });
    // the quoted note spans lines 3–4, so the third reading is on physical line 5
    expect(surveys[0]?.readings.map((r) => r.line)).toEqual([2, 3, 5]);
    expect(counts).toEqual({ dataRows: 3, used: 3, rejected: 0, blankLines: 2 });
  });

  it('importSurveys() reads old Mac CR-only line breaks', () => {
    const { surveys, detection } = importSurveys('distance (mm),B (mT)\r0,1\r1,2\r2,3\r', { source });
    expect(detection.lineBreak).toBe('CR');
    expect(surveys[0]?.readings.map((r) => r.line)).toEqual([2, 3, 4]);
  });

  it('importSurveys() splits a fleet log into one survey per coil and date, rows in file order', () => {
    const text = 'coil,date,distance (mm),B (mT)\nA,2026-01-10,0,2\nB,2026-01-10,0,3\nA,2026-01-10,10,1.5\nA,2026-01-10,20,1\n' +
      'B,2026-01-10,10,2\nB,2026-01-10,20,1\nA,2026-07-10,0,1.9\nA,2026-07-10,10,1.4\nA,2026-07-10,20,0.9\n';
    const { surveys } = importSurveys(text, { source });
    expect(surveys.map((s) => `${s.coil} ${s.date}`)).toEqual(['A 2026-01-10', 'B 2026-01-10', 'A 2026-07-10']);
    expect(surveys[0]?.readings.map((r) => r.line)).toEqual([2, 4, 5]);
    expect(surveys[1]?.readings.map((r) => r.line)).toEqual([3, 6, 7]);
  });

  it('importSurveys() keeps detector types apart: an rms and a peak survey of one coil and date', () => {
    const text = 'coil,reading,distance (mm),B (mT)\nA,rms,0,1\nA,peak,0,1.41\nA,rms,1,1\nA,peak,1,1.41\nA,rms,2,1\nA,peak,2,1.41\n';
    const { surveys } = importSurveys(text, { source });
    expect(surveys.map((s) => s.readingType)).toEqual(['rms', 'peak']);
    expect(surveys[0]?.notes.join(' ')).toContain('also has peak readings');
  });

  it('importSurveys() combines Bx, By, Bz into |B| and keeps the components', () => {
    const { surveys } = importSurveys('distance (mm),Bx (mT),By (mT),Bz (mT)\n0,0.3,0.4,1.2\n1,0,0,1\n2,0,0,0.5\n', { source });
    const first = surveys[0]?.readings[0];
    // √(0.3² + 0.4² + 1.2²) = 1.3 (a 3-4-12-13 Pythagorean quadruple)
    expectClose(first?.field ?? NaN, 0.0013, { rel: 1e-15 });
    expect(first?.components).toEqual({ x: 0.0003, y: 0.0004, z: 0.0012 });
    expect(surveys[0]?.fieldKind).toBe('components');
  });

  it('importSurveys() reads the radial offset and uncertainty columns', () => {
    const { surveys } = importSurveys('z (mm),rho (mm),|B| (mT),uncertainty (uT)\n0,0,1,20\n0,-10,1.1,\n0,20,1.2,20\n', { source });
    // 1 mm = 1e-3 m, 1 uT = 1e-6 T (SI Brochure 9th ed.); −10 mm is read as its absolute value
    expect(surveys[0]?.readings.map((r) => r.radial)).toEqual([0, 0.01, 0.02]);
    expect(surveys[0]?.readings[0]?.standardUncertainty).toBe(2e-5);
    expect(surveys[0]?.readings[1]).not.toHaveProperty('standardUncertainty');
    expect(surveys[0]?.notes.join(' ')).toContain('negative radial offset read as its absolute value');
  });

  it('importSurveys() uses --field-unit and --distance-unit only for headers without units', () => {
    const { surveys, detection } = importSurveys('z,B\n0,17\n1,9\n2,4\n', { source, fieldUnit: 'G', distanceUnit: 'cm' });
    // NIST SP 811 (2008) App. B.8/B.9: 1 cm = 0.01 m, 1 G = 1e-4 T exactly
    expect(surveys[0]?.readings[1]).toMatchObject({ distance: 0.01, field: 0.0009 });
    expect(detection.columns.map((c) => c.unitSource)).toEqual(['option', 'option']);
  });

  it('importSurveys() keeps small negative readings of a plain B column and says so', () => {
    const { surveys } = importSurveys('distance (mm),B (uT)\n0,1700\n100,200\n300,-3\n400,-4\n', { source });
    // 1 uT = 1e-6 T (SI Brochure 9th ed.), signs as written
    expect(surveys[0]?.readings.map((r) => r.field)).toEqual([0.0017, 0.0002, -0.000003, -0.000004]);
    expect(surveys[0]?.notes[0]).toContain('2 negative readings kept');
  });

  it('importSurveys() flips a survey read with the probe reversed and notes it', () => {
    const { surveys } = importSurveys('distance (mm),B (uT)\n0,-1700\n100,-200\n300,-3\n400,2\n', { source });
    // the farthest reading is lifted above zero by background; the sign flip is still due
    expect(surveys[0]?.readings.map((r) => r.field)).toEqual([0.0017, 0.0002, 0.000003, -0.000002]);
    expect(surveys[0]?.notes[0]).toContain('probe read reversed');
  });

  it('importSurveys() keeps every repeated reading, and repeatStatistics() gives mean and sample SD', () => {
    const { surveys } = importSurveys('distance (mm),B (mT)\n0,1.0\n10,0.5\n0,1.2\n0,1.1\n20,0.2\n', { source });
    expect(surveys[0]?.readings).toHaveLength(5);
    const groups = repeatStatistics(surveys[0] as NonNullable<(typeof surveys)[0]>);
    expect(groups.map((g) => g.count)).toEqual([3, 1, 1]);
    // mean of 1.0, 1.2, 1.1 mT = 1.1 mT; sample SD = 0.1 mT (n − 1 divisor), by hand
    expectClose(groups[0]?.mean ?? NaN, 0.0011, { rel: 1e-12 });
    expectClose(groups[0]?.standardDeviation ?? NaN, 0.0001, { rel: 1e-9 });
    expect(groups[0]?.lines).toEqual([2, 4, 5]);
    expect(groups[1]?.standardDeviation).toBeNull();
  });

  it('importSurveys() lets a hand-made mapping override detection', () => {
    const text = 'pos,reading value,temp\n0,1.7,20\n10,1.6,20\n20,1.3,21\n';
    const { surveys, detection } = importSurveys(text, {
      source,
      mapping: [{ column: 0, role: 'distance', unit: 'mm' }, { column: 'reading value', role: 'magnitude', unit: 'mT' }],
    });
    expect(surveys[0]?.readings[2]).toMatchObject({ distance: 0.02, field: 0.0013 });
    expect(detection.columns.map((c) => [c.role, c.unitSource])).toEqual([['distance', 'mapping'], ['magnitude', 'mapping'], [null, null]]);
    expect(detection.columns[1]?.reason).toBe('set by hand as magnitude');
  });

  it('importSurveys() reads a distance column mapped as "position" as a scan: negative positions used, not set aside', () => {
    const text = 'distance (mm),B (mT)\n-20,1.3\n-10,1.6\n0,1.7\n10,1.6\n20,1.3\n';
    // as named, a distance never goes below the datum: the two negative rows are set aside
    expect(importSurveys(text, { source }).surveys[0]?.readings).toHaveLength(3);
    const { surveys, detection } = importSurveys(text, { source, mapping: [{ column: 0, role: 'position' }] });
    expect(surveys[0]?.readings.map((r) => r.distance)).toEqual([-0.02, -0.01, 0, 0.01, 0.02]);
    expect(surveys[0]?.axis).toBe('position');
    expect(detection.columns[0]).toMatchObject({ role: 'distance', axis: 'scan', reason: 'set by hand as ruler position (a scan)' });
  });

  it('importSurveysStreaming() gives the same result as importSurveys() for any chunking', async () => {
    const text = '# coil: Q\r\ndistance (mm);B (mT)\r\n0;1,7\r\n10;"1,6"\r\n20;1,3\r\nx;1\r\n';
    const whole = importSurveys(text, { source });
    const oneByOne = await importSurveysStreaming(text.split(''), { source });
    expect(oneByOne).toEqual(whole);
  });

  it('importSurveys() returns a survey of MIN_USABLE_READINGS = 3 readings and refuses one of 2', () => {
    // DESIGN.md catalog: the smallest model, dipole(moment, probeOffset, background), has 3 parameters
    expect(MIN_USABLE_READINGS).toBe(3);
    expect(importSurveys('distance (mm),B (mT)\n10,1\n20,0.5\n30,0.2\n', { source }).surveys[0]?.readings).toHaveLength(3);
    expect(() => importSurveys('distance (mm),B (mT)\n10,1\n20,0.5\n', { source })).toThrow(/Too few usable readings/);
  });
});
