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
    const run = spawnSync('node', ['bin/ringfall.mjs', ...args], { encoding: 'utf8' });
    expect(run.stdout).toBe(match![2]);
    // CONTRACT.md exit status: 1 when a spec check failed
    expect(run.status).toBe(1);
  });
});
