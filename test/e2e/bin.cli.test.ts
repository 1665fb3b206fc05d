import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

// bin/ringfall.mjs runs the CLI from a cached esbuild bundle, or through tsx as a fallback;
// both must print the same reports (common practice: a bundler must not change behaviour).
const root = join(import.meta.dirname, '..', '..');

// a fixed time of the run (SOURCE_DATE_EPOCH), so two runs can be compared byte for byte
function ringfall(env: Record<string, string>, ...args: string[]) {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000, env: { ...process.env, SOURCE_DATE_EPOCH: '1773480600', ...env } });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe('bin/ringfall.mjs', () => {
  it('prints the same report from the cached bundle as through tsx, and keeps the bundle in node_modules/.cache/ringfall', () => {
    const args = ['fit', 'sample-data/qt-9-2026-02-03-thick.csv', '--spec', 'sample-data/specs/qt-9.spec.json', '--threshold', 'implant-static', '--json'];
    const bundled = ringfall({}, ...args);
    const loaded = ringfall({ RINGFALL_LOADER: 'tsx' }, ...args);
    expect(bundled.stderr).toBe('');
    expect(bundled.status).toBe(loaded.status);
    expect(bundled.stdout).toBe(loaded.stdout);
    expect(JSON.parse(bundled.stdout).surveys[0].verdict.checks.map((c: { what: string }) => c.what)).toContain('ampereTurns at label geometry');
    expect(readdirSync(join(root, 'node_modules', '.cache', 'ringfall')).filter((name) => /^cli-[0-9a-f]{20}\.mjs$/.test(name))).toHaveLength(1);
  });

  it('finds files next to the sources from the bundle too (demo\'s sample data, the batch worker, Chart.js for --html)', () => {
    const demo = ringfall({}, 'demo', '--json');
    expect(demo.status).not.toBe(2);
    // demo.ts: exit 0 when it ran (the fleet's failed checks are the demo's point)
    expect(demo.status).toBe(0);
    expect(demo.stderr).not.toContain('ringfall:');
    expect(JSON.parse(demo.stdout).surveys.length).toBeGreaterThan(5);
    const folder = mkdtempSync(join(tmpdir(), 'ringfall-bin-test-'));
    try {
      const html = join(folder, 'report.html');
      expect(ringfall({}, 'fit', 'sample-data/qa-107-2025-03-11-healthy.csv', '--html', html).status).toBe(0);
      // the Chart.js UMD bundle is inlined from the installed package
      expect(readFileSync(html, 'utf8')).toContain('Chart.js v4.6.1');
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });
});
