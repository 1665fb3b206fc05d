import { spawnSync } from 'node:child_process';
import { copyFileSync, cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, symlinkSync, utimesSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

// bin/ringfall.mjs runs dist/cli.js in an installed package (its batch workers start
// dist/batch-worker.js) and the sources through tsx in a checkout; both must print the
// same reports (common practice: a bundler must not change behaviour). The package here
// is a folder laid out as the tarball unpacks (bin, dist from scripts/build-package.ts,
// sample-data, package.json) with the checkout's node_modules linked in; test/e2e/
// package.cli.test.ts installs the real tarball.
const root = join(import.meta.dirname, '..', '..');
let scratch = '';
let pkg = '';

// a fixed time of the run (SOURCE_DATE_EPOCH), so two runs can be compared byte for byte
function run(folder: string, env: Record<string, string>, ...args: string[]) {
  const result = spawnSync(process.execPath, [join(folder, 'bin', 'ringfall.mjs'), ...args], { cwd: folder, encoding: 'utf8', timeout: 120_000, maxBuffer: 1 << 26, env: { ...process.env, SOURCE_DATE_EPOCH: '1773480600', ...env } });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

beforeAll(() => {
  scratch = mkdtempSync(join(tmpdir(), 'ringfall-bin-test-'));
  pkg = join(scratch, 'package');
  mkdirSync(join(pkg, 'bin'), { recursive: true });
  copyFileSync(join(root, 'bin', 'ringfall.mjs'), join(pkg, 'bin', 'ringfall.mjs'));
  copyFileSync(join(root, 'package.json'), join(pkg, 'package.json'));
  cpSync(join(root, 'sample-data'), join(pkg, 'sample-data'), { recursive: true });
  symlinkSync(join(root, 'node_modules'), join(pkg, 'node_modules'), 'dir');
  const build = spawnSync(process.execPath, [join(root, 'node_modules', 'tsx', 'dist', 'cli.mjs'), join(root, 'scripts', 'build-package.ts'), join(pkg, 'dist')], { cwd: root, encoding: 'utf8', timeout: 170_000 });
  if (build.status !== 0) throw new Error(`build-package failed: ${build.stderr}`);
}, 180_000);

afterAll(() => {
  if (scratch !== '') rmSync(scratch, { recursive: true, force: true });
});

describe('bin/ringfall.mjs', () => {
  it('prints the same fit report from dist/cli.js (a package: no src/) as from the sources through tsx', () => {
    const args = ['fit', 'sample-data/qt-9-2026-02-03-thick.csv', '--spec', 'sample-data/specs/qt-9.spec.json', '--threshold', 'implant-static', '--json'];
    const built = run(pkg, {}, ...args);
    const sources = run(root, { RINGFALL_LOADER: 'tsx' }, ...args);
    expect(built.stderr).toBe('');
    expect(built.status).toBe(sources.status);
    expect(built.stdout).toBe(sources.stdout);
    expect(JSON.parse(built.stdout).surveys[0].verdict.checks.map((c: { what: string }) => c.what)).toContain('ampereTurns at label geometry');
    expect(run(pkg, {}, ...args, '--debug').stderr).toBe(`ringfall: running ${join(pkg, 'dist', 'cli.js')}\n`);
  });

  it('runs batch workers from dist/batch-worker.js with the same reports as the tsx-loaded workers, and finds the sample data and Chart.js', () => {
    // demo fits sample-data/ in batch workers (demo.ts), from the package root
    const built = run(pkg, {}, 'demo', '--json');
    const sources = run(root, { RINGFALL_LOADER: 'tsx' }, 'demo', '--json');
    // demo.ts: exit 0 when it ran (the fleet's failed checks are the demo's point)
    expect(built.status).toBe(0);
    expect(built.stderr).not.toContain('ringfall:');
    expect(JSON.parse(built.stdout).surveys.length).toBeGreaterThan(5);
    expect(built.stdout).toBe(sources.stdout);
    const html = join(scratch, 'report.html');
    expect(run(pkg, {}, 'fit', 'sample-data/qa-107-2025-03-11-healthy.csv', '--html', html).status).toBe(0);
    // the Chart.js UMD bundle is inlined from the installed package
    expect(readFileSync(html, 'utf8')).toContain('Chart.js v4.6.1');
  });

  it('in a checkout, runs the sources through tsx when dist/cli.js is older than a source file or RINGFALL_LOADER=tsx, else dist/cli.js', () => {
    symlinkSync(join(root, 'src'), join(pkg, 'src'), 'dir');
    try {
      const cli = join(pkg, 'dist', 'cli.js');
      const args = ['predict', '--model', 'loop', '--set', 'ampereTurns=100A', '--set', 'radius=40mm', '--at', '20mm', '--json', '--debug'];
      utimesSync(cli, new Date('2001-01-01'), new Date('2001-01-01'));
      const stale = run(pkg, {}, ...args);
      expect(stale.status).toBe(0);
      expect(stale.stderr).toMatch(/^ringfall: running the sources through tsx \(src\/.+ is newer than dist\/cli\.js\)\n$/);
      const future = new Date(Date.now() + 3_600_000);
      utimesSync(cli, future, future);
      const fresh = run(pkg, {}, ...args);
      expect(fresh.stderr).toBe(`ringfall: running ${cli}\n`);
      expect(fresh.stdout).toBe(stale.stdout);
      expect(run(pkg, { RINGFALL_LOADER: 'tsx' }, ...args).stderr).toBe('ringfall: running the sources through tsx (RINGFALL_LOADER=tsx)\n');
    } finally {
      rmSync(join(pkg, 'src'));
    }
  });
});
