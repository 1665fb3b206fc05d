import { describe, expect, it } from 'vitest';
import { detectColumns } from '../../src/io/import/detect-columns';
import { importSurveys } from '../../src/io/index';

// The layout learnt from a header already read (read-layout.ts) must give each file what
// detecting its columns afresh gives: checked against detectColumns itself, the importer's
// own detection (an independent run of the same rules), file after file.
describe('a header read once is not detected again, with the same result', () => {
  const header = 'distance (mm),B (mT),probe note';
  const file = (coil: string, rows: string) => `# coil: ${coil}\n${header}\n${rows}`;

  it('a second and third file with the same header get the detection, notes and readings detectColumns gives them', () => {
    const fresh = detectColumns(header.split(','), 2, { source: 'b.csv' });
    importSurveys(file('A-1', '0,1.7,x\n10,1.6,x\n20,1.3,x\n'), { source: 'a.csv' });
    for (const source of ['b.csv', 'c.csv']) {
      const result = importSurveys(file('B-2', '0,2.7,y\n10,2.6,y\n20,2.3,y\n30,oops,y\n'), { source });
      expect(result.detection.columns).toEqual(fresh.columns);
      expect(result.detection.notes).toEqual(fresh.notes);
      expect(result.surveys[0]?.source).toBe(source);
      // SI prefix milli = 1e-3 (BIPM, The International System of Units, 9th ed., table 7): 2.7 mT = 0.0027 T
      expect(result.surveys[0]?.readings.map((r) => r.field)).toEqual([0.0027, 0.0026, 0.0023]);
      // the bad cell is named with this file's line, not the first file's
      expect(result.surveys[0]?.rejected.map((row) => [row.line, row.value])).toEqual([[6, 'oops']]);
    }
  });

  it('a header whose detection finds a problem is refused every time, each message naming its own file', () => {
    const bad = 'distance (mm),B\n0,1\n10,1\n20,1\n';
    for (const source of ['x.csv', 'y.csv']) expect(() => importSurveys(bad, { source })).toThrow(source);
    // the same header with the unit given as an option is read, and the learnt layout of that does not leak to a run without it
    // 1 mT = 0.001 T (SI prefix milli, as above)
    expect(importSurveys(bad, { source: 'z.csv', fieldUnit: 'mT' }).surveys[0]?.readings[0]?.field).toBe(0.001);
    expect(() => importSurveys(bad, { source: 'w.csv' })).toThrow('w.csv');
  });
});
