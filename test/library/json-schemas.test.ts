import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { modelIds } from '../../src/core/models';
import { toJsonReport } from '../../src/core/report/to-json-report';
import { analyseSurvey } from '../../src/core/report/analyse-survey';
import { importSurveys } from '../../src/io';
import { parseSpecs } from '../../src/io/spec';
import { readSchema, schemaErrors } from '../support/json-schemas';

// The shipped JSON Schemas (schema/*.schema.json) must mean something: they accept what
// ringfall writes and reads, and refuse what the contract rules out. test/e2e/
// json-schema.cli.test.ts validates every JSON the CLI prints.
const healthy = 'sample-data/qa-107-2025-03-11-healthy.csv';

function report(): Record<string, unknown> {
  const [survey] = importSurveys(readFileSync(healthy, 'utf8'), { source: healthy }).surveys;
  return JSON.parse(JSON.stringify(toJsonReport({ surveys: [analyseSurvey(survey!, { fit: { models: ['loop', 'dipole'] }, specs: [], thresholds: [] })] }))) as Record<string, unknown>;
}

describe('schema/*.schema.json', () => {
  it('declare JSON Schema draft 2020-12 and list the catalog\'s model ids (no drift from models/index.ts)', () => {
    for (const name of ['report', 'plan', 'predict', 'spec'] as const) {
      expect(readSchema(name)['$schema']).toBe('https://json-schema.org/draft/2020-12/schema');
    }
    const report = readSchema('report') as { $defs: { modelId: { enum: string[] } } };
    expect(report.$defs.modelId.enum).toEqual([...modelIds]);
    expect((readSchema('spec') as { $defs: { spec: { properties: { model: { enum: string[] } } } } }).$defs.spec.properties.model.enum).toEqual([...modelIds]);
  });

  it('report: accepts toJsonReport\'s output and a run record, refuses a wrong tag, a missing key or a wrong type', () => {
    const json = report();
    expect(schemaErrors('report', json)).toEqual([]);
    // CONTRACT.md `run`: how the report was made, with each input's SHA-256
    const run = { tool: 'ringfall', version: '0.1.0', command: 'fit', time: '2026-03-14T09:30:00Z', inputs: [{ name: 'a.csv', sha256: 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855', bytes: 0 }], settings: { seed: 1 } };
    expect(schemaErrors('report', { ...json, run })).toEqual([]);
    expect(schemaErrors('report', { ...json, run: { ...run, inputs: [{ name: 'a.csv', sha256: 'not a hash', bytes: 0 }] } })).not.toEqual([]);
    expect(schemaErrors('report', { ...json, run: 'yesterday' })).not.toEqual([]);
    expect(schemaErrors('report', { ...json, schema: 'ringfall-report/2' })).not.toEqual([]);
    const surveys = json['surveys'] as Record<string, unknown>[];
    const { best: _best, ...withoutBest } = surveys[0]!;
    expect(schemaErrors('report', { ...json, surveys: [withoutBest] }).join('\n')).toContain("must have required property 'best'");
    const fits = surveys[0]!['fits'] as Record<string, unknown>[];
    const badFit = { ...fits[0]!, stats: { ...(fits[0]!['stats'] as object), n: '28' } };
    expect(schemaErrors('report', { ...json, surveys: [{ ...surveys[0]!, fits: [badFit] }] }).join('\n')).toContain('/stats/n must be integer');
    expect(schemaErrors('report', { ...json, surveys: [{ ...surveys[0]!, readingType: 'ac' }] })).not.toEqual([]);
  });

  it('spec: accepts every sample spec file, and refuses an unknown key and a spec with nothing to check, as the spec reader does', () => {
    const files = readdirSync('sample-data/specs').filter((name) => name.endsWith('.json'));
    expect(files.length).toBeGreaterThan(3);
    for (const name of files) expect(schemaErrors('spec', JSON.parse(readFileSync(`sample-data/specs/${name}`, 'utf8')))).toEqual([]);
    const typo = { model: 'loop', params: { radius: '45 mm' }, tolerance: '5%', tolerence: '10%' };
    expect(schemaErrors('spec', typo)).not.toEqual([]);
    expect(() => parseSpecs(JSON.stringify(typo), 'typo.json')).toThrow(/unknown key "tolerence"/);
    const empty = { model: 'loop', tolerance: '5%' };
    expect(schemaErrors('spec', empty)).not.toEqual([]);
    expect(() => parseSpecs(JSON.stringify(empty), 'empty.json')).toThrow(/nothing to check/);
    expect(schemaErrors('spec', [])).not.toEqual([]);
  });
});
