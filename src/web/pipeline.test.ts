import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseSurvey } from '../core/report/analyse-survey';
import { parseThresholdLevel } from '../core/analysis/thresholds/threshold-level';
import { parseSpecs } from '../io/spec/parse-specs';
import { importSurveys } from '../io';
import { defaultSettings } from './fit-settings';
import { runPipeline } from './pipeline';

const sample = (name: string) => readFileSync(join(__dirname, '..', '..', 'sample-data', name), 'utf8');
const healthy = 'qa-107-2025-03-11-healthy.csv';
const plain = { ...defaultSettings, thresholds: [], spec: '' };

describe('runPipeline()', () => {
  it('gives the survey report `ringfall fit` builds (analyseSurvey) for the same file, spec, level and uncertainty', () => {
    const text = sample(healthy);
    const spec = sample('specs/qa-107.spec.json');
    const settings = { ...plain, spec, thresholds: ['implant-static'], uncertainty: '1.5%+2uT' };
    const outcome = runPipeline([{ id: 'a', name: healthy, text }], settings);
    const imported = importSurveys(text, { source: healthy });
    const reference = analyseSurvey(imported.surveys[0]!, {
      fit: { models: plain.models, fixed: {}, instrumentUncertainty: { relative: 0.015, absolute: 2e-6 } },
      specs: parseSpecs(spec, 'the spec'),
      thresholds: [parseThresholdLevel('implant-static')],
    });
    expect(outcome.settingErrors).toEqual([]);
    expect(outcome.report.surveys[0]).toEqual(reference);
  });

  it('reports a file it cannot read with the importer’s code and message, and fits the other file', () => {
    const outcome = runPipeline([
      { id: 'bad', name: 'no-unit.csv', text: 'distance (mm),B\n1,2\n3,4\n5,6\n' },
      { id: 'good', name: healthy, text: sample(healthy) },
    ], plain);
    const bad = outcome.files.find((f) => f.id === 'bad')!;
    expect(bad.error?.code).toBe('IMPORT_FIELD_UNIT_MISSING');
    expect(bad.error?.message).toContain('"B"');
    // the header could still be read, so the page can offer to set the unit by hand
    expect(bad.detection?.columns.map((c) => c.header)).toEqual(['distance (mm)', 'B']);
    expect(outcome.report.surveys.map((s) => s.coil)).toEqual(['QA-107']);
  });

  it('lists every row it did not use, with line and reason', () => {
    const outcome = runPipeline([{ id: 'f', name: 'bad-rows.csv', text: sample('flawed/bad-rows.csv') }], plain);
    const file = outcome.files[0]!;
    // sample-data/README.md: bad-rows.csv has nine broken rows on purpose
    expect(file.rowsNotUsedTotal).toBe(9);
    expect(file.rowsNotUsed.every((row) => row.line > 0 && row.reason.length > 0)).toBe(true);
  });

  it('lists every row of a file with too few usable readings, not only the three its message quotes', () => {
    const bad = Array.from({ length: 10 }, (_, i) => `${i + 1},x${i}`);
    const text = ['distance (mm),B (mT)', ...bad, '20,4', '30,2'].join('\n') + '\n';
    const file = runPipeline([{ id: 'few', name: 'few.csv', text }], plain).files[0]!;
    expect(file.error?.code).toBe('IMPORT_TOO_FEW_ROWS');
    // the text above: 10 unreadable cells on lines 2–11, then 2 usable readings (lines 12–13), too few to fit
    expect(file.rowsNotUsedTotal).toBe(12);
    expect(file.rowsNotUsed.map((row) => row.line)).toEqual(Array.from({ length: 12 }, (_, i) => i + 2));
    expect(file.rowsNotUsed[9]!.reason).toContain('"x9"');
    expect(file.skipped.map((group) => group.reason)).toEqual([expect.stringContaining('2 usable readings')]);
  });

  it('returns setting mistakes without fitting', () => {
    const outcome = runPipeline([{ id: 'a', name: healthy, text: sample(healthy) }], { ...plain, uncertainty: '1.5 %+ two uT', thresholds: ['icnirp-public'] });
    expect(outcome.settingErrors.map((e) => e.field)).toEqual(['uncertainty', 'threshold:0']);
    expect(outcome.report.surveys).toEqual([]);
  });
});
