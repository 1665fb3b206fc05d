import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(import.meta.dirname, '..', '..');
const healthy = 'sample-data/qa-107-2025-03-11-healthy.csv';

function ringfall(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const truth = (JSON.parse(readFileSync(join(root, 'sample-data', 'TRUTH.json'), 'utf8')) as {
  surveys: { file: string; params: Record<string, number> }[];
}).surveys.find((s) => s.file === 'qa-107-2025-03-11-healthy.csv')!;

describe('ringfall fit (CONTRACT.md)', () => {
  it('ringfall fit FILE --json prints the CONTRACT.md report, exit 0, and the loop intervals contain the TRUTH.json ampere-turns and radius', () => {
    const run = ringfall('fit', healthy, '--json');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    expect(report.schema).toBe('ringfall-report/1');
    expect(report.surveys).toHaveLength(1);
    const survey = report.surveys[0];
    expect(survey).toMatchObject({ source: healthy, coil: 'QA-107', date: '2025-03-11', readingType: 'dc', best: 'loop', verdict: null, thresholds: [] });
    // the sample file has 28 data rows after its 6 metadata lines and header, none of them flawed
    expect(survey.readings).toEqual({ total: 28, used: 28, rejected: [] });
    expect(Array.isArray(survey.warnings)).toBe(true);
    // CONTRACT.md default models, in that order
    expect(survey.fits.map((f: { model: string }) => f.model)).toEqual(['loop', 'dipole', 'power-law', 'inverse-square', 'inverse-cube']);
    for (const fit of survey.fits) {
      expect(Object.keys(fit)).toEqual(expect.arrayContaining(['model', 'converged', 'stopReason', 'params', 'stats', 'warnings']));
      expect(Object.keys(fit.stats)).toEqual(expect.arrayContaining(['n', 'k', 'rss', 'rmse', 'reducedChiSquare', 'aicc', 'bic', 'akaikeWeight']));
      for (const estimate of Object.values(fit.params) as Record<string, unknown>[]) {
        expect(Object.keys(estimate)).toEqual(expect.arrayContaining(['value', 'unit', 'stderr', 'ci95', 'fixed']));
      }
    }
    const loop = survey.fits[0];
    expect(loop.params.ampereTurns.unit).toBe('A');
    expect(loop.params.radius.unit).toBe('m');
    for (const name of ['ampereTurns', 'radius']) {
      const [low, high] = loop.params[name].ci95;
      expect(low, name).toBeLessThanOrEqual(truth.params[name]!);
      expect(high, name).toBeGreaterThanOrEqual(truth.params[name]!);
    }
  });

  it('ringfall fit FILE prints a text report with the parameter table in A and mm and the model comparison, exit 0', () => {
    const run = ringfall('fit', healthy, '--uncertainty', '1%+0.5uT', '--position-uncertainty', '0.2mm');
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('Coil as measured — loop');
    expect(run.stdout).toMatch(/ampereTurns\s+\d+\.\d A\s+\d+\.\d to \d+\.\d A/);
    expect(run.stdout).toMatch(/radius\s+\d+\.\d+ mm/);
    expect(run.stdout).toContain('Models side by side');
  });

  it('ringfall fit --fix radius=45mm reports the radius fixed at 0.045 m with no interval', () => {
    const run = ringfall('fit', healthy, '--model', 'loop', '--fix', 'radius=45mm', '--json');
    expect(run.status).toBe(0);
    const loop = JSON.parse(run.stdout).surveys[0].fits[0];
    // 45 mm as given on the command line, in m; k: the loop's 4 parameters (ampereTurns, radius, probeOffset, background) less the fixed one
    expect(loop.params.radius).toMatchObject({ value: 0.045, fixed: true, stderr: null, ci95: null });
    expect(loop.stats.k).toBe(3);
  });

  it('ringfall fit with a missing file exits 2 with one line on stderr naming it, and no stack trace', () => {
    const run = ringfall('fit', 'sample-data/no-such-survey.csv');
    expect(run.status).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toContain('no-such-survey.csv');
    expect(run.stderr).not.toMatch(/\bat .*\.ts:\d+/);
    expect(run.stdout).toBe('');
  });

  it('ringfall fit --model helix exits 2 naming the catalog ids', () => {
    const run = ringfall('fit', healthy, '--model', 'loop,helix');
    expect(run.status).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toContain('"helix" is not a model');
    expect(run.stderr).toContain('loop, thick-coil');
  });

  it('ringfall fit --fix radius=45A (a current for a length) exits 2 saying a length is needed', () => {
    const run = ringfall('fit', healthy, '--fix', 'radius=45A');
    expect(run.status).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toMatch(/--fix radius: "45A" is a current but a length is needed/);
  });

  it('ringfall fit --fix radii=45mm exits 2 naming the parameters of the chosen models', () => {
    const run = ringfall('fit', healthy, '--model', 'loop', '--fix', 'radii=45mm');
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('"radii" is not a parameter of loop');
    expect(run.stderr).toContain('ampereTurns, radius, probeOffset, background');
  });

  it('ringfall fit --field-unit furlong exits 2 with one line before reading any file, not one line per file', () => {
    const run = ringfall('fit', healthy, 'sample-data/flawed/no-field-unit.csv', '--field-unit', 'furlong');
    expect(run.status).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toBe('ringfall: --field-unit: "furlong" is not usable. Give a field unit: T, mT, µT, nT, kG, G, mG.\n');
  });

  const usage: [string, string[], string][] = [
    ['an unknown option', ['fit', healthy, '--bogus'], `ringfall: unknown option '--bogus' (did you mean --robust?). See "ringfall fit --help" for the usage.\n`],
    ['an option without its value', ['fit', healthy, '--seed'], `ringfall: option '--seed <n>' argument missing. See "ringfall fit --help" for the usage.\n`],
    ['no file', ['fit'], 'ringfall: No survey files given. Name the files or the folders that hold them, or give a list with --files-from FILE (one path per line).\n'],
    ['an unknown command', ['fitt', healthy], `ringfall: unknown command 'fitt' (did you mean fit?). See "ringfall --help" for the usage.\n`],
  ];
  for (const [what, args, line] of usage) {
    it(`ringfall exits 2 with one line saying what was wrong and where to look for ${what} (commander's usage errors)`, () => {
      // CONTRACT.md: exit status 2 for usage errors, one line on stderr that says what to do
      const run = ringfall(...args);
      expect(run.status).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toBe(line);
    });
  }

  it('ringfall fit with one good and one unreadable file reports the good one and exits 2 naming the other', () => {
    const run = ringfall('fit', healthy, 'sample-data/flawed/no-field-unit.csv', '--model', 'loop', '--json');
    expect(run.status).toBe(2);
    expect(run.stderr).toContain('no-field-unit.csv');
    expect(run.stderr).toContain('--field-unit');
    expect(JSON.parse(run.stdout).surveys.map((s: { source: string }) => s.source)).toEqual([healthy]);
  });

  it('ringfall fit --html/--csv into a folder that does not exist stops before fitting, exit 2, naming the folder', () => {
    // CONTRACT.md: exit 2 for a usage or input error, one line saying what to do
    for (const option of ['--html', '--csv']) {
      const run = ringfall('fit', healthy, option, 'no-such-folder-here/out.file');
      expect(run.status).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toMatch(new RegExp(`^ringfall: ${option}: the folder ".*no-such-folder-here" for "no-such-folder-here/out.file" does not exist\\. Create it first`));
    }
  });

  it('ringfall fit --json on many files (written survey by survey as they are fitted) prints the bytes, stderr and exit status of the report built whole (as with --csv)', () => {
    // the in-memory path, kept for --html/--csv, is the independent reference: one JSON.stringify of the whole report
    const folder = mkdtempSync(join(tmpdir(), 'ringfall-fit-stream-'));
    try {
      const files = ['sample-data/qa-107-2025-03-11-healthy.csv', 'sample-data/fleet-log-2025-2026.csv', 'sample-data/flawed/bad-rows.csv', 'sample-data/flawed/no-field-unit.csv', 'sample-data/flawed/reversed-probe.csv'];
      const args = ['fit', ...files, '--spec', 'sample-data/specs/qa-107.spec.json', '--model', 'loop,dipole', '--json'];
      const env = { ...process.env, SOURCE_DATE_EPOCH: '0' };
      const streamed = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000, env });
      const whole = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args, '--csv', join(folder, 'out.csv')], { cwd: root, encoding: 'utf8', timeout: 120_000, env });
      expect(JSON.parse(streamed.stdout).surveys.length).toBeGreaterThan(3);
      expect(streamed.stdout).toBe(whole.stdout);
      expect(streamed.stderr).toBe(whole.stderr);
      expect(streamed.status).toBe(whole.status);
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });
});
