import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readSpecFile } from '../../io/spec';
import { readFitFlags } from '../fit-options';
import type { BatchSettings } from './batch-settings';
import { FleetCollector } from './fleet-collector';
import { fitSurveyFile } from './fit-survey-file';
import { fleetRows } from './fleet-rows';
import { assembleReport } from './run-batch';
import { SurveySpool } from './survey-spool';

const scratch = mkdtempSync(join(tmpdir(), 'ringfall-collector-test-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('FleetCollector', () => {
  // reference: the fleet section of every survey at once (assembleReport: fleetHistory over
  // all reports kept in memory), the way batch made it before surveys went to the spool
  it('gives the fleet section and the summary rows of all surveys at once, from what it spooled', async () => {
    const options = readFitFlags({});
    const settings: BatchSettings = {
      fit: options.fit, import: options.import, thresholds: options.thresholds, keepPoints: false,
      specs: await readSpecFile('sample-data/specs/all-coils.spec.json'),
    };
    // the sample fleet (coils surveyed on several dates, in several files) and a survey without a coil id
    const uncoiled = join(scratch, 'no-coil.csv');
    writeFileSync(uncoiled, `distance (mm),B (mT)\n${[10, 20, 30, 40, 50, 60].map((d) => `${d},${(200 / (1 + (d / 40) ** 2) ** 1.5).toFixed(3)}`).join('\n')}\n`);
    const files = [...readdirSync('sample-data').filter((name) => name.endsWith('.csv')).map((name) => join('sample-data', name)), uncoiled];
    const outcomes = files.map((path, index) => fitSurveyFile({ index, path }, settings));
    const spool = new SurveySpool(join(scratch, 'spool.jsonl'));
    try {
      const collector = new FleetCollector(settings, spool);
      for (const outcome of outcomes) collector.add(outcome);
      const whole = assembleReport(outcomes, settings);
      const collected = collector.report();
      expect(whole.fleet!.coils.length).toBeGreaterThan(3);
      expect(whole.fleet!.ungrouped!.length).toBe(1);
      expect(collected.fleet).toEqual(whole.fleet);
      expect(JSON.stringify(collected.fleet)).toBe(JSON.stringify(whole.fleet));
      const rows = (report: typeof whole) => fleetRows(report).map((row) => [row.coil, row.latest.source, row.latest.date, row.surveys]);
      expect(rows(collected)).toEqual(rows(whole));
      expect(collector.surveyCount).toBe(whole.surveys.length);
    } finally {
      spool.dispose();
    }
  });
});
