import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { toJsonReport } from '../../core/report/to-json-report';
import { SurveySpool } from '../batch/survey-spool';
import { readFitFlags } from '../fit-options';
import { fitFiles, fitFilesOnWorkers, fitWorkers, StreamedSurveys } from './fit';

const root = join(import.meta.dirname, '..', '..', '..');
const files = ['qa-107-2025-03-11-healthy.csv', 'fleet-log-2025-2026.csv', 'flawed/bad-rows.csv', 'flawed/no-field-unit.csv', 'flawed/reversed-probe.csv', 'no-such-file.csv']
  .map((name) => join(root, 'sample-data', name));

describe('fit --json on worker threads', () => {
  it('prints, from two workers, the bytes of the whole report made on one thread (fitFiles, then one JSON.stringify), with the same problems', async () => {
    // the reference: the whole report built in memory on this thread, as fit does for --html/--csv
    const options = readFitFlags({ model: ['loop,dipole'] });
    const whole = fitFiles(files, options);
    const expected = `${JSON.stringify(toJsonReport({ surveys: whole.reports, rejected: whole.rejected }), null, 2)}\n`;
    const folder = mkdtempSync(join(tmpdir(), 'ringfall-fit-workers-'));
    const spool = new SurveySpool(join(folder, 'surveys.jsonl'));
    try {
      const streamed = new StreamedSurveys(spool);
      const result = await fitFilesOnWorkers(files, options, [], { onStop: () => undefined }, streamed, 2);
      let text = '';
      await streamed.write({ rejected: result.rejected }, {}, { write: (piece: string) => (text += piece) });
      expect(text).toBe(expected);
      expect(result.problems).toEqual(whole.problems);
      expect(result.problems).toHaveLength(2);
      expect(result.filesDone).toBe(files.length);
    } finally {
      spool.dispose();
      rmSync(folder, { recursive: true, force: true });
    }
  }, 120_000);

  it('fits on one thread below 200 files and on two cores, on every core above two from 200 files (the rule DEVELOPERS.md states)', () => {
    expect([fitWorkers(199, 8), fitWorkers(200, 8), fitWorkers(10_000, 2), fitWorkers(10_000, 1), fitWorkers(200, 3)]).toEqual([1, 8, 1, 1, 3]);
  });
});
