import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { toJsonReport } from '../../core/report/to-json-report';
import { readSpecFile } from '../../io/spec';
import { readFitFlags } from '../fit-options';
import { JsonReportStream } from '../json-report-stream';
import type { BatchSettings } from './batch-settings';
import type { FileOutcome } from './batch-types';
import { FleetCollector } from './fleet-collector';
import { fitSurveyFile } from './fit-survey-file';
import { fleetRows } from './fleet-rows';
import { assembleReport } from './run-batch';
import { spoolSurveyJson, writeSpooledSurveys } from './survey-json';
import { WorkerSpools } from './worker-spool';

const scratch = mkdtempSync(join(tmpdir(), 'ringfall-collector-test-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

// the sample fleet (coils surveyed on several dates, in several files, specs for some) and a
// survey without a coil id, fitted as a batch worker fits them; the summaryModel of the JSON
// report comes from the specs, the coil histories (without specs) and the best model, so
// each way of filling the worker's gap is met
let settings: BatchSettings;
let files: string[];
let outcomes: FileOutcome[];
beforeAll(async () => {
  const options = readFitFlags({});
  settings = {
    fit: options.fit, import: options.import, thresholds: options.thresholds, keepPoints: false,
    specs: await readSpecFile('sample-data/specs/all-coils.spec.json'),
  };
  const uncoiled = join(scratch, 'no-coil.csv');
  writeFileSync(uncoiled, `distance (mm),B (mT)\n${[10, 20, 30, 40, 50, 60].map((d) => `${d},${(200 / (1 + (d / 40) ** 2) ** 1.5).toFixed(3)}`).join('\n')}\n`);
  files = [...readdirSync('sample-data').filter((name) => name.endsWith('.csv')).map((name) => join('sample-data', name)), uncoiled];
  outcomes = files.map((path, index) => fitSurveyFile({ index, path }, settings));
});

describe('FleetCollector', () => {
  // reference: the fleet section of every survey at once (assembleReport: fleetHistory over
  // all reports kept in memory), the way batch made it before surveys went to the spool
  it('gives the fleet section and the summary rows of all surveys at once, from what it spooled', () => {
    const folder = join(scratch, 'collector');
    mkdirSync(folder);
    const spool = new WorkerSpools(folder);
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
      spool.close();
    }
  });
});

describe('a survey\'s JSON text made by the worker', () => {
  // reference: JSON.stringify(toJsonReport(report), null, 2), the report's bytes when it is written whole
  it('gives, with the fleet\'s summaryModel filled in, the bytes of the whole report', async () => {
    const bases = new Set<string | null>();
    const gapped = new Set<boolean>();
    for (const [i, specs] of [settings.specs, []].entries()) {
      const plain = { ...settings, specs };
      const report = assembleReport(files.map((path, index) => fitSurveyFile({ index, path }, plain)), plain);
      for (const survey of toJsonReport(report).surveys) bases.add(survey.summaryModel?.basis ?? null);
      const folder = join(scratch, `json-${i}`);
      mkdirSync(folder);
      const spools = new WorkerSpools(folder);
      try {
        const places = report.surveys.map((survey) => spoolSurveyJson(survey, spools.writer()));
        for (const place of places) gapped.add(place.gap >= 0);
        const writes: Buffer[] = [];
        const stream = new JsonReportStream({ write: (text: string | Uint8Array) => writes.push(Buffer.from(text)) }, (part) => toJsonReport({ ...part, fleet: report.fleet! }));
        await writeSpooledSurveys(stream, places, spools, report);
        await stream.finish();
        expect(Buffer.concat(writes).toString('utf8')).toBe(`${JSON.stringify(toJsonReport(report), null, 2)}\n`);
      } finally {
        spools.close();
      }
    }
    expect(bases).toEqual(new Set(['spec', 'coil-history', 'best-physical']));
    // some surveys' summaryModel waited for the fleet, some did not
    expect(gapped).toEqual(new Set([true, false]));
  });
});
