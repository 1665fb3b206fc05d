import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

// The README's worked example shows a real `ringfall fit` run; this keeps it true.
describe('README worked example', () => {
  it('the README shows exactly what `ringfall fit` prints for the degraded sample coil, and exit status 1', () => {
    const readme = readFileSync('README.md', 'utf8');
    const match = /<!-- cli-example -->\s*```\n\$ npx ringfall (.*)\n([\s\S]*?)```/.exec(readme);
    expect(match).not.toBeNull();
    const args = match![1]!.split(' ');
    // the example's run record states when it was made; the same time is handed in through
    // SOURCE_DATE_EPOCH (reproducible-builds.org), so the rest must match byte for byte
    const time = /time of the run: (\S+)/.exec(match![2]!)?.[1];
    expect(time).toBeDefined();
    const epoch = String(Date.parse(time!) / 1000);
    const run = spawnSync('node', ['bin/ringfall.mjs', ...args], { encoding: 'utf8', env: { ...process.env, SOURCE_DATE_EPOCH: epoch } });
    expect(run.stdout).toBe(match![2]);
    // CONTRACT.md exit status: 1 when a spec check failed
    expect(run.status).toBe(1);
  });
});
