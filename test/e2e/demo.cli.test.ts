import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';

describe('ringfall demo', () => {
  it('ringfall demo fits the sample fleet: one survey in full, the fleet summary, exit 0', () => {
    const run = spawnSync('node', ['bin/ringfall.mjs', 'demo'], { encoding: 'utf8' });
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('invented Quillfield Coil Bench');
    expect(run.stdout).toContain('Coil as measured — loop');
    expect(run.stdout).toContain('Fleet summary');
    // sample-data/TRUTH.json: QA-107 lost 15 % of its ampere-turns (degraded), QA-214 has a 60 mm radius on a 45 mm label
    expect(run.stdout).toMatch(/QA-107: failed its spec \(degraded\)/);
    expect(run.stdout).toMatch(/QA-214: failed its spec \(mislabeled/);
    expect(run.stdout).not.toContain('/work/');
  });

  it('ringfall demo --json prints the CONTRACT report with a fleet section', () => {
    const run = spawnSync('node', ['bin/ringfall.mjs', 'demo', '--json'], { encoding: 'utf8' });
    expect(run.status).toBe(0);
    const json = JSON.parse(run.stdout) as { schema: string; surveys: unknown[]; fleet: { coils: { coil: string; flags: string[] }[] } };
    expect(json.schema).toBe('ringfall-report/1');
    expect(json.surveys.length).toBeGreaterThan(10);
    expect(json.fleet.coils.find((c) => c.coil === 'QA-107')?.flags).toContain('degrading');
  });
});
