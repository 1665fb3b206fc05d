/**
 * Every CLI report is a record of how it was made (CONTRACT.md `run`): version, time of
 * the run, each input file with its SHA-256, every setting. The hashes are checked against
 * coreutils `sha256sum`, an implementation outside the project.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const root = join(import.meta.dirname, '..', '..');
const scratch = mkdtempSync(join(tmpdir(), 'ringfall-run-record-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
const survey = 'sample-data/qa-107-2026-03-10-degraded.csv';
const spec = 'sample-data/specs/qa-107.spec.json';
const version = (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string }).version;
// 1773480600 s after 1970-01-01T00:00:00Z (POSIX time) is 2026-03-14T09:30:00Z
const epoch = '1773480600';
const time = '2026-03-14T09:30:00Z';

function ringfall(...args: string[]) {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000, env: { ...process.env, SOURCE_DATE_EPOCH: epoch } });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** coreutils sha256sum of a file. */
function sha256sum(path: string): string {
  return execFileSync('sha256sum', [path], { cwd: root, encoding: 'utf8' }).split(' ')[0]!;
}

interface Run {
  tool: string; version: string; command: string; time: string;
  inputs: { name: string; sha256: string | null; bytes: number | null }[];
  settings: Record<string, unknown>;
}

describe('run record', () => {
  it('fit --json opens with `run`: version, time, the survey and spec with their SHA-256, every setting', () => {
    const result = ringfall('fit', survey, '--spec', spec, '--uncertainty', '1.5%+2uT', '--model', 'loop,inverse-square', '--fix', 'background=0T', '--threshold', 'implant-static', '--seed', '7', '--json');
    const json = JSON.parse(result.stdout) as { run: Run };
    expect(Object.keys(json)[1]).toBe('run');
    const { run } = json;
    expect(run).toMatchObject({ tool: 'ringfall', version, command: 'fit', time });
    expect(run.inputs).toEqual([{ name: survey, sha256: sha256sum(survey), bytes: readFileSync(join(root, survey)).byteLength }]);
    expect(run.settings).toMatchObject({
      models: ['loop', 'inverse-square'],
      fixed: { background: { value: 0, unit: 'T' } },
      // 1.5 % and 2 µT as typed, in SI
      readingUncertainty: { relative: 0.015, absolute: { value: 2e-6, unit: 'T' } },
      positionUncertainty: null, robustLoss: null, seed: 7, allStarts: false,
      spec: { name: spec, sha256: sha256sum(spec) },
      // the implant-static preset: 0.5 mT (ICNIRP 2009)
      thresholds: [{ value: 5e-4, unit: 'T' }],
    });
  });

  it('fit text ends with the run record; --csv opens with it as # lines; --html shows it', () => {
    const csv = join(scratch, 'r.csv');
    const html = join(scratch, 'r.html');
    const result = ringfall('fit', survey, '--csv', csv, '--html', html);
    const record = result.stdout.slice(result.stdout.lastIndexOf('Run record'));
    expect(record).toContain(`made by: ringfall ${version} (fit)`);
    expect(record).toContain(`time of the run: ${time}`);
    expect(record.replace(/\s+/g, ' ')).toContain(`input file: ${survey}, `);
    expect(record).toContain(sha256sum(survey));
    const lines = readFileSync(csv, 'utf8').split('\r\n');
    expect(lines[0]).toBe(`# made by: ringfall ${version} (fit)`);
    expect(lines.find((line) => !line.startsWith('#'))).toMatch(/^source,coil,date/);
    const page = readFileSync(html, 'utf8');
    expect(page).toContain('How this report was made');
    expect(page).toContain(sha256sum(survey));
  });

  it('predict and plan record their settings; batch records every file it read', () => {
    const predict = JSON.parse(ringfall('predict', '--model', 'loop', '--set', 'ampereTurns=1A', '--set', 'radius=50mm', '--at', '10mm', '--json').stdout) as { run: Run };
    expect(predict.run).toMatchObject({ command: 'predict', time, inputs: [], settings: { model: 'loop', distance: { value: 0.01, unit: 'm' } } });
    const plan = JSON.parse(ringfall('plan', '--model', 'loop', '--set', 'ampereTurns=360A', '--set', 'radius=45mm', '--json').stdout) as { run: Run };
    expect(plan.run).toMatchObject({ command: 'plan', settings: { model: 'loop', points: 12 } });
    const out = join(scratch, 'fleet');
    const batch = JSON.parse(ringfall('batch', survey, 'sample-data/qa-107-2025-03-11-healthy.csv', '--json', '--out', out).stdout) as { run: Run };
    expect(batch.run.command).toBe('batch');
    // batch reads files in sorted order
    const files = [survey, 'sample-data/qa-107-2025-03-11-healthy.csv'].sort();
    expect(batch.run.inputs.map((input) => [input.name, input.sha256])).toEqual(files.map((file) => [file, sha256sum(file)]));
    expect(readFileSync(join(out, 'index.html'), 'utf8')).toContain('How this report was made');
    expect(readFileSync(join(out, 'qa-107.html'), 'utf8')).toContain(sha256sum(survey));
  });

  it('a SOURCE_DATE_EPOCH that is not a number of seconds is a usage error (exit 2)', () => {
    const result = spawnSync(process.execPath, ['bin/ringfall.mjs', 'fit', survey], { cwd: root, encoding: 'utf8', env: { ...process.env, SOURCE_DATE_EPOCH: 'soon' } });
    expect(result.status).toBe(2);
    expect(result.stderr).toContain('SOURCE_DATE_EPOCH');
  });
});
