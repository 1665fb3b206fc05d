import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { schemaErrors, type SchemaName } from '../support/json-schemas';

// Every JSON the CLI prints is valid under the schema the package ships for it
// (schema/*.schema.json, JSON Schema draft 2020-12, checked by ajv).
const root = join(import.meta.dirname, '..', '..');

function json(...args: string[]): unknown {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000, maxBuffer: 1 << 28 });
  // a report is printed with 0 (passed), 1 (a check failed), 3 (inconclusive) and, for a
  // file batch could not use or a spec that applied to no survey, 2; 70 is a defect
  expect([0, 1, 2, 3], result.stderr).toContain(result.status);
  return JSON.parse(result.stdout) as unknown;
}

function expectValid(name: SchemaName, value: unknown): void {
  expect(schemaErrors(name, value)).toEqual([]);
}

const surveys = readdirSync(join(root, 'sample-data')).filter((name) => name.endsWith('.csv')).sort().map((name) => `sample-data/${name}`);

describe('the JSON the CLI prints meets the shipped schemas', () => {
  it('fit --json on every sample survey, with the fleet spec file, thresholds, a robust loss and stated uncertainties (report.schema.json)', () => {
    const report = json('fit', ...surveys, '--spec', 'sample-data/specs/all-coils.spec.json', '--threshold', 'implant-static', '--threshold', '0.1mT', '--uncertainty', '1.5%+2uT', '--robust', 'huber', '--json') as { surveys: unknown[] };
    expect(report.surveys.length).toBeGreaterThan(10);
    expectValid('report', report);
  });

  it('fit --json on the flawed sample files (rejected rows, reversed probe) with every model (report.schema.json)', () => {
    const report = json('fit', 'sample-data/flawed/bad-rows.csv', 'sample-data/flawed/reversed-probe.csv', '--model', 'loop,thick-coil,solenoid,coil-pair,rectangle,dipole,power-law,inverse-square,inverse-cube', '--json') as { surveys: { readings: { rejected: unknown[] } }[] };
    expect(report.surveys.some((survey) => survey.readings.rejected.length > 0)).toBe(true);
    expectValid('report', report);
  });

  it('batch --json and demo --json, with their fleet sections (report.schema.json)', () => {
    const batch = json('batch', 'sample-data', '--spec', 'sample-data/specs/all-coils.spec.json', '--threshold', '0.5mT', '--workers', '2', '--json') as { fleet?: unknown };
    expect(batch.fleet).toBeDefined();
    expectValid('report', batch);
    const demo = json('demo', '--json') as { fleet?: unknown };
    expect(demo.fleet).toBeDefined();
    expectValid('report', demo);
  });

  it('plan --json, with and without a plan to compare and off-axis positions (plan.schema.json)', () => {
    expectValid('plan', json('plan', '--model', 'loop', '--set', 'ampereTurns=360A', '--set', 'radius=45mm', '--json'));
    const compared = json('plan', '--model', 'thick-coil', '--set', 'ampereTurns=1500A', '--set', 'innerRadius=20mm', '--set', 'outerRadius=40mm', '--set', 'length=30mm', '--compare', '0mm,10mm,20mm,40mm,80mm', '--off-axis', '60mm', '--json') as { plans: { compared: unknown } };
    expect(compared.plans.compared).not.toBeNull();
    expectValid('plan', compared);
    expectValid('plan', json('plan', '--model', 'power-law', '--set', 'amplitude=2e-6', '--set', 'exponent=3', '--json'));
    expectValid('plan', json('plan', '--model', 'solenoid', '--set', 'ampereTurns=500A', '--set', 'radius=20mm', '--set', 'length=80mm', '--scan', '--reach=-150mm..120mm', '--json'));
  });

  it('predict --json on and off the axis (predict.schema.json)', () => {
    expectValid('predict', json('predict', '--model', 'loop', '--set', 'ampereTurns=100A', '--set', 'radius=40mm', '--at', '20mm', '--json'));
    expectValid('predict', json('predict', '--model', 'rectangle', '--set', 'ampereTurns=50A', '--set', 'width=40mm', '--set', 'height=20mm', '--at', '30mm', '--radial', '10mm', '--json'));
  });
});
